/// @brief `limits [--limits 5,10,60] [--threads N] [--seed N] [ITEM...]`: does `rotaweave solve`
/// end within its --time-limit, at what peak memory, and with complete outputs? Each item runs
/// at each limit as a child process, timed from outside as a user would see it (loading and
/// writing the outputs included). One JSON line per run, then a summary line. Without items:
/// the 24 benchmark instances (see datasetFolder) and generated:300x31 and generated:1000x31.
#include <algorithm>
#include <cctype>
#include <cstdio>
#include <iostream>
#include <string>
#include <thread>
#include <vector>

#include "bench/arguments.hpp"
#include "bench/items.hpp"
#include "bench/json_line.hpp"
#include "bench/modes.hpp"
#include "bench/solve_child.hpp"

namespace rotaweave::bench {
namespace {

/// A run keeps its limit if it ends within this much past it: a second for loading and writing
/// the outputs, or 2 % of long limits (the solver stops between generations, not mid-move).
double allowedOverrun(double limit) { return std::max(1.0, 0.02 * limit); }

std::vector<std::string> defaultItems() {
  std::vector<std::string> items;
  const fs::path dataset = datasetFolder();
  for (int n = 1; n <= 24; ++n) {
    const fs::path instance = dataset / ("Instance" + std::to_string(n) + ".txt");
    if (fs::is_regular_file(instance)) items.push_back(instance.string());
  }
  if (items.empty())
    std::cerr << "rotaweave-bench: no benchmark instances in " << dataset
              << " (set ROTAWEAVE_DATASET); generated items only\n";
  items.insert(items.end(), {"generated:300x31", "generated:1000x31"});
  return items;
}

/// A name for the item's output folder: letters and digits kept, anything else '_'.
std::string folderName(const std::string& label) {
  std::string name = label;
  for (char& c : name)
    if (!std::isalnum(static_cast<unsigned char>(c))) c = '_';
  return name;
}

}  // namespace

int limitsMode(const Args& args) {
  ChildLauncher launcher;
  const Arguments a(args, {"limits", "threads", "seed"});
  const auto limits = numberList(a.value("limits").value_or("5,10,60"), "--limits");
  const long threads = a.integer("threads", std::max(1U, std::thread::hardware_concurrency()));
  const long seed = a.integer("seed", 1);
  const std::vector<std::string> items = a.positional().empty() ? defaultItems() : a.positional();

  ScratchFolder scratch("limits");
  int runs = 0, within = 0, complete = 0;
  double worstOver = -1e300, worstPeak = 0;
  std::string worstOverRun, worstPeakRun;
  for (const auto& arg : items) {
    const Item item = resolveItem(arg, scratch.path());
    for (const double limit : limits) {
      char limitText[32];
      std::snprintf(limitText, sizeof limitText, "%g", limit);
      SolveCall call;
      call.scenario = item.yaml;
      call.out = scratch.path() / (folderName(item.label) + "-" + limitText + "s");
      call.timeLimit = limit;
      call.threads = static_cast<int>(threads);
      call.seed = static_cast<std::uint64_t>(seed);
      call.killAfter = limit * 3 + 60;  // far past any sane overrun: only a hung run gets here
      const SolveRun run = runSolve(launcher, call);

      const double over = run.child.wallSeconds - limit;
      const bool inTime = over <= allowedOverrun(limit);
      const bool outputs = run.rosterCsv && run.reportJson && run.reportTxt && run.report.valid;
      JsonLine line;
      line.text("item", item.label).number("limit", limit, -1).integer("threads", threads);
      addSolveFields(line, run);
      line.number("over_s", over, 3).boolean("within", inTime);
      line.print();

      const std::string name = item.label + " at " + limitText + " s";
      ++runs;
      within += inTime;
      complete += outputs && run.child.exitStatus && *run.child.exitStatus <= 1;
      if (over > worstOver) worstOver = over, worstOverRun = name;
      if (run.child.peakRssMb > worstPeak) worstPeak = run.child.peakRssMb, worstPeakRun = name;
    }
  }
  JsonLine summary;
  summary.text("summary", "limits").integer("runs", runs).integer("within", within).integer("complete", complete);
  summary.number("worst_over_s", runs ? worstOver : 0, 3).text("worst_over_run", worstOverRun);
  summary.number("worst_peak_rss_mb", worstPeak, 1).text("worst_peak_run", worstPeakRun).print();
  return 0;
}

}  // namespace rotaweave::bench
