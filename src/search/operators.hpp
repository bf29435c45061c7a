/// @brief Genetic operators as free functions taking the RNG explicitly: selection,
/// crossover and mutation. All keep every cell within its eligible options.
#pragma once
#include <vector>

#include "search/eligibility.hpp"
#include "search/individual.hpp"
#include "search/rng.hpp"
#include "search/solver_options.hpp"

namespace rotaweave::search {

/// Picks `count` parent indices from `population` (sorted best first) into `out`.
/// Tournament and rank use the ordering; roulette and stochastic universal sampling use fitnessValue().
void selectParents(const std::vector<Individual>& population, int count, Selection method, int tournamentSize,
                   Rng& rng, std::vector<int>& out);

/// Child takes each person's whole row from a or b at random.
void rowUniformCrossover(const model::Roster& a, const model::Roster& b, model::Roster& child, Rng& rng);
/// Two-point crossover on days: child is a, with the days between two cut points taken from b.
void dayBlockCrossover(const model::Roster& a, const model::Roster& b, model::Roster& child, Rng& rng);

/// Reassigns each free cell with probability `rate` to another eligible task.
void reassignMutation(const Eligibility& e, model::Roster& g, double rate, Rng& rng);
/// Applies `moves` random neighbourhood moves (swaps, block swaps, run fills) to the genome.
void swapMutation(const Eligibility& e, model::Roster& g, int moves, Rng& rng);

}  // namespace rotaweave::search
