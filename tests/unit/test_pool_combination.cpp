/// @brief Row pool and pool combination: the search finds the cheapest combination of pooled
/// rows, checked against trying every combination.
#include <doctest/doctest.h>

#include <algorithm>
#include <cmath>

#include "row_rules_setup.hpp"
#include "search/construction.hpp"
#include "search/pool_combination.hpp"
#include "search/row_pool.hpp"

using namespace rotaweave;

namespace {

constexpr double kWeight = 100.0;

/// Random rosters with every row re-fitted against the real cover, then put in a pool: rows
/// of different quality, each feasible or close to it.
struct Setup : test::RowRulesSetup {
  Setup() : RowRulesSetup("[]"), pool(p.staffCount(), p.days, 1 << 20) {}
  model::Roster refitted(search::Rng& rng, int passes) {
    model::Roster r(p.staffCount(), p.days);
    search::randomRoster(e, r, 0.5, rng);
    ev.load(r);
    search::RowChange change;
    for (int pass = 0; pass < passes; ++pass)
      for (StaffIdx s = 0; s < p.staffCount(); ++s)
        if (refit.refit(ev, s, 0, p.days, nullptr, kWeight, change)) search::applyRowChange(ev, change);
    return ev.roster();
  }
  /// The cheapest roster made of pooled rows, by trying every combination.
  double cheapestByEnumeration() {
    model::Roster r(p.staffCount(), p.days);
    double best = INFINITY;
    std::vector<size_t> pick(static_cast<size_t>(p.staffCount()), 0);
    while (true) {
      for (StaffIdx s = 0; s < p.staffCount(); ++s) {
        const auto& row = pool.rows(s)[pick[static_cast<size_t>(s)]];
        std::copy(row.begin(), row.end(), r.cells.begin() + static_cast<std::ptrdiff_t>(s) * p.days);
      }
      best = std::min(best, ev.score(r).weighed(kWeight));
      StaffIdx s = 0;
      while (s < p.staffCount() && ++pick[static_cast<size_t>(s)] == pool.rows(s).size()) pick[static_cast<size_t>(s++)] = 0;
      if (s == p.staffCount()) return best;
    }
  }
  search::RowPool pool;
};

}  // namespace

TEST_SUITE("search") {
  TEST_CASE("the row pool keeps each person's distinct rows once, within its size") {
    Setup x;
    search::Rng rng(1);
    const model::Roster a = x.refitted(rng, 0), b = x.refitted(rng, 0);
    x.pool.addRows(a);
    x.pool.addRows(a);
    CHECK(x.pool.size() == 3);
    x.pool.addRows(b);
    size_t distinct = 3;
    for (StaffIdx s = 0; s < 3; ++s) distinct += !std::equal(a.row(s), a.row(s) + a.days, b.row(s));
    CHECK(x.pool.size() == distinct);
    CHECK(x.pool.rows(1).front() == std::vector<TaskIdx>(a.row(1), a.row(1) + a.days));

    search::RowPool small(3, x.p.days, static_cast<size_t>(2 * x.p.days));  // room for two rows
    small.addRows(a);
    CHECK(small.size() == 2);
    CHECK(small.rows(2).empty());
  }

  TEST_CASE("the pool combination is the cheapest combination of pooled rows") {
    // Every rule in this scenario is a row rule or cover, so the model's cost is the
    // evaluator's: the combination must match the enumeration exactly.
    for (std::uint64_t seed = 1; seed <= 4; ++seed) {
      CAPTURE(seed);
      Setup x;
      search::Rng rng(seed);
      std::vector<model::Roster> seen;
      for (int i = 0; i < 8; ++i) {
        seen.push_back(x.refitted(rng, i % 3));
        x.pool.addRows(seen.back());
      }
      const double cheapest = x.cheapestByEnumeration();
      // The worst roster seen as the incumbent, so there is something to improve on.
      const model::Roster* worst = &seen.front();
      for (const auto& r : seen)
        if (x.ev.score(r).weighed(kWeight) > x.ev.score(*worst).weighed(kWeight)) worst = &r;
      REQUIRE(cheapest < x.ev.score(*worst).weighed(kWeight));

      const search::PoolCombination result = search::combinePool(x.pool, x.ev, *worst, kWeight, rng, {});
      REQUIRE(result.roster.has_value());
      CHECK(x.ev.score(*result.roster).weighed(kWeight) == doctest::Approx(cheapest));
      CHECK(result.proven);
      CHECK(result.bound <= cheapest + 1e-6 * kCostScale);
      for (StaffIdx s = 0; s < x.p.staffCount(); ++s) {
        const std::vector<TaskIdx> row(result.roster->row(s), result.roster->row(s) + x.p.days);
        CHECK(std::find(x.pool.rows(s).begin(), x.pool.rows(s).end(), row) != x.pool.rows(s).end());
      }

      // Not run once the pool's dual shows every combination costs more than is worth having.
      REQUIRE(result.bound > 0);
      search::PoolSearchLimits modest;
      modest.worthwhileCost = result.bound / 2;
      const search::PoolCombination skipped = search::combinePool(x.pool, x.ev, *worst, kWeight, rng, modest);
      CHECK_FALSE(skipped.roster.has_value());
      CHECK(skipped.nodes == 0);
      CHECK(skipped.bound > modest.worthwhileCost);

      // From the cheapest roster itself there is nothing better to find.
      const search::PoolCombination again = search::combinePool(x.pool, x.ev, *result.roster, kWeight, rng, {});
      CHECK_FALSE(again.roster.has_value());
      CHECK(again.proven);
    }
  }

  TEST_CASE("the pool combination stops at its deadline and at an empty pool") {
    Setup x;
    search::Rng rng(1);
    const model::Roster r = x.refitted(rng, 1);
    search::RowPool empty(3, x.p.days, 1 << 20);
    CHECK_FALSE(search::combinePool(empty, x.ev, r, kWeight, rng, {}).roster.has_value());
    x.pool.addRows(r);
    search::PoolSearchLimits past;
    past.deadline = std::chrono::steady_clock::now();
    const search::PoolCombination late = search::combinePool(x.pool, x.ev, r, kWeight, rng, past);
    CHECK_FALSE(late.roster.has_value());
    CHECK(late.nodes == 0);
  }
}
