/// @brief The workbook reader's pieces: cell names, part names, and whole workbooks written
/// here with minizip's writer (shared strings, dates, merges, formulas, limits).
#include <doctest/doctest.h>
#include <zip.h>

#include "fixtures.hpp"
#include "io/input_error.hpp"
#include "io/roster_csv.hpp"
#include "io/xlsx_read/sheet_rows.hpp"
#include "io/xlsx_read/workbook_index.hpp"

using namespace rotaweave;

namespace {

const std::string kNs =
    "xmlns=\"http://schemas.openxmlformats.org/spreadsheetml/2006/main\" "
    "xmlns:r=\"http://schemas.openxmlformats.org/officeDocument/2006/relationships\"";

/// A workbook with one sheet named `sheet` holding `sheetXml`, and optional shared strings.
std::string writeWorkbook(const std::string& sheet, const std::string& sheetXml, const std::string& sharedXml = "") {
  const std::string path = test::writeTemp("", ".xlsx");
  zipFile z = zipOpen(path.c_str(), APPEND_STATUS_CREATE);
  REQUIRE(z);
  auto add = [&](const char* name, const std::string& text) {
    zip_fileinfo info{};
    REQUIRE(zipOpenNewFileInZip(z, name, &info, nullptr, 0, nullptr, 0, nullptr, Z_DEFLATED, 6) == ZIP_OK);
    REQUIRE(zipWriteInFileInZip(z, text.data(), static_cast<unsigned>(text.size())) == ZIP_OK);
    REQUIRE(zipCloseFileInZip(z) == ZIP_OK);
  };
  add("_rels/.rels",
      "<Relationships xmlns=\"http://schemas.openxmlformats.org/package/2006/relationships\"><Relationship Id=\"rId1\" "
      "Type=\"http://schemas.openxmlformats.org/officeDocument/2006/relationships/officeDocument\" Target=\"/xl/workbook.xml\"/></Relationships>");
  add("xl/workbook.xml", "<workbook " + kNs + "><workbookPr/><sheets><sheet name=\"" + sheet + "\" sheetId=\"1\" r:id=\"rId1\"/></sheets></workbook>");
  std::string rels =
      "<Relationships xmlns=\"http://schemas.openxmlformats.org/package/2006/relationships\"><Relationship Id=\"rId1\" "
      "Type=\"http://schemas.openxmlformats.org/officeDocument/2006/relationships/worksheet\" Target=\"worksheets/../worksheets/s1.xml\"/>";
  if (!sharedXml.empty())
    rels += "<Relationship Id=\"rId2\" Type=\"http://schemas.openxmlformats.org/officeDocument/2006/relationships/sharedStrings\" Target=\"strings.xml\"/>";
  add("xl/_rels/workbook.xml.rels", rels + "</Relationships>");
  if (!sharedXml.empty()) add("xl/strings.xml", sharedXml);
  add("xl/worksheets/s1.xml", sheetXml);
  REQUIRE(zipClose(z, nullptr) == ZIP_OK);
  return path;
}

const std::string kTwoDays =
    "name: two days\n"
    "period: {start: 2027-03-01, end: 2027-03-02}\n"
    "shifts:\n  - {id: E, start: \"07:00\", end: \"15:00\"}\n  - {id: N, start: \"22:00\", end: \"06:00\"}\n"
    "skills: [rn, hca]\n"
    "staff:\n  - {id: ana, skills: [rn]}\n  - {id: ben, skills: [rn, hca]}\n";

}  // namespace

TEST_SUITE("io") {
  TEST_CASE("cell and part names") {
    using namespace io::xlsx_read;
    CHECK(cellName(12, 6) == "F12");
    CHECK(cellName(1, 27) == "AA1");
    CHECK(cellName(3, 16384) == "XFD3");
    int r = 0, c = 0;
    CHECK(parseCellName("AB$7", r, c));
    CHECK(r == 7);
    CHECK(c == 28);
    CHECK_FALSE(parseCellName("A1B", r, c));
    CHECK_FALSE(parseCellName("XFE1", r, c));
    CHECK(resolvePartName("xl/workbook.xml", "worksheets/sheet1.xml") == "xl/worksheets/sheet1.xml");
    CHECK(resolvePartName("xl/workbook.xml", "/xl/sharedStrings.xml") == "xl/sharedStrings.xml");
    CHECK(resolvePartName("xl/worksheets/sheet1.xml", "../drawings/d.xml") == "xl/drawings/d.xml");
  }

  TEST_CASE("a workbook roster: shared strings, date serials, a merge, a cached formula, prefixed XML") {
    const auto p = test::loadYaml(kTwoDays);
    // 2027-03-01 is serial 46447 in the 1900 date system. ana's E spans both days by a merge;
    // ben's second day is a formula whose cached value is "N/hca".
    const std::string sheet =
        "<x:worksheet xmlns:x=\"http://schemas.openxmlformats.org/spreadsheetml/2006/main\"><x:sheetData>"
        "<x:row r=\"1\"><x:c r=\"A1\" t=\"s\"><x:v>0</x:v></x:c></x:row>"
        "<x:row r=\"2\"><x:c r=\"B2\" t=\"s\"><x:v>1</x:v></x:c><x:c r=\"C2\" s=\"1\"><x:v>46447</x:v></x:c>"
        "<x:c r=\"D2\"><x:v>46448</x:v></x:c><x:c r=\"E2\" t=\"inlineStr\"><x:is><x:t>Hours</x:t></x:is></x:c></x:row>"
        "<x:row r=\"3\"><x:c r=\"A3\" t=\"inlineStr\"><x:is><x:t>Ana</x:t></x:is></x:c><x:c r=\"B3\" t=\"s\"><x:v>2</x:v></x:c>"
        "<x:c r=\"C3\" t=\"s\"><x:v>4</x:v></x:c><x:c r=\"E3\"><x:f>SUM(1,1)</x:f><x:v>16</x:v></x:c></x:row>"
        "<x:row r=\"4\"><x:c r=\"B4\" t=\"s\"><x:v>3</x:v></x:c><x:c r=\"D4\" t=\"str\"><x:f>\"N/\"&amp;\"hca\"</x:f><x:v>N/hca</x:v></x:c></x:row>"
        "</x:sheetData><x:mergeCells count=\"1\"><x:mergeCell ref=\"C3:D3\"/></x:mergeCells></x:worksheet>";
    const std::string shared =
        "<sst " + kNs + "><si><r><t>Ward</t></r><r><t> B</t></r><rPh><t>ignored</t></rPh></si><si><t>Id</t></si><si><t>ana</t></si>"
        "<si><t>ben</t></si><si><t>E</t></si></sst>";
    const auto r = io::readRosterCsv(writeWorkbook("Roster", sheet, shared), p);
    CHECK(r.at(0, 0) == p.task(0, 0));
    CHECK(r.at(0, 1) == p.task(0, 0));
    CHECK(r.at(1, 0) == kOff);
    CHECK(r.at(1, 1) == p.task(1, 1));
  }

  TEST_CASE("workbook errors name the sheet and cell") {
    const auto p = test::loadYaml(kTwoDays);
    auto expect = [&](const std::string& path, const std::string& words) {
      try {
        io::readRosterCsv(path, p);
        FAIL("no error for: " << words);
      } catch (const io::InputError& e) {
        CAPTURE(e.what());
        CHECK(e.file() == path);
        CHECK(std::string(e.what()).find(words) != std::string::npos);
      }
    };
    auto sheet = [&](const std::string& rows) { return "<worksheet " + kNs + "><sheetData>" + rows + "</sheetData></worksheet>"; };
    const std::string head = "<row r=\"1\"><c r=\"A1\" t=\"inlineStr\"><is><t>staff</t></is></c><c r=\"B1\"><v>46447</v></c><c r=\"C1\" t=\"inlineStr\"><is><t>2027-03-02</t></is></c></row>";
    auto person = [](int row, const char* id, const char* b, const char* c) {
      std::string out = "<row r=\"" + std::to_string(row) + "\"><c r=\"A" + std::to_string(row) + "\" t=\"inlineStr\"><is><t>" + id + "</t></is></c>";
      if (*b) out += std::string("<c r=\"B") + std::to_string(row) + "\" t=\"inlineStr\"><is><t>" + b + "</t></is></c>";
      if (*c) out += std::string("<c r=\"C") + std::to_string(row) + "\" " + c + "</c>";
      return out + "</row>";
    };
    expect(writeWorkbook("Plan", sheet(head + person(2, "ana", "E", "") + person(3, "ben", "Q", ""))), "Plan!B3: unknown shift 'Q'");
    expect(writeWorkbook("Roster", sheet(head + person(2, "ana", "E", "t=\"e\"><v>#N/A</v>") + person(3, "ben", "", ""))),
           "Roster!C2: holds the error value #N/A");
    expect(writeWorkbook("Roster", sheet(head + person(2, "ana", "E", "") + person(3, "bne", "E", ""))), "Roster!A3: unknown staff id 'bne'");
    expect(writeWorkbook("Roster", sheet(head + person(2, "ana", "E", ""))), "no row for 'ben'");
    expect(writeWorkbook("Roster", sheet(head + person(2, "ana", "E", "") + person(3, "ana", "", ""))), "Roster!A3: a second row for 'ana'");
    expect(writeWorkbook("Roster", sheet(head + person(2, "ana", "E", "t=\"s\"><v>9</v>"))), "Roster!C2: the cell refers to text number 9");
    expect(writeWorkbook("Roster", "<worksheet " + kNs + "><sheetData><row r=\"1\">"), "not well-formed");
    // Past the row limit (staff + 1000 rows with content) the sheet is refused while streaming.
    std::string many = head;
    for (int row = 2; row < 1010; ++row) many += "<row r=\"" + std::to_string(row) + "\"><c r=\"A" + std::to_string(row) + "\"><v>1</v></c></row>";
    expect(writeWorkbook("Roster", sheet(many)), "more than 1002 rows with content");
  }
}
