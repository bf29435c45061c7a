/// @brief Roster header dates written day-first, month-first or ISO; the period settles which.
#include <doctest/doctest.h>

#include "fixtures.hpp"
#include "io/input_error.hpp"
#include "io/roster_csv.hpp"
#include "io/roster_dates.hpp"

using namespace rotaweave;

namespace {

model::DateSerial iso(const char* text) { return *model::parseIsoDate(text); }

const std::string kWeek =
    "name: dates\n"
    "period: {start: 2027-10-01, end: 2027-10-07}\n"
    "shifts:\n  - {id: E, start: \"07:00\", end: \"15:00\"}\n"
    "skills: [rn]\n"
    "staff:\n  - {id: ana, skills: [rn]}\n";

}  // namespace

TEST_SUITE("io") {
  TEST_CASE("one cell: ISO, year-first, and the two readings of D/M/Y") {
    CHECK(*io::readDateText("2027-10-01").dayFirst == iso("2027-10-01"));
    CHECK_FALSE(io::readDateText("2027-10-01").numeric);
    CHECK(*io::readDateText("2027/10/01").dayFirst == iso("2027-10-01"));
    const auto r = io::readDateText(" 01/10/2027 ");
    CHECK(r.numeric);
    CHECK(*r.dayFirst == iso("2027-10-01"));
    CHECK(*r.monthFirst == iso("2027-01-10"));
    const auto only = io::readDateText("13.01.27");  // no 13th month: day first only, 20YY
    CHECK(*only.dayFirst == iso("2027-01-13"));
    CHECK_FALSE(only.monthFirst);
    CHECK_FALSE(io::readDateText("Mon").any());
    CHECK_FALSE(io::readDateText("01 Oct").any());
    CHECK_FALSE(io::readDateText("31/02/2027").dayFirst);
    CHECK_FALSE(io::readDateText("1/2/3/4").any());
    CHECK_FALSE(io::readDateText("01/10-2027").any());
  }

  TEST_CASE("a header row: the period decides between day-first and month-first") {
    const auto first = iso("2027-10-01"), last = iso("2027-10-07");
    // Day first: 01/10/2027 is 1 October (inside); read month first it would be 10 January.
    auto h = io::resolveHeaderDates({"01/10/2027", "02/10/2027", "Hours"}, first, last);
    CHECK(h.ambiguousCell == -1);
    CHECK(*h.dates[0] == iso("2027-10-01"));
    CHECK(*h.dates[1] == iso("2027-10-02"));
    CHECK_FALSE(h.dates[2]);
    // Month first.
    h = io::resolveHeaderDates({"10/01/2027", "10/02/27"}, first, last);
    CHECK(h.ambiguousCell == -1);
    CHECK(*h.dates[0] == iso("2027-10-01"));
    CHECK(*h.dates[1] == iso("2027-10-02"));
    // Both readings fit a year-long period and differ: refused, with the fix.
    h = io::resolveHeaderDates({"2027-01-01", "01/02/2027", "02/01/2027"}, iso("2027-01-01"), iso("2027-12-31"));
    CHECK(h.ambiguousCell == 1);
    CHECK(h.error.find("2027-02-01 (day first) or 2027-01-02 (month first)") != std::string::npos);
    CHECK(h.error.find("YYYY-MM-DD") != std::string::npos);
    // Equal day and month read the same both ways: no ambiguity.
    h = io::resolveHeaderDates({"01/01/2027"}, iso("2027-01-01"), iso("2027-12-31"));
    CHECK(h.ambiguousCell == -1);
    CHECK(*h.dates[0] == iso("2027-01-01"));
    // One unambiguous cell settles the row.
    h = io::resolveHeaderDates({"01/02/2027", "13/01/2027"}, iso("2027-01-01"), iso("2027-12-31"));
    CHECK(h.ambiguousCell == -1);
    CHECK(*h.dates[0] == iso("2027-02-01"));
  }

  TEST_CASE("roster CSV with day-first, month-first and ambiguous headers") {
    const auto p = test::loadYaml(kWeek);
    const std::string row = "ana,E,,,,,,E\n";
    const auto dayFirst = io::readRosterCsv(
        test::writeTemp("staff,01/10/2027,02/10/2027,03/10/2027,04/10/2027,05/10/2027,06/10/2027,07/10/2027\n" + row, ".csv"), p);
    const auto monthFirst = io::readRosterCsv(
        test::writeTemp("staff,10/01/27,10/02/27,10/03/27,10/04/27,10/05/27,10/06/27,10/07/27\n" + row, ".csv"), p);
    const auto isoRoster = io::readRosterCsv(
        test::writeTemp("staff,2027-10-01,2027-10-02,2027-10-03,2027-10-04,2027-10-05,2027-10-06,2027-10-07\n" + row, ".csv"), p);
    CHECK(dayFirst == isoRoster);
    CHECK(monthFirst == isoRoster);
    CHECK(isoRoster.at(0, 0) == p.task(0, 0));
    CHECK(isoRoster.at(0, 6) == p.task(0, 0));
    // A header of another month names the column that does not fit.
    const std::string path = test::writeTemp("staff,01/11/2027,02/11/2027,03/11/2027,04/11/2027,05/11/2027,06/11/2027,07/11/2027\n" + row, ".csv");
    try {
      io::readRosterCsv(path, p);
      FAIL("a November header was accepted for an October period");
    } catch (const io::InputError& e) {
      CHECK(e.line() == 1);
      CHECK(std::string(e.what()).find("expected date 2027-10-01") != std::string::npos);
    }
  }

  TEST_CASE("roster CSV as a spreadsheet saves our Roster sheet: title, Name column, totals") {
    const auto p = test::loadYaml(kWeek);
    const std::string csv =
        "\"Ward, October  -  2027-10-01 to 2027-10-07\",,,,,,,,,,\n"
        "Name,Id,Fri,Sat,Sun,Mon,Tue,Wed,Thu,,Totals\n"
        ",,10/01/2027,10/02/2027,10/03/2027,10/04/2027,10/05/2027,10/06/2027,10/07/2027,,Hours\n"
        "Ana Example,ana,E,,,,,,E,,16\n"
        ",,,,,,,,,,\n"
        "Legend,,,,,,,,,,\n"
        "E,Early 07:00-15:00,,,,,,,,,\n";
    const auto r = io::readRosterCsv(test::writeTemp(csv, ".csv"), p);
    CHECK(r.at(0, 0) == p.task(0, 0));
    CHECK(r.at(0, 1) == kOff);
    CHECK(r.at(0, 6) == p.task(0, 0));
    // Dates shown as day numbers only cannot be read: the message says what to do.
    const std::string shown = "\"Ward\",,,\nName,Id,Fri,Sat\n,,01 Oct,02,03,04,05,06,07\nAna,ana,E,,,,,,E\n";
    try {
      io::readRosterCsv(test::writeTemp(shown, ".csv"), p);
      FAIL("day numbers were accepted as dates");
    } catch (const io::InputError& e) {
      CHECK(std::string(e.what()).find("give the workbook itself") != std::string::npos);
    }
  }
}
