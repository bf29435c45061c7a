/// @brief Roster CSV reading with precise errors, and writing.
#include "io/roster_csv.hpp"


#include <algorithm>
#include <cctype>
#include <cstdio>

#include "io/absence_codes.hpp"
#include "io/csv.hpp"
#include "io/input_error.hpp"
#include "io/input_limits.hpp"
#include "io/roster_dates.hpp"
#include "io/roster_table.hpp"
#include "io/roster_xlsx.hpp"
#include "io/xlsx_read/zip_archive.hpp"

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
  std::string why;
  const auto task = parseRosterCell(cell, s, p, why);
  if (!task) throw InputError(file, line, col, why);
  return *task;
}

/// A CSV saved from a spreadsheet: every cell as text, laid out as on the sheet.
model::Roster readSpreadsheetCsv(const std::vector<CsvRow>& rows, const std::string& path, const model::Problem& p) {
  std::vector<GridCell> cells;
  for (const CsvRow& row : rows)
    for (size_t c = 0; c < row.cells.size(); ++c) {
      if (trimCell(row.cells[c]).empty()) continue;
      GridCell cell;
      cell.row = row.line;
      cell.col = static_cast<int>(c) + 1;
      cell.text = row.cells[c];
      cells.push_back(std::move(cell));
    }
  return readRosterGrid(cells, p, GridSource{path, ""});
}

}  // namespace

std::optional<TaskIdx> parseRosterCell(const std::string& cell, StaffIdx s, const model::Problem& p, std::string& error) {
  if (cell.empty()) return kOff;
  const size_t slash = cell.find('/');
  const std::string shiftId = trimCell(cell.substr(0, slash));
  const ShiftIdx shift = p.findShift(shiftId);
  if (shift == kNoShift) {
    if (absenceCodeMeaning(p, cell)) return kOff;  // the workbook shows absence days as LV, SK, ...
    std::vector<std::string> shiftIds;
    for (const auto& sh : p.shifts) shiftIds.push_back(sh.id);
    error = "unknown shift '" + shiftId + "'" + didYouMean(shiftId, shiftIds) + "; use a shift id (" + joinIds(shiftIds) +
            "), SHIFT/skill, or leave the cell empty for off";
    return std::nullopt;
  }
  SkillIdx skill = p.staff[static_cast<size_t>(s)].skills.front();
  if (slash != std::string::npos) {
    const std::string skillId = trimCell(cell.substr(slash + 1));
    skill = p.findSkill(skillId);
    if (skill < 0) {
      error = "unknown skill '" + skillId + "'" + didYouMean(skillId, p.skills) + " in '" + cell + "'";
      return std::nullopt;
    }
  }
  return p.task(shift, skill);
}

model::Roster readRosterCsv(const std::string& path, const model::Problem& p) {
  if (xlsx_read::startsLikeZip(path)) return readRosterXlsx(path, p);
  if (path.size() > 5) {
    std::string ext = path.substr(path.size() - 5);
    std::transform(ext.begin(), ext.end(), ext.begin(), [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
    if (ext == ".xlsx" || ext == ".xlsm")
      if (std::FILE* f = std::fopen(path.c_str(), "rb")) {
        std::fclose(f);
        throw InputError(path, 0, 0, "the file is named " + ext + " but is not a workbook (an xlsx file is a zip container, and this one "
                                     "does not start like one); save it again from the spreadsheet program as an Excel workbook (.xlsx), or give the roster as CSV");
      }
  }
  checkRosterCsvShape(path, p.staff.size(), p.days);  // before any row is stored
  const auto rows = readCsvFile(path, "roster file");
  if (rows.empty()) throw InputError(path, 0, 0, "the roster file is empty; expected a header staff,<dates>");

  const CsvRow& header = rows.front();
  std::vector<std::string> headerDates(header.cells.begin() + 1, header.cells.end());
  const HeaderDates dates = resolveHeaderDates(headerDates, p.start, p.start + p.days - 1);
  // No date on the first line: a title row above the table, as a spreadsheet program saves
  // our Roster sheet; find the table by content instead.
  if (std::none_of(dates.dates.begin(), dates.dates.end(), [](const auto& d) { return d.has_value(); }) &&
      trimCell(header.cells[0]) != "staff")
    return readSpreadsheetCsv(rows, path, p);
  if (trimCell(header.cells[0]) != "staff")
    throw InputError(path, header.line, 1, "the first header cell must be 'staff', found '" + header.cells[0] + "'");
  if (static_cast<int>(header.cells.size()) != p.days + 1)
    throw InputError(path, header.line, 0, "the header has " + std::to_string(header.cells.size() - 1) + " dates; the period " +
                                               p.dateText(0) + " to " + p.dateText(p.days - 1) + " has " + std::to_string(p.days));
  if (dates.ambiguousCell >= 0) throw InputError(path, header.line, dates.ambiguousCell + 2, dates.error);
  for (DayIdx d = 0; d < p.days; ++d)
    if (dates.dates[static_cast<size_t>(d)] != p.start + d)
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
