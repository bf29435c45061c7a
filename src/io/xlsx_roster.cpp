/// @brief The Roster sheet: people by dates, shift colours, breach marks with comments,
/// per-person totals beside the contract bounds, a legend and the print setup.
#include <algorithm>
#include <map>
#include <string>
#include <vector>

#include "io/xlsx_sheets.hpp"
#include "report/changes.hpp"

namespace rotaweave::io::xlsx {
namespace {

constexpr lxw_row_t kTitleRow = 0, kWeekdayRow = 1, kDateRow = 2, kFirstPersonRow = 3;
constexpr lxw_col_t kNameCol = 0, kIdCol = 1, kFirstDayCol = 2;

/// The messages attached to one cell and whether any of them is hard.
struct Marks {
  std::vector<std::string> messages;
  bool hard = false;
  bool soft = false;
};
using MarkMap = std::map<std::pair<lxw_row_t, lxw_col_t>, Marks>;

struct Layout {
  lxw_col_t totalsCol;  ///< first totals column (Hours), after one spacer column
  lxw_col_t minCol() const { return totalsCol + 1; }
  lxw_col_t maxCol() const { return totalsCol + 2; }
  lxw_col_t shiftCol(ShiftIdx s) const { return static_cast<lxw_col_t>(totalsCol + 3 + s); }
  lxw_col_t shiftsCol;
  lxw_col_t weekendsCol;
};

Layout layoutFor(const model::Problem& p) {
  Layout l{};
  l.totalsCol = static_cast<lxw_col_t>(kFirstDayCol + p.days + 1);
  l.shiftsCol = static_cast<lxw_col_t>(l.totalsCol + 3 + static_cast<int>(p.shifts.size()));
  l.weekendsCol = l.shiftsCol + 1;
  return l;
}

lxw_row_t personRow(StaffIdx s) { return static_cast<lxw_row_t>(kFirstPersonRow + s); }
lxw_col_t dayCol(DayIdx d) { return static_cast<lxw_col_t>(kFirstDayCol + d); }

/// Where a breach that names no single day is shown: the total it is about.
lxw_col_t summaryColumnFor(const std::string& kind, const Layout& l) {
  if (kind.find("hours") != std::string::npos) return l.totalsCol;
  if (kind.find("count") != std::string::npos) return l.shiftsCol;
  if (kind.find("weekend") != std::string::npos) return l.weekendsCol;
  return kNameCol;
}

MarkMap collectMarks(const OutputBundle& b, const Layout& l) {
  MarkMap marks;
  const model::Problem& p = b.problem;
  for (const rules::Breach& br : b.report.breaches) {
    const std::string line = std::string(br.hard ? "[hard] " : "[soft] ") + br.message;
    std::vector<std::pair<lxw_row_t, lxw_col_t>> cells;
    const bool wholePeriod = br.days.empty() || static_cast<int>(br.days.size()) >= p.days;
    if (br.staff >= 0) {
      if (wholePeriod) cells.emplace_back(personRow(br.staff), summaryColumnFor(br.kind, l));
      else for (DayIdx d : br.days) cells.emplace_back(personRow(br.staff), dayCol(d));
    } else {
      // Breaches of no single person (cover, fair share) go on the date header, or the title.
      if (wholePeriod) cells.emplace_back(kTitleRow, kNameCol);
      else for (DayIdx d : br.days) cells.emplace_back(kDateRow, dayCol(d));
    }
    for (const auto& cell : cells) {
      Marks& m = marks[cell];
      m.messages.push_back(line);
      if (br.kind == "changes") continue;  // shown by the changed-cell border, not as a breach mark
      (br.hard ? m.hard : m.soft) = true;
    }
  }
  return marks;
}

/// Adds the breach border to a style.
Style marked(Style s, const Marks* m) {
  if (!m || (!m->hard && !m->soft)) return s;
  s.border = m->hard ? LXW_BORDER_THICK : LXW_BORDER_MEDIUM;
  s.borderColour = m->hard ? kHardColour : kSoftColour;
  s.bold = s.bold || m->hard;
  return s;
}

void writeComment(lxw_worksheet* ws, lxw_row_t row, lxw_col_t col, const Marks& m) {
  std::string text;
  int lines = 0;
  for (const auto& msg : m.messages) {
    text += (text.empty() ? "" : "\n") + msg;
    lines += static_cast<int>(msg.size() / 52) + 1;
  }
  if (text.size() > 32000) text = text.substr(0, 32000) + "\n...";
  lxw_comment_options opt{};
  opt.author = const_cast<char*>("rotaweave");
  opt.width = 380;
  opt.height = static_cast<uint16_t>(std::min(600, 12 + 15 * lines));
  check(worksheet_write_comment_opt(ws, row, col, text.c_str(), &opt), "roster comment");
}

void writeHeader(Book& bk, lxw_worksheet* ws, const Layout& l, const MarkMap& marks) {
  const model::Problem& p = bk.data.problem;
  Formats& f = bk.formats;
  Style title;
  title.bold = true;
  auto titleIt = marks.find({kTitleRow, kNameCol});
  const std::string titleText = p.name + "  -  " + p.dateText(0) + " to " + p.dateText(p.days - 1);
  check(worksheet_write_string(ws, kTitleRow, kNameCol, titleText.c_str(),
                               f.get(marked(title, titleIt == marks.end() ? nullptr : &titleIt->second))), "roster title");
  check(worksheet_set_row(ws, kTitleRow, 20, nullptr), "roster title row");

  Style head;
  head.fill = kHeaderFill;
  head.font = 0xFFFFFF;
  head.bold = true;
  head.center = true;
  check(worksheet_merge_range(ws, kWeekdayRow, kNameCol, kDateRow, kNameCol, "Name", f.get(head)), "roster header");
  check(worksheet_merge_range(ws, kWeekdayRow, kIdCol, kDateRow, kIdCol, "Id", f.get(head)), "roster header");
  for (DayIdx d = 0; d < p.days; ++d) {
    const size_t di = static_cast<size_t>(d);
    Style h = head;
    if (p.holiday[di] || p.weekend[di]) {
      h.fill = p.holiday[di] ? kHolidayFill : kWeekendFill;
      h.font = 0x000000;
    }
    check(worksheet_write_string(ws, kWeekdayRow, dayCol(d), weekdayLabel(p.weekday[di]).c_str(), f.get(h)), "roster header");
    Style date = h;
    const std::string iso = p.dateText(d);
    date.numFormat = (d == 0 || iso.substr(8) == "01") ? "dd mmm" : "dd";  // "d" alone is not read as a date by some readers
    auto it = marks.find({kDateRow, dayCol(d)});
    const Marks* m = it == marks.end() ? nullptr : &it->second;
    if (m) {  // cover short or over that day: a pale warning fill that stays readable
      date.fill = m->hard ? kShortFill : kTargetFill;
      date.font = m->hard ? kHardColour : 0x7A4B00;
    }
    lxw_datetime dt = excelDate(p, d);
    check(worksheet_write_datetime(ws, kDateRow, dayCol(d), &dt, f.get(date)), "roster header");
    if (m) writeComment(ws, kDateRow, dayCol(d), *m);
  }
  check(worksheet_merge_range(ws, kWeekdayRow, l.totalsCol, kWeekdayRow, l.weekendsCol, "Totals and contract bounds", f.get(head)),
        "roster header");
  auto totalHead = [&](lxw_col_t col, const std::string& text) {
    check(worksheet_write_string(ws, kDateRow, col, text.c_str(), f.get(head)), "roster header");
  };
  totalHead(l.totalsCol, "Hours");
  totalHead(l.minCol(), "Min h");
  totalHead(l.maxCol(), "Max h");
  for (size_t s = 0; s < p.shifts.size(); ++s) totalHead(l.shiftCol(static_cast<ShiftIdx>(s)), p.shifts[s].id);
  totalHead(l.shiftsCol, "Shifts");
  totalHead(l.weekendsCol, "Wkends");
}

void writePerson(Book& bk, lxw_worksheet* ws, const Layout& l, const MarkMap& marks, StaffIdx s) {
  const model::Problem& p = bk.data.problem;
  const model::Roster& r = bk.data.roster;
  const report::PersonSummary& sum = bk.data.report.byPerson[static_cast<size_t>(s)];
  const model::Person& person = p.staff[static_cast<size_t>(s)];
  Formats& f = bk.formats;
  const lxw_row_t row = personRow(s);
  auto markAt = [&](lxw_col_t col) -> const Marks* {
    auto it = marks.find({row, col});
    return it == marks.end() ? nullptr : &it->second;
  };
  auto comment = [&](lxw_col_t col) {
    if (const Marks* m = markAt(col)) writeComment(ws, row, col, *m);
  };

  Style name;
  name.border = LXW_BORDER_HAIR;
  name.borderColour = 0xBFBFBF;
  if (sum.hardCount > 0) name.font = kHardColour;
  check(worksheet_write_string(ws, row, kNameCol, person.name.c_str(), f.get(marked(name, markAt(kNameCol)))), "roster name");
  comment(kNameCol);
  check(worksheet_write_string(ws, row, kIdCol, person.id.c_str(), f.get(name)), "roster id");

  for (DayIdx d = 0; d < p.days; ++d) {
    const size_t di = static_cast<size_t>(d);
    const TaskIdx t = r.at(s, d);
    Style cell;
    cell.center = true;
    cell.border = LXW_BORDER_HAIR;
    cell.borderColour = 0xBFBFBF;
    if (t != kOff) {
      cell.fill = shiftColour(p, p.tasks[static_cast<size_t>(t)].shift);
      cell.font = textColourOn(cell.fill);
    } else if (p.absent[p.cell(s, d)]) {
      cell.fill = kAbsenceFill;
      cell.hatched = true;
    } else if (p.holiday[di]) {
      cell.fill = kHolidayFill;
    } else if (p.weekend[di]) {
      cell.fill = kWeekendFill;
    }
    if (report::isChanged(p, r, s, d)) {  // replan: differs from the published roster
      cell.border = LXW_BORDER_DOUBLE;
      cell.borderColour = kChangedColour;
    }
    lxw_format* fmt = f.get(marked(cell, markAt(dayCol(d))));
    const std::string text = p.taskText(t, s);
    if (text.empty()) check(worksheet_write_blank(ws, row, dayCol(d), fmt), "roster cell");
    else check(worksheet_write_string(ws, row, dayCol(d), text.c_str(), fmt), "roster cell");
    comment(dayCol(d));
  }

  const model::Contract* contract = person.contract >= 0 ? &p.contracts[static_cast<size_t>(person.contract)] : nullptr;
  const int paid = sum.paidMinutes;
  Style hours;
  hours.numFormat = "0.0#";
  hours.center = true;
  const int counted = paid + sum.creditMinutes;  // contract hours count absence credit
  const bool under = contract && contract->minMinutes && counted < *contract->minMinutes;
  const bool over = contract && contract->maxMinutes && counted > *contract->maxMinutes;
  if (under || over) {
    hours.font = contract->hard ? kHardColour : kSoftColour;
    hours.bold = true;
  }
  check(worksheet_write_number(ws, row, l.totalsCol, paid / 60.0, f.get(marked(hours, markAt(l.totalsCol)))), "roster hours");
  comment(l.totalsCol);
  Style bound;
  bound.numFormat = "0.0";
  bound.center = true;
  bound.font = 0x595959;
  if (contract && contract->minMinutes)
    check(worksheet_write_number(ws, row, l.minCol(), *contract->minMinutes / 60.0, f.get(bound)), "roster bound");
  if (contract && contract->maxMinutes)
    check(worksheet_write_number(ws, row, l.maxCol(), *contract->maxMinutes / 60.0, f.get(bound)), "roster bound");

  Style count;
  count.center = true;
  for (size_t k = 0; k < p.shifts.size(); ++k)
    check(worksheet_write_number(ws, row, l.shiftCol(static_cast<ShiftIdx>(k)), sum.shiftsByType[k], f.get(count)), "roster count");
  check(worksheet_write_number(ws, row, l.shiftsCol, sum.shiftsWorked, f.get(marked(count, markAt(l.shiftsCol)))), "roster count");
  comment(l.shiftsCol);
  check(worksheet_write_number(ws, row, l.weekendsCol, sum.weekendsWorked, f.get(marked(count, markAt(l.weekendsCol)))),
        "roster count");
  comment(l.weekendsCol);
}

void writeLegend(Book& bk, lxw_worksheet* ws, lxw_row_t row) {
  const model::Problem& p = bk.data.problem;
  Formats& f = bk.formats;
  Style bold;
  bold.bold = true;
  check(worksheet_write_string(ws, row++, kNameCol, "Legend", f.get(bold)), "legend");
  auto item = [&](const Style& sample, const std::string& sampleText, const std::string& text) {
    lxw_format* fmt = f.get(sample);
    if (sampleText.empty()) check(worksheet_write_blank(ws, row, kNameCol, fmt), "legend");
    else check(worksheet_write_string(ws, row, kNameCol, sampleText.c_str(), fmt), "legend");
    check(worksheet_write_string(ws, row, kIdCol, text.c_str(), nullptr), "legend");
    ++row;
  };
  for (size_t s = 0; s < p.shifts.size(); ++s) {
    Style sample;
    sample.center = true;
    sample.fill = shiftColour(p, static_cast<ShiftIdx>(s));
    sample.font = textColourOn(sample.fill);
    item(sample, p.shifts[s].id, shiftDescription(p.shifts[s]));
  }
  Style plain;
  plain.center = true;
  plain.fill = kWeekendFill;
  item(plain, "", "Weekend (day off)");
  plain.fill = kHolidayFill;
  item(plain, "", "Holiday (day off)");
  plain.fill = kAbsenceFill;
  plain.hatched = true;
  item(plain, "", "Absence (day off)");
  Style hard;
  hard.center = true;
  hard.bold = true;
  hard.border = LXW_BORDER_THICK;
  hard.borderColour = kHardColour;
  item(hard, "", "Breaks a hard rule; the cell comment says which. A red or amber date: cover is short or over that day");
  Style soft = hard;
  soft.bold = false;
  soft.border = LXW_BORDER_MEDIUM;
  soft.borderColour = kSoftColour;
  item(soft, "", "Breaks a soft rule (preference, fairness, target cover); see the cell comment");
  if (bk.data.report.changes) {
    Style changed;
    changed.center = true;
    changed.border = LXW_BORDER_DOUBLE;
    changed.borderColour = kChangedColour;
    item(changed, "", "Changed against the published roster (see the Changes sheet)");
  }
  item(Style{}, "", "Cells show the shift id, with /skill where the person holds several skills; empty = off");
}

void setColumns(Book& bk, lxw_worksheet* ws, const Layout& l) {
  const model::Problem& p = bk.data.problem;
  size_t nameWidth = 8, idWidth = 4, cellWidth = 3;
  for (StaffIdx s = 0; s < p.staffCount(); ++s) {
    nameWidth = std::max(nameWidth, p.staff[static_cast<size_t>(s)].name.size());
    idWidth = std::max(idWidth, p.staff[static_cast<size_t>(s)].id.size());
    for (DayIdx d = 0; d < p.days; ++d) cellWidth = std::max(cellWidth, p.taskText(bk.data.roster.at(s, d), s).size());
  }
  check(worksheet_set_column(ws, kNameCol, kNameCol, static_cast<double>(std::min<size_t>(nameWidth, 32)) + 2, nullptr), "columns");
  check(worksheet_set_column(ws, kIdCol, kIdCol, static_cast<double>(std::min<size_t>(idWidth, 20)) + 2, nullptr), "columns");
  check(worksheet_set_column(ws, kFirstDayCol, dayCol(p.days - 1), static_cast<double>(std::max<size_t>(cellWidth, 4)) + 1.5,
                             nullptr), "columns");
  check(worksheet_set_column(ws, l.totalsCol - 1, l.totalsCol - 1, 1.5, nullptr), "columns");
  check(worksheet_set_column(ws, l.totalsCol, l.maxCol(), 7, nullptr), "columns");
  check(worksheet_set_column(ws, l.shiftCol(0), l.weekendsCol, 6.5, nullptr), "columns");
}

void setPrint(lxw_worksheet* ws, const Layout& l, lxw_row_t lastRow) {
  worksheet_set_landscape(ws);
  worksheet_set_paper(ws, 9);  // A4
  worksheet_set_margins(ws, 0.3, 0.3, 0.5, 0.5);
  worksheet_fit_to_pages(ws, 1, 0);
  check(worksheet_repeat_rows(ws, kTitleRow, kDateRow), "print titles");
  check(worksheet_print_area(ws, 0, 0, lastRow, l.weekendsCol), "print area");
  check(worksheet_set_footer(ws, "&L&A&RPage &P of &N"), "footer");
  worksheet_freeze_panes(ws, kFirstPersonRow, kFirstDayCol);
}

}  // namespace

void writeRosterSheet(Book& bk) {
  lxw_worksheet* ws = workbook_add_worksheet(bk.workbook, "Roster");
  if (!ws) check(LXW_ERROR_MEMORY_MALLOC_FAILED, "Roster sheet");
  const model::Problem& p = bk.data.problem;
  const Layout l = layoutFor(p);
  const MarkMap marks = collectMarks(bk.data, l);
  writeHeader(bk, ws, l, marks);
  for (StaffIdx s = 0; s < p.staffCount(); ++s) writePerson(bk, ws, l, marks, s);
  const lxw_row_t legendRow = personRow(p.staffCount()) + 1;
  writeLegend(bk, ws, legendRow);
  setColumns(bk, ws, l);
  setPrint(ws, l, legendRow + static_cast<lxw_row_t>(p.shifts.size()) + 8);
  worksheet_set_comments_author(ws, const_cast<char*>("rotaweave"));
  worksheet_activate(ws);
}

}  // namespace rotaweave::io::xlsx
