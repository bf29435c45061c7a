/// @brief report.json reading through yaml-cpp.
#include "bench/report_fields.hpp"

#include <yaml-cpp/yaml.h>

namespace rotaweave::bench {

ReportFields readReportFields(const std::filesystem::path& reportJson) {
  ReportFields fields;
  try {
    const YAML::Node root = YAML::LoadFile(reportJson.string());
    const YAML::Node summary = root["summary"], run = root["run"];
    if (!summary.IsMap() || !summary["hard"] || !summary["soft"] || !root["violations"].IsSequence()) {
      fields.error = "no summary with hard and soft, or no violations list";
      return fields;
    }
    fields.hard = summary["hard"].as<double>();
    fields.soft = summary["soft"].as<double>();
    if (run.IsMap() && run["generations"]) fields.generations = run["generations"].as<long>();
    if (run.IsMap() && run["stop"]) fields.stop = run["stop"].as<std::string>();
    fields.valid = true;
  } catch (const YAML::Exception& e) {
    fields.error = e.what();
  }
  return fields;
}

}  // namespace rotaweave::bench
