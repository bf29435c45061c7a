/// @brief Fill candidates (qualified, not absent, no hard rule broken by taking the slot) and
/// advice that never relaxes a rule marked legal.
#include <doctest/doctest.h>

#include "analysis/capacity.hpp"
#include "analysis/fill_candidates.hpp"
#include "fixtures.hpp"

namespace rotaweave {

TEST_SUITE("analysis") {
  TEST_CASE("fill candidates hold the skill, are not absent and break no hard rule by taking the slot") {
    // Day 2 E: ana works it; bea is absent; cal holds only hca; dan worked L on day 1 (9 h
    // rest before E, under the 11 h rule); eve is free; fay is fixed off that day.
    const auto p = test::loadYaml(
        "name: t\nperiod: {start: 2027-03-01, end: 2027-03-04}\n"
        "shifts:\n  - {id: E, start: \"07:00\", end: \"15:00\"}\n  - {id: L, start: \"14:00\", end: \"22:00\"}\n"
        "skills: [rn, hca]\n"
        "staff:\n  - {id: ana, skills: [rn]}\n"
        "  - {id: bea, skills: [rn], absences: [{date: 2027-03-03}]}\n"
        "  - {id: cal, skills: [hca]}\n  - {id: dan, skills: [rn]}\n  - {id: eve, skills: [hca, rn]}\n"
        "  - {id: fay, skills: [rn], fixed: [{date: 2027-03-03, off: true}]}\n"
        "rules:\n  list:\n    - {id: daily-rest, kind: min-rest, hours: 11, legal: true}\n");
    CHECK(p.rules.back().legal);
    const auto roster = test::rosterFrom(p, {". . E .", ". . . .", ". . . .", ". L . .", ". . . .", ". . . ."});
    const rules::RuleSet rs(p);
    eval::Evaluator ev(rs);
    const TaskIdx eRn = p.task(0, 0);
    const auto ids = analysis::fillCandidateIds(ev, roster, 2, eRn);
    CHECK(ids == std::vector<std::string>{"eve"});
    CHECK(analysis::fillCandidateIds(ev, roster, 2, p.task(0, 1)) == std::vector<std::string>{"cal", "eve"});
  }

  TEST_CASE(
      "advice on a breach of a legal rule suggests staffing, never relaxing, and names who could take the shift") {
    const std::string body =
        "staff:\n  - {id: ana, skills: [rn]}\n  - {id: bea, skills: [rn]}\n  - {id: cal, skills: [rn]}\n"
        "demand:\n  - {shift: E, skill: rn, min: 1}\n  - {shift: L, skill: rn, min: 1}\n"
        "rules:\n  list:\n    - {id: daily-rest, kind: min-rest, hours: 11";
    for (const bool legal : {true, false}) {
      const auto p = test::loadYaml(test::header(3) + body + (legal ? ", legal: true}\n" : "}\n"));
      // ana: L then E (9 h rest); bea works the other slots she can; cal is free all three days.
      const auto roster = test::rosterFrom(p, {". L E", "E E L", ". . ."});
      const auto found = test::breaches(p, roster);
      analysis::CapacityReport report = analysis::analyseCapacity(p);
      analysis::compareWithRoster(report, p, roster, found);
      REQUIRE(report.roster);
      bool seen = false;
      for (const auto& tag : report.roster->tags) {
        if (found[tag.breach].ruleId != "daily-rest") continue;
        seen = true;
        CHECK_FALSE(tag.unavoidable);
        CHECK(tag.cause.find("cal") != std::string::npos);
        const bool relax =
            tag.remedy.find("relax") != std::string::npos || tag.remedy.find("soft") != std::string::npos;
        CHECK(relax == !legal);
        if (legal) CHECK(tag.remedy.find("marked legal") != std::string::npos);
      }
      CHECK(seen);
    }
  }
}

}  // namespace rotaweave
