/// @brief Building worksheet formulas as text: cell and range references, text criteria for
/// COUNTIF-style functions, and the hidden Lists sheet's layout that other sheets refer to.
/// Internal to the xlsx_*.cpp files.
#pragma once
#include <xlsxwriter.h>

#include <string>
#include <vector>

#include "model/problem.hpp"

namespace rotaweave::io::xlsx {

/// "C4", "$C$4", "$C4" or "C$4".
std::string cellRef(lxw_row_t row, lxw_col_t col, bool absRow = false, bool absCol = false);
/// "C4:AF4" (relative) or "$C$4:$AF$4" (absolute).
std::string rangeRef(lxw_row_t row1, lxw_col_t col1, lxw_row_t row2, lxw_col_t col2, bool absolute = false);
/// An Excel string literal: "ab""c".
std::string textLiteral(const std::string& text);
/// A COUNTIF criterion that matches `text` exactly (case aside): "=E", with the wildcards
/// * ? ~ escaped by ~ and a trailing "*" when `prefix` is set ("=E/*": every E/skill).
std::string exactCriterion(const std::string& text, bool prefix = false);

/// Where the hidden Lists sheet keeps what formulas and drop-down lists read.
struct ListsPlan {
  static constexpr const char* kSheet = "Lists";
  /// Shift table: A shift id, B paid hours, C label; one row per shift from row 1 (0-based).
  std::vector<std::string> shiftHoursCell;  ///< per shift: "Lists!$B$2"
  /// Absence codes: E code, F meaning, from row 1.
  std::vector<std::string> absenceCodes;
  /// Per person, one column from H: row 0 the id, rows 1.. the codes the person may take.
  std::vector<std::vector<std::string>> personCodes;
  std::vector<std::string> personListRange;  ///< per person: "=Lists!$H$2:$H$7"
  static constexpr lxw_col_t kFirstPersonCol = 7;
};

/// The codes each person may type into a roster cell: each shift with each skill they hold
/// (as written in the roster: "E", or "E/rn" where they hold several skills), then the codes
/// of their own absences.
ListsPlan planLists(const model::Problem& problem);

}  // namespace rotaweave::io::xlsx

namespace rotaweave::io::xlsx {

struct RosterLayout;

/// Formulas over one person's row of the Roster sheet (row `row`, days in columns from
/// kFirstDayCol), so the totals follow any edit of the row.
struct RowFormulas {
  const model::Problem& problem;
  const RosterLayout& layout;
  const ListsPlan& lists;

  /// Shifts of type `shift` in the row: =COUNTIF(row,"=E")+COUNTIF(row,"=E/*").
  std::string shiftCount(lxw_row_t row, ShiftIdx shift) const;
  /// Paid hours: each shift count times that shift's paid hours on the Lists sheet.
  std::string hours(lxw_row_t row) const;
  /// Shifts worked: the sum of the per-shift counts.
  std::string shifts(lxw_row_t row) const;
  /// Weekends with at least one worked day: per weekend, (COUNTA(days) - absence codes > 0).
  /// Empty when the period has no weekend (the caller writes 0).
  std::string weekends(lxw_row_t row, StaffIdx staff) const;
};

/// People assigned to (day, task) on the Roster sheet, counted from its date column:
/// the cells "SHIFT/skill", plus the cells "SHIFT" of people whose main skill is `skill`.
std::string coverAssignedFormula(const model::Problem& problem, const RosterLayout& layout, DayIdx day, TaskIdx task);

/// Excel refuses formulas longer than this many characters.
inline constexpr size_t kMaxFormulaLength = 8000;

}  // namespace rotaweave::io::xlsx
