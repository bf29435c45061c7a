/// @brief Explain, report, write.
#include "app/pipeline.hpp"

#include "analysis/capacity.hpp"
#include "eval/evaluator.hpp"
#include "io/input_error.hpp"
#include "io/output_writer.hpp"
#include "report/changes.hpp"

namespace rotaweave::app {

void refuseToOverwrite(const std::filesystem::path& input, const std::filesystem::path& out) {
  std::error_code ec;
  if (std::filesystem::equivalent(input, out / "roster.csv", ec))
    throw io::OutputError("--out " + out.string() + " would overwrite the input roster " + input.string() +
                          "; choose another output folder");
}

Outcome reportAndWrite(const model::Problem& problem, const model::Roster& roster, report::RunInfo run,
                       const std::filesystem::path& out) {
  const rules::RuleSet ruleSet(problem);
  eval::Evaluator evaluator(ruleSet);
  Outcome outcome;
  outcome.report = report::buildReport(problem, roster, evaluator.explain(roster), std::move(run));
  analysis::CapacityReport capacity = analysis::analyseCapacity(problem);
  analysis::compareWithRoster(capacity, problem, roster, outcome.report.breaches);
  outcome.report.capacity = std::move(capacity);
  if (problem.published) outcome.report.changes = report::computeChanges(problem, roster);
  io::writeStandardOutputs(out, io::OutputBundle{problem, roster, outcome.report});
  outcome.exitCode = outcome.report.hardCount > 0 ? 1 : 0;
  return outcome;
}

}  // namespace rotaweave::app
