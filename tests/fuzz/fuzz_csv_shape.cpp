/// @brief libFuzzer target: any bytes as CSV text. The streaming count that refuses oversized
/// rosters (io::measureCsv) must see exactly the rows and cells the parser (io::parseCsv) reads,
/// and stop on the row that passes a limit; otherwise it would refuse good files or let large
/// ones through.
#include <algorithm>
#include <cstdint>
#include <cstdlib>
#include <sstream>
#include <string>

#include "io/csv.hpp"
#include "io/input_error.hpp"
#include "io/input_limits.hpp"

using namespace rotaweave;

extern "C" int LLVMFuzzerTestOneInput(const uint8_t* data, size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  std::vector<io::CsvRow> rows;
  try {
    rows = io::parseCsv(text, "fuzz.csv");
  } catch (const io::InputError&) {
    return 0;  // bad UTF-8, a control character or an unclosed quote: the parser refuses it
  }
  // The parser drops a byte-order mark; the count reads raw bytes, where a mark is a cell's text.
  const std::string counted = text.rfind("\xEF\xBB\xBF", 0) == 0 ? text.substr(3) : text;
  size_t widest = 0;
  for (const auto& r : rows) widest = std::max(widest, r.cells.size());
  std::istringstream in(counted);
  const io::CsvShape shape = io::measureCsv(in, rows.size(), widest);
  if (shape.stopped || shape.rows != rows.size() || shape.widest != widest) std::abort();
  if (!rows.empty()) {
    std::istringstream again(counted);
    const io::CsvShape stopped = io::measureCsv(again, rows.size() - 1, widest);
    if (!stopped.stopped || stopped.line != rows.back().line) std::abort();
  }
  if (widest > 1) {
    std::istringstream again(counted);
    if (!io::measureCsv(again, rows.size(), widest - 1).stopped) std::abort();
  }
  return 0;
}
