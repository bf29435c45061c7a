/// @brief `solve`: search for a roster, then report and write it.
#include <algorithm>
#include <chrono>

#include "app/commands.hpp"
#include "app/pipeline.hpp"
#include "app/progress.hpp"
#include "io/scenario_loader.hpp"
#include "search/stop_signal.hpp"

namespace rotaweave::app {

Outcome searchAndWrite(const model::Problem& problem, const std::vector<model::Roster>& seeds, const SolveRequest& request,
                       const char* command, io::OutputFolder& out) {
  const rules::RuleSet ruleSet(problem);
  search::installStopSignals();
  ProgressPrinter printer(request.options.quiet);
  // The time limit covers the whole run: what loading took and what writing will take come
  // out of the search's share.
  search::SolverOptions options = request.options;
  const double spent = std::chrono::duration<double>(std::chrono::steady_clock::now() - request.startedAt).count();
  options.timeLimit = std::max(0.0, request.options.timeLimit - spent - outputReserve(problem, request.options.timeLimit));
  const search::SolveResult result = search::solve(ruleSet, options, seeds, std::ref(printer));
  printer.finish(result);
  report::RunInfo run{command, result.seed, result.islands, result.threads, result.generations,
                      result.seconds, result.stopReason, result.history, result.lowerBound};
  return reportAndWrite(ruleSet, result.best, std::move(run), out, nullptr, request.previousCalendars.get());
}

Outcome solve(const SolveRequest& request) {
  io::OutputFolder out(request.out);  // checked and locked before anything is read or searched
  const model::Problem problem = io::loadScenario(request.scenario);
  printNotes(problem);
  return searchAndWrite(problem, {}, request, "solve", out);
}

}  // namespace rotaweave::app
