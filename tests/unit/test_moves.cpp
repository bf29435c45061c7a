/// @brief Neighbourhood moves and late acceptance: moves stay within eligibility, their
/// incremental scores equal full re-scores, and late acceptance keeps the best roster it saw.
#include <doctest/doctest.h>

#include "fixtures.hpp"
#include "search/construction.hpp"
#include "search/eligibility.hpp"
#include "search/local_search.hpp"
#include "search/moves.hpp"

using namespace rotaweave;

namespace {

/// Five people over two weeks with an absence, a fixed shift, two skills and rules of every
/// family the moves touch (cover, rest, runs, hours, fair share, requests).
model::Problem movesWard() {
  return test::loadYaml(test::header(14) +
                        "contracts:\n  ft: {hours: {min: 40, max: 72}}\n"
                        "staff:\n"
                        "  - {id: a, contract: ft, skills: [rn], absences: [{from: 2027-03-03, to: 2027-03-05}]}\n"
                        "  - {id: b, contract: ft, skills: [rn], fixed: [{date: 2027-03-08, shift: N}]}\n"
                        "  - {id: c, contract: ft, skills: [rn], requests: [{date: 2027-03-06, off: true, weight: 2}]}\n"
                        "  - {id: d, contract: ft, skills: [rn]}\n"
                        "  - {id: e, contract: ft, skills: [rn]}\n"
                        "demand:\n  - {shift: E, skill: rn, min: 1, target: 2}\n  - {shift: L, skill: rn, min: 1}\n"
                        "  - {shift: N, skill: rn, min: 1}\n"
                        "rules:\n  list:\n    - {kind: min-rest, hours: 11}\n    - {kind: max-consecutive-days, days: 5}\n"
                        "    - {kind: fair-share, shift: N}\n");
}

bool withinEligibility(const search::Eligibility& e, const model::Roster& r) {
  for (StaffIdx s = 0; s < r.staff; ++s)
    for (DayIdx d = 0; d < r.days; ++d)
      if (!e.allows(s, d, r.at(s, d))) return false;
  return true;
}

}  // namespace

TEST_SUITE("moves") {
  TEST_CASE("every move keeps cells eligible and its incremental score equals a full re-score") {
    const auto p = movesWard();
    const rules::RuleSet set(p);
    const search::Eligibility e(p);
    search::Rng rng(11);
    model::Roster roster(p.staffCount(), p.days);
    search::randomRoster(e, roster, 0.5, rng);
    eval::Evaluator ev(set), full(set);
    ev.load(roster);
    eval::Move move;
    int applied = 0;
    for (int i = 0; i < 3000; ++i) {
      search::randomMove(e, ev.roster(), rng, move);
      if (move.size == 0) continue;
      for (const auto& c : move) REQUIRE(e.allows(c.staff, c.day, c.task));
      const rules::Tally predicted = ev.tryMove(move);
      model::Roster after = ev.roster();
      search::applyMove(after, move);
      REQUIRE(predicted == full.score(after));
      if (i % 3 == 0) {  // commit a third of them, so later moves start from changed rosters
        ev.commit();
        ++applied;
        REQUIRE(ev.roster() == after);
        REQUIRE(ev.total() == full.score(after));
      }
    }
    CHECK(applied > 500);
    CHECK(withinEligibility(e, ev.roster()));
  }

  TEST_CASE("moves never change an absence or a fixed cell") {
    const auto p = movesWard();
    const search::Eligibility e(p);
    search::Rng rng(5);
    model::Roster roster(p.staffCount(), p.days);
    search::randomRoster(e, roster, 0.5, rng);
    eval::Move move;
    for (int i = 0; i < 5000; ++i) {
      search::randomMove(e, roster, rng, move);
      for (const auto& c : move) {
        REQUIRE_FALSE((c.staff == 0 && c.day >= 2 && c.day <= 4));  // a's absence
        REQUIRE_FALSE((c.staff == 1 && c.day == 7));                // b's fixed night
      }
      search::applyMove(roster, move);
    }
    CHECK(roster.at(1, 7) == p.task(2, 0));
    CHECK(roster.at(0, 3) == kOff);
  }
}

TEST_SUITE("late acceptance") {
  TEST_CASE("late acceptance ends on the best roster it saw, never worse than its start") {
    const auto p = movesWard();
    const rules::RuleSet set(p);
    const search::Eligibility e(p);
    eval::Evaluator ev(set), full(set);
    search::LateAcceptanceScratch scratch;
    scratch.late.resize(50);
    search::LateAcceptanceSettings settings;
    for (std::uint64_t seed = 1; seed <= 5; ++seed) {
      CAPTURE(seed);
      search::Rng rng(seed);
      model::Roster start(p.staffCount(), p.days);
      search::randomRoster(e, start, 0.5, rng);
      ev.load(start);
      const rules::Tally before = ev.total();
      search::lateAcceptance(e, ev, rng, 20000, settings, scratch);
      CHECK_FALSE(before < ev.total());
      CHECK(ev.total() == full.score(ev.roster()));
      CHECK(withinEligibility(e, ev.roster()));
      CHECK(ev.total() < before);  // a random roster of this ward is always improvable
    }
  }

  TEST_CASE("late acceptance with no moves leaves the roster as it was") {
    const auto p = movesWard();
    const rules::RuleSet set(p);
    const search::Eligibility e(p);
    search::Rng rng(3);
    model::Roster start(p.staffCount(), p.days);
    search::randomRoster(e, start, 0.5, rng);
    eval::Evaluator ev(set);
    ev.load(start);
    search::LateAcceptanceScratch scratch;
    scratch.late.resize(10);
    search::lateAcceptance(e, ev, rng, 0, search::LateAcceptanceSettings{}, scratch);
    CHECK(ev.roster() == start);
  }

  TEST_CASE("late acceptance returns at a deadline already past, within one look at the clock") {
    const auto p = movesWard();
    const rules::RuleSet set(p);
    const search::Eligibility e(p);
    search::Rng rng(4);
    model::Roster start(p.staffCount(), p.days);
    search::randomRoster(e, start, 0.5, rng);
    eval::Evaluator ev(set);
    ev.load(start);
    search::LateAcceptanceScratch scratch;
    scratch.late.resize(10);
    search::LateAcceptanceSettings settings;
    settings.deadline = std::chrono::steady_clock::now() - std::chrono::seconds(1);
    settings.chainInterval = 0;
    // A billion moves would take minutes; the past deadline must end the call after the first
    // look at the clock. Bounded by work, not time: the test fails by hanging, not by timing.
    search::lateAcceptance(e, ev, rng, 1000000000, settings, scratch);
    CHECK(withinEligibility(e, ev.roster()));
  }
}
