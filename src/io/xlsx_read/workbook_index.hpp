/// @brief What a workbook holds, read from its package relationships: the sheets by name and
/// the part of each, the shared-strings part, and the date system (1900 or 1904).
#pragma once
#include <string>
#include <vector>

#include "io/xlsx_read/zip_archive.hpp"

namespace rotaweave::io::xlsx_read {

struct SheetEntry {
  std::string name;  ///< as shown on the tab
  std::string part;  ///< zip part name, e.g. "xl/worksheets/sheet1.xml"
};

struct WorkbookIndex {
  std::vector<SheetEntry> sheets;  ///< in tab order
  std::string sharedStrings;       ///< part name, empty when the workbook has none
  bool date1904 = false;           ///< serial 0 is 1904-01-01 instead of 1899-12-30

  /// The sheet of this name (compared without regard to ASCII case), or nullptr.
  const SheetEntry* find(const std::string& name) const;
};

/// Reads _rels/.rels, the workbook part and its relationships. Throws ZipError or XmlError.
WorkbookIndex readWorkbookIndex(ZipArchive& zip);

/// Resolves a relationship target against the folder of the part that names it
/// ("xl/workbook.xml" + "worksheets/sheet1.xml" -> "xl/worksheets/sheet1.xml"; "/xl/x" -> "xl/x").
std::string resolvePartName(const std::string& sourcePart, const std::string& target);

}  // namespace rotaweave::io::xlsx_read
