/// @brief The Baseline sheet (check --baseline): against the roster an edited one came from,
/// the changed cells and the breaches that are new, gone or changed in amount, as two
/// filterable tables under a summary line.
#include <algorithm>
#include <string>

#include "io/xlsx_sheets.hpp"
#include "report/report.hpp"
#include "report/text.hpp"

namespace rotaweave::io::xlsx {

void writeBaselineSheet(Book& bk) {
  if (!bk.data.report.baseline) return;
  const report::BaselineDiff& d = *bk.data.report.baseline;
  lxw_worksheet* ws = workbook_add_worksheet(bk.workbook, "Baseline");
  if (!ws) check(LXW_ERROR_MEMORY_MALLOC_FAILED, "Baseline sheet");
  const model::Problem& p = bk.data.problem;
  Formats& f = bk.formats;
  Style bold;
  bold.bold = true;
  const std::string title = "Against " + d.source + ": " + report::baselineLine(d);
  check(worksheet_write_string(ws, 0, 0, title.c_str(), f.get(bold)), "baseline title");
  const std::string penalty = "Penalty: hard " + report::pointsText(d.before.hard) + " -> " +
                              report::pointsText(d.after.hard) + ", soft " + report::pointsText(d.before.soft) +
                              " -> " + report::pointsText(d.after.soft);
  check(worksheet_write_string(ws, 1, 0, penalty.c_str(), nullptr), "baseline title");

  Style centred;
  centred.center = true;
  auto text = [&](lxw_row_t row, lxw_col_t col, const std::string& value, lxw_format* fmt = nullptr) {
    check(worksheet_write_string(ws, row, col, value.c_str(), fmt), "baseline cell");
  };

  const lxw_row_t cellsHead = 3;
  lxw_row_t row = cellsHead + 1;
  for (const report::BaselineCell& c : d.cells) {
    const model::Person& who = p.staff[static_cast<size_t>(c.staff)];
    text(row, 0, who.id);
    text(row, 1, who.name);
    text(row, 2, p.dateText(c.day));
    text(row, 3, p.cellText(c.before, c.staff), f.get(centred));
    text(row, 4, p.cellText(c.after, c.staff), f.get(centred));
    ++row;
  }
  const lxw_row_t cellsLast = d.cells.empty() ? cellsHead + 1 : row - 1;
  addTable(ws, f, "BaselineCells", {"Person", "Name", "Date", "Before", "After"}, cellsHead, cellsLast);

  const lxw_row_t breachHead = cellsLast + 3;
  row = breachHead + 1;
  Style hard;
  hard.font = kHardColour;
  hard.bold = true;
  auto breach = [&](const char* status, const rules::Breach& b, const std::string& before, const std::string& after) {
    text(row, 0, status);
    text(row, 1, b.hard ? "hard" : "soft", b.hard ? f.get(hard) : nullptr);
    text(row, 2, b.ruleId);
    text(row, 3, b.staff >= 0 ? p.staff[static_cast<size_t>(b.staff)].id : "");
    text(row, 4, report::datesText(p, b.days));
    text(row, 5, before, f.get(centred));
    text(row, 6, after, f.get(centred));
    text(row, 7, b.message);
    ++row;
  };
  for (const auto& b : d.added) breach("new", b, "", report::amountWithUnit(b.kind, b.amount));
  for (const auto& b : d.gone) breach("gone", b, report::amountWithUnit(b.kind, b.amount), "");
  for (const auto& c : d.changed)
    breach("changed", c.after, report::amountWithUnit(c.before.kind, c.before.amount),
           report::amountWithUnit(c.after.kind, c.after.amount));
  const lxw_row_t breachLast = row == breachHead + 1 ? breachHead + 1 : row - 1;
  addTable(ws, f, "BaselineBreaches", {"Status", "Severity", "Rule", "Person", "Dates", "Before", "After", "Message"},
           breachHead, breachLast);

  const double widths[] = {12, 18, 18, 10, 24, 11, 11, 80};
  for (lxw_col_t c = 0; c < 8; ++c) check(worksheet_set_column(ws, c, c, widths[c], nullptr), "columns");
  worksheet_set_landscape(ws);
  worksheet_set_paper(ws, 9);
  worksheet_fit_to_pages(ws, 1, 0);
  check(worksheet_set_footer(ws, "&L&A&RPage &P of &N"), "footer");
}

}  // namespace rotaweave::io::xlsx
