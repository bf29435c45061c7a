/// @brief What keeps the Roster sheet usable after edits and on paper: drop-down lists of each
/// person's codes, conditional colours that follow a cell's content, and the print setup.
#include <algorithm>
#include <string>
#include <vector>

#include "io/input_error.hpp"
#include "io/xlsx_sheets.hpp"

namespace rotaweave::io::xlsx {
namespace {

lxw_row_t lastPersonRow(const model::Problem& p) { return personRow(std::max(p.staffCount(), 1) - 1); }

/// A conditional format's look: fill and font colour only (Excel ignores sizes and alignment there).
lxw_format* conditionalLook(lxw_workbook* book, lxw_color_t fill, lxw_color_t font, bool bold = false) {
  lxw_format* f = workbook_add_format(book);
  if (!f) throw OutputError("cannot build roster.xlsx: out of memory");
  format_set_bg_color(f, fill);
  format_set_font_color(f, font);
  if (bold) format_set_bold(f);
  return f;
}

void addFormat(lxw_worksheet* ws, const std::vector<std::pair<lxw_col_t, lxw_col_t>>& columns, lxw_row_t first,
               lxw_row_t last, lxw_conditional_format& cf, const char* what) {
  if (columns.empty()) return;
  std::string multi;
  for (const auto& [from, to] : columns) multi += (multi.empty() ? "" : " ") + rangeRef(first, from, last, to);
  if (columns.size() > 1) cf.multi_range = multi.data();
  check(worksheet_conditional_format_range(ws, first, columns.front().first, last, columns.front().second, &cf), what);
}

/// Runs of consecutive day columns whose days satisfy `keep`.
template <class Keep>
std::vector<std::pair<lxw_col_t, lxw_col_t>> dayRuns(const model::Problem& p, Keep keep) {
  std::vector<std::pair<lxw_col_t, lxw_col_t>> runs;
  for (DayIdx d = 0; d < p.days; ++d) {
    if (!keep(static_cast<size_t>(d))) continue;
    if (!runs.empty() && runs.back().second + 1 == dayCol(d))
      runs.back().second = dayCol(d);
    else
      runs.emplace_back(dayCol(d), dayCol(d));
  }
  return runs;
}

}  // namespace

void addRosterValidation(Book& bk, lxw_worksheet* ws) {
  const model::Problem& p = bk.data.problem;
  if (p.days == 0) return;
  for (StaffIdx s = 0; s < p.staffCount(); ++s) {
    const auto& codes = bk.lists.personCodes[static_cast<size_t>(s)];
    std::string list;
    for (const std::string& c : codes) list += (list.empty() ? "" : ", ") + c;
    std::string message = "Choose a code from the list (" + list + "), or leave the cell empty for a day off.";
    if (message.size() > 250) message = "Choose a code from the drop-down list, or leave the cell empty for a day off.";
    std::string title = "Not a code for " + p.staff[static_cast<size_t>(s)].id;
    if (title.size() > 31) title = "Not a code for this person";
    std::string source = bk.lists.personListRange[static_cast<size_t>(s)];
    lxw_data_validation v{};
    v.validate = LXW_VALIDATION_TYPE_LIST_FORMULA;
    v.value_formula = source.data();
    v.error_type = LXW_VALIDATION_ERROR_TYPE_STOP;
    v.error_title = title.data();
    v.error_message = message.data();
    check(worksheet_data_validation_range(ws, personRow(s), kFirstDayCol, personRow(s), dayCol(p.days - 1), &v),
          "roster drop-down list");
  }
}

void addRosterConditionalFormats(Book& bk, lxw_worksheet* ws, const RosterLayout&) {
  const model::Problem& p = bk.data.problem;
  if (p.days == 0 || p.staffCount() == 0) return;
  const lxw_row_t first = kFirstPersonRow, last = lastPersonRow(p);
  const std::vector<std::pair<lxw_col_t, lxw_col_t>> all{{kFirstDayCol, dayCol(p.days - 1)}};
  const std::string topLeft = cellRef(first, kFirstDayCol);
  // Rules are added in priority order; each cell matches at most one, so Excel and
  // LibreOffice (which applies the first match) agree.
  for (size_t s = 0; s < p.shifts.size(); ++s) {
    const std::string& id = p.shifts[s].id;
    std::string formula = "=OR(" + topLeft + "=" + textLiteral(id) + ",LEFT(" + topLeft + "," +
                          std::to_string(id.size() + 1) + ")=" + textLiteral(id + "/") + ")";
    const lxw_color_t fill = shiftColour(p, static_cast<ShiftIdx>(s));
    lxw_conditional_format cf{};
    cf.type = LXW_CONDITIONAL_TYPE_FORMULA;
    cf.value_string = formula.data();
    cf.format = conditionalLook(bk.workbook, fill, textColourOn(fill));
    addFormat(ws, all, first, last, cf, "roster shift colours");
  }
  std::string absent;
  for (const std::string& code : bk.lists.absenceCodes)
    absent += (absent.empty() ? "" : ",") + topLeft + "=" + textLiteral(code);
  std::string formula = "=OR(" + absent + ")";
  lxw_conditional_format cf{};
  cf.type = LXW_CONDITIONAL_TYPE_FORMULA;
  cf.value_string = formula.data();
  cf.format = conditionalLook(bk.workbook, kAbsenceFill, 0xFFFFFF, true);
  addFormat(ws, all, first, last, cf, "roster absence colour");
  // A cleared cell takes the fill of a day off on its date.
  const auto blanks = [&](std::vector<std::pair<lxw_col_t, lxw_col_t>> runs, lxw_color_t fill) {
    lxw_conditional_format b{};
    b.type = LXW_CONDITIONAL_TYPE_BLANKS;
    b.format = conditionalLook(bk.workbook, fill, 0x000000);
    addFormat(ws, runs, first, last, b, "roster day-off colour");
  };
  blanks(dayRuns(p, [&](size_t d) { return p.holiday[d] != 0; }), kHolidayFill);
  blanks(dayRuns(p, [&](size_t d) { return !p.holiday[d] && p.weekend[d]; }), kWeekendFill);
  blanks(dayRuns(p, [&](size_t d) { return !p.holiday[d] && !p.weekend[d]; }), 0xFFFFFF);
}

void addHoursConditionalFormats(Book& bk, lxw_worksheet* ws, const RosterLayout& l) {
  const model::Problem& p = bk.data.problem;
  lxw_format* within = conditionalLook(bk.workbook, 0xFFFFFF, 0x000000);
  lxw_format* hardOut = conditionalLook(bk.workbook, 0xFFFFFF, kHardColour, true);
  lxw_format* softOut = conditionalLook(bk.workbook, 0xFFFFFF, kSoftColour, true);
  for (StaffIdx s = 0; s < p.staffCount(); ++s) {
    const int contract = p.staff[static_cast<size_t>(s)].contract;
    if (contract < 0) continue;
    const model::Contract& c = p.contracts[static_cast<size_t>(contract)];
    if (!c.minMinutes && !c.maxMinutes) continue;
    const lxw_row_t row = personRow(s);
    const std::string hours = cellRef(row, l.totalsCol), lo = cellRef(row, l.minCol()), hi = cellRef(row, l.maxCol());
    std::vector<std::string> outside;
    if (c.minMinutes) outside.push_back(hours + "<" + lo);
    if (c.maxMinutes) outside.push_back(hours + ">" + hi);
    std::string test = outside.size() == 1 ? outside.front() : "OR(" + outside[0] + "," + outside[1] + ")";
    std::string out = "=" + test, in = "=NOT(" + test + ")";
    lxw_conditional_format cf{};
    cf.type = LXW_CONDITIONAL_TYPE_FORMULA;
    cf.value_string = out.data();
    cf.format = c.hard ? hardOut : softOut;
    check(worksheet_conditional_format_cell(ws, row, l.totalsCol, &cf), "roster hours colour");
    cf.value_string = in.data();
    cf.format = within;
    check(worksheet_conditional_format_cell(ws, row, l.totalsCol, &cf), "roster hours colour");
  }
}

void setRosterPrint(Book& bk, lxw_worksheet* ws, const RosterLayout& l, const RosterWidths& w, lxw_row_t lastRow) {
  const model::Problem& p = bk.data.problem;
  worksheet_set_landscape(ws);
  worksheet_set_paper(ws, 9);  // A4
  worksheet_set_margins(ws, 0.3, 0.3, 0.5, 0.5);
  check(worksheet_repeat_rows(ws, kTitleRow, kDateRow), "print titles");
  check(worksheet_repeat_columns(ws, kNameCol, kIdCol), "print titles");
  check(worksheet_print_area(ws, 0, 0, lastRow, l.skillCol), "print area");
  check(worksheet_set_footer(ws, "&L&A&RPage &P of &N"), "footer");

  // Page size in pixels at 100 % (96 dpi; a column of width w is about 7w + 5 pixels wide)
  // and in points: A4 landscape less the margins, header and footer.
  constexpr double kPageWidthPx = (11.69 - 0.6) * 96, kPageHeightPt = (8.27 - 1.0) * 72 - 30;
  constexpr int kMinScale = 75;  // 10 pt type printed no smaller than 7.5 pt
  const auto px = [](double width) { return width * 7 + 5; };
  const double titles = px(w.name) + px(w.id);
  const double totals = 3 * px(7) + static_cast<double>(p.shifts.size() + 2) * px(6.5) + px(10);
  const auto widthScale = [&](int daysPerPage) {
    const double widest = std::max(titles + daysPerPage * px(w.day), titles + totals);
    return 100.0 * kPageWidthPx / widest;
  };
  const int daysPerPage = widthScale(14) >= kMinScale ? 14 : 7;
  const double heightScale = 100.0 * kPageHeightPt / (20 + 15.0 * (lastRow));
  const double fit = std::min({100.0, widthScale(daysPerPage), heightScale});
  worksheet_set_print_scale(ws, static_cast<uint16_t>(std::max<double>(kMinScale, fit)));

  // Column breaks: pages start on a Monday where the weeks allow, hold at most daysPerPage
  // days, and the totals get a page of their own. (Fit-to-page would override the breaks.)
  std::vector<lxw_col_t> breaks;
  DayIdx pageStart = 0;
  for (DayIdx d = 1; d < p.days; ++d) {
    const bool monday = p.weekday[static_cast<size_t>(d)] == 0;
    if ((monday && d - pageStart + 7 > daysPerPage) || d - pageStart >= daysPerPage) {
      breaks.push_back(dayCol(d));
      pageStart = d;
    }
  }
  breaks.push_back(l.totalsCol);
  if (breaks.size() > 1000) breaks.resize(1000);  // Excel keeps at most 1,023
  breaks.push_back(0);
  check(worksheet_set_v_pagebreaks(ws, breaks.data()), "page breaks");
}

}  // namespace rotaweave::io::xlsx
