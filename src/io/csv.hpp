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
/// Quotes a cell if it holds a comma, quote or line break.
std::string csvCell(const std::string& value);

}  // namespace rotaweave::io
