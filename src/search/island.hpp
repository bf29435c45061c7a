/// @brief One island: a population evolving on its own evaluator and random stream.
///
/// Islands share only the read-only Problem, RuleSet and Eligibility, so they can run on
/// any thread; the result depends on the seed alone, never on scheduling.
#pragma once
#include <chrono>
#include <vector>

#include "eval/evaluator.hpp"
#include "search/eligibility.hpp"
#include "search/individual.hpp"
#include "search/local_search.hpp"
#include "search/rng.hpp"
#include "search/row_refit.hpp"
#include "search/row_repair.hpp"
#include "search/solver_options.hpp"

namespace rotaweave::search {

class Island {
 public:
  Island(const rules::RuleSet& rules, const Eligibility& eligibility, const SolverOptions& options, std::uint64_t seed);

  /// Builds the first population; `seeds` (e.g. a published roster) join it as they are,
  /// `starts` after local search.
  /// Past `deadline`, the rest of the population are quick variants of the first individual;
  /// local search in later generations also returns at `deadline`.
  void initialize(const std::vector<model::Roster>& seeds, const std::vector<model::Roster>& starts, std::chrono::steady_clock::time_point deadline);
  /// Runs up to `generations` generations; stops early when `stop()` returns true.
  template <class Stop>
  int evolve(int generations, Stop&& stop) {
    int done = 0;
    for (; done < generations && !stop(); ++done) step();
    return done;
  }
  const Individual& best() const { return population_.front(); }
  /// Re-fits the rows of the best roster that break a hard rule, around a breach each; keeps
  /// the result if it is better (search/row_repair.hpp).
  void repairBest();
  /// Copies of the best k individuals.
  std::vector<Individual> emigrants(int k) const;
  /// Replaces the worst individuals with the immigrants, keeping the population sorted.
  void immigrate(const std::vector<Individual>& incoming);

 private:
  void step();
  void improve(Individual& ind, int moves);
  void sortPopulation();

  const Eligibility* eligibility_;
  SolverOptions options_;
  eval::Evaluator ev_;
  Rng rng_;
  std::vector<Individual> population_, offspring_;
  std::vector<int> parents_;
  LateAcceptanceScratch lateScratch_;
  RowRefit refit_;
  RowRepairScratch repairScratch_;
  std::chrono::steady_clock::time_point deadline_ = std::chrono::steady_clock::time_point::max();
};

}  // namespace rotaweave::search
