/// @brief The hidden Lists sheet: what the Roster sheet's formulas and drop-down lists read.
/// Shift table (A:C), absence codes (E:F), one column of allowed codes per person (from H).
#include <algorithm>
#include <string>

#include "io/absence_codes.hpp"
#include "io/xlsx_sheets.hpp"

namespace rotaweave::io::xlsx {

void writeListsSheet(Book& bk) {
  lxw_worksheet* ws = workbook_add_worksheet(bk.workbook, ListsPlan::kSheet);
  if (!ws) check(LXW_ERROR_MEMORY_MALLOC_FAILED, "Lists sheet");
  const model::Problem& p = bk.data.problem;
  const ListsPlan& plan = bk.lists;
  Style bold;
  bold.bold = true;
  lxw_format* head = bk.formats.get(bold);
  check(worksheet_write_string(ws, 0, 0, "Shift", head), "lists");
  check(worksheet_write_string(ws, 0, 1, "Paid hours", head), "lists");
  check(worksheet_write_string(ws, 0, 2, "Label", head), "lists");
  for (size_t s = 0; s < p.shifts.size(); ++s) {
    const auto row = static_cast<lxw_row_t>(1 + s);
    check(worksheet_write_string(ws, row, 0, p.shifts[s].id.c_str(), nullptr), "lists");
    check(worksheet_write_number(ws, row, 1, p.shifts[s].paidMinutes() / 60.0, nullptr), "lists");
    check(worksheet_write_string(ws, row, 2, shiftDescription(p.shifts[s]).c_str(), nullptr), "lists");
  }
  check(worksheet_write_string(ws, 0, 4, "Absence code", head), "lists");
  check(worksheet_write_string(ws, 0, 5, "Meaning", head), "lists");
  for (size_t a = 0; a < plan.absenceCodes.size(); ++a) {
    const auto row = static_cast<lxw_row_t>(1 + a);
    check(worksheet_write_string(ws, row, 4, plan.absenceCodes[a].c_str(), nullptr), "lists");
    check(worksheet_write_string(ws, row, 5, absenceCodeMeaning(p, plan.absenceCodes[a])->c_str(), nullptr), "lists");
  }
  for (StaffIdx s = 0; s < p.staffCount(); ++s) {
    const auto col = static_cast<lxw_col_t>(ListsPlan::kFirstPersonCol + s);
    check(worksheet_write_string(ws, 0, col, p.staff[static_cast<size_t>(s)].id.c_str(), head), "lists");
    const auto& codes = plan.personCodes[static_cast<size_t>(s)];
    for (size_t k = 0; k < codes.size(); ++k)
      check(worksheet_write_string(ws, static_cast<lxw_row_t>(1 + k), col, codes[k].c_str(), nullptr), "lists");
  }
  check(worksheet_set_column(ws, 0, 1, 10, nullptr), "columns");
  check(worksheet_set_column(ws, 2, 2, 36, nullptr), "columns");
  check(worksheet_set_column(ws, 4, 5, 13, nullptr), "columns");
  worksheet_hide(ws);
}

}  // namespace rotaweave::io::xlsx
