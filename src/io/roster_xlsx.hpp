/// @brief A roster from an xlsx workbook: our own roster.xlsx after edits in a spreadsheet
/// program, or a plain sheet laid out like roster.csv.
#pragma once
#include <string>

#include "model/problem.hpp"
#include "model/roster.hpp"

namespace rotaweave::io {

/// Reads the sheet named "Roster" (any case), or the workbook's only sheet, and locates the
/// roster on it by content (roster_table.hpp). Date cells are read as dates (1900 or 1904 date
/// system), formulas by their saved value, merged cells as their top-left value over the range.
/// Memory is bounded: every part's unpacked size is capped, the sheet is streamed and refused
/// past staff + 1000 rows with content. Throws InputError naming the file and, where it can,
/// the sheet and cell ("Roster!F12").
model::Roster readRosterXlsx(const std::string& path, const model::Problem& problem);

}  // namespace rotaweave::io
