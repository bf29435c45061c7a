/// @brief Archipelago loop: epochs, ring migration, stopping rules.
#include "search/solver.hpp"

#include <algorithm>
#include <atomic>
#include <chrono>
#include <cmath>
#include <memory>

#ifdef _OPENMP
#include <omp.h>
#endif

#include "search/column_generation.hpp"
#include "search/construction.hpp"
#include "search/eligibility.hpp"
#include "search/island.hpp"
#include "search/lagrangian.hpp"
#include "search/stop_signal.hpp"

namespace rotaweave::search {
namespace {

using Clock = std::chrono::steady_clock;

/// A hard point outweighs this many soft ones while the starting rosters are built.
constexpr double kStartHardWeight = 1000.0;
/// The most of the time limit the relaxation may take.
constexpr double kLagrangianTimeShare = 0.1;

/// Threads asked for, or every core.
int wantedThreads(int requested) {
  int cores = 1;
#ifdef _OPENMP
  cores = omp_get_num_procs();
#endif
  return std::max(1, requested > 0 ? requested : cores);
}

std::uint64_t resolveSeed(std::uint64_t seed) {
  if (seed != 0) return seed;
  auto now = static_cast<std::uint64_t>(Clock::now().time_since_epoch().count());
  return splitmix64(now) % 1000000000ULL + 1;  // short enough to retype
}

}  // namespace

SolveResult solve(const rules::RuleSet& rules, const SolverOptions& options, const std::vector<model::Roster>& seeds,
                  const ProgressSink& onProgress) {
  const auto started = Clock::now();
  auto elapsed = [&] { return std::chrono::duration<double>(Clock::now() - started).count(); };

  SolveResult result;
  result.seed = resolveSeed(options.seed);
  const int threads = wantedThreads(options.threads);
  result.islands = options.islands > 0 ? options.islands : std::max(kMinIslands, threads);
  result.threads = std::min(threads, result.islands);

  const Eligibility eligibility(rules.problem());
  std::vector<std::unique_ptr<Island>> islands;
  std::uint64_t seedState = result.seed;
  for (int i = 0; i < result.islands; ++i)
    islands.push_back(std::make_unique<Island>(rules, eligibility, options, splitmix64(seedState)));

  std::atomic<bool> outOfTime{false};
  auto stopNow = [&] {
    if (stopRequested()) return true;
    if (elapsed() >= options.timeLimit) outOfTime = true;
    return outOfTime.load();
  };

  auto after = [&](double seconds) { return started + std::chrono::duration_cast<Clock::duration>(std::chrono::duration<double>(seconds)); };
  const auto deadline = after(options.timeLimit);
  // 1 - Starting rosters from the relaxation of cover, within a share of the time limit; every
  // island's population starts with the caller's seeds, then these.
  std::vector<model::Roster> starts;
  if (options.lagrangianRounds > 0 && options.lagrangianStarts > 0 && !eligibility.freeCells().empty()) {
    eval::Evaluator ev(rules);
    std::vector<RowRefit> refits(static_cast<size_t>(result.threads), RowRefit(rules, eligibility));
    Rng rng(splitmix64(seedState));
    LagrangianResult relaxed = lagrangianStarts(eligibility, ev, refits, rng, options.lagrangianRounds, options.lagrangianStarts,
                                                kStartHardWeight, after(options.timeLimit * kLagrangianTimeShare));
    starts = std::move(relaxed.rosters);
    std::optional<double> bound = relaxed.bound;
    // Then column generation over the rows the rounds proposed, within its own share.
    if (options.columnShare > 0 && relaxed.pool) {
      // Where the relaxation's share ended before its first repaired roster (large
      // scenarios, busy machines), columns grow from a greedy roster instead.
      if (starts.empty()) {
        greedyRoster(eligibility, ev, rng, 0.0, deadline);
        starts.push_back(ev.roster());
      }
      const double share = std::min(options.columnShare, std::max(0.0, 1.0 - elapsed() / options.timeLimit));
      ColumnGenerationLimits limits;
      limits.pricingDeadline = std::min(deadline, Clock::now() + std::chrono::duration_cast<Clock::duration>(
                                                                     std::chrono::duration<double>(options.timeLimit * share / 3)));
      limits.integerSeconds = options.timeLimit * share * 2 / 3;
      const ColumnGenerationResult generated = generateColumns(ev, refits, *relaxed.pool, starts.front(), kStartHardWeight, limits);
      if (generated.bound) bound = std::max(bound.value_or(-INFINITY), *generated.bound);
      if (generated.roster) starts.insert(starts.begin(), *generated.roster);
    }
    // Every roster costs a whole number of cost units: the bound rounds up to one, after a
    // margin for the rounding of its sum in doubles.
    if (bound && eligibility.complete())
      result.lowerBound = std::max<Cost>(0, static_cast<Cost>(std::ceil(*bound - 1e-6 * std::max(1.0, std::abs(*bound)))));
  }

  result.phases.push_back({"starts", elapsed()});

  // 2 - Initial populations, one island per thread, within the time limit.
#pragma omp parallel for num_threads(result.threads) schedule(dynamic, 1)
  for (int i = 0; i < result.islands; ++i) islands[static_cast<size_t>(i)]->initialize(seeds, starts, deadline);

  result.phases.push_back({"populations", elapsed() - result.phases.back().seconds});

  auto bestIsland = [&] {
    int best = 0;
    for (int i = 1; i < result.islands; ++i)
      if (islands[static_cast<size_t>(i)]->best().score < islands[static_cast<size_t>(best)]->best().score) best = i;
    return best;
  };
  rules::Tally best = islands[static_cast<size_t>(bestIsland())]->best().score;
  result.history.emplace_back(elapsed(), best);
  long generation = 0, lastImprovement = 0;
  const Cost targetSoft = std::llround(options.targetSoft * static_cast<double>(kCostScale));

  while (true) {
    // 3 - Stopping rules, checked between epochs.
    if (stopRequested()) { result.stopReason = "interrupted"; break; }
    if (outOfTime || elapsed() >= options.timeLimit) { result.stopReason = "time limit"; break; }
    if (options.generations > 0 && generation >= options.generations) { result.stopReason = "generation limit"; break; }
    if (options.stallGenerations > 0 && generation - lastImprovement >= options.stallGenerations) {
      result.stopReason = "no improvement for " + std::to_string(options.stallGenerations) + " generations";
      break;
    }
    if (best.hard == 0 && best.soft <= targetSoft) {
      result.stopReason = best.soft == 0 ? "no penalty left" : "target reached";
      break;
    }

    // 4 - One epoch: every island evolves on its own.
    int epoch = options.migrationInterval;
    if (options.generations > 0) epoch = static_cast<int>(std::min<long>(epoch, options.generations - generation));
    std::vector<int> done(static_cast<size_t>(result.islands), 0);
#pragma omp parallel for num_threads(result.threads) schedule(dynamic, 1)
    for (int i = 0; i < result.islands; ++i) {
      done[static_cast<size_t>(i)] = islands[static_cast<size_t>(i)]->evolve(epoch, stopNow);
      if (!stopNow()) islands[static_cast<size_t>(i)]->repairBest();
    }
    generation += *std::max_element(done.begin(), done.end());

    // 5 - Migration on the ring, in island order so the outcome never depends on threads.
    if (result.islands > 1 && options.migrants > 0) {
      std::vector<std::vector<Individual>> outgoing;
      for (const auto& island : islands) outgoing.push_back(island->emigrants(options.migrants));
      for (int i = 0; i < result.islands; ++i)
        islands[static_cast<size_t>((i + 1) % result.islands)]->immigrate(outgoing[static_cast<size_t>(i)]);
    }

    const rules::Tally now = islands[static_cast<size_t>(bestIsland())]->best().score;
    if (now < best) {
      best = now;
      lastImprovement = generation;
      result.history.emplace_back(elapsed(), best);
    }
    if (onProgress) {
      Progress p{elapsed(), generation, best, {}};
      for (const auto& island : islands) p.islandBest.push_back(island->best().score);
      onProgress(p);
    }
  }
  result.phases.push_back({"generations", elapsed() - result.phases[0].seconds - result.phases[1].seconds});
  const Island& winner = *islands[static_cast<size_t>(bestIsland())];
  result.best = winner.best().genome;
  result.score = winner.best().score;
  result.generations = generation;
  result.seconds = elapsed();
  result.history.emplace_back(result.seconds, result.score);
  return result;
}

}  // namespace rotaweave::search
