/// @brief The few figures the bench reads back from a `rotaweave` report.json: the summary's
/// hard and soft penalty points and the run's generations and stop reason.
#pragma once
#include <filesystem>
#include <optional>
#include <string>

namespace rotaweave::bench {

struct ReportFields {
  bool valid = false;  ///< the file parsed as a whole and has summary.hard, summary.soft and a violations list
  double hard = 0, soft = 0;
  long generations = 0;
  std::string stop;   ///< run.stop, e.g. "time limit", "interrupted"
  std::string error;  ///< why it is not valid
};

/// Reads report.json with yaml-cpp (the project's YAML library; JSON's syntax is YAML's flow
/// style, so it reads a JSON file as it is). A truncated or garbled file does not parse and
/// comes back not valid. yaml-cpp is laxer than a JSON parser in what it accepts (unquoted
/// words, for one), which does not matter for a file that our own writer made or cut short.
ReportFields readReportFields(const std::filesystem::path& reportJson);

}  // namespace rotaweave::bench
