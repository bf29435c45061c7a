/// @brief Row re-fit against brute force: on rules it models, its row is the cheapest feasible one.
#include <doctest/doctest.h>

#include <algorithm>
#include <cmath>

#include "fixtures.hpp"
#include "row_rules_setup.hpp"
#include "search/construction.hpp"
#include "search/eligibility.hpp"
#include "search/refit_chain.hpp"
#include "search/row_refit.hpp"

using namespace rotaweave;

namespace {

/// A re-fit of this short scenario's rows fits in one move.
eval::Move asMove(const search::RowChange& change) {
  eval::Move move;
  for (const auto& c : change.cells) REQUIRE(move.add(c.staff, c.day, c.task));
  return move;
}

/// Hard penalty of everyone but s (all hard rules here are row rules).
Cost othersHard(eval::Evaluator& ev, StaffIdx s) {
  Cost hard = 0;
  for (const auto& b : ev.explain(ev.roster()))
    if (b.hard && b.staff != s) hard += b.penalty;
  return hard;
}

/// The cheapest row for s with no hard breach of its own (hard above `others`), by trying
/// every row the eligibility allows; hard stays above `others` if there is none.
rules::Tally bruteForce(const search::Eligibility& e, eval::Evaluator& ev, StaffIdx s, int days, Cost others) {
  rules::Tally best{others + 1, 0};
  std::vector<int> pick(static_cast<size_t>(days), 0);
  for (;;) {
    eval::Move move;
    for (DayIdx d = 0; d < days; ++d) move.add(s, d, e.begin(s, d)[pick[static_cast<size_t>(d)]]);
    const rules::Tally t = ev.tryMove(move);
    if (t.hard == others && (best.hard > others || t.soft < best.soft)) best = t;
    DayIdx d = 0;
    while (d < days && ++pick[static_cast<size_t>(d)] == e.count(s, d)) pick[static_cast<size_t>(d++)] = 0;
    if (d == days) return best;
  }
}

/// Every row of s with no hard breach of its own (hard stays at `others`), by trying every row
/// the eligibility allows.
std::vector<std::vector<TaskIdx>> feasibleRows(const search::Eligibility& e, eval::Evaluator& ev, StaffIdx s, int days,
                                               Cost others) {
  std::vector<std::vector<TaskIdx>> rows;
  std::vector<int> pick(static_cast<size_t>(days), 0);
  std::vector<TaskIdx> row(static_cast<size_t>(days));
  for (;;) {
    eval::Move move;
    for (DayIdx d = 0; d < days; ++d) move.add(s, d, row[static_cast<size_t>(d)] = e.begin(s, d)[pick[static_cast<size_t>(d)]]);
    if (ev.tryMove(move).hard == others) rows.push_back(row);
    DayIdx d = 0;
    while (d < days && ++pick[static_cast<size_t>(d)] == e.count(s, d)) pick[static_cast<size_t>(d++)] = 0;
    if (d == days) return rows;
  }
}

/// The scenario with everything a re-fit needs, and a random roster loaded.
struct Setup : test::RowRulesSetup {
  using RowRulesSetup::RowRulesSetup;
  void loadRandom(search::Rng& rng) {
    model::Roster r(p.staffCount(), p.days);
    search::randomRoster(e, r, 0.5, rng);
    ev.load(r);
  }
};

}  // namespace

TEST_SUITE("search") {
  TEST_CASE("row re-fit finds the cheapest feasible row, as brute force does") {
    for (const std::string history : {"[]", "[L, L]", "[E, E, E, E]", "[N, off]"}) {
      CAPTURE(history);
      Setup x(history);
      auto& [p, set, e, refit, ev] = x;
      for (std::uint64_t seed = 1; seed <= 6; ++seed) {
        search::Rng rng(seed);
        x.loadRandom(rng);
        for (StaffIdx s = 0; s < p.staffCount(); ++s) {
          CAPTURE(s);
          const Cost others = othersHard(ev, s);
          const rules::Tally best = bruteForce(e, ev, s, p.days, others);
          search::RowChange change;
          const bool found = refit.refit(ev, s, 0, p.days, nullptr, 100.0, change);
          REQUIRE(found == (best.hard == others));
          if (!found) continue;
          const rules::Tally got = change.empty() ? ev.total() : ev.tryMove(asMove(change));
          CHECK(got.hard == others);
          CHECK(got.soft == best.soft);
        }
      }
    }
  }

  TEST_CASE("row re-fit at prices finds the cheapest feasible row, as brute force does") {
    constexpr double kWeight = 100.0;
    for (const std::string history : {"[]", "[L, L]", "[E, E, E, E]", "[N, off]"}) {
      CAPTURE(history);
      Setup x(history);
      auto& [p, set, e, refit, ev] = x;
      const size_t tasks = static_cast<size_t>(p.taskCount());
      // A row's cost at prices, worked out here: cell-local rules on every day, the price of each worked cell.
      auto pricedCost = [&](StaffIdx s, const std::vector<TaskIdx>& row, const std::vector<double>& prices) {
        double cost = 0;
        for (DayIdx d = 0; d < p.days; ++d) {
          const TaskIdx t = row[static_cast<size_t>(d)];
          cost += ev.cellCost(s, d, t).weighed(kWeight) + (t == kOff ? 0.0 : prices[static_cast<size_t>(d) * tasks + static_cast<size_t>(t)]);
        }
        return cost;
      };
      for (std::uint64_t seed = 1; seed <= 3; ++seed) {
        search::Rng rng(seed);
        x.loadRandom(rng);
        for (StaffIdx s = 0; s < p.staffCount(); ++s) {
          CAPTURE(s);
          const auto rows = feasibleRows(e, ev, s, p.days, othersHard(ev, s));  // prices do not change feasibility
          for (int table = 0; table < 4; ++table) {
            // From a reward of 6 points to a charge of 6 per cell: the order of the cover weights.
            std::vector<double> prices(static_cast<size_t>(p.days) * tasks);
            for (double& price : prices) price = (12 * rng.uniform() - 6) * kCostScale;
            double best = INFINITY;
            for (const auto& row : rows) best = std::min(best, pricedCost(s, row, prices));
            search::RowChange change;
            double cost = NAN;
            const bool found = refit.refitAtPrices(ev, s, 0, p.days, prices.data(), kWeight, change, cost);
            REQUIRE(found == !rows.empty());
            if (!found) continue;
            CHECK(cost == doctest::Approx(best).epsilon(1e-9).scale(kCostScale));
            std::vector<TaskIdx> row(ev.roster().row(s), ev.roster().row(s) + p.days);
            for (const auto& c : change.cells) row[static_cast<size_t>(c.day)] = c.task;
            CHECK(std::find(rows.begin(), rows.end(), row) != rows.end());
            CHECK(pricedCost(s, row, prices) == doctest::Approx(cost).epsilon(1e-9).scale(kCostScale));
          }
        }
      }
    }
  }

  TEST_CASE("a window re-fit keeps the days outside it and joins them without a modelled breach") {
    Setup x("[]");
    auto& [p, set, e, refit, ev] = x;
    for (std::uint64_t seed = 1; seed <= 20; ++seed) {
      search::Rng rng(seed);
      x.loadRandom(rng);
      const StaffIdx s = rng.below(p.staffCount());
      const DayIdx first = 1 + rng.below(3);
      std::vector<TaskIdx> needs(static_cast<size_t>(p.days), search::RowRefit::kAnyTask);
      needs[static_cast<size_t>(first + 1)] = ev.roster().at(s, first + 1) == kOff ? search::RowRefit::kAnyShift : kOff;
      search::RowChange change;
      if (!refit.refit(ev, s, first, 4, needs.data(), 100.0, change)) continue;
      for (const auto& c : change.cells) CHECK((c.day >= first && c.day < first + 4));
      bool flipped = false;  // the forced day goes from worked to off or from off to worked
      for (const auto& c : change.cells) flipped |= c.day == first + 1 && (c.task == kOff) != (ev.roster().at(s, c.day) == kOff);
      CHECK(flipped);
      // Only the window changed, so the row's hard cost comes from rules it does not model: none here.
      if (ev.total().hard == 0) CHECK(ev.tryMove(asMove(change)).hard == 0);
    }
  }

  TEST_CASE("a refit chain leaves a consistent roster and its undo restores the start") {
    Setup x("[L]");
    auto& [p, set, e, refit, ev] = x;
    search::Rng rng(7);
    x.loadRandom(rng);
    search::RefitUndo undo;
    for (int i = 0; i < 50; ++i) {
      const model::Roster before = ev.roster();
      const rules::Tally total = ev.total();
      if (!search::refitChain(e, ev, refit, rng, 100.0, 3, undo)) continue;
      CHECK(ev.score(ev.roster()) == ev.total());
      search::undoRefitChain(ev, undo);
      CHECK(ev.roster() == before);
      CHECK(ev.total() == total);
      if (i % 2) search::refitChain(e, ev, refit, rng, 100.0, 3, undo);  // keep some, to move on
    }
  }
}
