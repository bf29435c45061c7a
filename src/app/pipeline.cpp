/// @brief Explain, report, write.
#include "app/pipeline.hpp"

#include <algorithm>
#include <iostream>

#include "analysis/capacity.hpp"
#include "eval/evaluator.hpp"
#include "io/input_error.hpp"
#include "io/output_writer.hpp"
#include "report/changes.hpp"

namespace rotaweave::app {

void printNotes(const model::Problem& problem) {
  for (const auto& note : problem.notes) std::cerr << "note: " << note << "\n";
}

void refuseToOverwrite(const std::filesystem::path& input, const std::filesystem::path& out) {
  std::error_code ec;
  if (std::filesystem::equivalent(input, out / "roster.csv", ec))
    throw io::OutputError("--out " + out.string() + " would overwrite the input roster " + input.string() +
                          "; choose another output folder");
}

double outputReserve(const model::Problem& problem, double timeLimit) {
  // Measured on a 150-person year (Instance 24 of the open benchmark, 54,600 cells and over
  // 50,000 breaches): about 1.5 s for every file, the workbook on a thread of its own; a
  // good roster has far fewer breaches and writes faster.
  constexpr double kFixed = 0.05, kPerCell = 1.5 / 54600.0;
  const double cells = static_cast<double>(problem.staffCount()) * static_cast<double>(problem.days);
  return std::min(kFixed + kPerCell * cells, timeLimit / 5);
}

Outcome reportAndWrite(const rules::RuleSet& ruleSet, const model::Roster& roster, report::RunInfo run,
                       io::OutputFolder& out, const BaselineInput* baseline,
                       const io::CalendarHistory* previousCalendars) {
  const model::Problem& problem = ruleSet.problem();
  eval::Evaluator evaluator(ruleSet);
  Outcome outcome;
  outcome.report = report::buildReport(problem, roster, evaluator.explain(roster), std::move(run));
  analysis::CapacityReport capacity = analysis::analyseCapacity(problem);
  analysis::compareWithRoster(capacity, problem, roster, outcome.report.breaches);
  outcome.report.capacity = std::move(capacity);
  if (problem.published) outcome.report.changes = report::computeChanges(ruleSet, roster);
  if (baseline)
    outcome.report.baseline = report::compareWithBaseline(problem, baseline->roster, evaluator.explain(baseline->roster), roster,
                                                          outcome.report.breaches, baseline->source);
  const io::OutputBundle bundle{problem, roster, outcome.report, previousCalendars};
  out.writeSet([&bundle](const std::filesystem::path& dir) { io::writeStandardOutputs(dir, bundle); });
  outcome.exitCode = outcome.report.hardCount > 0 ? 1 : 0;
  return outcome;
}

}  // namespace rotaweave::app
