/// @brief The island-model search: islands evolve in parallel (OpenMP), migrate on a ring at
/// fixed generation counts, and stop on time, generations, stall or a signal.
///
/// Determinism: islands are advanced in epochs of `migrationInterval` generations, each island
/// with its own random stream, and migration happens between epochs in island order. The same
/// seed, islands and generations therefore give the same roster for any thread count
/// (a time limit or a signal can stop a run at a different point, by nature).
#pragma once
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "model/roster.hpp"
#include "rules/rule_set.hpp"
#include "search/solver_options.hpp"

namespace rotaweave::search {

struct Progress {
  double seconds = 0;
  long generation = 0;
  rules::Tally best;
  std::vector<rules::Tally> islandBest;
};

/// Wall time one phase of a solve took.
struct PhaseTime {
  const char* name;  ///< "starts" (relaxation and pool), "populations", "generations"
  double seconds;
};

struct SolveResult {
  model::Roster best;
  rules::Tally score;
  long generations = 0;
  double seconds = 0;
  std::string stopReason;
  std::uint64_t seed = 0;
  int islands = 0;
  int threads = 0;
  std::vector<std::pair<double, rules::Tally>> history;  ///< best over time
  std::vector<PhaseTime> phases;                         ///< in the order they ran
  /// Soft penalty (cost units) no roster without a hard breach can score below, where the
  /// relaxation proves one (search/lagrangian.hpp); unset where it cannot.
  std::optional<Cost> lowerBound;
};

using ProgressSink = std::function<void(const Progress&)>;

/// Runs the search. `seeds` are rosters to start from (may be empty). `onProgress` is called
/// after every epoch from the calling thread.
SolveResult solve(const rules::RuleSet& rules, const SolverOptions& options, const std::vector<model::Roster>& seeds,
                  const ProgressSink& onProgress);

}  // namespace rotaweave::search
