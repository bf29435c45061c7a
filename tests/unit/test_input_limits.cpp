/// @brief Input limits and control characters: oversized input is refused while it is read,
/// before large structures are built; control characters are refused with their position.
#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>
#include <random>
#include <sstream>

#include "fixtures.hpp"
#include "io/control_chars.hpp"
#include "io/csv.hpp"
#include "io/input_error.hpp"
#include "io/input_limits.hpp"
#include "io/roster_csv.hpp"

using namespace rotaweave;

namespace {

const std::string kHead =
    "name: limits\n"
    "period: {start: 2027-03-01, end: 2027-03-03}\n"
    "shifts:\n"
    "  - {id: E, start: \"07:00\", end: \"15:00\"}\n"
    "skills: [rn]\n";

/// The InputError's message for loading `yaml`, or "".
std::string yamlError(const std::string& yaml, int* line = nullptr, int* column = nullptr) {
  try {
    test::loadYaml(yaml);
  } catch (const io::InputError& e) {
    if (line) *line = e.line();
    if (column) *column = e.column();
    return e.what();
  }
  return "";
}

std::string staffList(size_t people) {
  std::string s = kHead + "staff:\n";
  for (size_t i = 0; i < people; ++i) s += "  - {id: p" + std::to_string(i) + ", skills: [rn]}\n";
  return s;
}

/// The InputError's message for reading `csv` as a roster of the two-person scenario, or "".
std::string csvError(const std::string& csv, int* line = nullptr) {
  static const model::Problem p = test::loadYaml(kHead + "staff:\n  - {id: ana, skills: [rn]}\n  - {id: ben, skills: [rn]}\n");
  try {
    io::readRosterCsv(test::writeTemp(csv, ".csv"), p);
  } catch (const io::InputError& e) {
    if (line) *line = e.line();
    return e.what();
  }
  return "";
}

const std::string kCsvHeader = "staff,2027-03-01,2027-03-02,2027-03-03\n";

}  // namespace

TEST_SUITE("input limits") {
  TEST_CASE("a staff list over the limit is refused at the first person too many") {
    int line = 0;
    const std::string message = yamlError(staffList(io::kMaxStaff + 1), &line);
    CAPTURE(message);
    CHECK(message.find("more than 5000 people") != std::string::npos);
    CHECK(line == 6 + static_cast<int>(io::kMaxStaff) + 1);
    CHECK(yamlError(staffList(io::kMaxStaff)).empty());
  }

  TEST_CASE("a file with too many YAML nodes is refused before its tree is built") {
    std::string yaml = kHead + "staff: [{id: a, skills: [rn]}]\ndescription: [";
    for (size_t i = 0; i < io::kMaxYamlNodes; ++i) yaml += "1,";
    yaml += "1]\n";
    const std::string message = yamlError(yaml);
    CAPTURE(message.substr(0, 200));
    CHECK(message.find("YAML values, lists and maps") != std::string::npos);
  }

  TEST_CASE("a file over the size cap is refused from its size alone") {
    const std::string path = test::writeTemp("", ".csv");
    std::filesystem::resize_file(path, io::kMaxInputBytes + 1);  // sparse: nothing is written
    CHECK_THROWS_WITH_AS(io::readInputFile(path, "roster file"), doctest::Contains("at most 64 MB"), io::InputError);
    CHECK_THROWS_WITH_AS(io::checkInputSize(path, "roster file"), doctest::Contains("the roster file is 65 MB"), io::InputError);
  }

  TEST_CASE("a folder given as an input file is named as one") {
    CHECK_THROWS_WITH_AS(io::readInputFile(std::filesystem::temp_directory_path().string(), "file"),
                         doctest::Contains("this is a folder"), io::InputError);
  }

  TEST_CASE("roster CSV rows are counted against the staff while the file is streamed") {
    std::string csv = kCsvHeader;
    for (size_t i = 0; i < 2 + io::kSpareCsvRows; ++i) csv += "x" + std::to_string(i) + ",,,\n";
    int line = 0;
    const std::string message = csvError(csv, &line);
    CAPTURE(message);
    CHECK(message.find("more than 102 rows but the scenario has 2 people") != std::string::npos);
    CHECK(line == 103);
    // Blank lines, and line breaks inside quoted cells, are not rows.
    std::string blank = kCsvHeader + "ana,E,,\n";
    for (int i = 0; i < 300; ++i) blank += "\r\n";
    blank += "\"ben\",\"E\n\n\n\",,\n";
    CHECK_NOTHROW(io::checkRosterCsvShape(test::writeTemp(blank, ".csv"), 2, 3));
  }

  TEST_CASE("a roster row with far too many cells is refused at once") {
    std::string csv = kCsvHeader + "ana" + std::string(200, ',') + "\n";
    CHECK(csvError(csv).find("more than 104 cells but the period has 3 days") != std::string::npos);
    // Quoted commas are not cells.
    CHECK_NOTHROW(io::checkRosterCsvShape(test::writeTemp(kCsvHeader + "ana,\"" + std::string(200, ',') + "\",,\n", ".csv"), 2, 3));
  }
}

TEST_SUITE("input limits") {
  TEST_CASE("the streaming count agrees with the parser on random CSV text") {
    // Quotes, commas and line ends in every order: the count that refuses large files must
    // never see more rows or cells than the parser that reads the accepted ones.
    std::mt19937 rng(7);
    const char alphabet[] = {'a', ',', '"', '\r', '\n', ' '};
    int compared = 0;
    for (int round = 0; round < 20000; ++round) {
      std::string text(rng() % 24, 'a');
      for (char& c : text) c = alphabet[rng() % sizeof alphabet];
      std::vector<io::CsvRow> rows;
      try {
        rows = io::parseCsv(text, "random.csv");
      } catch (const io::InputError&) {
        continue;  // an unclosed quote
      }
      size_t widest = 0;
      for (const auto& r : rows) widest = std::max(widest, r.cells.size());
      std::istringstream in(text);
      const io::CsvShape shape = io::measureCsv(in, 1000, 1000);
      CAPTURE(text);
      CHECK(shape.rows == rows.size());
      CHECK(shape.widest == widest);
      if (!rows.empty()) {
        std::istringstream again(text);
        const io::CsvShape stopped = io::measureCsv(again, rows.size() - 1, 1000);
        CHECK(stopped.stopped);
        CHECK(stopped.line == rows.back().line);
      }
      ++compared;
    }
    CHECK(compared > 5000);
  }
}

TEST_SUITE("control characters") {
  TEST_CASE("found with their line and column, named as U+XXXX") {
    const auto nul = io::findControlChar(std::string_view("ab\ncd\xC3\xA9x\0y", 10));
    REQUIRE(nul);
    CHECK(nul->code == 0);
    CHECK(nul->line == 2);
    CHECK(nul->column == 5);  // c, d, é (two bytes, one character), x, then the NUL
    CHECK(io::codePointName(nul->code) == "U+0000");
    CHECK(io::findControlChar("tab\there\r\n")  == std::nullopt);
    CHECK(io::findControlChar("tab\there", false)->code == U'\t');
    CHECK(io::findControlChar("del\x7F")->code == 0x7F);
    CHECK(io::findControlChar("next line \xC2\x85")->code == 0x85);
    CHECK(io::findControlChar("no-break space \xC2\xA0") == std::nullopt);
    CHECK(io::escapeControlChars(std::string("E\0x", 3)) == "E\\x00x");
  }

  TEST_CASE("a NUL byte in a scenario name is refused at its position") {
    int line = 0, column = 0;
    const std::string yaml = kHead + "staff:\n  - {id: ana, name: \"An" + std::string(1, '\0') + "a\", skills: [rn]}\n";
    const std::string message = yamlError(yaml, &line, &column);
    CAPTURE(io::escapeControlChars(message));
    CHECK(message.find("control character U+0000") != std::string::npos);
    CHECK(message.find('\0') == std::string::npos);
    CHECK(line == 7);
    CHECK(column == 24);
  }

  TEST_CASE("a control character written as an escape is refused too") {
    const std::string message = yamlError(kHead + "staff:\n  - {id: ana, name: \"An\\0a\", skills: [rn]}\n");
    CHECK(message.find("control character U+0000 in this value") != std::string::npos);
    CHECK(yamlError(kHead + "staff:\n  - {id: ana, name: \"Ana\\e\", skills: [rn]}\n").find("U+001B") != std::string::npos);
    CHECK(yamlError(kHead + "contracts:\n  \"f\\x01\": {}\nstaff:\n  - {id: ana, skills: [rn]}\n").find("U+0001") != std::string::npos);
  }

  TEST_CASE("a NUL byte in a roster CSV is refused, and the message is not cut at it") {
    int line = 0;
    const std::string message = csvError(kCsvHeader + "ana,E,,\n\"ben\",\"E" + std::string(1, '\0') + "\",,\n", &line);
    CAPTURE(io::escapeControlChars(message));
    CHECK(message.find("control character U+0000") != std::string::npos);
    CHECK(line == 3);
    CHECK(csvError(kCsvHeader + "ana,E\t,,\nben,,,\n").empty());  // a tab is layout
  }
}
