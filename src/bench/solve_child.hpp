/// @brief One `rotaweave solve` run as a child process, as a user would run it, and what it
/// left behind: how it ended, its time and memory, the report's figures, which outputs exist.
/// `limits`, `interrupt` and `table` all run the solver this way.
#pragma once
#include <cstdint>
#include <filesystem>
#include <optional>
#include <string>
#include <vector>

#include "bench/child_launcher.hpp"
#include "bench/json_line.hpp"
#include "bench/report_fields.hpp"

namespace rotaweave::bench {

struct SolveCall {
  std::filesystem::path scenario;
  std::filesystem::path out;  ///< --out; the child's stdout and stderr go to out + ".log"
  double timeLimit = 60;
  int threads = 0;  ///< 0: not passed (the solver's default, all cores)
  std::uint64_t seed = 1;
  double killAfter = 0;                  ///< hard limit, seconds
  std::optional<double> interruptAfter;  ///< send SIGINT after this many seconds
  std::vector<std::string> extra;        ///< more options for `solve`, e.g. {"--stall", "0"}
};

struct SolveRun {
  ChildRun child;
  ReportFields report;
  bool rosterCsv = false, reportJson = false, reportTxt = false;
};

/// Runs `rotaweave solve` (the binary next to this one) with --quiet, through `launcher`.
SolveRun runSolve(ChildLauncher& launcher, const SolveCall& call);

/// Adds the fields every mode prints for a child run: wall_s, peak_rss_mb, exit (null when a
/// signal ended it), signal, killed, hard and soft (null without a valid report), and
/// roster_csv, report_json, report_txt (whether each exists).
void addSolveFields(JsonLine& line, const SolveRun& run);

}  // namespace rotaweave::bench
