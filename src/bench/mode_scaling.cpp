/// @brief `scaling ITEM [--time-limit S] [--threads 1,2,4,8,16] [--seed N] [--islands N]`: one
/// item solved in-process at each thread count with the same time limit and seed, one JSON line
/// each. The solver runs at most one thread per island, so unless --islands is given every run
/// gets as many islands as threads (at least the solver's default): otherwise threads beyond
/// the default island count would sit idle and the line would show nothing about them.
#include <algorithm>
#include <string>

#include "bench/arguments.hpp"
#include "bench/items.hpp"
#include "bench/json_line.hpp"
#include "bench/measure.hpp"
#include "bench/modes.hpp"
#include "io/scenario_loader.hpp"
#include "report/report.hpp"
#include "search/solver.hpp"

namespace rotaweave::bench {

int scalingMode(const Args& args) {
  const Arguments a(args, {"time-limit", "threads", "seed", "islands"});
  if (a.positional().size() != 1)
    throw std::invalid_argument(
        "usage: rotaweave-bench scaling ITEM [--time-limit S] [--threads 1,2,4,8,16] [--seed N] [--islands N]");
  const double timeLimit = a.number("time-limit", 10);
  const auto threadCounts = rangeList(a.value("threads").value_or("1,2,4,8,16"), "--threads");
  const long seed = a.integer("seed", 1);

  ScratchFolder scratch("scaling");
  const Item item = resolveItem(a.positional()[0], scratch.path());
  const model::Problem problem = io::loadScenario(item.yaml.string());
  const rules::RuleSet set(problem);

  for (const long threads : threadCounts) {
    search::SolverOptions o;
    o.seed = static_cast<std::uint64_t>(seed);
    o.timeLimit = timeLimit;
    o.stallGenerations = 0;  // the whole time limit at every thread count, so the lines compare
    o.threads = static_cast<int>(threads);
    o.islands =
        a.has("islands") ? static_cast<int>(a.integer("islands", o.islands)) : std::max<int>(o.islands, o.threads);
    const double cpu0 = processCpuSeconds();
    const auto t0 = Clock::now();
    const search::SolveResult r = search::solve(set, o, {}, nullptr);
    const double wall = secondsSince(t0);
    JsonLine line;
    line.text("item", item.label)
        .integer("threads", threads)
        .integer("threads_used", r.threads)
        .integer("islands", r.islands);
    line.integer("generations", r.generations).raw("best_hard", report::pointsText(r.score.hard));
    line.raw("best_soft", report::pointsText(r.score.soft)).number("wall_s", wall, 3);
    line.number("cpu_per_wall", (processCpuSeconds() - cpu0) / wall, 2).raw("phases", phasesJson(r.phases));
    line.number("time_limit_s", timeLimit, -1).integer("seed", seed).print();
  }
  return 0;
}

}  // namespace rotaweave::bench
