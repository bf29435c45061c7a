/// @brief Starting rosters from a Lagrangian relaxation of cover.
///
/// Cover is what ties people's rows together. Pricing it instead (a reward per person on each
/// (day, task) cell, tuned by subgradient steps) lets every row be chosen on its own by the
/// exact row re-fit. The priced rows show which days and weekends each person should work in
/// a good roster, even where the local search would need many rows to change together to find
/// that out. Each round's priced roster is repaired by re-fitting rows against the real cover.
/// Every row proposed on the way is pooled, and the pool's cheapest combination
/// (search/pool_combination.hpp) joins the best repaired rosters that seed the islands.
#pragma once
#include <chrono>
#include <optional>
#include <vector>

#include "eval/evaluator.hpp"
#include "search/eligibility.hpp"
#include "search/rng.hpp"
#include "search/row_pool.hpp"
#include "search/row_refit.hpp"

namespace rotaweave::search {

struct LagrangianResult {
  std::vector<model::Roster> rosters;  ///< the best distinct repaired or combined rosters, best first
  /// Best value of the relaxation, in weighed cost units (0 if no round ran).
  double dual = 0;
  /// The best value of the rounds whose every row was priced exactly (no labels dropped),
  /// if any: no roster without a hard breach costs less, provided every cell may take every
  /// role its person holds (Eligibility::complete). Rules the re-fit does not model only make
  /// it lower: it prices rows by cell rules and cover alone and never rules out a row a hard
  /// rule allows.
  std::optional<double> bound;
  int rounds = 0;                      ///< subgradient rounds run
  std::optional<RowPool> pool;         ///< every row the rounds proposed
};

/// Runs up to `rounds` subgradient rounds (fewer past `deadline`) and keeps the `keep` best
/// distinct repaired rosters. `hardWeight` weighs hard cost against soft, as in local search.
/// Rows are re-fitted on as many threads as `refits` holds re-fitters (one each). Uses `ev`
/// and `refits` as scratch; deterministic for a given `rng` state, whatever the thread count.
LagrangianResult lagrangianStarts(const Eligibility& e, eval::Evaluator& ev, std::vector<RowRefit>& refits, Rng& rng,
                                  int rounds, int keep, double hardWeight, std::chrono::steady_clock::time_point deadline);

}  // namespace rotaweave::search
