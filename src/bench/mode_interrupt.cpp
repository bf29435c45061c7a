/// @brief `interrupt [--at 0.5,2,5] [--threads N] [--seed N] [--phases] ITEM`: how soon
/// `rotaweave solve` stops on SIGINT, and whether what it leaves is whole. For each time, one
/// child runs with --time-limit 600 (and --stall 0, so it cannot end by itself first) and gets
/// SIGINT that many seconds after its start; the line gives the time from the signal to its
/// exit, its status (0 or 1 expected) and whether roster.csv reads back with one row per
/// person, report.json parses and report.txt exists. A solve goes through loading, the
/// relaxation ("starts"), the first populations, the generations, then the report; --phases
/// first solves the item in-process to one generation and prints when each phase ends, and then
/// names the phase each signal fell in, so the times can be chosen to hit each one.
#include <algorithm>
#include <cmath>
#include <string>
#include <thread>

#include "bench/arguments.hpp"
#include "bench/items.hpp"
#include "bench/json_line.hpp"
#include "bench/measure.hpp"
#include "bench/modes.hpp"
#include "bench/solve_child.hpp"
#include "io/input_error.hpp"
#include "io/roster_csv.hpp"
#include "io/scenario_loader.hpp"
#include "search/solver.hpp"

namespace rotaweave::bench {
namespace {

/// The time limit of every interrupted run: far beyond any signal time, so only the signal ends it.
constexpr double kTimeLimit = 600;
/// A child still running this long after its signal is killed and the run counts as failed.
constexpr double kGraceSeconds = 120;

/// When each phase of a solve of the item ends, seconds from the start of the process
/// (loading included), measured in-process with the same seed and threads.
struct PhaseEnds {
  std::vector<std::pair<std::string, double>> ends;  ///< "loading", "starts", "populations", "generation 1"
  std::string phaseAt(double seconds) const {
    for (const auto& [name, end] : ends)
      if (seconds < end) return name;
    return "generations";
  }
};

PhaseEnds measurePhases(const Item& item, long threads, long seed) {
  const auto t0 = Clock::now();
  const model::Problem problem = io::loadScenario(item.yaml.string());
  const rules::RuleSet set(problem);
  PhaseEnds phases;
  double at = secondsSince(t0);
  phases.ends.emplace_back("loading", at);
  search::SolverOptions o;
  o.timeLimit = kTimeLimit;
  o.generations = 1;
  o.stallGenerations = 0;
  o.threads = static_cast<int>(threads);
  o.seed = static_cast<std::uint64_t>(seed);
  for (const auto& phase : search::solve(set, o, {}, nullptr).phases)
    phases.ends.emplace_back(std::string(phase.name) == "generations" ? "generation 1" : phase.name,
                             at += phase.seconds);
  return phases;
}

/// Whether roster.csv reads back for the scenario with the project's reader, which insists on
/// one row per person; the reader's message when it does not.
std::string rosterProblem(const fs::path& roster, const model::Problem& problem) {
  try {
    io::readRosterCsv(roster.string(), problem);
    return "";
  } catch (const io::InputError& e) {
    return e.what();
  }
}

}  // namespace

int interruptMode(const Args& args) {
  ChildLauncher launcher;  // before the scenario is loaded or solved here: see child_launcher.hpp
  const Arguments a(args, {"at", "threads", "seed"}, {"phases"});
  if (a.positional().size() != 1)
    throw std::invalid_argument(
        "usage: rotaweave-bench interrupt [--at 0.5,2,5] [--threads N] [--seed N] [--phases] ITEM");
  const auto times = numberList(a.value("at").value_or("0.5,2,5"), "--at");
  const long threads = a.integer("threads", std::max(1U, std::thread::hardware_concurrency()));
  const long seed = a.integer("seed", 1);

  ScratchFolder scratch("interrupt");
  const Item item = resolveItem(a.positional()[0], scratch.path());
  const model::Problem problem = io::loadScenario(item.yaml.string());
  PhaseEnds phases;
  if (a.has("phases")) {
    phases = measurePhases(item, threads, seed);
    JsonLine line;
    line.text("item", item.label).text("phase_ends", "seconds from the start, in-process, to one generation");
    for (const auto& [name, end] : phases.ends) line.number(name.c_str(), end, 2);
    line.print();
  }

  int runs = 0, ok = 0;
  double worstLatency = 0, worstAt = 0;
  for (size_t k = 0; k < times.size(); ++k) {
    SolveCall call;
    call.scenario = item.yaml;
    call.out = scratch.path() / ("run-" + std::to_string(k + 1));
    call.timeLimit = kTimeLimit;
    call.threads = static_cast<int>(threads);
    call.seed = static_cast<std::uint64_t>(seed);
    call.interruptAfter = times[k];
    call.killAfter = times[k] + kGraceSeconds;
    call.extra = {"--stall", "0"};
    const SolveRun run = runSolve(launcher, call);

    const auto& status = run.child.exitStatus;
    const bool exitOk = status && (*status == 0 || *status == 1);
    const std::string rosterError = run.rosterCsv ? rosterProblem(call.out / "roster.csv", problem) : "no roster.csv";
    const bool whole =
        exitOk && run.child.signalled && !run.child.killed && rosterError.empty() && run.report.valid && run.reportTxt;
    JsonLine line;
    line.text("item", item.label).number("at_s", times[k], -1);
    if (!phases.ends.empty()) line.text("phase", phases.phaseAt(times[k]));
    line.boolean("signalled", run.child.signalled)
        .number("latency_s", run.child.signalled ? run.child.signalToExitSeconds : std::nan(""), 3);
    addSolveFields(line, run);
    line.boolean("exit_ok", exitOk).boolean("roster_rows_ok", rosterError.empty());
    if (!rosterError.empty()) line.text("roster_error", rosterError);
    line.boolean("report_json_valid", run.report.valid);
    if (run.reportJson && !run.report.valid) line.text("report_error", run.report.error);
    if (run.report.valid) line.integer("generations", run.report.generations).text("stop", run.report.stop);
    line.boolean("ok", whole).print();

    ++runs;
    ok += whole;
    if (run.child.signalled && run.child.signalToExitSeconds > worstLatency)
      worstLatency = run.child.signalToExitSeconds, worstAt = times[k];
  }
  JsonLine summary;
  summary.text("summary", "interrupt").text("item", item.label).integer("runs", runs).integer("ok", ok);
  summary.number("worst_latency_s", worstLatency, 3).number("worst_latency_at_s", worstAt, -1).print();
  return 0;
}

}  // namespace rotaweave::bench
