/// @brief report.json: summary, violations (contract fields) and run details.
#pragma once
#include <string>

#include "report/report.hpp"

namespace rotaweave::io {

std::string reportJson(const report::Report& report, const model::Problem& problem);
/// JSON string literal with escapes.
std::string jsonString(const std::string& s);

}  // namespace rotaweave::io
