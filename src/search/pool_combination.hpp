/// @brief The cheapest roster made of pooled rows: one row per person, cover scored exactly.
///
/// Picking one row per person from a pool is a set-partitioning problem. Its Lagrangian dual
/// (cover priced, each person then takes their cheapest row at those prices) is tight on the
/// instances we measured, so every row and cover count of a good combination has a reduced cost
/// near zero. A depth-first search over those rows, with the dual as its bound, finds the
/// cheapest combination; ties among rows make its running time heavy-tailed, so it restarts
/// often, each time with ties in a new random order.
///
/// The model scores row rules and cover only. Rules across people (fair share) are left out, so
/// the combination is a proposal for the evaluator, never trusted.
#pragma once
#include <chrono>
#include <cmath>
#include <optional>

#include "eval/evaluator.hpp"
#include "search/rng.hpp"
#include "search/row_pool.hpp"

namespace rotaweave::search {

struct PoolSearchLimits {
  int dualRounds = 30000;       ///< subgradient rounds on the pool's dual
  int restarts = 2000;          ///< depth-first searches, each with ties in a fresh random order
  long nodesPerRestart = 2000;  ///< search nodes one restart may visit
  /// The most a combination worth having may cost: once the pool's dual shows every one costs
  /// more, the search is not run.
  double worthwhileCost = INFINITY;
  std::chrono::steady_clock::time_point deadline = std::chrono::steady_clock::time_point::max();
};

struct PoolCombination {
  /// The cheapest combination found, if it costs less than the incumbent (in the model's terms).
  std::optional<model::Roster> roster;
  double bound = 0;   ///< no combination of pooled rows costs less (weighed, as `hardWeight` says)
  bool proven = false;  ///< the search showed no combination is cheaper than its best
  long nodes = 0;     ///< search nodes visited, over all restarts
};

/// Combines pooled rows into the cheapest roster it can find, starting from `incumbent` (any
/// roster; its cost is the first upper bound). `ev` prices rows (its loaded roster is kept).
/// Deterministic for a given `rng` state unless the deadline cuts it short.
PoolCombination combinePool(const RowPool& pool, eval::Evaluator& ev, const model::Roster& incumbent, double hardWeight,
                            Rng& rng, const PoolSearchLimits& limits);

}  // namespace rotaweave::search
