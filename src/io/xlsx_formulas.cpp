/// @brief Formula text helpers and the Lists sheet plan.
#include "io/xlsx_formulas.hpp"

#include <algorithm>

#include "io/absence_codes.hpp"

namespace rotaweave::io::xlsx {

std::string cellRef(lxw_row_t row, lxw_col_t col, bool absRow, bool absCol) {
  char name[16];
  lxw_col_to_name(name, col, 0);
  return (absCol ? "$" : "") + std::string(name) + (absRow ? "$" : "") + std::to_string(row + 1);
}

std::string rangeRef(lxw_row_t row1, lxw_col_t col1, lxw_row_t row2, lxw_col_t col2, bool absolute) {
  return cellRef(row1, col1, absolute, absolute) + ":" + cellRef(row2, col2, absolute, absolute);
}

std::string textLiteral(const std::string& text) {
  std::string out = "\"";
  for (char c : text) {
    if (c == '"') out += '"';
    out += c;
  }
  return out + "\"";
}

std::string exactCriterion(const std::string& text, bool prefix) {
  std::string escaped = "=";
  for (char c : text) {
    if (c == '*' || c == '?' || c == '~') escaped += '~';
    escaped += c;
  }
  if (prefix) escaped += "*";
  return textLiteral(escaped);
}

ListsPlan planLists(const model::Problem& p) {
  ListsPlan plan;
  for (size_t s = 0; s < p.shifts.size(); ++s)
    plan.shiftHoursCell.push_back(std::string(ListsPlan::kSheet) + "!" +
                                  cellRef(static_cast<lxw_row_t>(1 + s), 1, true, true));
  plan.absenceCodes = allAbsenceCodes(p);
  for (StaffIdx s = 0; s < p.staffCount(); ++s) {
    const model::Person& person = p.staff[static_cast<size_t>(s)];
    std::vector<std::string> codes;
    for (size_t sh = 0; sh < p.shifts.size(); ++sh)
      for (SkillIdx k : person.skills) {
        const TaskIdx t = p.task(static_cast<ShiftIdx>(sh), k);
        if (t > 0) codes.push_back(p.taskText(t, s));
      }
    for (DayIdx d = 0; d < p.days; ++d) {
      const size_t c = p.cell(s, d);
      if (!p.absent[c]) continue;
      const std::string code = absenceCode(p, p.absenceReason[c]);
      if (std::find(codes.begin(), codes.end(), code) == codes.end()) codes.push_back(code);
    }
    const auto col = static_cast<lxw_col_t>(ListsPlan::kFirstPersonCol + s);
    const auto last = static_cast<lxw_row_t>(std::max<size_t>(codes.size(), 1));
    plan.personListRange.push_back("=" + std::string(ListsPlan::kSheet) + "!" + rangeRef(1, col, last, col, true));
    plan.personCodes.push_back(std::move(codes));
  }
  return plan;
}

}  // namespace rotaweave::io::xlsx

#include "io/xlsx_layout.hpp"

namespace rotaweave::io::xlsx {

namespace {

std::string rowRange(const model::Problem& p, lxw_row_t row) {
  return rangeRef(row, kFirstDayCol, row, dayCol(p.days - 1));
}

}  // namespace

std::string RowFormulas::shiftCount(lxw_row_t row, ShiftIdx shift) const {
  const std::string range = rowRange(problem, row);
  const std::string& id = problem.shifts[static_cast<size_t>(shift)].id;
  return "=COUNTIF(" + range + "," + exactCriterion(id) + ")+COUNTIF(" + range + "," + exactCriterion(id + "/", true) +
         ")";
}

std::string RowFormulas::hours(lxw_row_t row) const {
  std::string f = "=";
  for (size_t s = 0; s < problem.shifts.size(); ++s)
    f += (s ? "+" : "") + cellRef(row, layout.shiftCol(static_cast<ShiftIdx>(s))) + "*" + lists.shiftHoursCell[s];
  return problem.shifts.empty() ? "=0" : f;
}

std::string RowFormulas::shifts(lxw_row_t row) const {
  if (problem.shifts.empty()) return "=0";
  return "=SUM(" + cellRef(row, layout.shiftCol(0)) + ":" +
         cellRef(row, layout.shiftCol(static_cast<ShiftIdx>(problem.shifts.size() - 1))) + ")";
}

std::string RowFormulas::weekends(lxw_row_t row, StaffIdx staff) const {
  const auto& codes = lists.personCodes[static_cast<size_t>(staff)];
  std::vector<std::string> absenceCodes;
  for (const std::string& c : codes)
    if (std::find(lists.absenceCodes.begin(), lists.absenceCodes.end(), c) != lists.absenceCodes.end())
      absenceCodes.push_back(c);
  std::string f;
  int blocks = 0;
  for (DayIdx d = 0; d < problem.days;) {
    const int block = problem.weekendBlock[static_cast<size_t>(d)];
    if (block < 0) {
      ++d;
      continue;
    }
    DayIdx last = d;
    while (last + 1 < problem.days && problem.weekendBlock[static_cast<size_t>(last + 1)] == block) ++last;
    const std::string range = rangeRef(row, dayCol(d), row, dayCol(last));
    std::string worked = "COUNTA(" + range + ")";
    for (const std::string& c : absenceCodes) worked += "-COUNTIF(" + range + "," + exactCriterion(c) + ")";
    f += (f.empty() ? "=" : "+") + std::string("(") + worked + ">0)";
    ++blocks;
    d = last + 1;
  }
  // One comparison alone would show TRUE or FALSE; a sum of them is a number.
  return blocks == 1 ? f + "*1" : f;
}

std::string coverAssignedFormula(const model::Problem& p, const RosterLayout& l, DayIdx day, TaskIdx task) {
  const lxw_row_t first = kFirstPersonRow,
                  last = static_cast<lxw_row_t>(kFirstPersonRow + std::max(p.staffCount(), 1) - 1);
  const std::string sheet = std::string(kRosterSheet) + "!";
  const std::string cells = sheet + rangeRef(first, dayCol(day), last, dayCol(day), true);
  const std::string skills = sheet + rangeRef(first, l.skillCol, last, l.skillCol, true);
  const model::Task& t = p.tasks[static_cast<size_t>(task)];
  const std::string& shift = p.shifts[static_cast<size_t>(t.shift)].id;
  const std::string& skill = p.skills[static_cast<size_t>(t.skill)];
  return "=COUNTIFS(" + cells + "," + exactCriterion(shift) + "," + skills + "," + exactCriterion(skill) +
         ")+COUNTIF(" + cells + "," + exactCriterion(shift + "/" + skill) + ")";
}

}  // namespace rotaweave::io::xlsx
