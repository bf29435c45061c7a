/// @brief Run-length rules: consecutive days, shifts, days off and recovery after nights.
#include <doctest/doctest.h>

#include "fixtures.hpp"

using namespace rotaweave;
using namespace rotaweave::test;

namespace {

model::Problem withRule(int days, const std::string& rule, const std::string& person = "{id: ana, skills: [rn]}") {
  return loadYaml(header(days) + "staff:\n  - " + person + "\nrules:\n  list:\n    - " + rule + "\n");
}

}  // namespace

TEST_SUITE("rules") {
  TEST_CASE("max-consecutive-days: amount is the days beyond the bound") {
    const auto p = withRule(10, "{kind: max-consecutive-days, days: 6}");
    CHECK(amountOf(p, rosterFrom(p, {"E E E E E E . E E E"}), "max-consecutive-days") == 0);
    const auto b = breaches(p, rosterFrom(p, {"E E E E E E E E . ."}), "max-consecutive-days");
    REQUIRE(b.size() == 1);
    CHECK(b[0].amount == 2 * kAmountScale);
    CHECK(b[0].days.size() == 8);
    CHECK(b[0].message == "ana: works 8 days in a row, from 2027-03-01 to 2027-03-08; at most 6 allowed");
  }

  TEST_CASE("max-consecutive-days: history days count toward the run") {
    const auto p = withRule(5, "{kind: max-consecutive-days, days: 6}", "{id: ana, skills: [rn], history: [E, E, E, E, E]}");
    // 5 history days + 3 in the period = 8 in a row.
    CHECK(amountOf(p, rosterFrom(p, {"E E E . ."}), "max-consecutive-days") == 2);
  }

  TEST_CASE("EU-05c: twelve days in a row with a rest day in each 7-day block passes weekly rest but not OH-06") {
    // CJEU C-306/16 (EU-05c): days off on Monday of week 1 and Sunday of week 2 leave 12 working
    // days between them, and each 7-day period still holds a rest day. HSE/SWA guidance (OH-06)
    // limits runs to 5-7 days, so a max-consecutive-days 7 guidance rule still fires.
    const auto p = loadYaml(header(14) +
                            "staff:\n  - {id: ana, skills: [rn]}\nrules:\n  list:\n"
                            "    - {kind: weekly-rest, hours: 24}\n"
                            "    - {kind: max-consecutive-days, days: 7, severity: soft}\n");
    const auto r = rosterFrom(p, {". E E E E E E E E E E E E ."});
    CHECK(breaches(p, r, "weekly-rest").empty());
    CHECK(amountOf(p, r, "max-consecutive-days") == 5);
  }

  TEST_CASE("min-consecutive-days: short runs inside the period, edges exempt without history") {
    const auto p = withRule(10, "{kind: min-consecutive-days, days: 3}");
    // Run of 1 at the start (exempt), run of 2 in the middle (1 short), run of 1 at the end (exempt).
    const auto b = breaches(p, rosterFrom(p, {"E . E E . . . . . E"}), "min-consecutive-days");
    REQUIRE(b.size() == 1);
    CHECK(b[0].amount == kAmountScale);
    CHECK(b[0].days == std::vector<DayIdx>{2, 3});
  }

  TEST_CASE("min-consecutive-days: with history, a run at the start is judged with its history part") {
    const auto p = withRule(6, "{kind: min-consecutive-days, days: 3}", "{id: ana, skills: [rn], history: [off, E]}");
    // History ends with 1 worked day; day 0 worked, day 1 off: a run of 2 that does not touch the oldest history day.
    CHECK(amountOf(p, rosterFrom(p, {"E . . . . ."}), "min-consecutive-days") == 1);
  }

  TEST_CASE("max-consecutive and min-consecutive of one shift") {
    // OH-02: HSE suggests 2-3 nights in a row, SWA 3-4; 5 nights exceed a preset of 3 by 2.
    const auto p = withRule(9, "{kind: max-consecutive, shift: N, count: 3, severity: soft, weight: 10}");
    const auto b = breaches(p, rosterFrom(p, {"N N N N N . . . ."}), "max-consecutive");
    REQUIRE(b.size() == 1);
    CHECK(b[0].amount == 2 * kAmountScale);
    CHECK(b[0].penalty == 20 * kCostScale);
    const auto q = withRule(9, "{kind: min-consecutive, shift: N, count: 2}");
    CHECK(amountOf(q, rosterFrom(q, {". N . N N . . N ."}), "min-consecutive") == 2);  // two single nights, 1 short each
  }

  TEST_CASE("min-consecutive-off: single days off between work, edges exempt") {
    const auto p = withRule(8, "{kind: min-consecutive-off, days: 2}");
    CHECK(amountOf(p, rosterFrom(p, {". E . E E . . E"}), "min-consecutive-off") == 1);
  }

  TEST_CASE("days-off-after: recovery after a night series (OH-03)") {
    // OH-03: at least 2 full nights' sleep after the last night (HSE, SWA).
    const auto p = withRule(8, "{kind: days-off-after, shift: N, days: 2}");
    CHECK(amountOf(p, rosterFrom(p, {"N N . E . . . ."}), "days-off-after") == 1);
    CHECK(amountOf(p, rosterFrom(p, {"N N E . . . . ."}), "days-off-after") == 2);
    CHECK(amountOf(p, rosterFrom(p, {"N N . . E . . ."}), "days-off-after") == 0);
    // The period ends before the recovery can be judged: not penalised.
    CHECK(amountOf(p, rosterFrom(p, {". . . . . . N N"}), "days-off-after") == 0);
  }

  TEST_CASE("OH-03 check value: 25 h after the last night fails a 2-night recovery, 49 h passes") {
    // Labour-facts check 10 (HSE; SWA): last Night ends Thursday 06:00 and the next Early starts
    // Friday 07:00 (25 h, one night's sleep): fails; an Early on Saturday 07:00 (49 h) passes.
    const auto p = withRule(7, "{kind: days-off-after, shift: N, days: 2}");
    // 2027-03-01 is a Monday: Nights on Tuesday and Wednesday end Thursday 06:00.
    CHECK(amountOf(p, rosterFrom(p, {". N N . E . ."}), "days-off-after") == 1);
    CHECK(amountOf(p, rosterFrom(p, {". N N . . E ."}), "days-off-after") == 0);
  }
}
