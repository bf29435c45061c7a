/// @brief Starting rosters: a greedy that fills demand day by day, and random rosters for diversity.
#pragma once
#include <chrono>

#include "eval/evaluator.hpp"
#include "search/eligibility.hpp"
#include "search/rng.hpp"

namespace rotaweave::search {

/// Each free cell takes a random option; off with probability `offShare`.
void randomRoster(const Eligibility& e, model::Roster& g, double offShare, Rng& rng);

/// Fills each day's demand cells, scarcest first, with the person whose assignment lowers
/// the total penalty most (ties and, with `noise` > 0, near-ties broken at random).
/// Leaves the result loaded in `ev`. Past `deadline` the remaining days are left off, so a
/// huge scenario still gets a valid (partial) start in bounded time.
void greedyRoster(const Eligibility& e, eval::Evaluator& ev, Rng& rng, double noise,
                  std::chrono::steady_clock::time_point deadline = std::chrono::steady_clock::time_point::max());

}  // namespace rotaweave::search
