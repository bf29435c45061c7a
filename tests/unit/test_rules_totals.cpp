/// @brief Hours, counts, weekends and weekly rest on hand-built rows.
#include <doctest/doctest.h>

#include "fixtures.hpp"

using namespace rotaweave;
using namespace rotaweave::test;

namespace {

model::Problem withRules(int days, const std::string& rules, const std::string& person = "{id: ana, skills: [rn]}",
                         const std::string& shifts = "") {
  return loadYaml(header(days, shifts) + "staff:\n  - " + person + "\nrules:\n  list:\n" + rules);
}

}  // namespace

TEST_SUITE("rules") {
  TEST_CASE("max-hours per period and contract hours bounds") {
    const auto p = loadYaml(header(7) +
                            "contracts:\n  part: {hours: {min: 24, max: 32}}\n"
                            "staff:\n  - {id: ana, contract: part, skills: [rn]}\n");
    // 5 shifts of 8 h = 40 h: 8 h over the contract's 32 (soft, 1 per hour).
    const auto over = breaches(p, rosterFrom(p, {"E E E E E . ."}), "max-hours");
    REQUIRE(over.size() == 1);
    CHECK(over[0].ruleId == "contract-part-max-hours");
    CHECK(over[0].amount == 8 * kAmountScale);
    CHECK(over[0].penalty == 8 * kCostScale);
    CHECK(!over[0].hard);
    CHECK(amountOf(p, rosterFrom(p, {"E E . . . . ."}), "min-hours") == 8);
  }

  TEST_CASE("EU-06: max 48 h in any 7 days, as a rolling window") {
    // Directive 2003/88/EC Art. 6(b) (EU-06) limits the *average* to 48 h; a rolling 7-day
    // window is the stricter, common roster simplification.
    const std::string shift12 = "  - {id: D, start: \"07:00\", end: \"19:00\"}\n";
    const auto p = withRules(10, "    - {kind: max-hours, hours: 48, window_days: 7}\n", "{id: ana, skills: [rn]}", shift12);
    CHECK(breaches(p, rosterFrom(p, {"D D D D . . . D D D"}), "max-hours").empty());  // 48 h
    const auto b = breaches(p, rosterFrom(p, {"D D D D D . . . . ."}), "max-hours");      // 60 h in every window holding all 5
    REQUIRE(b.size() == 1);  // the overlapping windows merge into one breach
    CHECK(b[0].amount == 12 * kAmountScale);
  }

  TEST_CASE("min-hours over a rolling window ignores windows cut by the period start") {
    const auto p = withRules(9, "    - {kind: min-hours, hours: 16, window_days: 7}\n");
    // Windows starting day 0, 1, 2: E on day 0 and 8 only; windows 1..7 start at day 1 and hold 0 h.
    const auto b = breaches(p, rosterFrom(p, {"E . . . . . . . E"}), "min-hours");
    REQUIRE(b.size() == 1);
    CHECK(b[0].amount == 16 * kAmountScale);  // the worst window (days 1-7) has 0 h
  }

  TEST_CASE("max-count and min-count of a shift, and of all shifts") {
    const auto p = withRules(7,
                             "    - {kind: max-count, shift: N, count: 2}\n"
                             "    - {kind: min-count, count: 5, severity: soft, weight: 2}\n");
    const auto r = rosterFrom(p, {"N N N E . . ."});
    CHECK(amountOf(p, r, "max-count") == 1);
    const auto b = breaches(p, r, "min-count");
    REQUIRE(b.size() == 1);
    CHECK(b[0].amount == kAmountScale);
    CHECK(b[0].penalty == 2 * kCostScale);
  }

  TEST_CASE("max-weekends and complete-weekends") {
    // 2027-03-01 is a Monday: weekends are days 5-6, 12-13, 19-20.
    const auto p = withRules(21,
                             "    - {kind: max-weekends, count: 1}\n"
                             "    - {kind: complete-weekends, severity: soft}\n");
    const auto r = rosterFrom(p, {". . . . . E E . . . . . E . . . . . . . E"});
    const auto mw = breaches(p, r, "max-weekends");
    REQUIRE(mw.size() == 1);
    CHECK(mw[0].amount == 2 * kAmountScale);  // 3 weekends worked
    CHECK(mw[0].days == std::vector<DayIdx>{5, 6, 12, 20});
    CHECK(amountOf(p, r, "complete-weekends") == 2);  // the 2nd and 3rd are half worked
  }

  TEST_CASE("a night starting on Friday belongs to Friday, not the weekend (CAL-07)") {
    // CAL-07 (common practice): a shift belongs to the date on which it starts.
    const auto p = withRules(7, "    - {kind: max-weekends, count: 0}\n");
    CHECK(breaches(p, rosterFrom(p, {". . . . N . ."}), "max-weekends").empty());
  }

  TEST_CASE("weekly-rest: EU 35 h against UK 24 h for the same roster") {
    // Labour-facts check 4: last shift ends Sunday 06:00, next starts Monday 06:00: 24 h free.
    // Passes the UK 24 h per 7 days (UK-03), fails the EU 24 + 11 = 35 h (EU-05a).
    const std::string shifts = "  - {id: X, start: \"22:00\", end: \"06:00\"}\n  - {id: M, start: \"06:00\", end: \"14:00\"}\n";
    // History: a night on the Sunday before, so the week does not open with unbounded rest.
    const std::string person = "{id: ana, skills: [rn], history: [X]}";
    const std::string row = "X X X X X X . M . . . . . .";  // nights Mon-Sat end Sun 06:00; M on Monday 06:00
    const auto uk = withRules(14, "    - {kind: weekly-rest, hours: 24}\n", person, shifts);
    const auto eu = withRules(14, "    - {kind: weekly-rest, hours: 35}\n", person, shifts);
    CHECK(breaches(uk, rosterFrom(uk, {row}), "weekly-rest").empty());
    const auto b = breaches(eu, rosterFrom(eu, {row}), "weekly-rest");
    REQUIRE(b.size() == 1);
    CHECK(b[0].amount == 11 * kAmountScale);
    CHECK(b[0].days.front() == 0);
    CHECK(b[0].message.find("is 24.0 h; the rule needs 35 h") != std::string::npos);
  }

  TEST_CASE("weekly-rest: Monday to Saturday 08:00-16:00 leaves 40 h and passes 35 h") {
    // Labour-facts check 5 (EU-05a): free block Saturday 16:00 to Monday 08:00 = 40 h.
    const std::string shifts = "  - {id: W, start: \"08:00\", end: \"16:00\"}\n";
    const auto p = withRules(14, "    - {kind: weekly-rest, hours: 35}\n", "{id: ana, skills: [rn], history: [W]}", shifts);
    CHECK(breaches(p, rosterFrom(p, {"W W W W W W . W W W W W W ."}), "weekly-rest").empty());
  }
}
