/// @brief Locating the roster table on a sheet by content, then reading its cells.
#include "io/roster_table.hpp"

#include <algorithm>
#include <map>

#include "io/csv.hpp"
#include "io/input_error.hpp"
#include "io/roster_csv.hpp"
#include "io/roster_dates.hpp"
#include "io/xlsx_read/sheet_rows.hpp"

namespace rotaweave::io {
namespace {

constexpr int kHeaderSearchRows = 50;  ///< the header row is among the first rows with content

class Grid {
 public:
  Grid(const std::vector<GridCell>& cells, const GridSource& source) : source_(source) {
    for (const GridCell& c : cells) rows_[c.row][c.col] = &c;
  }

  /// "Roster!F12" or "line 12, column 6".
  [[noreturn]] void fail(int row, int col, const std::string& message) const {
    if (source_.sheet.empty()) throw InputError(source_.file, row, col, message);
    std::string where = source_.sheet;
    if (row > 0 && col > 0) where += "!" + xlsx_read::cellName(row, col);
    else if (row > 0) where += " row " + std::to_string(row);
    else if (col > 0) where += " column " + xlsx_read::cellName(0, col);
    throw InputError(source_.file, 0, 0, where + ": " + message);
  }
  std::string name(int row, int col) const {
    if (source_.sheet.empty()) return "line " + std::to_string(row) + ", column " + std::to_string(col);
    return source_.sheet + "!" + xlsx_read::cellName(row, col);
  }
  std::string rowName(int row) const { return source_.sheet.empty() ? "line " + std::to_string(row) : source_.sheet + " row " + std::to_string(row); }
  std::string colName(int col) const {
    return source_.sheet.empty() ? "column " + std::to_string(col) : "column " + xlsx_read::cellName(0, col);
  }

  const std::map<int, std::map<int, const GridCell*>>& rows() const { return rows_; }

 private:
  const GridSource& source_;
  std::map<int, std::map<int, const GridCell*>> rows_;
};

/// Date of each cell of a row, by column (text dates settled by the period as one row).
std::map<int, std::optional<model::DateSerial>> rowDates(const std::map<int, const GridCell*>& row, const model::Problem& p,
                                                         int* ambiguousCol, std::string* ambiguity) {
  std::vector<std::string> texts;
  std::vector<int> cols;
  std::map<int, std::optional<model::DateSerial>> out;
  for (const auto& [col, cell] : row) {
    if (cell->kind == GridCell::Kind::Number) out[col] = cell->date;
    else if (cell->kind == GridCell::Kind::Text) {
      texts.push_back(cell->text);
      cols.push_back(col);
    }
  }
  const HeaderDates h = resolveHeaderDates(texts, p.start, p.start + p.days - 1);
  for (size_t i = 0; i < cols.size(); ++i) out[cols[i]] = h.dates[i];
  if (ambiguousCol) *ambiguousCol = h.ambiguousCell >= 0 ? cols[static_cast<size_t>(h.ambiguousCell)] : 0;
  if (ambiguity) *ambiguity = h.error;
  return out;
}

std::vector<std::string> staffIds(const model::Problem& p) {
  std::vector<std::string> ids;
  for (const auto& s : p.staff) ids.push_back(s.id);
  return ids;
}

}  // namespace

model::Roster readRosterGrid(const std::vector<GridCell>& cells, const model::Problem& p, const GridSource& source) {
  const Grid grid(cells, source);
  const model::DateSerial first = p.start, last = p.start + p.days - 1;
  const std::string period = p.dateText(0) + " to " + p.dateText(p.days - 1);

  // 1. The header row: the one among the first rows with the most dates of the period.
  int headerRow = 0, best = 0, searched = 0;
  for (const auto& [r, row] : grid.rows()) {
    if (++searched > kHeaderSearchRows) break;
    int count = 0;
    for (const auto& [c, date] : rowDates(row, p, nullptr, nullptr)) {
      (void)c;
      if (date && *date >= first && *date <= last) ++count;
    }
    if (count > best) {
      best = count;
      headerRow = r;
    }
  }
  if (!headerRow)
    grid.fail(0, 0, "no row holds the dates of the period " + period +
                        "; the header row needs one cell per date, as a date cell or as text like " + p.dateText(0) +
                        " (a spreadsheet program may show dates as '01' or '01 Mar' and save them that way as CSV: "
                        "give the workbook itself, or format the date row as YYYY-MM-DD before saving)");

  // 2. The date columns.
  const auto& header = grid.rows().at(headerRow);
  int ambiguousCol = 0;
  std::string ambiguity;
  const auto dates = rowDates(header, p, &ambiguousCol, &ambiguity);
  if (ambiguousCol) grid.fail(headerRow, ambiguousCol, ambiguity);
  std::vector<int> dayColumn(static_cast<size_t>(p.days), 0);
  for (const auto& [col, date] : dates) {
    if (!date) continue;
    const GridCell* cell = header.at(col);
    if (*date < first || *date > last) {
      if (cell->kind == GridCell::Kind::Number) continue;  // a number that happens to be a day serial: not ours
      grid.fail(headerRow, col, "the date " + model::formatIsoDate(*date) + " ('" + cell->text + "') is outside the period " + period +
                                    "; the header lists the dates of the scenario's period only");
    }
    int& at = dayColumn[static_cast<size_t>(*date - first)];
    if (at) grid.fail(headerRow, col, "the date " + model::formatIsoDate(*date) + " appears twice in the header row (also in " +
                                          grid.name(headerRow, at) + "); keep one column per date");
    at = col;
  }
  for (DayIdx d = 0; d < p.days; ++d)
    if (!dayColumn[static_cast<size_t>(d)])
      grid.fail(headerRow, 0, "the header row has no column for " + p.dateText(d) + "; it needs one column per date of the period " +
                                  period + " (found " + std::to_string(best) + " of " + std::to_string(p.days) + ")");
  const int firstDateCol = *std::min_element(dayColumn.begin(), dayColumn.end());
  std::vector<char> isDateCol(static_cast<size_t>(*std::max_element(dayColumn.begin(), dayColumn.end()) + 1), 0);
  for (int c : dayColumn) isDateCol[static_cast<size_t>(c)] = 1;

  // 3. The id column: left of the dates, the one holding the most staff ids below the header
  //    (the nearest to the dates on a tie, so a Name column that repeats ids loses to Id).
  std::map<int, int> idHits;
  for (auto it = grid.rows().upper_bound(headerRow); it != grid.rows().end(); ++it)
    for (const auto& [col, cell] : it->second) {
      if (col >= firstDateCol) break;
      if (p.findStaff(trimCell(cell->text)) >= 0) ++idHits[col];
    }
  int idCol = 0, hits = 0;
  for (const auto& [col, n] : idHits)
    if (n >= hits) {
      idCol = col;
      hits = n;
    }
  if (!idCol)
    grid.fail(headerRow + 1, 0, "no column left of the dates holds the scenario's staff ids (such as '" + p.staff.front().id +
                                    "') under the header row " + std::to_string(headerRow) +
                                    "; put each person's id in the column before the first date");

  // 4. The people: rows whose id cell holds a staff id. The table under the header runs to the
  //    first empty row; an unknown id inside it is an error, rows after it (a legend, notes) are left alone.
  model::Roster roster(p.staffCount(), p.days);
  std::vector<int> rowOf(p.staff.size(), 0);
  const std::vector<std::string> ids = staffIds(p);
  bool inTable = true, seenPerson = false;
  int previous = headerRow;
  for (auto it = grid.rows().upper_bound(headerRow); it != grid.rows().end(); ++it) {
    const int r = it->first;
    const auto& row = it->second;
    if (seenPerson && r > previous + 1) inTable = false;  // an empty row ends the table
    previous = r;
    auto idIt = row.find(idCol);
    const std::string id = idIt == row.end() ? std::string() : trimCell(idIt->second->text);
    bool textInDates = false, anyInDates = false;
    for (const auto& [col, cell] : row)
      if (col < static_cast<int>(isDateCol.size()) && isDateCol[static_cast<size_t>(col)]) {
        anyInDates = true;
        textInDates = textInDates || cell->kind == GridCell::Kind::Text;
      }
    if (seenPerson && id.empty() && !anyInDates) {
      inTable = false;
      continue;
    }
    const StaffIdx s = p.findStaff(id);
    if (s < 0) {
      if (id.empty()) {
        // A row of shifts without an id is a person's row that lost its id.
        for (const auto& [col, cell] : row) {
          if (col >= static_cast<int>(isDateCol.size()) || !isDateCol[static_cast<size_t>(col)] || cell->kind != GridCell::Kind::Text) continue;
          std::string why;
          if (parseRosterCell(trimCell(cell->text), 0, p, why))
            grid.fail(r, col, "holds the shift '" + trimCell(cell->text) + "' but the row has no staff id in " + grid.name(r, idCol) +
                                  "; add the person's id or clear the row");
        }
        continue;
      }
      if (inTable && textInDates)
        grid.fail(r, idCol, "unknown staff id '" + id + "'" + didYouMean(id, ids) +
                                "; every row of the roster must name a person of the scenario");
      continue;
    }
    seenPerson = true;
    if (rowOf[static_cast<size_t>(s)])
      grid.fail(r, idCol, "a second row for '" + id + "' (the first is " + grid.rowName(rowOf[static_cast<size_t>(s)]) + "); keep one row per person");
    rowOf[static_cast<size_t>(s)] = r;
    for (DayIdx d = 0; d < p.days; ++d) {
      const int col = dayColumn[static_cast<size_t>(d)];
      auto cellIt = row.find(col);
      if (cellIt == row.end()) continue;  // empty: off
      const GridCell& cell = *cellIt->second;
      if (cell.kind == GridCell::Kind::Other)
        grid.fail(r, col, "holds " + cell.text + "; a roster cell holds a shift id, SHIFT/skill, or nothing for off");
      std::string why;
      const auto task = parseRosterCell(trimCell(cell.text), s, p, why);
      if (!task) grid.fail(r, col, why);
      roster.at(s, d) = *task;
    }
  }
  for (size_t s = 0; s < p.staff.size(); ++s)
    if (!rowOf[s])
      grid.fail(0, 0, "no row for '" + p.staff[s].id + "' (staff ids are read from " + grid.colName(idCol) + " under the header " +
                          grid.rowName(headerRow) + "); add a row for every person of the scenario (empty cells mean off)");
  return roster;
}

}  // namespace rotaweave::io
