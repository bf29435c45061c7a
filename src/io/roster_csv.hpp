/// @brief Roster CSV: header `staff,<dates...>`, one row per person, cell = SHIFT[/skill], empty = off.
#pragma once
#include <string>

#include "model/problem.hpp"
#include "model/roster.hpp"

namespace rotaweave::io {

/// Reads and validates a roster for `problem`; throws InputError with file, line and column.
model::Roster readRosterCsv(const std::string& path, const model::Problem& problem);
/// The roster as CSV text in the contract format.
std::string rosterCsvText(const model::Roster& roster, const model::Problem& problem);

}  // namespace rotaweave::io
