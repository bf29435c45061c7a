/// @brief The cells of one worksheet, streamed through expat with bounded memory: values as a
/// reader sees them (shared and inline strings, numbers, booleans, error values, the cached
/// value of a formula) and the merged ranges. Empty cells are not kept.
#pragma once
#include <string>
#include <vector>

#include "io/xlsx_read/zip_archive.hpp"

namespace rotaweave::io::xlsx_read {

struct SheetCell {
  enum class Type { Text, Number, Bool, Error, NoValue };
  int row = 0;  ///< 1-based
  int col = 0;  ///< 1-based (A = 1)
  Type type = Type::Text;
  std::string text;     ///< Text, Bool ("TRUE"/"FALSE"), Error ("#N/A"); Number: its text as stored
  double number = 0;    ///< Number
  bool formula = false; ///< the value is a formula's cached result (NoValue: none was saved)
};

struct MergedRange {
  int firstRow, firstCol, lastRow, lastCol;
};

struct SheetLimits {
  size_t maxPartBytes = 256u << 20;     ///< uncompressed sheet XML
  size_t maxRowsWithContent = 100000;   ///< rows holding at least one value
  size_t maxCells = 1000000;            ///< values kept
  size_t maxSharedStringBytes = 64u << 20;
  size_t maxSharedStrings = 1000000;
};

/// A sheet that breaks a limit or holds an impossible value, at a cell when one is known
/// (row and col 0 otherwise); the caller names the file and sheet.
struct SheetError {
  std::string message;
  int row = 0, col = 0;
};

/// Reads the shared-strings part (rich text runs joined, phonetic runs left out).
/// Throws ZipError, XmlError or SheetError (a limit).
std::vector<std::string> readSharedStrings(ZipArchive& zip, const std::string& part, const SheetLimits& limits);

struct SheetData {
  std::vector<SheetCell> cells;  ///< in document order (rows ascending in valid sheets)
  std::vector<MergedRange> merges;
};

/// Streams the worksheet part. Throws ZipError, XmlError or SheetError.
SheetData readSheet(ZipArchive& zip, const std::string& part, const std::vector<std::string>& sharedStrings,
                    const SheetLimits& limits);

/// "F12" for row 12, column 6.
std::string cellName(int row, int col);
/// Parses "F12" (or "F" / "12" alone, the missing part 0); false when malformed.
bool parseCellName(std::string_view ref, int& row, int& col);

}  // namespace rotaweave::io::xlsx_read
