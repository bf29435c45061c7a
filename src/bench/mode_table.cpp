/// @brief `table DIR [--time-limit S] [--threads N] [--seeds 1,2,3] [--instances 1-24]
/// [--keep DIR]`: every benchmark instance InstanceN.txt in DIR, solved by `rotaweave solve` as
/// a child process once per seed, as a markdown table against the published figures.
///
/// Each roster is kept (under --keep, or a temporary folder that is left in place) and scored
/// again here by eval::Evaluator, read back through io::readRosterCsv: the table shows what the
/// roster file is worth, not only what the solver said, and each run's JSON line says whether
/// the two agree.
#include <algorithm>
#include <iostream>
#include <memory>
#include <string>
#include <thread>
#include <utility>
#include <vector>

#include "bench/arguments.hpp"
#include "bench/benchmark_table.hpp"
#include "bench/items.hpp"
#include "bench/json_line.hpp"
#include "bench/modes.hpp"
#include "bench/solve_child.hpp"
#include "eval/evaluator.hpp"
#include "io/input_error.hpp"
#include "io/roster_csv.hpp"
#include "io/scenario_loader.hpp"
#include "report/report.hpp"

namespace rotaweave::bench {
namespace {

/// A kept roster scored by our evaluator; `error` says why there is no score.
struct Rescore {
  bool scored = false;
  rules::Tally tally;
  std::string error;
};

Rescore rescore(const fs::path& roster, const rules::RuleSet& set) {
  Rescore r;
  if (!fs::is_regular_file(roster)) {
    r.error = "no roster.csv";
    return r;
  }
  try {
    eval::Evaluator evaluator(set);
    r.tally = evaluator.score(io::readRosterCsv(roster.string(), set.problem()));
    r.scored = true;
  } catch (const io::InputError& e) {
    r.error = e.what();
  }
  return r;
}

/// Points as the report writes them, read back as a number: equal exactly when the report's
/// text and our score's text are the same.
double pointsValue(Cost cost) { return std::stod(report::pointsText(cost)); }

std::string sizeText(const model::Problem& p) {
  return std::to_string(p.staffCount()) + " x " + std::to_string(p.days) + " x " + std::to_string(p.shifts.size());
}

}  // namespace

int tableMode(const Args& args) {
  ChildLauncher launcher;  // before any scenario is loaded here: see child_launcher.hpp
  const Arguments a(args, {"time-limit", "threads", "seeds", "instances", "keep"});
  if (a.positional().size() != 1)
    throw std::invalid_argument(
        "usage: rotaweave-bench table DIR [--time-limit S] [--threads N] [--seeds 1,2,3] [--instances 1-24] [--keep "
        "DIR]");
  const fs::path dataset = a.positional()[0];
  const double timeLimit = a.number("time-limit", 60);
  const long threads = a.integer("threads", std::max(1U, std::thread::hardware_concurrency()));
  const auto seeds = rangeList(a.value("seeds").value_or("1,2,3"), "--seeds");
  std::vector<std::pair<int, fs::path>> instances;
  for (const long number : rangeList(a.value("instances").value_or("1-24"), "--instances")) {
    const fs::path instance = dataset / ("Instance" + std::to_string(number) + ".txt");
    if (fs::is_regular_file(instance)) instances.emplace_back(static_cast<int>(number), instance);
  }
  if (instances.empty()) throw std::invalid_argument("no InstanceN.txt for the asked instances in " + dataset.string());

  std::unique_ptr<ScratchFolder> temporary;
  fs::path keep;
  if (const auto folder = a.value("keep")) {
    keep = *folder;
    fs::create_directories(keep);
  } else {
    temporary = std::make_unique<ScratchFolder>("table");
    temporary->release();  // the rosters are the evidence behind the table: never deleted here
    keep = temporary->path();
  }
  std::cerr << "rotaweave-bench: rosters kept in " << keep.string() << "\n";

  std::vector<TableRow> rows;
  for (const auto& [number, instance] : instances) {
    const Item item = resolveItem(instance.string(), keep);
    const model::Problem problem = io::loadScenario(item.yaml.string());
    const rules::RuleSet set(problem);
    TableRow row{number, sizeText(problem), {}};
    for (const long seed : seeds) {
      SolveCall call;
      call.scenario = item.yaml;
      call.out = keep / (item.label + "-seed" + std::to_string(seed));
      call.timeLimit = timeLimit;
      call.threads = static_cast<int>(threads);
      call.seed = static_cast<std::uint64_t>(seed);
      call.killAfter = timeLimit * 3 + 60;
      const SolveRun run = runSolve(launcher, call);
      const Rescore score = rescore(call.out / "roster.csv", set);

      JsonLine line;
      line.text("instance", item.label)
          .integer("seed", seed)
          .number("time_limit", timeLimit, -1)
          .integer("threads", threads);
      addSolveFields(line, run);
      if (score.scored) {
        line.raw("rescored_hard", report::pointsText(score.tally.hard))
            .raw("rescored_soft", report::pointsText(score.tally.soft));
        line.boolean("rescore_matches_report", run.report.valid && pointsValue(score.tally.hard) == run.report.hard &&
                                                   pointsValue(score.tally.soft) == run.report.soft);
      } else {
        line.raw("rescored_hard", "null").raw("rescored_soft", "null").text("rescore_error", score.error);
      }
      line.text("roster", (call.out / "roster.csv").string()).print();
      row.runs.push_back(TableRun{score.scored, score.scored ? pointsValue(score.tally.hard) : 0,
                                  score.scored ? pointsValue(score.tally.soft) : 0, run.child.wallSeconds});
    }
    rows.push_back(std::move(row));
  }

  std::cout << "\nTime limit " << timeLimit << " s, " << threads << " threads, " << seeds.size()
            << " seed(s); hard and soft re-scored from the kept rosters; gap: (median soft - best known) / best known, "
               "– where a run left a hard breach or no roster.\n\n"
            << markdownTable(rows) << std::flush;
  return 0;
}

}  // namespace rotaweave::bench
