/// @brief The Cover sheet: needed and assigned people per date, shift and skill, with a chart
/// of the daily sums. Assigned counts are formulas over the Roster sheet's date columns (and the
/// gaps and daily sums formulas over those), with our values cached.
#include <algorithm>
#include <string>
#include <vector>

#include "io/xlsx_sheets.hpp"

namespace rotaweave::io::xlsx {
namespace {

constexpr lxw_row_t kHeaderRow = 1, kFirstRow = 2;
// Main table columns.
enum : lxw_col_t { kDate, kDay, kShift, kSkill, kMin, kTarget, kMax, kAssigned, kShortMin, kShortTarget, kOverMax };
// Daily sums, beside the main table after a spacer column.
constexpr lxw_col_t kSumDate = kOverMax + 2, kSumMin = kSumDate + 1, kSumTarget = kSumDate + 2, kSumAssigned = kSumDate + 3;

struct DaySums {
  int min = 0, target = 0, assigned = 0;
};

std::vector<int> assignedCounts(const model::Problem& p, const model::Roster& r, DayIdx d) {
  std::vector<int> counts(static_cast<size_t>(p.taskCount()), 0);
  for (StaffIdx s = 0; s < p.staffCount(); ++s) ++counts[static_cast<size_t>(r.at(s, d))];
  return counts;
}

void writeHeaders(Book& bk, lxw_worksheet* ws) {
  Style head;
  head.fill = kHeaderFill;
  head.font = 0xFFFFFF;
  head.bold = true;
  head.center = true;
  head.wrap = true;
  const char* names[] = {"Date", "Day", "Shift", "Skill", "Min", "Target", "Max", "Assigned", "Short of min", "Short of target", "Over max"};
  for (lxw_col_t c = 0; c <= kOverMax; ++c) check(worksheet_write_string(ws, kHeaderRow, c, names[c], bk.formats.get(head)), "cover header");
  const char* sums[] = {"Date", "Min", "Target", "Assigned"};
  for (lxw_col_t c = 0; c < 4; ++c) check(worksheet_write_string(ws, kHeaderRow, kSumDate + c, sums[c], bk.formats.get(head)), "cover header");
  Style bold;
  bold.bold = true;
  check(worksheet_write_string(ws, 0, kDate, "Cover per date, shift and skill (where demand is defined)", bk.formats.get(bold)), "cover title");
  check(worksheet_write_string(ws, 0, kSumDate, "Per day, summed over shifts and skills", bk.formats.get(bold)), "cover title");
  check(worksheet_set_row(ws, kHeaderRow, 28, nullptr), "cover header row");
}

/// One table row; returns the next row.
lxw_row_t writeCell(Book& bk, lxw_worksheet* ws, lxw_row_t row, DayIdx d, TaskIdx t, int assigned) {
  const model::Problem& p = bk.data.problem;
  const model::DemandCell& c = p.demandAt(d, t);
  const model::Task& task = p.tasks[static_cast<size_t>(t)];
  Formats& f = bk.formats;
  Style base;
  base.center = true;
  if (p.weekend[static_cast<size_t>(d)] || p.holiday[static_cast<size_t>(d)]) base.fill = p.holiday[static_cast<size_t>(d)] ? kHolidayFill : kWeekendFill;
  Style date = base;
  date.numFormat = "yyyy-mm-dd";
  lxw_datetime dt = excelDate(p, d);
  check(worksheet_write_datetime(ws, row, kDate, &dt, f.get(date)), "cover date");
  check(worksheet_write_string(ws, row, kDay, weekdayLabel(p.weekday[static_cast<size_t>(d)]).c_str(), f.get(base)), "cover cell");
  check(worksheet_write_string(ws, row, kShift, p.shifts[static_cast<size_t>(task.shift)].id.c_str(), f.get(base)), "cover cell");
  check(worksheet_write_string(ws, row, kSkill, p.skills[static_cast<size_t>(task.skill)].c_str(), f.get(base)), "cover cell");
  check(worksheet_write_number(ws, row, kMin, c.min, f.get(base)), "cover cell");
  check(worksheet_write_number(ws, row, kTarget, c.target, f.get(base)), "cover cell");
  if (c.max >= 0) check(worksheet_write_number(ws, row, kMax, c.max, f.get(base)), "cover cell");
  else check(worksheet_write_blank(ws, row, kMax, f.get(base)), "cover cell");
  const std::string counted = coverAssignedFormula(p, rosterLayout(p), d, t);
  check(worksheet_write_formula_num(ws, row, kAssigned, counted.c_str(), f.get(base), assigned), "cover cell");
  const std::string assignedCell = cellRef(row, kAssigned);

  // Shortfalls: zeros are hidden, breaches shaded (red for a hard minimum, amber otherwise).
  auto gap = [&](lxw_col_t col, int amount, bool hard, const std::string& formula) {
    Style s = base;
    s.numFormat = "0;-0;;@";
    if (amount > 0) {
      s.fill = hard ? kShortFill : kTargetFill;
      s.font = hard ? kHardColour : 0x7A4B00;
      s.bold = true;
    }
    check(worksheet_write_formula_num(ws, row, col, formula.c_str(), f.get(s), amount), "cover cell");
  };
  gap(kShortMin, std::max(0, c.min - assigned), c.minHard, "=MAX(0," + cellRef(row, kMin) + "-" + assignedCell + ")");
  gap(kShortTarget, std::max(0, c.target - assigned), false, "=MAX(0," + cellRef(row, kTarget) + "-" + assignedCell + ")");
  gap(kOverMax, c.max >= 0 ? std::max(0, assigned - c.max) : 0, false,
      c.max >= 0 ? "=MAX(0," + assignedCell + "-" + cellRef(row, kMax) + ")" : "=0");
  return row + 1;
}

void writeChart(Book& bk, lxw_worksheet* ws, lxw_row_t lastSumRow) {
  lxw_chart* chart = workbook_add_chart(bk.workbook, LXW_CHART_LINE);
  if (!chart) check(LXW_ERROR_MEMORY_MALLOC_FAILED, "cover chart");
  chart_title_set_name(chart, "People needed and assigned per day");
  const struct {
    lxw_col_t col;
    const char* name;
    lxw_color_t colour;
    uint8_t dash;
  } series[] = {{kSumMin, "Min", kHardColour, LXW_CHART_LINE_DASH_DASH},
                {kSumTarget, "Target", kSoftColour, LXW_CHART_LINE_DASH_SQUARE_DOT},
                {kSumAssigned, "Assigned", 0x2F6F8F, LXW_CHART_LINE_DASH_SOLID}};
  for (const auto& s : series) {
    lxw_chart_series* cs = chart_add_series(chart, nullptr, nullptr);
    if (!cs) check(LXW_ERROR_MEMORY_MALLOC_FAILED, "cover chart");
    chart_series_set_categories(cs, "Cover", kFirstRow, kSumDate, lastSumRow, kSumDate);
    chart_series_set_values(cs, "Cover", kFirstRow, s.col, lastSumRow, s.col);
    chart_series_set_name(cs, s.name);
    lxw_chart_line line{};
    line.color = s.colour;
    line.width = s.col == kSumAssigned ? 2.25f : 1.5f;
    line.dash_type = s.dash;
    chart_series_set_line(cs, &line);
  }
  lxw_chart_axis* x = chart->x_axis;
  chart_axis_set_num_format(x, "d mmm");
  chart_axis_set_name(chart->y_axis, "people");
  chart_legend_set_position(chart, LXW_CHART_LEGEND_BOTTOM);
  lxw_chart_options opt{};
  opt.x_scale = 1.4;
  opt.y_scale = 1.2;
  check(worksheet_insert_chart_opt(ws, lastSumRow + 2, kSumDate, chart, &opt), "cover chart");
}

}  // namespace

void writeCoverSheet(Book& bk) {
  lxw_worksheet* ws = workbook_add_worksheet(bk.workbook, "Cover");
  if (!ws) check(LXW_ERROR_MEMORY_MALLOC_FAILED, "Cover sheet");
  const model::Problem& p = bk.data.problem;
  writeHeaders(bk, ws);
  lxw_row_t row = kFirstRow;
  Style sum;
  sum.center = true;
  Style sumDate = sum;
  sumDate.numFormat = "yyyy-mm-dd";
  std::vector<DaySums> sums;
  for (DayIdx d = 0; d < p.days; ++d) {
    const std::vector<int> counts = assignedCounts(p, bk.data.roster, d);
    DaySums day;
    for (TaskIdx t = 1; t < p.taskCount(); ++t) {
      const model::DemandCell& c = p.demandAt(d, t);
      if (!c.defined) continue;
      const int assigned = counts[static_cast<size_t>(t)];
      row = writeCell(bk, ws, row, d, t, assigned);
      day.min += c.min;
      day.target += c.target;
      day.assigned += assigned;
    }
    const lxw_row_t sumRow = kFirstRow + static_cast<lxw_row_t>(d);
    lxw_datetime dt = excelDate(p, d);
    check(worksheet_write_datetime(ws, sumRow, kSumDate, &dt, bk.formats.get(sumDate)), "cover sums");
    check(worksheet_write_number(ws, sumRow, kSumMin, day.min, bk.formats.get(sum)), "cover sums");
    check(worksheet_write_number(ws, sumRow, kSumTarget, day.target, bk.formats.get(sum)), "cover sums");
    sums.push_back(day);
  }
  const lxw_row_t lastRow = row > kFirstRow ? row - 1 : kFirstRow;
  // The daily assigned sum adds up the table's Assigned formulas of its date.
  const std::string dates = rangeRef(kFirstRow, kDate, lastRow, kDate, true), assignedColumn = rangeRef(kFirstRow, kAssigned, lastRow, kAssigned, true);
  for (DayIdx d = 0; d < p.days; ++d) {
    const lxw_row_t sumRow = kFirstRow + static_cast<lxw_row_t>(d);
    const std::string formula = "=SUMIF(" + dates + "," + cellRef(sumRow, kSumDate) + "," + assignedColumn + ")";
    check(worksheet_write_formula_num(ws, sumRow, kSumAssigned, formula.c_str(), bk.formats.get(sum), sums[static_cast<size_t>(d)].assigned),
          "cover sums");
  }
  check(worksheet_autofilter(ws, kHeaderRow, kDate, lastRow, kOverMax), "cover filter");
  writeChart(bk, ws, kFirstRow + static_cast<lxw_row_t>(p.days) - 1);

  check(worksheet_set_column(ws, kDate, kDate, 11, nullptr), "columns");
  check(worksheet_set_column(ws, kDay, kSkill, 7, nullptr), "columns");
  check(worksheet_set_column(ws, kMin, kOverMax, 8, nullptr), "columns");
  check(worksheet_set_column(ws, kOverMax + 1, kOverMax + 1, 2, nullptr), "columns");
  check(worksheet_set_column(ws, kSumDate, kSumDate, 11, nullptr), "columns");
  check(worksheet_set_column(ws, kSumMin, kSumAssigned, 8, nullptr), "columns");
  worksheet_freeze_panes(ws, kFirstRow, 0);
  worksheet_set_landscape(ws);
  worksheet_set_paper(ws, 9);
  worksheet_fit_to_pages(ws, 1, 0);
  check(worksheet_repeat_rows(ws, 0, kHeaderRow), "print titles");
  check(worksheet_set_footer(ws, "&L&A&RPage &P of &N"), "footer");
}

}  // namespace rotaweave::io::xlsx
