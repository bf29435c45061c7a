/// @brief libFuzzer target: the workbook roster reader. Input starting with "PK" is taken as a
/// whole xlsx file (the zip layer and the package parts); any other input is taken as the XML
/// of the Roster sheet and packed here, with fixed shared strings, into a valid workbook, so
/// the fuzzer spends its time in the sheet reader and the table locator rather than on
/// checksums. The reader may only reject with io::InputError naming the file; a roster it
/// accepts must hold valid cells.
#include <zip.h>

#include <cstdint>
#include <cstdlib>
#include <string>

#include "fuzz_common.hpp"
#include "io/input_error.hpp"
#include "io/roster_csv.hpp"
#include "io/scenario_loader.hpp"

using namespace rotaweave;

namespace {

const char* kScenario = R"(name: fuzz
period: {start: 2027-03-01, end: 2027-03-03}
shifts:
  - {id: E, start: "07:00", end: "15:00"}
  - {id: N, start: "22:00", end: "06:00"}
skills: [rn, hca]
staff:
  - {id: ana, skills: [rn]}
  - {id: ben, skills: [hca, rn]}
)";

const model::Problem& problem() {
  static const model::Problem p = [] {
    const std::string text(kScenario);
    return io::loadScenario(fuzz::writeScratch("fixed.yaml", reinterpret_cast<const uint8_t*>(text.data()), text.size()));
  }();
  return p;
}

void add(zipFile z, const char* name, const char* data, size_t size) {
  zip_fileinfo info{};
  if (zipOpenNewFileInZip(z, name, &info, nullptr, 0, nullptr, 0, nullptr, 0, 0) != ZIP_OK) std::abort();  // stored
  if (size && zipWriteInFileInZip(z, data, static_cast<unsigned>(size)) != ZIP_OK) std::abort();
  if (zipCloseFileInZip(z) != ZIP_OK) std::abort();
}

void add(zipFile z, const char* name, const std::string& text) { add(z, name, text.data(), text.size()); }

/// A workbook whose Roster sheet is exactly these bytes.
std::string wrapAsSheet(const uint8_t* data, size_t size) {
  const std::string path = (fuzz::scratchDir() / "wrapped.xlsx").string();
  zipFile z = zipOpen(path.c_str(), APPEND_STATUS_CREATE);
  if (!z) std::abort();
  const std::string ns = "xmlns=\"http://schemas.openxmlformats.org/spreadsheetml/2006/main\" "
                         "xmlns:r=\"http://schemas.openxmlformats.org/officeDocument/2006/relationships\"";
  const std::string relNs = "xmlns=\"http://schemas.openxmlformats.org/package/2006/relationships\"";
  const std::string type = "http://schemas.openxmlformats.org/officeDocument/2006/relationships/";
  add(z, "_rels/.rels", "<Relationships " + relNs + "><Relationship Id=\"a\" Type=\"" + type + "officeDocument\" Target=\"xl/workbook.xml\"/></Relationships>");
  add(z, "xl/workbook.xml", "<workbook " + ns + "><sheets><sheet name=\"Roster\" sheetId=\"1\" r:id=\"s\"/></sheets></workbook>");
  add(z, "xl/_rels/workbook.xml.rels", "<Relationships " + relNs + "><Relationship Id=\"s\" Type=\"" + type +
                                           "worksheet\" Target=\"worksheets/sheet1.xml\"/><Relationship Id=\"t\" Type=\"" + type +
                                           "sharedStrings\" Target=\"sharedStrings.xml\"/></Relationships>");
  add(z, "xl/sharedStrings.xml", "<sst " + ns + "><si><t>staff</t></si><si><t>ana</t></si><si><t>ben</t></si><si><t>E</t></si>"
                                 "<si><t>N/hca</t></si><si><t>2027-03-01</t></si><si><t>02/03/2027</t></si></sst>");
  add(z, "xl/worksheets/sheet1.xml", reinterpret_cast<const char*>(data), size);
  if (zipClose(z, nullptr) != ZIP_OK) std::abort();
  return path;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const uint8_t* data, size_t size) {
  const model::Problem& p = problem();
  const bool whole = size >= 2 && data[0] == 'P' && data[1] == 'K';
  const std::string path = whole ? fuzz::writeScratch("roster.xlsx", data, size) : wrapAsSheet(data, size);
  model::Roster roster;
  try {
    roster = io::readRosterCsv(path, p);
  } catch (const io::InputError& e) {
    if (e.file() != path) std::abort();  // the message names the workbook
    return 0;
  }
  if (roster.staff != p.staffCount() || roster.days != p.days) std::abort();
  for (TaskIdx t : roster.cells)
    if (t != kOff && (t < 0 || static_cast<size_t>(t) >= p.tasks.size())) std::abort();
  return 0;
}
