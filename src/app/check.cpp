/// @brief `check`: score a given roster and write the report.
#include "app/commands.hpp"
#include "app/pipeline.hpp"
#include "io/roster_csv.hpp"
#include "io/scenario_loader.hpp"

namespace rotaweave::app {

Outcome check(const std::string& scenario, const std::string& rosterPath, const std::filesystem::path& out) {
  refuseToOverwrite(rosterPath, out);
  const model::Problem problem = io::loadScenario(scenario);
  printNotes(problem);
  const model::Roster roster = io::readRosterCsv(rosterPath, problem);
  report::RunInfo run;
  run.command = "check";
  return reportAndWrite(rules::RuleSet(problem), roster, std::move(run), out);
}

}  // namespace rotaweave::app
