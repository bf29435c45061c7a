/// @brief Workbook -> cells -> roster table.
#include "io/roster_xlsx.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <map>

#include "io/input_error.hpp"
#include "io/roster_table.hpp"
#include "io/xlsx_read/sheet_rows.hpp"
#include "io/xlsx_read/workbook_index.hpp"
#include "io/xlsx_read/xml_part.hpp"
#include "io/xlsx_read/zip_archive.hpp"

namespace rotaweave::io {
namespace {

using namespace xlsx_read;

/// Rows with content beyond the people: titles, headings, a legend and notes.
constexpr size_t kExtraRows = 1000;

/// The date a whole-number serial means. 1900 system: serial 1 is 1900-01-01 and serial 60 the
/// 29 February 1900 that never was, so from 61 on the count starts at 1899-12-30.
std::optional<model::DateSerial> serialDate(double value, bool date1904) {
  if (value < 1 || value > 2958465 || std::floor(value) != value) return std::nullopt;
  const int n = static_cast<int>(value);
  if (date1904) return model::serialFromCivil(1904, 1, 1) + n;
  if (n == 60) return std::nullopt;
  return model::serialFromCivil(1899, 12, n < 60 ? 31 : 30) + n;
}

std::string sheetNames(const WorkbookIndex& index) {
  std::string out;
  for (const auto& s : index.sheets) out += (out.empty() ? "'" : ", '") + s.name + "'";
  return out;
}

/// Spreads each merged range's top-left value over the range (within the cells that exist).
void spreadMerges(std::vector<GridCell>& cells, const std::vector<MergedRange>& merges, size_t maxCells) {
  if (merges.empty()) return;
  int maxRow = 0, maxCol = 0;
  for (const auto& c : cells) {
    maxRow = std::max(maxRow, c.row);
    maxCol = std::max(maxCol, c.col);
  }
  std::map<std::pair<int, int>, size_t> at;
  for (size_t i = 0; i < cells.size(); ++i) at[{cells[i].row, cells[i].col}] = i;
  for (const MergedRange& m : merges) {
    auto top = at.find({m.firstRow, m.firstCol});
    if (top == at.end()) continue;
    const GridCell origin = cells[top->second];
    for (int r = m.firstRow; r <= std::min(m.lastRow, maxRow); ++r)
      for (int c = m.firstCol; c <= std::min(m.lastCol, maxCol); ++c) {
        if ((r == m.firstRow && c == m.firstCol) || at.count({r, c})) continue;
        if (cells.size() >= maxCells) throw SheetError{"merged ranges spread over more than " + std::to_string(maxCells) + " cells", m.firstRow, m.firstCol};
        GridCell copy = origin;
        copy.row = r;
        copy.col = c;
        at[{r, c}] = cells.size();
        cells.push_back(std::move(copy));
      }
  }
  std::sort(cells.begin(), cells.end(), [](const GridCell& a, const GridCell& b) { return a.row != b.row ? a.row < b.row : a.col < b.col; });
}

}  // namespace

model::Roster readRosterXlsx(const std::string& path, const model::Problem& p) {
  const std::string fix = "; save the roster again from the spreadsheet program as an .xlsx workbook, or give the roster as CSV";
  std::string sheetName;
  try {
    ZipArchive zip(path);
    const WorkbookIndex index = readWorkbookIndex(zip);
    const SheetEntry* sheet = index.find("Roster");
    if (!sheet && index.sheets.size() == 1) sheet = &index.sheets.front();
    if (!sheet)
      throw InputError(path, 0, 0, "the workbook has no sheet named 'Roster' (its sheets: " + sheetNames(index) +
                                       "); name the sheet that holds the roster 'Roster', or keep only that sheet");
    sheetName = sheet->name;
    if (!zip.has(sheet->part))
      throw InputError(path, 0, 0, "the workbook lists the sheet '" + sheetName + "' but its part " + sheet->part + " is missing" + fix);

    SheetLimits limits;
    limits.maxRowsWithContent = static_cast<size_t>(p.staffCount()) + kExtraRows;
    std::vector<std::string> shared;
    if (!index.sharedStrings.empty() && zip.has(index.sharedStrings)) shared = readSharedStrings(zip, index.sharedStrings, limits);
    SheetData data = readSheet(zip, sheet->part, shared, limits);

    std::vector<GridCell> cells;
    cells.reserve(data.cells.size());
    for (SheetCell& c : data.cells) {
      GridCell g;
      g.row = c.row;
      g.col = c.col;
      switch (c.type) {
        case SheetCell::Type::Text:
          g.text = std::move(c.text);
          break;
        case SheetCell::Type::Number: {
          g.kind = GridCell::Kind::Number;
          char buf[32];
          std::snprintf(buf, sizeof buf, "%.15g", c.number);
          g.text = buf;
          g.date = serialDate(c.number, index.date1904);
          break;
        }
        case SheetCell::Type::Bool:
          g.kind = GridCell::Kind::Other;
          g.text = "the value " + c.text;
          break;
        case SheetCell::Type::Error:
          g.kind = GridCell::Kind::Other;
          g.text = "the error value " + c.text + (c.formula ? " (from its formula)" : "");
          break;
        case SheetCell::Type::NoValue:
          g.kind = GridCell::Kind::Other;
          g.text = "a formula whose value was not saved (open and save the workbook in a spreadsheet program, or type the shift id)";
          break;
      }
      cells.push_back(std::move(g));
    }
    data.cells.clear();
    std::sort(cells.begin(), cells.end(), [](const GridCell& a, const GridCell& b) { return a.row != b.row ? a.row < b.row : a.col < b.col; });
    spreadMerges(cells, data.merges, limits.maxCells);
    return readRosterGrid(cells, p, GridSource{path, sheetName});
  } catch (const ZipError& e) {
    throw InputError(path, 0, 0, "cannot read the workbook: " + e.message + fix);
  } catch (const XmlError& e) {
    throw InputError(path, 0, 0, "cannot read the workbook: " + e.message + fix);
  } catch (const SheetError& e) {
    std::string where = sheetName.empty() ? std::string() : sheetName;
    if (!where.empty() && e.row > 0 && e.col > 0) where += "!" + cellName(e.row, e.col);
    else if (!where.empty() && e.row > 0) where += " row " + std::to_string(e.row);
    throw InputError(path, 0, 0, (where.empty() ? "" : where + ": ") + e.message);
  }
}

}  // namespace rotaweave::io
