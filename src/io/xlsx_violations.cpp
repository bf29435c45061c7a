/// @brief The Violations sheet: one table row per breach, hard first, with filters.
#include <algorithm>
#include <string>

#include "io/xlsx_sheets.hpp"
#include "report/text.hpp"

namespace rotaweave::io::xlsx {

void writeViolationsSheet(Book& bk) {
  lxw_worksheet* ws = workbook_add_worksheet(bk.workbook, "Violations");
  if (!ws) check(LXW_ERROR_MEMORY_MALLOC_FAILED, "Violations sheet");
  const model::Problem& p = bk.data.problem;
  const auto& breaches = bk.data.report.breaches;
  Formats& f = bk.formats;

  Style hard, soft, number;
  hard.font = kHardColour;
  hard.bold = true;
  soft.font = 0x7A4B00;
  number.numFormat = "0.##";
  number.center = true;
  const char* headers[] = {"Severity", "Rule", "Kind", "Person", "Name", "Dates", "Amount", "Penalty", "Message"};
  size_t width[9] = {9, 8, 8, 8, 8, 12, 9, 9, 40};
  auto fit = [&](int col, const std::string& text) { width[col] = std::max(width[col], text.size() + 2); };
  lxw_row_t row = 1;
  for (const rules::Breach& b : breaches) {
    const bool person = b.staff >= 0;
    const model::Person* who = person ? &p.staff[static_cast<size_t>(b.staff)] : nullptr;
    fit(1, b.ruleId);
    fit(2, b.kind);
    if (who) fit(3, who->id), fit(4, who->name);
    fit(5, report::datesText(p, b.days));
    fit(8, b.message);
    check(worksheet_write_string(ws, row, 0, b.hard ? "hard" : "soft", f.get(b.hard ? hard : soft)), "violation");
    check(worksheet_write_string(ws, row, 1, b.ruleId.c_str(), nullptr), "violation");
    check(worksheet_write_string(ws, row, 2, b.kind.c_str(), nullptr), "violation");
    check(worksheet_write_string(ws, row, 3, who ? who->id.c_str() : "", nullptr), "violation");
    check(worksheet_write_string(ws, row, 4, who ? who->name.c_str() : "", nullptr), "violation");
    check(worksheet_write_string(ws, row, 5, report::datesText(p, b.days).c_str(), nullptr), "violation");
    check(worksheet_write_number(ws, row, 6, static_cast<double>(b.amount) / kAmountScale, f.get(number)), "violation");
    check(worksheet_write_number(ws, row, 7, static_cast<double>(b.penalty) / kCostScale, f.get(number)), "violation");
    check(worksheet_write_string(ws, row, 8, b.message.c_str(), nullptr), "violation");
    ++row;
  }

  addTable(ws, f, "Violations", {std::begin(headers), std::end(headers)}, 0, breaches.empty() ? 1 : row - 1);

  const size_t caps[9] = {9, 40, 28, 20, 30, 60, 9, 9, 140};
  for (lxw_col_t c = 0; c < 9; ++c)
    check(worksheet_set_column(ws, c, c, static_cast<double>(std::min(width[c], caps[c])), nullptr), "columns");
  worksheet_freeze_panes(ws, 1, 0);
  worksheet_set_landscape(ws);
  worksheet_set_paper(ws, 9);
  worksheet_fit_to_pages(ws, 1, 0);
  check(worksheet_repeat_rows(ws, 0, 0), "print titles");
  check(worksheet_set_footer(ws, "&L&A&RPage &P of &N"), "footer");
}

}  // namespace rotaweave::io::xlsx
