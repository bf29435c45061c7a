/// @brief Cover, always-on rules (skill, absence, fixed, request) and fair share.
#include <doctest/doctest.h>

#include "fixtures.hpp"

using namespace rotaweave;
using namespace rotaweave::test;

TEST_SUITE("rules") {
  TEST_CASE("cover: min is hard, target and max are soft, per person short or extra") {
    const auto p = loadYaml(header(3) +
                            "staff:\n  - {id: a, skills: [rn]}\n  - {id: b, skills: [rn]}\n  - {id: c, skills: [rn]}\n"
                            "demand:\n  - {shift: E, skill: rn, min: 2, target: 3, max: 3, target_weight: 5}\n");
    const auto r = rosterFrom(p, {"E E .", ". E .", ". . ."});
    // Day 0: 1 assigned: 1 short of min (hard), 2 short of target (soft, weight 5).
    // Day 1: 2 assigned: 1 short of target. Day 2: 0 assigned: 2 short of min, 3 of target.
    const auto b = breaches(p, r, "cover");
    REQUIRE(b.size() == 5);
    CHECK(b[0].hard);
    CHECK(b[0].message == "2027-03-01 E rn: 1 assigned, at least 2 needed");
    CHECK(b[1].penalty == 2 * 5 * kCostScale);
    const rules::RuleSet set(p);
    eval::Evaluator ev(set);
    const auto t = ev.score(r);
    CHECK(t.hard == 3 * kCostScale);
    CHECK(t.soft == (2 + 1 + 3) * 5 * kCostScale);
  }

  TEST_CASE("cover: specific dates win over weekday filters, which win over every-day entries") {
    const auto p = loadYaml(header(7) +
                            "staff:\n  - {id: a, skills: [rn]}\n"
                            "demand:\n"
                            "  - {shift: E, skill: rn, min: 1}\n"
                            "  - {shift: E, skill: rn, min: 2, days: [sat, sun]}\n"
                            "  - {shift: E, skill: rn, min: 3, dates: [2027-03-06]}\n");
    CHECK(p.demandAt(0, p.task(0, 0)).min == 1);
    CHECK(p.demandAt(5, p.task(0, 0)).min == 3);  // Saturday, listed date
    CHECK(p.demandAt(6, p.task(0, 0)).min == 2);  // Sunday
    CHECK(p.demandAt(2, p.task(1, 0)).defined == false);
  }

  TEST_CASE("skill, absence, fixed and request rules") {
    const auto p = loadYaml("name: t\nperiod: {start: 2027-03-01, end: 2027-03-05}\n"
                            "shifts:\n  - {id: E, start: \"07:00\", end: \"15:00\"}\n  - {id: N, start: \"22:00\", end: \"06:00\"}\n"
                            "skills: [rn, hca]\n"
                            "staff:\n"
                            "  - id: ana\n    skills: [rn]\n"
                            "    absences: [{from: 2027-03-02, to: 2027-03-03, reason: leave}]\n"
                            "    fixed: [{date: 2027-03-01, shift: N}]\n"
                            "    requests:\n"
                            "      - {date: 2027-03-04, off: true, weight: 3}\n"
                            "      - {date: 2027-03-05, shift: E, weight: 2}\n");
    const auto r = rosterFrom(p, {"E E/hca . E N"});
    CHECK(breaches(p, r, "fixed").size() == 1);
    const auto abs = breaches(p, r, "absence");
    REQUIRE(abs.size() == 1);
    CHECK(abs[0].message == "ana: works E on 2027-03-02, a day of absence (leave)");
    CHECK(breaches(p, r, "skill").size() == 1);
    const auto req = breaches(p, r, "request");
    REQUIRE(req.size() == 2);
    CHECK(!req[0].hard);
    CHECK(req[0].penalty == 3 * kCostScale);
    CHECK(req[1].message == "ana: asked for E on 2027-03-05 but works N");
  }

  TEST_CASE("fair-share: sum over the group of |count - mean|") {
    const auto p = loadYaml(header(7) +
                            "staff:\n  - {id: a, skills: [rn]}\n  - {id: b, skills: [rn]}\n  - {id: c, skills: [rn]}\n"
                            "rules:\n  list:\n    - {kind: fair-share, shift: N, weight: 3}\n");
    // Nights: a 3, b 1, c 2: mean 2, deviations 1 + 1 + 0 = 2.
    const auto b = breaches(p, rosterFrom(p, {"N N N . . . .", "N . . . . . .", "N N . . . . ."}), "fair-share");
    REQUIRE(b.size() == 1);
    CHECK(b[0].amount == 2 * kAmountScale);
    CHECK(b[0].penalty == 6 * kCostScale);
    CHECK(b[0].staff == -1);
    // 1, 0, 0: mean 1/3, deviations 2/3 + 1/3 + 1/3 = 4/3, kept to 1/60.
    const auto c = breaches(p, rosterFrom(p, {"N . . . . . .", ". . . . . . .", ". . . . . . ."}), "fair-share");
    REQUIRE(c.size() == 1);
    CHECK(c[0].amount == 80);
  }

  TEST_CASE("narrowing by staff, contracts and skills") {
    const auto p = loadYaml(header(7) +
                            "contracts:\n  ft: {}\n  pt: {}\n"
                            "staff:\n  - {id: a, contract: ft, skills: [rn]}\n  - {id: b, contract: pt, skills: [rn]}\n"
                            "rules:\n  list:\n"
                            "    - {kind: max-count, count: 1, contracts: [pt]}\n"
                            "    - {kind: max-count, id: a-only, count: 0, staff: [a], skills: [rn]}\n");
    const auto b = breaches(p, rosterFrom(p, {"E E . . . . .", "E E . . . . ."}), "max-count");
    REQUIRE(b.size() == 2);  // rows are explained in staff order
    CHECK(b[0].ruleId == "a-only");
    CHECK(b[0].staff == 0);
    CHECK(b[0].amount == 2 * kAmountScale);
    CHECK(b[1].ruleId == "max-count");
    CHECK(b[1].staff == 1);
    CHECK(b[1].amount == kAmountScale);
  }
}
