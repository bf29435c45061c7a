/// @brief The Roster sheet: people by dates, shift colours, absence codes, breach marks with
/// comments, per-person totals (formulas over the row) beside the contract bounds and a legend.
/// Drop-down lists, conditional colours and the print setup are in xlsx_roster_live.cpp.
#include <algorithm>
#include <map>
#include <string>
#include <vector>

#include "io/absence_codes.hpp"
#include "io/xlsx_sheets.hpp"
#include "report/changes.hpp"

namespace rotaweave::io::xlsx {
namespace {

/// The messages attached to one cell and whether any of them is hard.
struct Marks {
  std::vector<std::string> messages;
  bool hard = false;
  bool soft = false;
};
using MarkMap = std::map<std::pair<lxw_row_t, lxw_col_t>, Marks>;

/// Where a breach that names no single day is shown: the total it is about.
lxw_col_t summaryColumnFor(const std::string& kind, const RosterLayout& l) {
  if (kind.find("hours") != std::string::npos) return l.totalsCol;
  if (kind.find("count") != std::string::npos) return l.shiftsCol;
  if (kind.find("weekend") != std::string::npos) return l.weekendsCol;
  return kNameCol;
}

MarkMap collectMarks(const OutputBundle& b, const RosterLayout& l) {
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
  // Absence cells: the reason and the dates of the whole absence, as a comment.
  for (StaffIdx s = 0; s < p.staffCount(); ++s)
    for (DayIdx d = 0; d < p.days;) {
      const size_t c = p.cell(s, d);
      if (!p.absent[c]) {
        ++d;
        continue;
      }
      DayIdx last = d;
      while (last + 1 < p.days && p.absent[p.cell(s, last + 1)] && p.absenceReason[p.cell(s, last + 1)] == p.absenceReason[c]) ++last;
      const std::string& reason = p.absenceReason[c];
      const std::string code = absenceCode(p, reason);
      std::string line = "Absent (" + code + ", " + *absenceCodeMeaning(p, code) + "): " + (reason.empty() ? "no reason given" : reason) +
                         ", " + p.dateText(d) + (last > d ? " to " + p.dateText(last) : "");
      for (DayIdx k = d; k <= last; ++k) marks[{personRow(s), dayCol(k)}].messages.insert(marks[{personRow(s), dayCol(k)}].messages.begin(), line);
      d = last + 1;
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

void writeHeader(Book& bk, lxw_worksheet* ws, const RosterLayout& l, const MarkMap& marks) {
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
  check(worksheet_merge_range(ws, kWeekdayRow, l.totalsCol, kWeekdayRow, l.skillCol, "Totals (formulas) and contract bounds", f.get(head)),
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
  totalHead(l.skillCol, "Main skill");
}

void writePerson(Book& bk, lxw_worksheet* ws, const RosterLayout& l, const MarkMap& marks, StaffIdx s) {
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
      cell.font = 0xFFFFFF;
      cell.bold = true;
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
    const size_t ci = p.cell(s, d);
    const std::string text = t == kOff && p.absent[ci] ? absenceCode(p, p.absenceReason[ci]) : p.taskText(t, s);
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
  // Totals are formulas over the row with our values cached, so they follow edits made in a
  // spreadsheet program and still read right in readers that do not recalculate.
  const RowFormulas formulas{p, l, bk.lists};
  double cachedHours = 0;  // summed as the formula sums, shift by shift
  for (size_t k = 0; k < p.shifts.size(); ++k) cachedHours += sum.shiftsByType[k] * (p.shifts[k].paidMinutes() / 60.0);
  check(worksheet_write_formula_num(ws, row, l.totalsCol, formulas.hours(row).c_str(), f.get(marked(hours, markAt(l.totalsCol))),
                                    cachedHours), "roster hours");
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
    check(worksheet_write_formula_num(ws, row, l.shiftCol(static_cast<ShiftIdx>(k)), formulas.shiftCount(row, static_cast<ShiftIdx>(k)).c_str(),
                                      f.get(count), sum.shiftsByType[k]), "roster count");
  check(worksheet_write_formula_num(ws, row, l.shiftsCol, formulas.shifts(row).c_str(), f.get(marked(count, markAt(l.shiftsCol))),
                                    sum.shiftsWorked), "roster count");
  comment(l.shiftsCol);
  const std::string weekends = formulas.weekends(row, s);
  lxw_format* weekendFormat = f.get(marked(count, markAt(l.weekendsCol)));
  if (weekends.empty() || weekends.size() > kMaxFormulaLength)
    check(worksheet_write_number(ws, row, l.weekendsCol, sum.weekendsWorked, weekendFormat), "roster count");
  else
    check(worksheet_write_formula_num(ws, row, l.weekendsCol, weekends.c_str(), weekendFormat, sum.weekendsWorked), "roster count");
  comment(l.weekendsCol);
  Style skill;
  skill.center = true;
  skill.font = 0x595959;
  if (!person.skills.empty())
    check(worksheet_write_string(ws, row, l.skillCol, p.skills[static_cast<size_t>(person.skills.front())].c_str(), f.get(skill)),
          "roster skill");
}

/// Returns the row after the legend.
lxw_row_t writeLegend(Book& bk, lxw_worksheet* ws, lxw_row_t row) {
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
  Style absence = plain;
  absence.fill = kAbsenceFill;
  absence.font = 0xFFFFFF;
  absence.bold = true;
  for (const std::string& code : bk.lists.absenceCodes)
    item(absence, code, "Absent: " + *absenceCodeMeaning(p, code) + " (day off); the cell comment gives the reason and dates");
  for (const std::string& clash : colourClashes(p)) {
    Style warn;
    warn.font = kSoftColour;
    item(warn, "warning", clash);
  }
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
  item(Style{}, "", "Cells show the shift id, with /skill where the person holds several skills; empty = off. "
                    "Each cell offers a drop-down list of the codes the person may take; a code without /skill fills "
                    "the person's main skill");
  item(Style{}, "", "Hours, shift counts and weekends are formulas over the row: they follow any edit");
  return row;
}

RosterWidths setColumns(Book& bk, lxw_worksheet* ws, const RosterLayout& l) {
  const model::Problem& p = bk.data.problem;
  size_t nameWidth = 8, idWidth = 4, cellWidth = 3;
  for (StaffIdx s = 0; s < p.staffCount(); ++s) {
    nameWidth = std::max(nameWidth, p.staff[static_cast<size_t>(s)].name.size());
    idWidth = std::max(idWidth, p.staff[static_cast<size_t>(s)].id.size());
    for (DayIdx d = 0; d < p.days; ++d) cellWidth = std::max(cellWidth, p.taskText(bk.data.roster.at(s, d), s).size());
  }
  for (const std::string& code : bk.lists.absenceCodes) cellWidth = std::max(cellWidth, code.size());
  RosterWidths w;
  w.name = static_cast<double>(std::min<size_t>(nameWidth, 32)) + 2;
  w.id = static_cast<double>(std::min<size_t>(idWidth, 20)) + 2;
  w.day = static_cast<double>(std::max<size_t>(cellWidth, 4)) + 1.5;
  check(worksheet_set_column(ws, kNameCol, kNameCol, w.name, nullptr), "columns");
  check(worksheet_set_column(ws, kIdCol, kIdCol, w.id, nullptr), "columns");
  check(worksheet_set_column(ws, kFirstDayCol, dayCol(p.days - 1), w.day, nullptr), "columns");
  check(worksheet_set_column(ws, l.totalsCol - 1, l.totalsCol - 1, 1.5, nullptr), "columns");
  check(worksheet_set_column(ws, l.totalsCol, l.maxCol(), 7, nullptr), "columns");
  check(worksheet_set_column(ws, l.shiftCol(0), l.weekendsCol, 6.5, nullptr), "columns");
  check(worksheet_set_column(ws, l.skillCol, l.skillCol, 10, nullptr), "columns");
  return w;
}

}  // namespace

void writeRosterSheet(Book& bk) {
  lxw_worksheet* ws = workbook_add_worksheet(bk.workbook, kRosterSheet);
  if (!ws) check(LXW_ERROR_MEMORY_MALLOC_FAILED, "Roster sheet");
  const model::Problem& p = bk.data.problem;
  const RosterLayout l = rosterLayout(p);
  const MarkMap marks = collectMarks(bk.data, l);
  writeHeader(bk, ws, l, marks);
  for (StaffIdx s = 0; s < p.staffCount(); ++s) writePerson(bk, ws, l, marks, s);
  const lxw_row_t legendRow = personRow(p.staffCount()) + 1;
  const lxw_row_t end = writeLegend(bk, ws, legendRow);
  const RosterWidths widths = setColumns(bk, ws, l);
  addRosterValidation(bk, ws);
  addRosterConditionalFormats(bk, ws, l);
  addHoursConditionalFormats(bk, ws, l);
  setRosterPrint(bk, ws, l, widths, end - 1);
  worksheet_freeze_panes(ws, kFirstPersonRow, kFirstDayCol);
  worksheet_set_comments_author(ws, const_cast<char*>("rotaweave"));
  worksheet_activate(ws);
}

}  // namespace rotaweave::io::xlsx
