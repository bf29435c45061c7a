/// @brief buildReport: totals, order and summaries of the report value all outputs render.
#include <doctest/doctest.h>

#include "fixtures.hpp"
#include "report/report.hpp"

using namespace rotaweave;

namespace {

/// Three people over a week; cover and rest hard, hours and a request soft, so one roster
/// breaks rules of both severities for more than one person.
model::Problem reportWard() {
  return test::loadYaml(test::header(7) +
                        "contracts:\n  ft: {hours: {min: 24, max: 40}}\n"
                        "staff:\n  - {id: a, contract: ft, skills: [rn], requests: [{date: 2027-03-02, off: true, weight: 3}]}\n"
                        "  - {id: b, contract: ft, skills: [rn]}\n  - {id: c, contract: ft, skills: [rn]}\n"
                        "demand:\n  - {shift: E, skill: rn, min: 1}\n  - {shift: L, skill: rn, min: 1}\n"
                        "rules:\n  list:\n    - {kind: min-rest, hours: 11, severity: hard}\n");
}

}  // namespace

TEST_SUITE("report") {
  TEST_CASE("the report's totals equal the evaluator's and every breach is summed once") {
    const auto p = reportWard();
    const rules::RuleSet set(p);
    eval::Evaluator ev(set);
    // a: a Late then an Early (quick return) and works the day she asked off; Sunday's Late is
    // uncovered; c works a single shift (below her 24 h minimum).
    const auto roster = test::rosterFrom(p, {"L E E E . . .", "E L L L E E .", ". . . . L L ."});
    const auto report = report::buildReport(p, roster, ev.explain(roster), report::RunInfo{});
    CHECK(report.total == ev.score(roster));
    REQUIRE(report.total.hard > 0);
    REQUIRE(report.total.soft > 0);

    // Hard first.
    bool seenSoft = false;
    int hard = 0;
    for (const auto& b : report.breaches) {
      if (!b.hard) seenSoft = true;
      CHECK_FALSE((b.hard && seenSoft));
      hard += b.hard;
    }
    CHECK(report.hardCount == hard);

    // Rule summaries add up to the totals; person summaries to the breaches with a person.
    rules::Tally byRule, byPerson;
    int counted = 0;
    for (const auto& r : report.byRule) {
      (r.hard ? byRule.hard : byRule.soft) += r.penalty;
      counted += r.count;
    }
    CHECK(byRule == report.total);
    CHECK(counted == static_cast<int>(report.breaches.size()));
    Cost personal = 0;
    for (const auto& b : report.breaches)
      if (b.staff >= 0) personal += b.penalty;
    for (const auto& ps : report.byPerson) byPerson.hard += ps.hard, byPerson.soft += ps.soft;
    CHECK(byPerson.hard + byPerson.soft == personal);
  }

  TEST_CASE("person summaries count shifts, paid hours and weekends from the roster") {
    const auto p = reportWard();
    const rules::RuleSet set(p);
    eval::Evaluator ev(set);
    // 2027-03-01 is a Monday: days 5 and 6 are the weekend.
    const auto roster = test::rosterFrom(p, {"E E . . . L L", "L . . E E . .", ". . . . . . ."});
    const auto report = report::buildReport(p, roster, ev.explain(roster), report::RunInfo{});
    REQUIRE(report.byPerson.size() == 3);
    const auto& a = report.byPerson[0];
    CHECK(a.shiftsWorked == 4);
    CHECK(a.paidMinutes == 4 * 8 * 60);  // Early and Late are 8 h without breaks (fixtures header)
    CHECK(a.weekendsWorked == 1);
    CHECK(a.shiftsByType[0] == 2);
    CHECK(a.shiftsByType[1] == 2);
    CHECK(report.byPerson[1].weekendsWorked == 0);
    CHECK(report.byPerson[2].shiftsWorked == 0);
  }

  TEST_CASE("a roster without breaches gives an empty report with the run info kept") {
    const auto p = test::loadYaml(test::header(2) + "staff:\n  - {id: a, skills: [rn]}\n" "demand:\n  - {shift: E, skill: rn, min: 1}\n");
    const rules::RuleSet set(p);
    eval::Evaluator ev(set);
    const auto roster = test::rosterFrom(p, {"E E"});
    report::RunInfo run;
    run.command = "solve";
    run.seed = 17;
    const auto report = report::buildReport(p, roster, ev.explain(roster), run);
    CHECK(report.breaches.empty());
    CHECK(report.total == rules::Tally{});
    CHECK(report.hardCount == 0);
    CHECK(report.run.command == "solve");
    CHECK(report.run.seed == 17);
  }
}
