/// @brief Streaming worksheet and shared-strings readers. Handlers never throw through expat:
/// they record the first problem and stop the parser, and the caller throws afterwards.
#include "io/xlsx_read/sheet_rows.hpp"

#include <cstdlib>
#include <optional>

#include "io/xlsx_read/xml_part.hpp"

namespace rotaweave::io::xlsx_read {

std::string cellName(int row, int col) {
  std::string letters;
  for (int c = col; c > 0; c = (c - 1) / 26) letters.insert(letters.begin(), static_cast<char>('A' + (c - 1) % 26));
  return letters + (row > 0 ? std::to_string(row) : "");
}

bool parseCellName(std::string_view ref, int& row, int& col) {
  row = col = 0;
  size_t i = 0;
  while (i < ref.size() && ref[i] == '$') ++i;
  for (; i < ref.size() && ref[i] >= 'A' && ref[i] <= 'Z'; ++i) {
    col = col * 26 + (ref[i] - 'A' + 1);
    if (col > 16384) return false;
  }
  if (i < ref.size() && ref[i] == '$') ++i;
  for (; i < ref.size() && ref[i] >= '0' && ref[i] <= '9'; ++i) {
    row = row * 10 + (ref[i] - '0');
    if (row > 1048576) return false;
  }
  return i == ref.size() && (row > 0 || col > 0);
}

namespace {

/// Streams a part into an XmlPart; rethrows a handler's recorded problem after the parse.
void streamPart(ZipArchive& zip, const std::string& part, size_t maxBytes, XmlPart& xml, std::optional<SheetError>& problem) {
  zip.stream(part, maxBytes, [&](std::string_view chunk) { return xml.feed(chunk); });
  if (problem) throw *problem;
  xml.finish();
  if (problem) throw *problem;
}

}  // namespace

std::vector<std::string> readSharedStrings(ZipArchive& zip, const std::string& part, const SheetLimits& limits) {
  std::vector<std::string> out;
  std::optional<SheetError> problem;
  size_t bytes = 0;
  int phonetic = 0;
  bool inItem = false, inText = false;
  XmlPart* self = nullptr;
  XmlHandlers h;
  h.start = [&](std::string_view local, const XmlAttributes&) {
    if (local == "si") {
      if (out.size() >= limits.maxSharedStrings) {
        problem = SheetError{"the workbook holds more than " + std::to_string(limits.maxSharedStrings) + " distinct texts; far more than a roster"};
        self->stop();
        return;
      }
      out.emplace_back();
      inItem = true;
    } else if (local == "rPh") {
      ++phonetic;
    } else if (local == "t" && inItem && !phonetic) {
      inText = true;
    }
  };
  h.end = [&](std::string_view local) {
    if (local == "si") inItem = false;
    else if (local == "rPh") --phonetic;
    else if (local == "t") inText = false;
  };
  h.text = [&](std::string_view text) {
    if (!inText) return;
    bytes += text.size();
    if (bytes > limits.maxSharedStringBytes) {
      problem = SheetError{"the workbook's texts exceed " + std::to_string(limits.maxSharedStringBytes >> 20) + " MiB; far more than a roster"};
      self->stop();
      return;
    }
    out.back().append(text);
  };
  XmlPart xml(part, h);
  self = &xml;
  streamPart(zip, part, limits.maxSharedStringBytes * 4, xml, problem);
  return out;
}

SheetData readSheet(ZipArchive& zip, const std::string& part, const std::vector<std::string>& shared, const SheetLimits& limits) {
  SheetData data;
  std::optional<SheetError> problem;
  XmlPart* self = nullptr;
  auto fail = [&](std::string message, int row, int col) {
    if (!problem) problem = SheetError{std::move(message), row, col};
    self->stop();
  };

  int row = 0, col = 0, lastContentRow = 0;
  size_t rowsWithContent = 0;
  bool inData = false;
  // The cell being read.
  std::string type, value, inlineText;
  bool inValue = false, inInline = false, inInlineText = false, hasValue = false, formula = false;
  int phonetic = 0;

  auto finishCell = [&]() {
    if (hasValue && value.empty() && type != "inlineStr") hasValue = false;  // <v></v>, as some writers leave a formula unsaved
    SheetCell cell;
    cell.row = row;
    cell.col = col;
    cell.formula = formula;
    if (type == "s") {
      if (!hasValue) return;
      char* end = nullptr;
      const long index = std::strtol(value.c_str(), &end, 10);
      if (end == value.c_str() || *end || index < 0 || static_cast<size_t>(index) >= shared.size())
        return fail("the cell refers to text number " + value + ", which the workbook does not hold (a damaged file)", row, col);
      cell.text = shared[static_cast<size_t>(index)];
    } else if (type == "inlineStr") {
      cell.text = hasValue ? value : inlineText;
    } else if (type == "str" || type == "d") {
      cell.text = value;
      if (!hasValue && formula) cell.type = SheetCell::Type::NoValue;
    } else if (type == "b") {
      if (!hasValue) return;
      cell.type = SheetCell::Type::Bool;
      cell.text = value == "1" ? "TRUE" : "FALSE";
    } else if (type == "e") {
      cell.type = SheetCell::Type::Error;
      cell.text = value;
    } else {  // "n" or absent
      if (!hasValue) {
        if (!formula) return;
        cell.type = SheetCell::Type::NoValue;
      } else {
        char* end = nullptr;
        cell.number = std::strtod(value.c_str(), &end);
        if (end == value.c_str() || *end) return fail("the number '" + value + "' is malformed (a damaged file)", row, col);
        cell.type = SheetCell::Type::Number;
        cell.text = value;
      }
    }
    if (cell.type == SheetCell::Type::Text && cell.text.empty() && !formula) return;
    if (row != lastContentRow) {
      lastContentRow = row;
      if (++rowsWithContent > limits.maxRowsWithContent)
        return fail("the sheet has more than " + std::to_string(limits.maxRowsWithContent) + " rows with content; a roster needs one row per person plus a few headings",
                    row, col);
    }
    if (data.cells.size() >= limits.maxCells)
      return fail("the sheet holds more than " + std::to_string(limits.maxCells) + " values; far more than a roster", row, col);
    data.cells.push_back(std::move(cell));
  };

  XmlHandlers h;
  h.start = [&](std::string_view local, const XmlAttributes& a) {
    if (local == "sheetData") {
      inData = true;
    } else if (local == "row" && inData) {
      const char* r = a.get("r");
      int parsed = 0;
      if (r) {
        char* end = nullptr;
        const long v = std::strtol(r, &end, 10);
        if (end == r || *end || v < 1 || v > 1048576) return fail(std::string("the row number '") + r + "' is malformed (a damaged file)", 0, 0);
        parsed = static_cast<int>(v);
      }
      row = parsed ? parsed : row + 1;
      if (row > 1048576) return fail("the sheet has more rows than a spreadsheet allows (a damaged file)", 0, 0);
      col = 0;
    } else if (local == "c" && inData) {
      const char* r = a.get("r");
      int rr = 0, cc = 0;
      if (r) {
        if (!parseCellName(r, rr, cc) || cc == 0) return fail(std::string("the cell reference '") + r + "' is malformed (a damaged file)", row, 0);
        if (rr > 0) row = rr;
        col = cc;
      } else {
        if (++col > 16384) return fail("the row has more columns than a spreadsheet allows (a damaged file)", row, 0);
      }
      const char* t = a.get("t");
      type = t ? t : "";
      value.clear();
      inlineText.clear();
      hasValue = formula = false;
    } else if (local == "v") {
      inValue = true;
      hasValue = true;
    } else if (local == "f") {
      formula = true;
    } else if (local == "is") {
      inInline = true;
    } else if (local == "rPh") {
      ++phonetic;
    } else if (local == "t" && inInline && !phonetic) {
      inInlineText = true;
    } else if (local == "mergeCell") {
      const char* ref = a.get("ref");
      if (!ref) return;
      const std::string_view text(ref);
      const size_t colon = text.find(':');
      if (colon == std::string_view::npos) return;
      MergedRange m{};
      if (!parseCellName(text.substr(0, colon), m.firstRow, m.firstCol) || !parseCellName(text.substr(colon + 1), m.lastRow, m.lastCol) ||
          m.firstRow == 0 || m.firstCol == 0 || m.lastRow < m.firstRow || m.lastCol < m.firstCol)
        return fail("the merged range '" + std::string(text) + "' is malformed (a damaged file)", 0, 0);
      if (data.merges.size() >= 100000) return fail("the sheet holds more than 100000 merged ranges; far more than a roster", 0, 0);
      data.merges.push_back(m);
    }
  };
  h.end = [&](std::string_view local) {
    if (local == "sheetData") inData = false;
    else if (local == "v") inValue = false;
    else if (local == "is") inInline = false;
    else if (local == "rPh") --phonetic;
    else if (local == "t") inInlineText = false;
    else if (local == "c" && inData) finishCell();
  };
  h.text = [&](std::string_view text) {
    if (inValue) {
      if (value.size() + text.size() > 32767) return fail("a cell holds more than 32767 characters (a damaged file)", row, col);
      value.append(text);
    } else if (inInlineText) {
      if (inlineText.size() + text.size() > 32767) return fail("a cell holds more than 32767 characters (a damaged file)", row, col);
      inlineText.append(text);
    }
  };
  XmlPart xml(part, h);
  self = &xml;
  streamPart(zip, part, limits.maxPartBytes, xml, problem);
  return data;
}

}  // namespace rotaweave::io::xlsx_read
