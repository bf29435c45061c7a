/// @brief `check`: score a given roster and write the report.
#include <optional>

#include "app/commands.hpp"
#include "app/pipeline.hpp"
#include "io/roster_csv.hpp"
#include "io/scenario_loader.hpp"

namespace rotaweave::app {

Outcome check(const std::string& scenario, const std::string& rosterPath, const std::filesystem::path& out,
              const std::string& baselinePath) {
  refuseToOverwrite(rosterPath, out);
  io::OutputFolder folder(out);  // checked and locked before anything is read
  if (!baselinePath.empty()) refuseToOverwrite(baselinePath, out);
  const model::Problem problem = io::loadScenario(scenario);
  printNotes(problem);
  const model::Roster roster = io::readRosterCsv(rosterPath, problem);
  // Read both rosters before anything is written: a bad baseline writes nothing either.
  std::optional<model::Roster> baseline;
  if (!baselinePath.empty()) baseline = io::readRosterCsv(baselinePath, problem);
  report::RunInfo run;
  run.command = "check";
  const rules::RuleSet ruleSet(problem);
  if (!baseline) return reportAndWrite(ruleSet, roster, std::move(run), folder);
  const BaselineInput input{*baseline, baselinePath};
  return reportAndWrite(ruleSet, roster, std::move(run), folder, &input);
}

}  // namespace rotaweave::app
