/// @brief Capacity analysis: planted impossibilities are diagnosed exactly, feasible scenarios
/// report none, and the bounds never exceed what the solver actually reaches.
#include <doctest/doctest.h>

#include <limits>
#include <string>

#include "analysis/capacity.hpp"
#include "eval/evaluator.hpp"
#include "fixtures.hpp"
#include "rules/rule_set.hpp"
#include "search/solver.hpp"

using namespace rotaweave;
using analysis::Missing;

namespace {

// One week from Monday 2027-03-08; two 8-hour paid shifts.
const std::string kHead = R"(name: capacity test
period: {start: 2027-03-08, end: 2027-03-14}
shifts:
  - {id: E, start: "07:00", end: "15:30", break_minutes: 30}
  - {id: N, start: "22:00", end: "06:30", break_minutes: 30}
skills: [rn, hca]
)";

/// Every rn on leave on 2027-03-10; E rn needs one a day.
const std::string kAllOnLeave = kHead + R"(staff:
  - {id: ana, skills: [rn], absences: [{from: 2027-03-09, to: 2027-03-10, reason: leave}]}
  - {id: ben, skills: [rn], absences: [{date: 2027-03-10, reason: sick}]}
  - {id: cat, skills: [hca]}
demand:
  - {shift: E, skill: rn, min: 1}
  - {shift: E, skill: hca, min: 1}
)";

/// Three rn, two absent on 2027-03-12: no single slot is short, but E and N cannot both be staffed.
const std::string kTwoAbsent = kHead + R"(staff:
  - {id: ana, skills: [rn], absences: [{date: 2027-03-12}]}
  - {id: ben, skills: [rn], absences: [{date: 2027-03-12}]}
  - {id: cat, skills: [rn]}
demand:
  - {shift: E, skill: rn, min: 1, target: 2}
  - {shift: N, skill: rn, min: 1}
)";

/// dee's contract asks 40 h but she is away four of seven days (8 h shifts: at most 24 h).
const std::string kContract = kHead + R"(contracts:
  week: {hours: {min: 40}, severity: hard}
  flexible: {hours: {min: 40}}
staff:
  - {id: dee, contract: week, skills: [rn], absences: [{from: 2027-03-08, to: 2027-03-10, reason: unpaid}],
     fixed: [{date: 2027-03-14, off: true}]}
  - {id: eve, contract: flexible, skills: [rn], absences: [{from: 2027-03-08, to: 2027-03-13, reason: unpaid}]}
  - {id: fay, contract: week, skills: [rn]}
demand:
  - {shift: E, skill: rn, min: 1}
)";

const std::string kFeasible = kHead + R"(contracts:
  part: {hours: {min: 16, max: 40}, severity: hard}
staff:
  - {id: ana, contract: part, skills: [rn], absences: [{date: 2027-03-10}]}
  - {id: ben, contract: part, skills: [rn, hca]}
  - {id: cat, contract: part, skills: [hca], fixed: [{date: 2027-03-09, shift: E}]}
  - {id: dee, skills: [rn]}
demand:
  - {shift: E, skill: rn, min: 1, target: 1}
  - {shift: N, skill: rn, min: 1}
  - {shift: E, skill: hca, min: 1}
rules:
  list:
    - {kind: min-rest, hours: 11}
)";

std::vector<std::string> ids(const model::Problem& p, const std::vector<Missing>& missing) {
  std::vector<std::string> out;
  for (const auto& m : missing) out.push_back(p.staff[static_cast<size_t>(m.staff)].id);
  return out;
}

search::SolverOptions quickOptions() {
  search::SolverOptions o;
  // Bounded by work, not time: a roster near the bounds makes the check sharp, and these
  // tiny scenarios reach one in a few generations of short local searches.
  o.timeLimit = 600;
  o.generations = 8;
  o.localSearchMoves = 20000;
  o.threads = 1;
  o.islands = 2;
  o.seed = 7;
  o.quiet = true;
  return o;
}

}  // namespace

TEST_SUITE("analysis") {
  TEST_CASE("a day when every qualified person is on leave is diagnosed with names and numbers") {
    const auto p = test::loadYaml(kAllOnLeave);
    const auto r = analysis::analyseCapacity(p);
    REQUIRE(r.cells.size() == 1);
    const auto& c = r.cells.front();
    CHECK(p.dateText(c.day) == "2027-03-10");
    CHECK(c.task == p.task(p.findShift("E"), p.findSkill("rn")));
    CHECK_FALSE(c.target);
    CHECK(c.hard);
    CHECK(c.needed == 1);
    CHECK(c.available == 0);
    CHECK(ids(p, c.missing) == std::vector<std::string>{"ana", "ben"});
    CHECK(c.missing[0].why == Missing::Why::Absent);
    CHECK(c.missing[0].reason == "leave");
    CHECK(analysis::describe(c, p) == "2027-03-10 E rn: need 1, at most 0 available (ana and ben absent)");
    CHECK(r.days.empty());  // the day's gap is the slot's gap
    CHECK(r.people.empty());
    CHECK(r.bounds.coverUnits == 1);
    CHECK(r.bounds.coverHard == kCostScale);
    CHECK(r.bounds.hard == kCostScale);
    CHECK(r.anyUnavoidable());
  }

  TEST_CASE("two people absent: the day cannot staff both shifts although each slot alone can") {
    const auto p = test::loadYaml(kTwoAbsent);
    const auto r = analysis::analyseCapacity(p);
    REQUIRE(r.days.size() == 1);
    const auto& d = r.days.front();
    CHECK(p.dateText(d.day) == "2027-03-12");
    CHECK(d.needed == 2);
    CHECK(d.fillable == 1);
    CHECK(d.shortBy() == 1);
    CHECK(ids(p, d.missing) == std::vector<std::string>{"ana", "ben"});
    // Only the target of E rn is short at slot level that day (2 wanted, at most 1 available).
    REQUIRE(r.cells.size() == 1);
    CHECK(r.cells.front().target);
    CHECK_FALSE(r.cells.front().hard);
    CHECK(r.cells.front().needed == 2);
    CHECK(r.cells.front().available == 1);
    CHECK(r.bounds.coverUnits == 1);
    CHECK(r.bounds.hard == kCostScale);
    const std::string text = analysis::describe(d, p);
    CHECK(text.find("2027-03-12") == 0);
    CHECK(text.find("need 2 people, at most 1 can be placed") != std::string::npos);
    CHECK(text.find("ana and ben absent") != std::string::npos);
    // Soft: targets sum to 3 a day; on 2027-03-12 cat alone fills at most one of them, so two
    // target slots stay empty unless someone is called in (a hard breach).
    CHECK(r.targetGap[4] == 2);
    CHECK(r.bounds.coverSoftIfNoHard == 2 * kCostScale);
  }

  TEST_CASE("a person holding two skills is counted once a day (matching, not sums)") {
    const auto p = test::loadYaml(kHead + R"(staff:
  - {id: ana, skills: [rn, hca]}
  - {id: ben, skills: [rn], absences: [{date: 2027-03-11}]}
demand:
  - {shift: E, skill: rn, min: 1}
  - {shift: E, skill: hca, min: 1}
)");
    const auto r = analysis::analyseCapacity(p);
    CHECK(r.cells.empty());  // each slot has someone
    REQUIRE(r.days.size() == 1);
    CHECK(p.dateText(r.days.front().day) == "2027-03-11");
    CHECK(r.days.front().fillable == 1);
    CHECK(ids(p, r.days.front().missing) == std::vector<std::string>{"ben"});
  }

  TEST_CASE("a contract minimum above what the available days allow") {
    const auto p = test::loadYaml(kContract);
    const auto r = analysis::analyseCapacity(p);
    REQUIRE(r.people.size() == 2);
    const auto& dee = r.people[0];
    CHECK(p.staff[static_cast<size_t>(dee.staff)].id == "dee");
    CHECK(dee.hard);
    CHECK(dee.neededMinutes == 40 * 60);
    CHECK(dee.availableDays == 3);
    CHECK(dee.longestMinutes == 8 * 60);
    CHECK(dee.possibleMinutes == 24 * 60);
    CHECK(dee.shortMinutes() == 16 * 60);
    CHECK(dee.absentDays.size() == 3);
    CHECK(dee.fixedOffDays.size() == 1);
    CHECK(analysis::describe(dee, p) ==
          "dee: contract week asks at least 40 h, at most 24 h possible on 3 available days (longest shift 8 h; "
          "absent 2027-03-08..2027-03-10; fixed off 2027-03-14)");
    const auto& eve = r.people[1];
    CHECK(p.staff[static_cast<size_t>(eve.staff)].id == "eve");
    CHECK_FALSE(eve.hard);
    CHECK(eve.possibleMinutes == 8 * 60);
    CHECK(r.cells.empty());
    CHECK(r.days.empty());
    // 16 h short at 1 point an hour, or two called-in days at 1 point each: the bound is 2 points.
    CHECK(r.bounds.contractHard == 2 * kCostScale);
    CHECK(r.bounds.coverHard == 0);
    CHECK(r.bounds.hard == 2 * kCostScale);
  }

  TEST_CASE("a feasible scenario reports no shortfall and zero bounds") {
    const auto p = test::loadYaml(kFeasible);
    const auto r = analysis::analyseCapacity(p);
    CHECK(r.cells.empty());
    CHECK(r.days.empty());
    CHECK(r.people.empty());
    CHECK_FALSE(r.anyUnavoidable());
    CHECK(r.bounds.hard == 0);
    CHECK(r.bounds.coverSoftIfNoHard == 0);
    const std::string text = analysis::renderCapacityText(r, p);
    CHECK(text.find("No unavoidable shortfall") != std::string::npos);
  }

  TEST_CASE("breaches are tagged: only the proven units are unavoidable") {
    const auto p = test::loadYaml(kAllOnLeave);
    // Nobody works: E rn and E hca are short every day, but only 2027-03-10 E rn is unavoidable.
    const model::Roster empty(p.staffCount(), p.days);
    const auto all = test::breaches(p, empty);
    const auto tags = analysis::unavoidable(analysis::analyseCapacity(p), p, empty, all);
    REQUIRE(tags.size() == all.size());
    int proven = 0;
    for (size_t i = 0; i < all.size(); ++i) {
      if (!tags[i]) continue;
      ++proven;
      CHECK(all[i].kind == "cover");
      CHECK(all[i].message.find("2027-03-10 E rn:") == 0);
    }
    CHECK(proven == 1);

    // Calling ben in on his sick day fills the slot; that absence breach is the unavoidable one.
    const auto called = test::rosterFrom(p, {". . . . . . .", "E E E E E E E", ". . E/hca . . . ."});
    const auto list = test::breaches(p, called);
    auto cap = analysis::analyseCapacity(p);
    analysis::compareWithRoster(cap, p, called, list);
    REQUIRE(cap.roster);
    int un = 0;
    for (const auto& tag : cap.roster->tags) {
      if (!tag.unavoidable) continue;
      ++un;
      CHECK(list[tag.breach].kind == "absence");
      CHECK(tag.cause.find("ben is called in") == 0);
      CHECK(tag.remedy.find("from outside") != std::string::npos);
    }
    CHECK(un == 1);
    // cat works only on 2027-03-10: the E hca breaches of the other days are avoidable (cat is free).
    bool sawAvoidable = false;
    for (const auto& tag : cap.roster->tags)
      if (!tag.unavoidable && list[tag.breach].kind == "cover") {
        sawAvoidable = true;
        CHECK(tag.cause.find("cat") != std::string::npos);
      }
    CHECK(sawAvoidable);
  }

  TEST_CASE("report text and JSON carry the shortfall, the bound and the roster's figure") {
    const auto p = test::loadYaml(kAllOnLeave);
    const model::Roster r0 = test::rosterFrom(p, {"E . . E E E E", "E E . E E E E", "E E E E E E E"});
    auto cap = analysis::analyseCapacity(p);
    analysis::compareWithRoster(cap, p, r0, test::breaches(p, r0));
    const std::string text = analysis::renderCapacityText(cap, p);
    CHECK(text.find("[hard] 2027-03-10 E rn: need 1, at most 0 available (ana and ben absent)") != std::string::npos);
    CHECK(text.find("Lower bound on the hard penalty: 1") != std::string::npos);
    CHECK(text.find("this roster has 1") != std::string::npos);
    CHECK(text.find("1 unavoidable, 0 avoidable") != std::string::npos);
    const std::string json = analysis::renderCapacityJson(cap, p);
    CHECK(json.find("\"type\": \"slot\"") != std::string::npos);
    CHECK(json.find("\"dates\": [\"2027-03-10\"], \"shift\": \"E\", \"skill\": \"rn\"") != std::string::npos);
    CHECK(json.find("\"needed\": 1, \"available\": 0, \"short\": 1") != std::string::npos);
    CHECK(json.find("{\"staff\": \"ana\", \"why\": \"absent\", \"reason\": \"leave\"}") != std::string::npos);
    CHECK(json.find("\"bounds\": {\"hard\": 1,") != std::string::npos);
    CHECK(json.find("\"unavoidable\": true") != std::string::npos);
  }

  TEST_CASE("the bounds never exceed what the solver reaches") {
    const std::string withRules = kHead + R"(contracts:
  full: {hours: {min: 32, max: 48}, severity: hard}
staff:
  - {id: ana, contract: full, skills: [rn], absences: [{from: 2027-03-11, to: 2027-03-14}]}
  - {id: ben, contract: full, skills: [rn, hca], absences: [{date: 2027-03-13}]}
  - {id: cat, skills: [hca], fixed: [{date: 2027-03-13, shift: E}]}
  - {id: dee, contract: full, skills: [rn], absences: [{from: 2027-03-12, to: 2027-03-13}]}
demand:
  - {shift: E, skill: rn, min: 1, target: 2}
  - {shift: N, skill: rn, min: 1}
  - {shift: E, skill: hca, min: 1, target: 1}
rules:
  list:
    - {kind: min-rest, hours: 11}
    - {kind: max-consecutive-days, days: 5}
)";
    for (const std::string& yaml : {kAllOnLeave, kTwoAbsent, kContract, kFeasible, withRules}) {
      const auto p = test::loadYaml(yaml);
      const rules::RuleSet ruleSet(p);
      const auto result = search::solve(ruleSet, quickOptions(), {}, nullptr);
      auto cap = analysis::analyseCapacity(p);
      CAPTURE(p.staff.front().id);
      CHECK(cap.bounds.hard <= result.score.hard);
      eval::Evaluator evaluator(ruleSet);
      const auto list = evaluator.explain(result.best);
      analysis::compareWithRoster(cap, p, result.best, list);
      REQUIRE(cap.roster);
      CHECK(cap.roster->hard == result.score.hard);
      CHECK(cap.roster->coverSoftBound <= cap.roster->coverSoft);
      CHECK(cap.bounds.coverUnits >= 0);
    }
  }
}

namespace {

/// Soft penalty of the roster's cover-target breaches ("N wanted"), as compareWithRoster counts it.
Cost coverTargetSoft(const std::vector<rules::Breach>& list) {
  Cost total = 0;
  for (const auto& b : list)
    if (b.kind == "cover" && !b.hard && b.message.find(" wanted") != std::string::npos && b.message.find("at most") == std::string::npos)
      total += b.penalty;
  return total;
}

/// Every roster of a tiny scenario: the hard bound is at most every roster's hard total, and the
/// soft bound for a roster's hard total is at most its cover-target penalty.
void checkExhaustively(const std::string& yaml) {
  const auto p = test::loadYaml(yaml);
  const rules::RuleSet ruleSet(p);
  eval::Evaluator evaluator(ruleSet);
  const auto cap = analysis::analyseCapacity(p);
  const size_t cells = static_cast<size_t>(p.staffCount()) * static_cast<size_t>(p.days);
  model::Roster r(p.staffCount(), p.days);
  Cost bestHard = std::numeric_limits<Cost>::max();
  long rosters = 0;
  for (;;) {
    const Cost hard = evaluator.score(r).hard;
    bestHard = std::min(bestHard, hard);
    const Cost softBound = cap.coverSoftBound(hard);
    if (softBound > 0) {
      const Cost soft = coverTargetSoft(evaluator.explain(r));
      if (softBound > soft) {
        FAIL_CHECK("soft bound " << softBound << " above " << soft);
        return;
      }
    }
    ++rosters;
    size_t i = 0;  // next roster: count in base taskCount over the cells
    while (i < cells && ++r.cells[i] == p.taskCount()) r.cells[i++] = kOff;
    if (i == cells) break;
  }
  CAPTURE(rosters);
  CHECK(cap.bounds.hard <= bestHard);
  CHECK(cap.bounds.hard > 0);  // the scenarios below are built to be short
}

const std::string kTiny = R"(name: tiny
period: {start: 2027-03-08, end: 2027-03-09}
shifts:
  - {id: E, start: "07:00", end: "15:30", break_minutes: 30}
  - {id: N, start: "22:00", end: "06:30", break_minutes: 30}
skills: [rn, hca]
)";

}  // namespace

TEST_SUITE("analysis") {
  TEST_CASE("bounds hold against every roster of tiny scenarios") {
    SUBCASE("leave, a fixed night and a hard contract") {
      checkExhaustively(kTiny + R"(contracts:
  two: {hours: {min: 16}, severity: hard}
staff:
  - {id: ana, contract: two, skills: [rn], absences: [{date: 2027-03-08}]}
  - {id: ben, skills: [rn, hca], fixed: [{date: 2027-03-09, shift: N, skill: rn}]}
  - {id: cat, skills: [hca]}
demand:
  - {shift: E, skill: rn, min: 1, target: 2}
  - {shift: N, skill: rn, min: 1}
  - {shift: E, skill: hca, min: 1, target: 2}
)");
    }
    SUBCASE("heavy minimum weights, a soft minimum and a weighted contract") {
      checkExhaustively(kTiny + R"(contracts:
  two: {hours: {min: 16}, severity: hard, weight: 3}
staff:
  - {id: ana, contract: two, skills: [rn], absences: [{from: 2027-03-08, to: 2027-03-09}]}
  - {id: ben, contract: two, skills: [hca], fixed: [{date: 2027-03-08, off: true}]}
  - {id: cat, skills: [rn, hca], absences: [{date: 2027-03-09}]}
demand:
  - {shift: E, skill: rn, min: 2, target: 3, min_weight: 4}
  - {shift: N, skill: rn, min: 1, severity: soft, target: 2, target_weight: 2.5}
  - {shift: E, skill: hca, min: 1, min_weight: 0.5}
rules:
  list:
    - {kind: min-rest, hours: 11}
)");
    }
  }
}
