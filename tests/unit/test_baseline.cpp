/// @brief check --baseline: the comparison of an edited roster against the one it came from.
#include <doctest/doctest.h>

#include "fixtures.hpp"
#include "report/baseline.hpp"

using namespace rotaweave;

namespace {

model::Problem smallWard() {
  return test::loadYaml(test::header(4) +
                        "staff:\n"
                        "  - {id: a, skills: [rn]}\n"
                        "  - {id: b, skills: [rn]}\n"
                        "demand:\n"
                        "  - {shift: E, skill: rn, min: 1}\n"
                        "rules:\n  list:\n"
                        "    - {kind: max-consecutive-days, days: 2, severity: hard}\n");
}

report::BaselineDiff diffOf(const model::Problem& p, const model::Roster& before, const model::Roster& after) {
  return report::compareWithBaseline(p, before, test::breaches(p, before), after, test::breaches(p, after),
                                     "before.csv");
}

size_t countKind(const std::vector<rules::Breach>& list, const std::string& kind) {
  size_t n = 0;
  for (const auto& b : list) n += b.kind == kind;
  return n;
}

}  // namespace

TEST_SUITE("report") {
  TEST_CASE("baseline: the same roster has no changed cell and no new or gone breach") {
    const model::Problem p = smallWard();
    const model::Roster r = test::rosterFrom(p, {"E E E .", ". . . E"});
    const report::BaselineDiff d = diffOf(p, r, r);
    CHECK(d.cells.empty());
    CHECK(d.people == 0);
    CHECK(d.added.empty());
    CHECK(d.gone.empty());
    CHECK(d.changed.empty());
    CHECK(d.before == d.after);
    CHECK(d.before.hard > 0);  // the run of three is kept, not hidden by the comparison
  }

  TEST_CASE("baseline: an edit that fixes one breach and makes another") {
    const model::Problem p = smallWard();
    // Before: a works three days in a row (hard), day 4 is covered by b.
    const model::Roster before = test::rosterFrom(p, {"E E E .", ". . . E"});
    // After: a's third day goes to b, and b's day 4 is left empty (cover short on day 4).
    const model::Roster after = test::rosterFrom(p, {"E E . .", ". . E ."});
    const report::BaselineDiff d = diffOf(p, before, after);
    REQUIRE(d.cells.size() == 3);
    CHECK(d.people == 2);
    CHECK(d.cells[0].staff == 0);
    CHECK(d.cells[0].day == 2);
    CHECK(d.cells[0].before != kOff);
    CHECK(d.cells[0].after == kOff);
    CHECK(d.cells[1].staff == 1);
    CHECK(d.cells[1].day == 2);
    CHECK(d.cells[2].day == 3);
    CHECK(countKind(d.gone, "max-consecutive-days") == 1);
    CHECK(countKind(d.added, "cover") == 2);  // under the hard minimum and the soft target (= min)
    for (const auto& b : d.added) CHECK(b.days == std::vector<DayIdx>{3});
    CHECK(d.addedHard() == 1);
    CHECK(d.goneHard() == 1);
    CHECK(report::baselineLine(d) == "3 cells changed for 2 people; 2 new breaches (1 hard), 1 gone (1 hard)");
    const std::string text = report::renderBaselineText(d, p);
    CHECK(text.find("BASELINE (against before.csv)") == 0);
    CHECK(text.find("a  2027-03-03  E -> off") != std::string::npos);
    CHECK(text.find("b  2027-03-04  E -> off") != std::string::npos);
  }

  TEST_CASE("baseline: a breach about the same thing by a different amount is changed, not new and gone") {
    const model::Problem p = test::loadYaml(test::header(4) +
                                            "staff:\n"
                                            "  - {id: a, skills: [rn]}\n"
                                            "rules:\n  list:\n"
                                            "    - {kind: max-count, shift: E, count: 1, severity: soft}\n");
    const model::Roster before = test::rosterFrom(p, {"E E E ."});
    const model::Roster after = test::rosterFrom(p, {"E E E E"});
    const report::BaselineDiff d = diffOf(p, before, after);
    CHECK(d.cells.size() == 1);
    CHECK(d.added.empty());
    CHECK(d.gone.empty());
    REQUIRE(d.changed.size() == 1);
    CHECK(d.changed[0].before.kind == "max-count");
    CHECK(d.changed[0].before.amount == 2 * kAmountScale);
    CHECK(d.changed[0].after.amount == 3 * kAmountScale);
    CHECK(report::renderBaselineText(d, p).find("(was 2 shifts, now 3 shifts)") != std::string::npos);
  }
}
