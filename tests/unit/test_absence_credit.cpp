/// @brief Absence credit toward hours rules, absences outside the period, the PyYAML-safe
/// day_off key and the wording of unknown ids.
#include <doctest/doctest.h>

#include "analysis/capacity.hpp"
#include "fixtures.hpp"
#include "io/input_error.hpp"
#include "search/eligibility.hpp"
#include "search/row_refit.hpp"

using namespace rotaweave;
using namespace rotaweave::test;

namespace {

/// 2027-03-01 (Monday) to 2027-03-07 (Sunday): 5 working days. A 40 h contract minimum is
/// then 8 h a day ("common practice": paid leave counts as time worked toward contracted hours).
model::Problem week(const std::string& absences, const std::string& extra = "", const std::string& contract = "{hours: {min: 40, max: 48}}") {
  return loadYaml(header(7) + "contracts:\n  ft: " + contract + "\n" + extra + "staff:\n  - {id: ana, contract: ft, skills: [rn], absences: " +
                  absences + "}\n");
}

std::string loadError(const std::string& yaml) {
  try {
    loadYaml(yaml);
  } catch (const io::InputError& e) {
    return e.what();
  }
  return "";
}

}  // namespace

TEST_SUITE("absence-credit") {
  TEST_CASE("leave credits the usual day toward contract hours; unpaid leave nothing") {
    const auto leave = week("[{from: 2027-03-01, to: 2027-03-03, reason: leave}]");
    CHECK(leave.staff[0].dailyMinutes == 8 * 60);
    CHECK(leave.credit(0) == 24 * 60);
    // Two 8 h shifts + 24 h credited = 40 h: the contract minimum is met.
    CHECK(breaches(leave, rosterFrom(leave, {". . . E E . ."}), "min-hours").empty());
    // Three shifts: 48 h counted, at the maximum; four: 56 h, 8 h over.
    CHECK(breaches(leave, rosterFrom(leave, {". . . E E E ."}), "max-hours").empty());
    const auto over = breaches(leave, rosterFrom(leave, {". . . E E E E"}), "max-hours");
    REQUIRE(over.size() == 1);
    CHECK(over[0].amount == 8 * kAmountScale);
    CHECK(over[0].message == "ana: 32.0 h worked + 24.0 h credited for absences = 56.0 h in the period; at most 48 h allowed");

    const auto unpaid = week("[{from: 2027-03-01, to: 2027-03-03, reason: unpaid}]");
    CHECK(unpaid.credit(0) == 0);
    CHECK(amountOf(unpaid, rosterFrom(unpaid, {". . . E E . ."}), "min-hours") == 24);
  }

  TEST_CASE("weekend days and holidays credit nothing; sick and unlisted reasons the usual day") {
    const auto p = week("[{from: 2027-03-05, to: 2027-03-07, reason: sick}, {date: 2027-03-02}]");
    // Friday credited, Saturday and Sunday not; the reason-less Tuesday counts the usual day.
    CHECK(p.credit(0) == 16 * 60);
    const auto h = loadYaml(header(7) + "holidays: [2027-03-02]\ncontracts:\n  ft: {hours: {min: 32}}\n"
                            "staff:\n  - {id: ana, contract: ft, skills: [rn], absences: [{from: 2027-03-01, to: 2027-03-02}]}\n");
    // 4 working days (the holiday is not one): 8 h each, and only Monday is credited.
    CHECK(h.credit(0) == 8 * 60);
  }

  TEST_CASE("absence_credit sets hours per reason; daily_hours sets the usual day") {
    const auto p = week("[{from: 2027-03-01, to: 2027-03-02, reason: training}, {date: 2027-03-03, reason: leave}]",
                        "absence_credit: {training: 6, leave: daily}\n", "{hours: {min: 40}, daily_hours: 7.5}");
    CHECK(p.staff[0].dailyMinutes == 450);
    CHECK(p.credit(0) == 2 * 360 + 450);
    const auto zero = week("[{date: 2027-03-01, reason: leave}]", "absence_credit: {leave: 0}\n");
    CHECK(zero.credit(0) == 0);
    CHECK(loadError(header(7) + "absence_credit: {leave: lots}\nstaff:\n  - {id: ana, skills: [rn]}\n").find("expected a number") !=
          std::string::npos);
  }

  TEST_CASE("a whole period away credits exactly the contract minimum, whatever the rounding") {
    // March 2027: 23 working days; 150 h / 23 is not a whole number of minutes.
    const auto p = loadYaml(header(31) + "contracts:\n  ft: {hours: {min: 150, max: 168}}\n"
                            "staff:\n  - {id: ana, contract: ft, skills: [rn], absences: [{from: 2027-03-01, to: 2027-03-31, reason: leave}]}\n");
    CHECK(p.credit(0) == 150 * 60);
    const model::Roster off(p.staffCount(), p.days);
    CHECK(breaches(p, off, "min-hours").empty());
  }

  TEST_CASE("credit_absences: false and rolling windows count hours worked only") {
    const auto p = week("[{from: 2027-03-01, to: 2027-03-03, reason: leave}]", "",
                        "{hours: {min: 40}}\nrules:\n  list:\n    - {kind: max-hours, hours: 30, credit_absences: false}\n"
                        "    - {kind: max-hours, hours: 16, window_days: 3}\n");
    const auto roster = rosterFrom(p, {". . . E E E ."});
    const auto b = breaches(p, roster, "max-hours");
    REQUIRE(b.size() == 1);  // 24 h worked: under 30; the rolling 3 days hold 24 h: 8 h over
    CHECK(b[0].ruleId == "max-hours");
    CHECK(b[0].windowFirst >= 3);
    CHECK(b[0].windowLast == b[0].windowFirst + 2);
    CHECK(loadError(header(7) + "staff:\n  - {id: ana, skills: [rn]}\nrules:\n  list:\n"
                    "    - {kind: max-hours, hours: 16, window_days: 3, credit_absences: true}\n")
              .find("rolling window counts hours worked") != std::string::npos);
  }

  TEST_CASE("capacity: contract minimums count the credit") {
    const auto p = week("[{from: 2027-03-01, to: 2027-03-05, reason: leave}]");
    const auto r = analysis::analyseCapacity(p);
    CHECK(r.people.empty());  // the week's 40 h are all credited: nothing to work
    CHECK(r.totals.contractMin == 0);
    CHECK(r.bounds.contractHard == 0);
    const auto unpaid = week("[{from: 2027-03-01, to: 2027-03-05, reason: unpaid}]", "", "{hours: {min: 40}, severity: hard}");
    const auto u = analysis::analyseCapacity(unpaid);
    REQUIRE(u.people.size() == 1);
    CHECK(u.people[0].neededMinutes == 40 * 60);
  }

  TEST_CASE("the row re-fit keeps the credited bounds: its rows meet the hard period hours") {
    // Leave Monday to Wednesday credits 24 h; hard min 40 and max 48 leave 16 to 24 h to work.
    const auto p = week("[{from: 2027-03-01, to: 2027-03-03, reason: leave}]", "", "{hours: {min: 40, max: 48}, severity: hard}");
    rules::RuleSet rs(p);
    search::Eligibility el(p);
    eval::Evaluator ev(rs);
    model::Roster empty(p.staffCount(), p.days);
    ev.load(empty);
    search::RowRefit refit(rs, el);
    search::RowChange change;
    REQUIRE(refit.refit(ev, 0, 0, p.days, nullptr, 1000.0, change));
    model::Roster after = empty;
    search::writeRowChange(after, change);
    CHECK(breaches(p, after, "min-hours").empty());
    CHECK(breaches(p, after, "max-hours").empty());
  }

  TEST_CASE("absences outside the period: wholly outside an error, partly outside clipped with a note") {
    const std::string err = loadError(header(7) + "staff:\n  - {id: ana, skills: [rn], absences: [{from: 2027-04-01, to: 2027-04-05}]}\n");
    CHECK(err.find("outside the period 2027-03-01 to 2027-03-07") != std::string::npos);
    CHECK(err.find("wrong month or year") != std::string::npos);
    const auto p = loadYaml(header(7) + "staff:\n  - {id: ana, skills: [rn], absences: [{from: 2027-02-25, to: 2027-03-02, reason: leave}]}\n");
    REQUIRE(p.notes.size() == 1);
    CHECK(p.notes[0].find("only 2027-03-01 to 2027-03-02 count") != std::string::npos);
    CHECK(p.absent[p.cell(0, 0)] == 1);
    CHECK(p.absent[p.cell(0, 2)] == 0);
  }

  TEST_CASE("day_off survives YAML 1.1 tools; their false: key gets an explanation") {
    const auto p = loadYaml(header(7) + "staff:\n  - {id: ana, skills: [rn], requests: [{date: 2027-03-02, day_off: true}],"
                            " fixed: [{date: 2027-03-03, day_off: true}]}\n");
    REQUIRE(p.staff[0].requests.size() == 1);
    CHECK(p.staff[0].requests[0].kind == model::Request::Kind::Off);
    CHECK(p.fixed[p.cell(0, 2)] == kOff);
    const std::string err = loadError(header(7) + "staff:\n  - id: ana\n    skills: [rn]\n    requests:\n    - date: 2027-03-02\n      false: true\n");
    CHECK(err.find("PyYAML") != std::string::npos);
    CHECK(err.find("day_off: true") != std::string::npos);
    CAPTURE(err);
    CHECK(err.find(":13:") != std::string::npos);  // the line of the false: key
  }

  TEST_CASE("unknown shift ids list the known ones") {
    const std::string err = loadError(header(7) + "staff:\n  - {id: ana, skills: [rn], fixed: [{date: 2027-03-02, shift: X}]}\n");
    CHECK(err.find("unknown shift 'X'") != std::string::npos);
    CHECK(err.find("known shifts: E, L, N") != std::string::npos);
    // PyYAML writes an unquoted `off` in a history list back as false.
    const std::string history = loadError(header(7) + "staff:\n  - {id: ana, skills: [rn], history: [E, false]}\n");
    CHECK(history.find("write 'off' in quotes") != std::string::npos);
  }
}
