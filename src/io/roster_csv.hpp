/// @brief Roster CSV: header `staff,<dates...>`, one row per person, cell = SHIFT[/skill], empty = off.
#pragma once
#include <optional>
#include <string>

#include "model/problem.hpp"
#include "model/roster.hpp"

namespace rotaweave::io {

/// Reads and validates a roster for `problem`; throws InputError with file, line and column.
/// Every command's --roster goes through here, so it takes any roster a user may hand over:
/// - an xlsx workbook (the file starts with the zip signature), read by readRosterXlsx;
/// - the contract CSV (`staff,<dates>`), its header dates in ISO or written day-first or
///   month-first (01/03/2027, 03/01/2027; the period settles which, see roster_dates.hpp);
/// - a CSV saved by a spreadsheet program from our Roster sheet (a title row, a Name column,
///   totals columns), located by content as in a workbook (roster_table.hpp).
model::Roster readRosterCsv(const std::string& path, const model::Problem& problem);

/// The task a roster cell names: a shift id, SHIFT/skill, or empty for off (kOff), for person
/// `s`. On anything else returns nullopt and sets `error` to what is wrong and how to fix it.
std::optional<TaskIdx> parseRosterCell(const std::string& text, StaffIdx s, const model::Problem& problem, std::string& error);
/// The roster as CSV text in the contract format.
std::string rosterCsvText(const model::Roster& roster, const model::Problem& problem);

}  // namespace rotaweave::io
