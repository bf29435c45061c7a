/// @brief Bad scenarios and rosters: each is rejected with the file, the line and what to fix.
#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>

#include "fixtures.hpp"
#include "app/commands.hpp"
#include "io/input_error.hpp"
#include "io/roster_csv.hpp"
#include "io/scenario_loader.hpp"

using namespace rotaweave;

namespace {

const std::string kValid =
    "name: valid\n"
    "period: {start: 2027-03-01, end: 2027-03-07}\n"
    "shifts:\n"
    "  - {id: E, start: \"07:00\", end: \"15:00\"}\n"
    "  - {id: N, start: \"22:00\", end: \"06:00\"}\n"
    "skills: [rn, hca]\n"
    "contracts:\n  ft: {hours: {min: 10, max: 40}}\n"
    "staff:\n"
    "  - {id: ana, contract: ft, skills: [rn]}\n"
    "  - {id: ben, skills: [rn, hca]}\n"
    "demand:\n  - {shift: E, skill: rn, min: 1}\n"
    "rules:\n  list:\n    - {kind: min-rest, hours: 11}\n";

std::string replaced(const std::string& from, const std::string& to) {
  const size_t at = kValid.find(from);
  REQUIRE(at != std::string::npos);
  std::string s = kValid;
  s.replace(at, from.size(), to);
  return s;
}

/// Loads `yaml`, expects an InputError naming the file and `line`, whose text contains `words`.
void expectError(const std::string& yaml, int line, const std::string& words) {
  std::string path;
  try {
    test::loadYaml(yaml, &path);
    FAIL("no error for: " << words);
  } catch (const io::InputError& e) {
    CAPTURE(e.what());
    CHECK(std::string(e.what()).rfind(e.file(), 0) == 0);
    CHECK(e.file().find(".yaml") != std::string::npos);
    if (line > 0) CHECK(e.line() == line);
    CHECK(std::string(e.what()).find(words) != std::string::npos);
  }
}

}  // namespace

TEST_SUITE("io") {
  TEST_CASE("the valid fixture loads") { CHECK_NOTHROW(test::loadYaml(kValid)); }

  TEST_CASE("scenario errors name the file, line and fix") {
    SUBCASE("YAML syntax") { expectError(replaced("skills: [rn, hca]", "skills: [rn, hca"), 0, "YAML syntax error"); }
    SUBCASE("unknown top-level key with suggestion") { expectError(replaced("skills:", "skils:"), 6, "did you mean 'skills'"); }
    SUBCASE("missing required key") { expectError(replaced("skills: [rn, hca]\n", ""), 0, "missing required key 'skills'"); }
    SUBCASE("impossible date") { expectError(replaced("end: 2027-03-07", "end: 2027-02-30"), 2, "invalid date '2027-02-30'"); }
    SUBCASE("period ends before it starts") { expectError(replaced("end: 2027-03-07", "end: 2027-02-27"), 2, "ends before it starts"); }
    SUBCASE("impossible time") { expectError(replaced("end: \"15:00\"", "end: \"25:00\""), 4, "invalid time '25:00'"); }
    SUBCASE("duplicate shift id") { expectError(replaced("id: N,", "id: E,"), 5, "duplicate shift id 'E'"); }
    SUBCASE("duplicate staff id") { expectError(replaced("id: ben", "id: ana"), 11, "duplicate staff id 'ana'"); }
    SUBCASE("unknown skill on a person") { expectError(replaced("skills: [rn, hca]}", "skills: [rn, hac]}"), 11, "unknown skill 'hac' (did you mean 'hca'?)"); }
    SUBCASE("unknown contract") { expectError(replaced("contract: ft", "contract: fulltime"), 10, "unknown contract 'fulltime'"); }
    SUBCASE("unknown shift in demand") { expectError(replaced("{shift: E, skill: rn, min: 1}", "{shift: X, skill: rn, min: 1}"), 13, "unknown shift 'X'"); }
    SUBCASE("target below min") { expectError(replaced("min: 1}", "min: 3, target: 2}"), 13, "target is below min"); }
    SUBCASE("unknown rule kind") { expectError(replaced("kind: min-rest", "kind: min-rst"), 16, "did you mean 'min-rest'"); }
    SUBCASE("unknown rule key") { expectError(replaced("hours: 11}", "hours: 11, hour: 3}"), 16, "unknown key 'hour'"); }
    SUBCASE("missing rule parameter") { expectError(replaced("{kind: min-rest, hours: 11}", "{kind: min-rest}"), 16, "needs 'hours'"); }
    SUBCASE("negative weight") { expectError(replaced("hours: 11}", "hours: 11, weight: -2}"), 16, "out of range"); }
    SUBCASE("weight with too many decimals") { expectError(replaced("hours: 11}", "hours: 11, weight: 0.125}"), 16, "at most 2 decimals"); }
    SUBCASE("bad severity") { expectError(replaced("hours: 11}", "hours: 11, severity: medium}"), 16, "severity must be hard or soft"); }
    SUBCASE("request outside the period") {
      expectError(replaced("skills: [rn]}", "skills: [rn], requests: [{date: 2027-04-02, off: true}]}"), 10, "outside the period");
    }
    SUBCASE("empty staff list") { expectError(replaced("  - {id: ana, contract: ft, skills: [rn]}\n  - {id: ben, skills: [rn, hca]}\n", "  []\n"), 0, "staff list is empty"); }
    SUBCASE("empty file") { expectError("   \n", 0, "the file is empty"); }
    SUBCASE("not UTF-8") { expectError(replaced("name: valid", "name: caf\xe9"), 1, "not valid UTF-8"); }
    SUBCASE("missing include") {
      expectError(replaced("rules:\n  list:", "rules:\n  include: [nowhere.yaml]\n  list:"), 15, "does not exist");
    }
    SUBCASE("include cycle") {
      const std::string a = test::writeTemp("list: []\n", ".yaml");
      const std::string dir = a.substr(0, a.rfind('/') + 1);
      std::ofstream(dir + "cycle-a.yaml") << "include: [cycle-b.yaml]\n";
      std::ofstream(dir + "cycle-b.yaml") << "include: [cycle-a.yaml]\n";
      expectError(replaced("rules:\n  list:", "rules:\n  include: [cycle-a.yaml]\n  list:"), 1, "include cycle");
    }
  }

  TEST_CASE("roster CSV errors name the file, line and column") {
    const auto p = test::loadYaml(kValid);
    const std::string header = "staff,2027-03-01,2027-03-02,2027-03-03,2027-03-04,2027-03-05,2027-03-06,2027-03-07\n";
    auto expectCsv = [&](const std::string& csv, int line, const std::string& words) {
      const std::string path = test::writeTemp(csv, ".csv");
      try {
        io::readRosterCsv(path, p);
        FAIL("no error for: " << words);
      } catch (const io::InputError& e) {
        CAPTURE(e.what());
        CHECK(e.file() == path);
        CHECK(e.line() == line);
        CHECK(std::string(e.what()).find(words) != std::string::npos);
      }
    };
    expectCsv(header + "ana,E,,,,,,\nzed,,,,,,,\n", 3, "unknown staff id 'zed'");
    expectCsv(header + "ana,E,,,,,,\nana,,,,,,,\n", 3, "a second row for 'ana'");
    expectCsv(header + "ana,E,,,,,\nben,,,,,,,\n", 2, "this row has 7 cells");
    expectCsv(header + "ana,E,X,,,,,\nben,,,,,,,\n", 2, "unknown shift 'X'");
    expectCsv(header + "ana,E,E/icu,,,,,\nben,,,,,,,\n", 2, "unknown skill 'icu'");
    expectCsv("staff,2027-03-01,2027-03-03,2027-03-03,2027-03-04,2027-03-05,2027-03-06,2027-03-07\n", 1, "expected date 2027-03-02");
    expectCsv(header + "ana,\"E,,,,,,\n", 2, "never closed");
  }

  TEST_CASE("roster CSV as spreadsheets save it: BOM, CRLF, quoted cells") {
    const auto p = test::loadYaml(kValid);
    const std::string csv = "\xEF\xBB\xBFstaff,2027-03-01,2027-03-02,2027-03-03,2027-03-04,2027-03-05,2027-03-06,2027-03-07\r\n"
                            "\"ana\",\"E\",,,,,,N\r\nben,E/hca,,,,,,\r\n";
    const auto r = io::readRosterCsv(test::writeTemp(csv, ".csv"), p);
    CHECK(r.at(0, 0) == p.task(0, 0));
    CHECK(r.at(0, 6) == p.task(1, 0));
    CHECK(r.at(1, 0) == p.task(0, 1));
    // Writing and reading back gives the same roster.
    CHECK(io::readRosterCsv(test::writeTemp(io::rosterCsvText(r, p), ".csv"), p) == r);
  }
}

TEST_SUITE("io") {
  TEST_CASE("check refuses an output folder that would overwrite its input roster") {
    // design.md: inputs are never overwritten.
    std::string scenario;
    const auto p = test::loadYaml(kValid, &scenario);
    const std::string header = "staff,2027-03-01,2027-03-02,2027-03-03,2027-03-04,2027-03-05,2027-03-06,2027-03-07\n";
    const std::string roster = test::writeTemp(header + "ana,E,,,,,,\nben,,,,,,,\n", ".csv");
    const auto dir = std::filesystem::path(roster).parent_path() / "in-place";
    std::filesystem::create_directories(dir);
    std::filesystem::copy_file(roster, dir / "roster.csv", std::filesystem::copy_options::overwrite_existing);
    CHECK_THROWS_AS(app::check(scenario, (dir / "roster.csv").string(), dir), io::OutputError);
    CHECK(std::filesystem::file_size(dir / "roster.csv") == std::filesystem::file_size(roster));
  }
}
