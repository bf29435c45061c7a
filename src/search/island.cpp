/// @brief The generation loop of one island.
#include "search/island.hpp"

#include <algorithm>

#include "search/construction.hpp"
#include "search/local_search.hpp"
#include "search/operators.hpp"
#include "search/stop_signal.hpp"

namespace rotaweave::search {

namespace {

/// Rows of an island's best roster repaired after each epoch, and the days re-fitted around
/// each breach: four weeks, so hours can move within a month.
constexpr int kRepairRows = 16;
constexpr int kRepairWindow = 28;
/// A hard point outweighs this many soft ones while repairing.
constexpr double kRepairHardWeight = 1000;

}  // namespace

Island::Island(const rules::RuleSet& rules, const Eligibility& eligibility, const SolverOptions& options, std::uint64_t seed)
    : eligibility_(&eligibility), options_(options), ev_(rules), rng_(seed), refit_(rules, eligibility) {
  lateScratch_.late.resize(50);
}

void Island::improve(Individual& ind, int moves) {
  ev_.load(ind.genome);
  LateAcceptanceSettings settings;
  settings.chainInterval = options_.chainInterval;
  settings.hardWeightFloor = options_.hardWeightFloor;
  settings.refit = &refit_;
  settings.refitInterval = options_.refitInterval;
  settings.refitPasses = options_.refitPasses;
  settings.deadline = deadline_;
  lateAcceptance(*eligibility_, ev_, rng_, moves, settings, lateScratch_);
  ind.genome.cells = ev_.roster().cells;  // same size: no allocation
  ind.score = ev_.total();
}

void Island::sortPopulation() {
  std::stable_sort(population_.begin(), population_.end(),
                   [](const Individual& a, const Individual& b) { return a.score < b.score; });
}

void Island::initialize(const std::vector<model::Roster>& seeds, const std::vector<model::Roster>& starts, std::chrono::steady_clock::time_point deadline) {
  deadline_ = deadline;
  refit_.setDeadline(deadline);
  const model::Problem& p = ev_.rules().problem();
  const int n = std::max(options_.population, 2);
  population_.assign(static_cast<size_t>(n), Individual{model::Roster(p.staffCount(), p.days), {}});
  for (int i = 0; i < n; ++i) {
    Individual& ind = population_[static_cast<size_t>(i)];
    const bool late = std::chrono::steady_clock::now() >= deadline || stopRequested();
    if (i < static_cast<int>(seeds.size())) {
      ind.genome = seeds[static_cast<size_t>(i)];
      ev_.load(ind.genome);
      ind.score = ev_.total();
      continue;
    }
    if (i < static_cast<int>(seeds.size() + starts.size())) {
      ind.genome = starts[static_cast<size_t>(i) - seeds.size()];
      improve(ind, late ? 0 : options_.localSearchMoves);
      continue;
    }
    if (late && i > 0) {
      // Out of time: a mutated copy of the first individual, scored but not improved.
      ind.genome = population_.front().genome;
      reassignMutation(*eligibility_, ind.genome, options_.mutationRate, rng_);
      ev_.load(ind.genome);
      ind.score = ev_.total();
      continue;
    }
    // Mostly noisy greedy starts; a quarter random, for diversity.
    if (i % 4 == 3) {
      randomRoster(*eligibility_, ind.genome, 0.6, rng_);
    } else {
      greedyRoster(*eligibility_, ev_, rng_, i == 0 ? 0.0 : 0.3, deadline);
      ind.genome = ev_.roster();
    }
    improve(ind, late ? 0 : options_.localSearchMoves);
  }
  sortPopulation();
  offspring_ = population_;
}

void Island::step() {
  const int n = static_cast<int>(population_.size());
  const int elite = std::min(options_.elite, n);
  // 1 - Elitism: the best survive unchanged.
  for (int i = 0; i < elite; ++i) offspring_[static_cast<size_t>(i)] = population_[static_cast<size_t>(i)];
  // 2 - Selection.
  selectParents(population_, 2 * (n - elite), options_.selection, options_.tournamentSize, rng_, parents_);
  for (int i = elite; i < n; ++i) {
    const Individual& a = population_[static_cast<size_t>(parents_[static_cast<size_t>(2 * (i - elite))])];
    const Individual& b = population_[static_cast<size_t>(parents_[static_cast<size_t>(2 * (i - elite) + 1)])];
    Individual& child = offspring_[static_cast<size_t>(i)];
    // 3 - Crossover.
    if (rng_.chance(options_.crossoverRate)) {
      if (rng_.chance(options_.blockCrossoverShare)) dayBlockCrossover(a.genome, b.genome, child.genome, rng_);
      else rowUniformCrossover(a.genome, b.genome, child.genome, rng_);
    } else {
      child.genome.cells = a.genome.cells;
    }
    // 4 - Mutation: per-cell reassignment plus a few neighbourhood moves.
    reassignMutation(*eligibility_, child.genome, options_.mutationRate, rng_);
    swapMutation(*eligibility_, child.genome, 1 + rng_.below(3), rng_);
    // 5 - Local search on the incremental evaluator.
    improve(child, options_.localSearchMoves);
  }
  // 6 - Replacement: the offspring become the population.
  std::swap(population_, offspring_);
  sortPopulation();
}

void Island::repairBest() {
  Individual& best = population_.front();
  if (best.score.hard == 0) return;
  ev_.load(best.genome);
  if (repairRows(ev_, refit_, rng_, kRepairHardWeight, kRepairWindow, kRepairRows, repairScratch_) == 0) return;
  if (!(ev_.total() < best.score)) return;
  best.genome.cells = ev_.roster().cells;
  best.score = ev_.total();
}

std::vector<Individual> Island::emigrants(int k) const {
  k = std::min(k, static_cast<int>(population_.size()));
  return std::vector<Individual>(population_.begin(), population_.begin() + k);
}

void Island::immigrate(const std::vector<Individual>& incoming) {
  const size_t n = population_.size();
  for (size_t i = 0; i < incoming.size() && i < n; ++i) population_[n - 1 - i] = incoming[i];
  sortPopulation();
}

}  // namespace rotaweave::search
