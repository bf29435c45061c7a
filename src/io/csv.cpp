/// @brief CSV parsing as spreadsheets save it: optional BOM, CRLF or LF, quoted cells.
#include "io/csv.hpp"

#include <fstream>
#include <sstream>

#include "io/control_chars.hpp"
#include "io/input_error.hpp"
#include "io/input_limits.hpp"

namespace rotaweave::io {
std::vector<CsvRow> parseCsv(const std::string& input, const std::string& file) {
  std::string_view text(input);
  if (text.substr(0, 3) == "\xEF\xBB\xBF") text.remove_prefix(3);
  if (const int bad = badUtf8Line(text))
    throw InputError(file, bad, 0, "the file is not valid UTF-8; save it as \"CSV UTF-8\" from the spreadsheet");
  rejectControlChars(text, file);
  std::vector<CsvRow> rows;
  CsvRow row;
  std::string cell;
  int line = 1;
  row.line = 1;
  bool quoted = false, any = false;
  auto endCell = [&] {
    row.cells.push_back(cell);
    cell.clear();
  };
  auto endRow = [&] {
    endCell();
    const bool blank = row.cells.size() == 1 && row.cells[0].empty();
    if (!blank) rows.push_back(std::move(row));
    row = CsvRow{};
    row.line = line;
    any = false;
  };
  for (size_t i = 0; i < text.size(); ++i) {
    const char c = text[i];
    if (quoted) {
      if (c == '"' && i + 1 < text.size() && text[i + 1] == '"') {
        cell += '"';
        ++i;
      } else if (c == '"') {
        quoted = false;
      } else {
        if (c == '\n') ++line;
        cell += c;
      }
      continue;
    }
    any = true;
    if (c == '"' && cell.empty()) {
      quoted = true;
    } else if (c == ',') {
      endCell();
    } else if (c == '\r' && i + 1 < text.size() && text[i + 1] == '\n') {
      continue;
    } else if (c == '\n' || c == '\r') {
      ++line;
      endRow();
    } else {
      cell += c;
    }
  }
  if (quoted) throw InputError(file, row.line, 0, "a quoted cell is never closed; add the missing '\"'");
  if (any || !cell.empty() || !row.cells.empty()) endRow();
  return rows;
}

std::vector<CsvRow> readCsvFile(const std::string& path, const std::string& what) {
  return parseCsv(readInputFile(path, what), path);
}

std::string trimCell(const std::string& s) {
  const size_t a = s.find_first_not_of(" \t");
  if (a == std::string::npos) return "";
  return s.substr(a, s.find_last_not_of(" \t") - a + 1);
}

std::string csvCell(const std::string& value) {
  if (value.find_first_of(",\"\r\n") == std::string::npos) return value;
  std::string out = "\"";
  for (char c : value) out += c == '"' ? std::string("\"\"") : std::string(1, c);
  return out + "\"";
}

}  // namespace rotaweave::io
