/// @brief The last step shared by every command: explain the roster, build the report, write it.
#pragma once
#include <filesystem>

#include "app/commands.hpp"
#include "model/problem.hpp"
#include "model/roster.hpp"

namespace rotaweave::app {

Outcome reportAndWrite(const model::Problem& problem, const model::Roster& roster, report::RunInfo run,
                       const std::filesystem::path& out);

}  // namespace rotaweave::app
