/// @brief The last step shared by every command: explain the roster, build the report, write it.
#pragma once
#include <filesystem>
#include <vector>

#include "app/commands.hpp"
#include "model/problem.hpp"
#include "model/roster.hpp"

namespace rotaweave::app {

/// Throws io::OutputError if writing roster.csv into `out` would replace the file `input`.
void refuseToOverwrite(const std::filesystem::path& input, const std::filesystem::path& out);

/// Runs the search from `seeds` (may be empty), then reports and writes the best roster.
Outcome searchAndWrite(const model::Problem& problem, const std::vector<model::Roster>& seeds, const SolveRequest& request,
                       const char* command);

Outcome reportAndWrite(const model::Problem& problem, const model::Roster& roster, report::RunInfo run,
                       const std::filesystem::path& out);

}  // namespace rotaweave::app
