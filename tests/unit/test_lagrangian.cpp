/// @brief Lagrangian starts: the relaxation bounds feasible rosters from below; the starts are sorted and reproducible.
#include <doctest/doctest.h>

#include <cmath>

#include "fixtures.hpp"
#include "row_rules_setup.hpp"
#include "search/construction.hpp"
#include "search/eligibility.hpp"
#include "search/lagrangian.hpp"
#include "search/row_refit.hpp"

using namespace rotaweave;

namespace {

constexpr double kWeight = 100.0;
using Clock = std::chrono::steady_clock;

/// The re-fit's scenario: every rule is cover, cell-local or a hard row rule the re-fit models,
/// so the relaxation is below every roster without a hard breach.
struct Setup : test::RowRulesSetup {
  using RowRulesSetup::RowRulesSetup;
  int threads = 1;
  search::LagrangianResult run(std::uint64_t seed, int rounds, int keep, Clock::time_point deadline = Clock::time_point::max()) {
    search::Rng rng(seed);
    std::vector<search::RowRefit> refits(static_cast<size_t>(threads), refit);
    return search::lagrangianStarts(e, ev, refits, rng, rounds, keep, kWeight, deadline);
  }
  /// A random roster, then each row re-fitted against the real cover a few times: good rosters.
  model::Roster refitted(search::Rng& rng) {
    model::Roster r(p.staffCount(), p.days);
    search::randomRoster(e, r, 0.5, rng);
    ev.load(r);
    search::RowChange change;
    for (int pass = 0; pass < 3; ++pass)
      for (StaffIdx s = 0; s < p.staffCount(); ++s)
        if (refit.refit(ev, s, 0, p.days, nullptr, kWeight, change)) search::applyRowChange(ev, change);
    return ev.roster();
  }
};

}  // namespace

TEST_SUITE("search") {
  TEST_CASE("the Lagrangian bound is below every roster without a hard breach") {
    // With [E, E, E, E] the bound meets the best start, 108000, which is the optimum (checked once
    // by trying every feasible roster, too slow to keep here), so a bound too high fails there.
    for (const std::string history : {"[]", "[L, L]", "[N, off]", "[E, E, E, E]"}) {
      CAPTURE(history);
      Setup x(history);
      const search::LagrangianResult result = x.run(1, 60, 5);
      REQUIRE(std::isfinite(result.dual));
      CHECK(result.dual > x.run(1, 1, 5).dual);  // the rounds raise the bound above the one at zero prices
      const double slack = 1e-9 * (kCostScale + std::abs(result.dual));
      for (const model::Roster& r : result.rosters) CHECK(result.dual <= x.ev.score(r).weighed(kWeight) + slack);
      // Other rosters: greedy ones and re-fitted random ones, those with no hard breach.
      search::Rng rng(2);
      double lowest = INFINITY;
      int others = 0;
      for (int i = 0; i < 40; ++i) {
        if (i % 4 == 0) search::greedyRoster(x.e, x.ev, rng, i == 0 ? 0.0 : 0.5);
        const model::Roster r = i % 4 == 0 ? x.ev.roster() : x.refitted(rng);
        const rules::Tally t = x.ev.score(r);
        if (t.hard != 0) continue;
        ++others;
        lowest = std::min(lowest, t.weighed(kWeight));
      }
      REQUIRE(others > 0);
      CHECK(result.dual <= lowest + slack);
      // Every row of this small scenario is priced exactly, so the rounds prove their bound.
      REQUIRE(result.bound.has_value());
      CHECK(*result.bound <= lowest + slack);
      CHECK(*result.bound == result.dual);
    }
  }

  TEST_CASE("no bound is proved from rounds whose rows were not priced exactly") {
    Setup x("[]");
    x.refit.setBeamWidth(1);  // the rounds copy it: every day drops labels
    const search::LagrangianResult result = x.run(1, 20, 2);
    CHECK(result.rounds > 0);
    CHECK_FALSE(result.bound.has_value());
  }

  TEST_CASE("Lagrangian starts come best first, distinct and within eligibility") {
    for (const std::string history : {"[]", "[E, E, E, E]"}) {
      CAPTURE(history);
      Setup x(history);
      const search::LagrangianResult result = x.run(3, 60, 4);
      REQUIRE(!result.rosters.empty());
      CHECK(result.rosters.size() <= 4);
      std::vector<double> scores;
      for (const model::Roster& r : result.rosters) scores.push_back(x.ev.score(r).weighed(kWeight));
      for (size_t i = 1; i < scores.size(); ++i) CHECK(scores[i - 1] <= scores[i]);
      for (size_t i = 0; i < result.rosters.size(); ++i)
        for (size_t j = 0; j < i; ++j) CHECK(result.rosters[i] != result.rosters[j]);
      int outside = 0;
      for (const model::Roster& r : result.rosters)
        for (StaffIdx s = 0; s < x.p.staffCount(); ++s)
          for (DayIdx d = 0; d < x.p.days; ++d) outside += !x.e.allows(s, d, r.at(s, d));
      CHECK(outside == 0);
      search::Rng rng(3);
      search::greedyRoster(x.e, x.ev, rng, 0.0);
      CHECK(scores.front() <= x.ev.total().weighed(kWeight));
    }
  }

  TEST_CASE("Lagrangian starts depend on the seed alone, and stop at the round limit and the deadline") {
    Setup x("[L, L]");
    const search::LagrangianResult a = x.run(7, 30, 4), b = Setup("[L, L]").run(7, 30, 4), c = x.run(7, 30, 4);
    CHECK(a.rosters == b.rosters);
    CHECK(a.dual == b.dual);
    CHECK(a.rounds == b.rounds);
    CHECK(a.rosters == c.rosters);  // the evaluator and re-fit left behind do not matter
    CHECK(a.dual == c.dual);

    for (const int rounds : {1, 3, 30}) {
      const search::LagrangianResult r = x.run(7, rounds, 4);
      CHECK(r.rounds >= 1);
      CHECK(r.rounds <= rounds);
      CHECK(!r.rosters.empty());
    }
    // No round: past the deadline, or none asked for.
    for (const search::LagrangianResult& r : {x.run(7, 30, 4, Clock::now() - std::chrono::seconds(1)), x.run(7, 0, 4)}) {
      CHECK(r.rounds == 0);
      CHECK(r.rosters.empty());
    }
  }

  TEST_CASE("Lagrangian starts are the same on any number of threads") {
    // 48 people, so repairs re-fit groups of three at once.
    std::string staff = "staff:\n";
    for (int i = 0; i < 48; ++i)
      staff += "  - {id: p" + std::to_string(i) + ", skills: [rn]" + (i % 5 == 0 ? ", absences: [{date: 2027-03-0" + std::to_string(1 + i % 9) + "}]" : "") + "}\n";
    const model::Problem p = test::loadYaml(test::header(21) + staff +
                                            "demand:\n  - {shift: E, skill: rn, min: 16, target: 20, severity: soft}\n"
                                            "  - {shift: L, skill: rn, min: 16, severity: soft}\n  - {shift: N, skill: rn, min: 10, max: 12, severity: soft}\n"
                                            "rules:\n  list:\n"
                                            "    - {kind: min-rest, hours: 11, severity: hard}\n"
                                            "    - {kind: max-consecutive-days, days: 5, severity: hard}\n"
                                            "    - {kind: min-hours, hours: 80, severity: hard}\n"
                                            "    - {kind: max-hours, hours: 120, severity: hard}\n");
    const rules::RuleSet set(p);
    const search::Eligibility e(p);
    auto run = [&](int threads) {
      eval::Evaluator ev(set);
      std::vector<search::RowRefit> refits(static_cast<size_t>(threads), search::RowRefit(set, e));
      search::Rng rng(5);
      return search::lagrangianStarts(e, ev, refits, rng, 12, 3, kWeight, Clock::time_point::max());
    };
    const search::LagrangianResult one = run(1), three = run(3);
    CHECK(one.rounds > 1);
    CHECK(one.rounds == three.rounds);
    CHECK(one.rosters == three.rosters);
    CHECK(one.dual == three.dual);
  }
}
