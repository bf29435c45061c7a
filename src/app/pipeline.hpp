/// @brief The last step shared by every command: explain the roster, build the report, write it.
#pragma once
#include <filesystem>
#include <string>
#include <vector>

#include "app/commands.hpp"
#include "io/output_folder.hpp"
#include "model/problem.hpp"
#include "model/roster.hpp"
#include "rules/rule_set.hpp"

namespace rotaweave::app {

/// Prints the loader's notes (Problem::notes) to stderr, one "note: ..." line each.
void printNotes(const model::Problem& problem);

/// Throws io::OutputError if writing roster.csv into `out` would replace the file `input`.
void refuseToOverwrite(const std::filesystem::path& input, const std::filesystem::path& out);

/// Runs the search from `seeds` (may be empty), then reports and writes the best roster into
/// `out` (prepared, and so checked and locked, before the input was read).
Outcome searchAndWrite(const model::Problem& problem, const std::vector<model::Roster>& seeds, const SolveRequest& request,
                       const char* command, io::OutputFolder& out);

/// The roster an edited one came from (check --baseline) and its file name for the report.
struct BaselineInput {
  const model::Roster& roster;
  std::string source;
};

/// Explains `roster`, builds the report (with the comparison against `baseline` when given)
/// and writes the whole output set into `out` as one. `previousCalendars` (may be null): see
/// io::OutputBundle.
Outcome reportAndWrite(const rules::RuleSet& rules, const model::Roster& roster, report::RunInfo run,
                       io::OutputFolder& out, const BaselineInput* baseline = nullptr,
                       const io::CalendarHistory* previousCalendars = nullptr);

/// Seconds the outputs of a run on `problem` are allowed for: taken from the time limit, so
/// that the whole run, loading to the last file, keeps it. Grows with the roster's size,
/// and is never more than a fifth of the limit.
double outputReserve(const model::Problem& problem, double timeLimit);

}  // namespace rotaweave::app
