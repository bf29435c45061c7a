/// @brief The Summary sheet: scenario, totals, breaches by rule, run settings, the caution,
/// and for a search the best penalty over time.
#include <algorithm>
#include <string>

#include "analysis/capacity.hpp"
#include "io/xlsx_sheets.hpp"

namespace rotaweave::io::xlsx {
namespace {

constexpr lxw_col_t kProgressCol = 7;  // H: seconds, I: hard, J: soft (G is a spacer)

double points(Cost c) { return static_cast<double>(c) / kCostScale; }

struct Writer {
  Book& bk;
  lxw_worksheet* ws;
  lxw_row_t row = 0;

  lxw_format* fmt(const Style& s) { return bk.formats.get(s); }
  void heading(const std::string& text) {
    Style s;
    s.bold = true;
    s.font = kHeaderFill;
    check(worksheet_write_string(ws, row++, 0, text.c_str(), fmt(s)), "summary heading");
  }
  void label(const char* name) {
    Style s;
    s.font = 0x595959;
    check(worksheet_write_string(ws, row, 0, name, fmt(s)), "summary label");
  }
  void text(const char* name, const std::string& value, const Style& style = Style{}) {
    label(name);
    check(worksheet_write_string(ws, row++, 1, value.c_str(), fmt(style)), "summary value");
  }
  void number(const char* name, double value, const Style& style = Style{}) {
    label(name);
    Style s = style;
    s.numFormat = "0.##";
    s.left = true;
    check(worksheet_write_number(ws, row++, 1, value, fmt(s)), "summary value");
  }
};

void writeByRule(Writer& w) {
  w.heading("Breaches by rule");
  Style head;
  head.fill = kHeaderFill;
  head.font = 0xFFFFFF;
  head.bold = true;
  const char* names[] = {"Rule", "Kind", "Severity", "Count", "Amount", "Penalty"};
  for (lxw_col_t c = 0; c < 6; ++c) {
    Style h = head;
    h.center = c >= 2;
    check(worksheet_write_string(w.ws, w.row, c, names[c], w.fmt(h)), "summary rules");
  }
  ++w.row;
  Style num;
  num.numFormat = "0.##";
  num.center = true;
  for (const report::RuleSummary& s : w.bk.data.report.byRule) {
    Style sev;
    sev.font = s.hard ? kHardColour : 0x7A4B00;
    sev.bold = s.hard;
    sev.center = true;
    check(worksheet_write_string(w.ws, w.row, 0, s.ruleId.c_str(), nullptr), "summary rules");
    check(worksheet_write_string(w.ws, w.row, 1, s.kind.c_str(), nullptr), "summary rules");
    check(worksheet_write_string(w.ws, w.row, 2, s.hard ? "hard" : "soft", w.fmt(sev)), "summary rules");
    check(worksheet_write_number(w.ws, w.row, 3, s.count, w.fmt(num)), "summary rules");
    check(worksheet_write_number(w.ws, w.row, 4, static_cast<double>(s.amount) / kAmountScale, w.fmt(num)), "summary rules");
    check(worksheet_write_number(w.ws, w.row, 5, points(s.penalty), w.fmt(num)), "summary rules");
    ++w.row;
  }
  if (w.bk.data.report.byRule.empty()) check(worksheet_write_string(w.ws, w.row++, 0, "No rule is broken.", nullptr), "summary rules");
}

void addProgressChart(Writer& w, const char* title, lxw_col_t valueCol, lxw_row_t last, lxw_color_t colour, lxw_row_t at) {
  lxw_chart* chart = workbook_add_chart(w.bk.workbook, LXW_CHART_SCATTER_STRAIGHT);
  if (!chart) check(LXW_ERROR_MEMORY_MALLOC_FAILED, "progress chart");
  chart_title_set_name(chart, title);
  lxw_chart_series* s = chart_add_series(chart, nullptr, nullptr);
  if (!s) check(LXW_ERROR_MEMORY_MALLOC_FAILED, "progress chart");
  chart_series_set_categories(s, "Summary", 1, kProgressCol, last, kProgressCol);
  chart_series_set_values(s, "Summary", 1, valueCol, last, valueCol);
  lxw_chart_line line{};
  line.color = colour;
  line.width = 2;
  chart_series_set_line(s, &line);
  chart_axis_set_name(chart->x_axis, "seconds");
  chart_axis_set_name(chart->y_axis, "penalty");
  chart_axis_set_min(chart->x_axis, 0);
  chart_legend_set_position(chart, LXW_CHART_LEGEND_NONE);
  lxw_chart_options opt{};
  opt.x_scale = 1.2;
  opt.y_scale = 0.9;
  check(worksheet_insert_chart_opt(w.ws, at, kProgressCol + 4, chart, &opt), "progress chart");
}

void writeProgress(Writer& w) {
  const auto& progress = w.bk.data.report.run.progress;
  if (progress.empty()) return;
  Style head;
  head.fill = kHeaderFill;
  head.font = 0xFFFFFF;
  head.bold = true;
  const char* names[] = {"Seconds", "Best hard", "Best soft"};
  head.center = true;
  for (lxw_col_t c = 0; c < 3; ++c) check(worksheet_write_string(w.ws, 0, kProgressCol + c, names[c], w.fmt(head)), "progress");
  Style num;
  num.numFormat = "0.###";
  num.center = true;
  lxw_row_t r = 1;
  for (const auto& [seconds, tally] : progress) {
    check(worksheet_write_number(w.ws, r, kProgressCol, seconds, w.fmt(num)), "progress");
    check(worksheet_write_number(w.ws, r, kProgressCol + 1, points(tally.hard), w.fmt(num)), "progress");
    check(worksheet_write_number(w.ws, r, kProgressCol + 2, points(tally.soft), w.fmt(num)), "progress");
    ++r;
  }
  addProgressChart(w, "Best hard penalty over time", kProgressCol + 1, r - 1, kHardColour, 1);
  addProgressChart(w, "Best soft penalty over time", kProgressCol + 2, r - 1, 0x2F6F8F, 15);
}

}  // namespace

/// The capacity analysis: lower bounds beside this roster's totals, then each unavoidable shortfall.
void writeCapacity(Writer& w) {
  const auto& capacity = w.bk.data.report.capacity;
  if (!capacity) return;
  const model::Problem& p = w.bk.data.problem;
  w.heading("Capacity (what the staff on hand can cover at best, whatever the roster)");
  w.number("Least possible hard penalty", points(capacity->bounds.hard));
  w.number("This roster's hard penalty", points(w.bk.data.report.total.hard));
  w.number("Unfillable minimum cover", capacity->bounds.coverUnits);
  std::vector<std::string> lines;
  for (const auto& c : capacity->cells) lines.push_back(analysis::describe(c, p));
  for (const auto& d : capacity->days) lines.push_back(analysis::describe(d, p));
  for (const auto& person : capacity->people) lines.push_back(analysis::describe(person, p));
  if (lines.empty()) lines.push_back("No shortfall is unavoidable: the staff on hand can meet every minimum.");
  for (const std::string& line : lines) check(worksheet_write_string(w.ws, w.row++, 0, line.c_str(), nullptr), "capacity");
  ++w.row;
}

void writeSummarySheet(Book& bk) {
  lxw_worksheet* ws = workbook_add_worksheet(bk.workbook, "Summary");
  if (!ws) check(LXW_ERROR_MEMORY_MALLOC_FAILED, "Summary sheet");
  const model::Problem& p = bk.data.problem;
  const report::Report& r = bk.data.report;
  Writer w{bk, ws};

  Style title;
  title.bold = true;
  check(worksheet_write_string(ws, w.row++, 0, "Roster summary", w.fmt(title)), "summary title");
  ++w.row;
  w.text("Scenario", p.name);
  w.text("Period", p.dateText(0) + " to " + p.dateText(p.days - 1) + " (" + std::to_string(p.days) + " days)");
  w.number("Staff", p.staffCount());
  ++w.row;
  Style bad;
  bad.font = kHardColour;
  bad.bold = true;
  const int soft = static_cast<int>(r.breaches.size()) - r.hardCount;
  w.number("Hard penalty", points(r.total.hard), r.hardCount ? bad : Style{});
  w.number("Hard breaches", r.hardCount, r.hardCount ? bad : Style{});
  w.number("Soft penalty", points(r.total.soft));
  w.number("Soft breaches", soft);
  w.text("Verdict", r.hardCount ? "Hard rules are broken: fix them before publishing" : "No hard rule is broken",
         r.hardCount ? bad : Style{});
  ++w.row;

  w.heading("How this roster was made");
  const report::RunInfo& run = r.run;
  w.text("Command", run.command);
  if (run.command != "check") {
    w.text("Seed", std::to_string(run.seed));
    w.number("Islands", run.islands);
    w.number("Threads", run.threads);
    w.number("Time (s)", run.seconds);
    w.number("Generations", static_cast<double>(run.generations));
    w.text("Stopped by", run.stopReason);
  } else {
    w.text("Roster", "given as input and checked, not searched");
  }
  ++w.row;
  writeByRule(w);
  ++w.row;
  writeCapacity(w);

  w.heading("Caution");
  Style caution;
  caution.wrap = true;
  caution.top = true;
  caution.italic = true;
  check(worksheet_merge_range(ws, w.row, 0, w.row + 6, 5, report::cautionText(), w.fmt(caution)), "caution");
  w.row += 7;

  writeProgress(w);
  size_t ruleWidth = 16, kindWidth = 20;
  for (const report::RuleSummary& s : r.byRule) {
    ruleWidth = std::max(ruleWidth, s.ruleId.size() + 2);
    kindWidth = std::max(kindWidth, s.kind.size() + 2);
  }
  check(worksheet_set_column(ws, 0, 0, static_cast<double>(std::min<size_t>(ruleWidth, 40)), nullptr), "columns");
  check(worksheet_set_column(ws, 1, 1, static_cast<double>(std::min<size_t>(kindWidth, 30)), nullptr), "columns");
  check(worksheet_set_column(ws, 2, 5, 10, nullptr), "columns");
  check(worksheet_set_column(ws, kProgressCol - 1, kProgressCol - 1, 3, nullptr), "columns");
  check(worksheet_set_column(ws, kProgressCol, kProgressCol + 2, 10, nullptr), "columns");
  worksheet_set_landscape(ws);
  worksheet_set_paper(ws, 9);
  worksheet_fit_to_pages(ws, 1, 0);
}

}  // namespace rotaweave::io::xlsx
