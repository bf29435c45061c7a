/// @brief Minimal CSV reading (quotes, BOM, CRLF) and cell quoting for writing.
#pragma once
#include <string>
#include <vector>

namespace rotaweave::io {

struct CsvRow {
  int line = 0;  ///< 1-based line where the row starts.
  std::vector<std::string> cells;
};

/// Splits CSV text into rows; throws InputError naming `file` on an unterminated quote.
std::vector<CsvRow> parseCsv(const std::string& text, const std::string& file);
/// Reads a CSV file (`what` names it in the error if it cannot be opened, e.g. "roster file").
std::vector<CsvRow> readCsvFile(const std::string& path, const std::string& what);
/// The cell without leading and trailing blanks and tabs.
std::string trimCell(const std::string& cell);
/// Quotes a cell if it holds a comma, quote or line break.
std::string csvCell(const std::string& value);

}  // namespace rotaweave::io
