/// @brief The `rotaweave solve` command line and the look at its outputs.
#include "bench/solve_child.hpp"

#include <cstdio>
#include <string>

#include "bench/items.hpp"

namespace rotaweave::bench {
namespace {

std::string numberText(double value) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%g", value);
  return buf;
}

}  // namespace

SolveRun runSolve(ChildLauncher& launcher, const SolveCall& call) {
  ChildSpec spec;
  spec.argv = {siblingBinary("rotaweave").string(),
               "solve",
               call.scenario.string(),
               "--out",
               call.out.string(),
               "--time-limit",
               numberText(call.timeLimit),
               "--seed",
               std::to_string(call.seed),
               "--quiet"};
  if (call.threads > 0) spec.argv.insert(spec.argv.end(), {"--threads", std::to_string(call.threads)});
  spec.argv.insert(spec.argv.end(), call.extra.begin(), call.extra.end());
  spec.log = call.out.string() + ".log";
  spec.killAfter = call.killAfter;
  spec.signalAfter = call.interruptAfter;

  SolveRun run;
  run.child = launcher.run(spec);
  run.rosterCsv = std::filesystem::is_regular_file(call.out / "roster.csv");
  run.reportJson = std::filesystem::is_regular_file(call.out / "report.json");
  run.reportTxt = std::filesystem::is_regular_file(call.out / "report.txt");
  if (run.reportJson) run.report = readReportFields(call.out / "report.json");
  return run;
}

void addSolveFields(JsonLine& line, const SolveRun& run) {
  const ChildRun& c = run.child;
  line.number("wall_s", c.wallSeconds, 3).number("peak_rss_mb", c.peakRssMb, 1);
  line.raw("exit", c.exitStatus ? std::to_string(*c.exitStatus) : "null");
  line.raw("signal", c.termSignal ? std::to_string(*c.termSignal) : "null").boolean("killed", c.killed);
  if (run.report.valid)
    line.number("hard", run.report.hard, -1).number("soft", run.report.soft, -1);
  else
    line.raw("hard", "null").raw("soft", "null");
  line.boolean("roster_csv", run.rosterCsv).boolean("report_json", run.reportJson).boolean("report_txt", run.reportTxt);
}

}  // namespace rotaweave::bench
