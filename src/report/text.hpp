/// @brief Plain-text rendering of a Report, for HR reviewers and terminals.
#pragma once
#include <string>

#include "report/report.hpp"

namespace rotaweave::report {

/// The full report.txt: totals, breaches by rule and by person, every breach, the caution.
std::string renderText(const Report& report, const model::Problem& problem);
/// A few lines for the terminal after a command.
std::string renderSummary(const Report& report);
/// "2027-03-04" or "2027-03-04..2027-03-10" or "2027-03-04, 2027-03-11" (a few listed dates).
std::string datesText(const model::Problem& problem, const std::vector<DayIdx>& days);

}  // namespace rotaweave::report
