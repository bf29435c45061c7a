/// @brief The Changes sheet (replan only): every cell changed against the published roster,
/// with the reason, as a filterable table under a one-line summary.
#include <algorithm>
#include <string>

#include "io/xlsx_sheets.hpp"
#include "report/changes.hpp"

namespace rotaweave::io::xlsx {

void writeChangesSheet(Book& bk) {
  if (!bk.data.report.changes) return;
  const report::ChangeSummary& changes = *bk.data.report.changes;
  lxw_worksheet* ws = workbook_add_worksheet(bk.workbook, "Changes");
  if (!ws) check(LXW_ERROR_MEMORY_MALLOC_FAILED, "Changes sheet");
  const model::Problem& p = bk.data.problem;
  Formats& f = bk.formats;

  Style bold;
  bold.bold = true;
  const std::string title = report::changesLine(changes, p) + " (days before " + p.dateText(changes.from) +
                            " are kept as published; changed cells have a double blue border on the Roster sheet)";
  check(worksheet_write_string(ws, 0, 0, title.c_str(), f.get(bold)), "changes title");

  constexpr lxw_row_t kHeadRow = 2;
  constexpr int kColumns = 6;
  const char* headers[kColumns] = {"Person", "Name", "Date", "Was", "Now", "Reason"};
  size_t width[kColumns] = {8, 8, 12, 6, 6, 30};
  auto fit = [&](int col, const std::string& text) { width[col] = std::max(width[col], text.size() + 2); };
  Style centred;
  centred.center = true;
  lxw_row_t row = kHeadRow + 1;
  for (const report::CellChange& c : changes.cells) {
    const model::Person& who = p.staff[static_cast<size_t>(c.staff)];
    const std::string was = p.cellText(c.was, c.staff), now = p.cellText(c.now, c.staff);
    fit(0, who.id);
    fit(1, who.name);
    fit(3, was);
    fit(4, now);
    fit(5, c.reason);
    check(worksheet_write_string(ws, row, 0, who.id.c_str(), nullptr), "change");
    check(worksheet_write_string(ws, row, 1, who.name.c_str(), nullptr), "change");
    check(worksheet_write_string(ws, row, 2, p.dateText(c.day).c_str(), nullptr), "change");
    check(worksheet_write_string(ws, row, 3, was.c_str(), f.get(centred)), "change");
    check(worksheet_write_string(ws, row, 4, now.c_str(), f.get(centred)), "change");
    check(worksheet_write_string(ws, row, 5, c.reason.c_str(), nullptr), "change");
    ++row;
  }

  addTable(ws, f, "Changes", {std::begin(headers), std::end(headers)}, kHeadRow, changes.cells.empty() ? kHeadRow + 1 : row - 1);

  const size_t caps[kColumns] = {20, 30, 12, 12, 12, 60};
  for (lxw_col_t c = 0; c < kColumns; ++c)
    check(worksheet_set_column(ws, c, c, static_cast<double>(std::min(width[c], caps[c])), nullptr), "columns");
  worksheet_freeze_panes(ws, kHeadRow + 1, 0);
  worksheet_set_paper(ws, 9);
  worksheet_fit_to_pages(ws, 1, 0);
  check(worksheet_repeat_rows(ws, kHeadRow, kHeadRow), "print titles");
  check(worksheet_set_footer(ws, "&L&A&RPage &P of &N"), "footer");
}

}  // namespace rotaweave::io::xlsx
