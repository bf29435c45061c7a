/// @brief `speed [ITEM...]`: evaluation and generation rates, one JSON line per item (a
/// scenario YAML, InstanceN.txt or generated:PxD; the generated 50 x 31 without arguments),
/// in about 30 s each.
#include <algorithm>
#include <cmath>
#include <cstdio>
#include <string>
#include <vector>

#include "bench/items.hpp"
#include "bench/json_line.hpp"
#include "bench/measure.hpp"
#include "bench/modes.hpp"
#include "eval/evaluator.hpp"
#include "io/scenario_loader.hpp"
#include "report/report.hpp"
#include "search/construction.hpp"
#include "search/eligibility.hpp"
#include "search/local_search.hpp"
#include "search/solver.hpp"

namespace rotaweave::bench {
namespace {

/// Best and median of five 0.4 s samples of a rate: a shared machine's noise only ever slows
/// a sample down, so the best shows the code's speed and the median what to expect.
struct Rate {
  double best = 0, median = 0;
};

template <class Work>
Rate sampleRate(Work&& work) {
  std::vector<double> samples;
  for (int k = 0; k < 5; ++k) {
    long n = 0;
    const double t0 = threadCpuSeconds();
    while (threadCpuSeconds() - t0 < 0.4) n += work();
    samples.push_back(static_cast<double>(n) / (threadCpuSeconds() - t0));
  }
  std::sort(samples.begin(), samples.end());
  return Rate{samples.back(), samples[samples.size() / 2]};
}

/// Full evaluations per second on one core, over random rosters.
Rate fullEvalsPerSecond(const rules::RuleSet& set, const search::Eligibility& e) {
  eval::Evaluator ev(set);
  search::Rng rng(1);
  std::vector<model::Roster> rosters(8, model::Roster(set.problem().staffCount(), set.problem().days));
  for (auto& r : rosters) search::randomRoster(e, r, 0.5, rng);
  Cost sink = 0;
  const Rate rate = sampleRate([&] {
    for (const auto& r : rosters) sink += ev.score(r).soft;
    return static_cast<long>(rosters.size());
  });
  if (sink == -1) std::puts("");  // keep the work observable
  return rate;
}

/// Incremental move evaluations per second on one core, about one in ten no-worse moves
/// committed: with tryMove, or with the bounded try local search uses (limit: no worse than
/// now, hard points weighed as 100 soft), which gives up early on a move that is sure to lose.
Rate movesPerSecond(const rules::RuleSet& set, const search::Eligibility& e, bool bounded) {
  eval::Evaluator ev(set);
  search::Rng rng(2);
  model::Roster g(set.problem().staffCount(), set.problem().days);
  search::randomRoster(e, g, 0.5, rng);
  ev.load(g);
  eval::Move move;
  constexpr double kHardWeight = 100;
  return sampleRate([&] {
    long n = 0;
    for (int i = 0; i < 4096; ++i) {
      search::randomMove(e, ev.roster(), rng, move);
      if (move.size == 0) continue;
      const rules::Tally now = ev.total();
      const bool noWorse =
          bounded ? ev.tryMoveWithin(move, kHardWeight, now.weighed(kHardWeight)) : !(now < ev.tryMove(move));
      if (noWorse && rng.below(10) == 0) ev.commit();
      ++n;
    }
    return n;
  });
}

/// One scenario should take about this long, whatever its size (a 30-person month used to take
/// over two minutes, most of it the relaxation that opens every solve); more only where one
/// generation alone takes longer.
constexpr double kScenarioBudgetSeconds = 30;
/// Kept back from the budget for what the plan below does not foresee and the output.
constexpr double kReserveSeconds = 2;
/// The most generations a timed solve runs (what the bench always ran when time was no object).
constexpr long kMostGenerations = 12;

/// The options of every solve here: seed 1, four islands, the solver's defaults otherwise, and
/// no stop before the generation count (a roster without penalty ends a normal solve early,
/// but here the count is the measure).
search::SolverOptions speedOptions(int threads) {
  search::SolverOptions o;
  o.seed = 1;
  o.islands = 4;
  o.threads = threads;
  o.stallGenerations = 0;
  o.targetSoft = -1;
  return o;
}

/// `cpuPerWall` is the process CPU time over the wall time of the whole solve.
struct TimedSolve {
  search::SolveResult result;
  double wallSeconds = 0, cpuPerWall = 0;
  /// Generations per second of the generations phase alone (the relaxation and the first
  /// populations left out); NaN when none ran or the time limit cut them short, since then
  /// islands may have run different numbers of them (with fewer threads than islands, the
  /// islands of an epoch run one after the other).
  double generationRate() const {
    if (result.stopReason != "generation limit" || result.phases.empty()) return std::nan("");
    return static_cast<double>(result.generations) / result.phases.back().seconds;
  }
};

TimedSolve timedSolve(const rules::RuleSet& set, const search::SolverOptions& o) {
  const double cpu0 = processCpuSeconds();
  const auto t0 = Clock::now();
  TimedSolve timed{search::solve(set, o, {}, nullptr)};
  timed.wallSeconds = secondsSince(t0);
  timed.cpuPerWall = (processCpuSeconds() - cpu0) / timed.wallSeconds;
  return timed;
}

/// How the timed solves are bounded: a generation count, and a time limit that leaves room for
/// all of them after the starts. The time limit also sets how long the relaxation may run (a
/// tenth of it, as long again for the pool's combination, then column generation's share).
struct Plan {
  double firstPopulationSeconds = 0;  ///< probe: the first populations, without relaxation starts
  double generationSeconds = 0;       ///< probe: one generation, one thread
  long generations = 1;
  double timeLimit = 0;
};

/// Times the first populations and one generation on one thread, with the relaxation off, then
/// picks the most generations whose two solves (one and two threads) fit in `secondsLeft`.
/// With W the one-thread work after the starts (populations plus generations), the time limit
/// is 2W + 2 s: the starts take at most half of it, so the generations are never cut. The two
/// solves then take about 2.5 W + 1 s (the two-thread one about half the work, the same starts).
Plan planSolves(const rules::RuleSet& set, double secondsLeft) {
  search::SolverOptions probe = speedOptions(1);
  probe.lagrangianRounds = 0;
  probe.generations = 1;
  probe.timeLimit = std::max(10.0, secondsLeft);
  const search::SolveResult r = search::solve(set, probe, {}, nullptr);
  Plan plan;
  plan.firstPopulationSeconds = r.phases[1].seconds;
  plan.generationSeconds = r.generations == 1 ? r.phases[2].seconds : probe.timeLimit;
  auto work = [&](long g) { return plan.firstPopulationSeconds + static_cast<double>(g) * plan.generationSeconds; };
  while (plan.generations < kMostGenerations && 2.5 * work(plan.generations + 1) + 1 <= secondsLeft) ++plan.generations;
  plan.timeLimit = std::ceil(2 * work(plan.generations) + 2);
  return plan;
}

}  // namespace

int speedMode(const Args& args) {
  ScratchFolder scratch("speed");
  std::vector<std::string> items = args;
  if (items.empty()) items.push_back("generated:50x31");
  for (const auto& arg : items) {
    const auto started = Clock::now();
    const Item item = resolveItem(arg, scratch.path());
    const model::Problem p = io::loadScenario(item.yaml.string());
    const rules::RuleSet set(p);
    const search::Eligibility e(p);
    const Rate full = fullEvalsPerSecond(set, e);
    const Rate moves = movesPerSecond(set, e, false), bounded = movesPerSecond(set, e, true);
    const Plan plan = planSolves(set, kScenarioBudgetSeconds - kReserveSeconds - secondsSince(started));
    search::SolverOptions o1 = speedOptions(1), o2 = speedOptions(2);
    o1.generations = o2.generations = plan.generations;
    o1.timeLimit = o2.timeLimit = plan.timeLimit;
    const TimedSolve one = timedSolve(set, o1), two = timedSolve(set, o2);
    const double rate1 = one.generationRate(), rate2 = two.generationRate();
    JsonLine line;
    line.text("scenario", item.label).integer("people", p.staffCount()).integer("days", p.days);
    line.number("full_evals_per_s", full.best, 0).number("full_evals_per_s_median", full.median, 0);
    line.number("moves_per_s", moves.best, 0).number("moves_per_s_median", moves.median, 0);
    line.number("bounded_moves_per_s", bounded.best, 0).number("bounded_moves_per_s_median", bounded.median, 0);
    line.number("probe_generation_s_1t", plan.generationSeconds, 2).integer("generations", plan.generations);
    line.number("solve_time_limit_s", plan.timeLimit, 0)
        .text("stop_1t", one.result.stopReason)
        .text("stop_2t", two.result.stopReason);
    line.number("gens_per_s_1t", rate1, 2).number("gens_per_s_2t", rate2, 2);
    line.number("speedup_2t", rate2 / rate1, 2).number("ms_per_generation_2t", 1000.0 / rate2, 1);
    line.number("cpu_per_wall_2t", two.cpuPerWall, 2).raw("phases_1t", phasesJson(one.result.phases));
    line.raw("phases_2t", phasesJson(two.result.phases));
    line.raw("best_hard_2t", report::pointsText(two.result.score.hard))
        .raw("best_soft_2t", report::pointsText(two.result.score.soft));
    line.number("seconds", secondsSince(started), 1).number("peak_rss_mb", peakRssMb(), 1).print();
  }
  return 0;
}

}  // namespace rotaweave::bench
