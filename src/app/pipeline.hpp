/// @brief The last step shared by every command: explain the roster, build the report, write it.
#pragma once
#include <filesystem>
#include <vector>

#include "app/commands.hpp"
#include "model/problem.hpp"
#include "model/roster.hpp"
#include "rules/rule_set.hpp"

namespace rotaweave::app {

/// Throws io::OutputError if writing roster.csv into `out` would replace the file `input`.
void refuseToOverwrite(const std::filesystem::path& input, const std::filesystem::path& out);

/// Runs the search from `seeds` (may be empty), then reports and writes the best roster.
Outcome searchAndWrite(const model::Problem& problem, const std::vector<model::Roster>& seeds, const SolveRequest& request,
                       const char* command);

/// `previousCalendars` (may be null): see io::OutputBundle.
Outcome reportAndWrite(const rules::RuleSet& rules, const model::Roster& roster, report::RunInfo run,
                       const std::filesystem::path& out, const io::CalendarHistory* previousCalendars = nullptr);

/// Seconds the outputs of a run on `problem` are allowed for: taken from the time limit, so
/// that the whole run, loading to the last file, keeps it. Grows with the roster's size,
/// and is never more than a fifth of the limit.
double outputReserve(const model::Problem& problem, double timeLimit);

}  // namespace rotaweave::app
