/// @brief A roster laid out as a table of cells, wherever it sits on a sheet: the header row is
/// the row that holds the period's dates, the id column the column left of the dates that holds
/// the scenario's staff ids; every other column (names, totals) and row (title, legend, notes
/// below the table) is left alone. Shared by the workbook reader and CSV files saved from a
/// spreadsheet program.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "model/problem.hpp"
#include "model/roster.hpp"

namespace rotaweave::io {

struct GridCell {
  enum class Kind { Text, Number, Other };
  int row = 0;  ///< 1-based
  int col = 0;  ///< 1-based
  Kind kind = Kind::Text;
  std::string text;  ///< Text; Number: its text ("3"); Other: what it holds, for the message
  /// Number: the date its value means when it is a whole day serial; else empty.
  std::optional<model::DateSerial> date;
};

/// Where the grid came from, for messages: a sheet ("Roster!F12") or, with `sheet` empty, a
/// CSV file (line and column).
struct GridSource {
  std::string file;
  std::string sheet;
};

/// Reads the roster from `cells` (in rows ascending, then columns ascending). Throws InputError
/// naming the cell for anything that is not a shift id, SHIFT/skill or empty in a person's date
/// cell, and for a missing, duplicate or unknown date or person.
model::Roster readRosterGrid(const std::vector<GridCell>& cells, const model::Problem& problem, const GridSource& source);

}  // namespace rotaweave::io
