/// @brief Roster CSV reading with precise errors, and writing.
#include "io/roster_csv.hpp"


#include "io/csv.hpp"
#include "io/input_error.hpp"

namespace rotaweave::io {
namespace {

std::vector<std::string> staffIds(const model::Problem& p) {
  std::vector<std::string> ids;
  for (const auto& s : p.staff) ids.push_back(s.id);
  return ids;
}

std::string joinIds(const std::vector<std::string>& ids) {
  std::string out;
  for (size_t i = 0; i < ids.size() && i < 12; ++i) out += (i ? ", " : "") + ids[i];
  if (ids.size() > 12) out += " and " + std::to_string(ids.size() - 12) + " more";
  return out;
}

TaskIdx parseCell(const std::string& cell, StaffIdx s, const model::Problem& p, const std::string& file, int line, int col) {
  if (cell.empty()) return kOff;
  const size_t slash = cell.find('/');
  const std::string shiftId = trimCell(cell.substr(0, slash));
  const ShiftIdx shift = p.findShift(shiftId);
  std::vector<std::string> shiftIds;
  for (const auto& sh : p.shifts) shiftIds.push_back(sh.id);
  if (shift == kNoShift)
    throw InputError(file, line, col, "unknown shift '" + shiftId + "'" + didYouMean(shiftId, shiftIds) +
                                          "; use a shift id (" + joinIds(shiftIds) + "), SHIFT/skill, or leave the cell empty for off");
  SkillIdx skill = p.staff[static_cast<size_t>(s)].skills.front();
  if (slash != std::string::npos) {
    const std::string skillId = trimCell(cell.substr(slash + 1));
    skill = p.findSkill(skillId);
    if (skill < 0)
      throw InputError(file, line, col, "unknown skill '" + skillId + "'" + didYouMean(skillId, p.skills) + " in '" + cell + "'");
  }
  return p.task(shift, skill);
}

}  // namespace

model::Roster readRosterCsv(const std::string& path, const model::Problem& p) {
  const auto rows = readCsvFile(path, "roster file");
  if (rows.empty()) throw InputError(path, 0, 0, "the roster file is empty; expected a header staff,<dates>");

  const CsvRow& header = rows.front();
  if (trimCell(header.cells[0]) != "staff")
    throw InputError(path, header.line, 1, "the first header cell must be 'staff', found '" + header.cells[0] + "'");
  if (static_cast<int>(header.cells.size()) != p.days + 1)
    throw InputError(path, header.line, 0, "the header has " + std::to_string(header.cells.size() - 1) + " dates; the period " +
                                               p.dateText(0) + " to " + p.dateText(p.days - 1) + " has " + std::to_string(p.days));
  for (DayIdx d = 0; d < p.days; ++d)
    if (trimCell(header.cells[static_cast<size_t>(d + 1)]) != p.dateText(d))
      throw InputError(path, header.line, d + 2, "expected date " + p.dateText(d) + " in this column, found '" +
                                                     header.cells[static_cast<size_t>(d + 1)] + "'; the header lists every date of the period in order");

  model::Roster roster(p.staffCount(), p.days);
  std::vector<int> seenAt(p.staff.size(), 0);
  for (size_t r = 1; r < rows.size(); ++r) {
    const CsvRow& row = rows[r];
    const std::string id = trimCell(row.cells[0]);
    const StaffIdx s = p.findStaff(id);
    if (s < 0) throw InputError(path, row.line, 1, "unknown staff id '" + id + "'" + didYouMean(id, staffIds(p)) + "; every row must name a person of the scenario");
    if (seenAt[static_cast<size_t>(s)])
      throw InputError(path, row.line, 1, "a second row for '" + id + "' (the first is on line " + std::to_string(seenAt[static_cast<size_t>(s)]) + "); keep one row per person");
    seenAt[static_cast<size_t>(s)] = row.line;
    if (row.cells.size() != header.cells.size())
      throw InputError(path, row.line, 0, "this row has " + std::to_string(row.cells.size()) + " cells, the header " +
                                              std::to_string(header.cells.size()) + "; every row needs one cell per date (empty = off)");
    for (DayIdx d = 0; d < p.days; ++d)
      roster.at(s, d) = parseCell(trimCell(row.cells[static_cast<size_t>(d + 1)]), s, p, path, row.line, d + 2);
  }
  for (size_t s = 0; s < p.staff.size(); ++s)
    if (!seenAt[s]) throw InputError(path, 0, 0, "no row for '" + p.staff[s].id + "'; add a row for every person (empty cells mean off)");
  return roster;
}

std::string rosterCsvText(const model::Roster& roster, const model::Problem& p) {
  std::string out = "staff";
  for (DayIdx d = 0; d < p.days; ++d) out += "," + p.dateText(d);
  out += "\n";
  for (StaffIdx s = 0; s < p.staffCount(); ++s) {
    out += csvCell(p.staff[static_cast<size_t>(s)].id);
    for (DayIdx d = 0; d < p.days; ++d) out += "," + csvCell(p.taskText(roster.at(s, d), s));
    out += "\n";
  }
  return out;
}

}  // namespace rotaweave::io
