/// @brief `replan`: keep the published days before --from, re-plan the rest with few changes.
#include "app/commands.hpp"
#include "app/pipeline.hpp"
#include "io/replan_loader.hpp"

namespace rotaweave::app {

Outcome replan(const ReplanRequest& request) {
  refuseToOverwrite(request.publishedRoster, request.solve.out);
  // The loader builds the whole replan problem (published roster, absences, frozen days, the
  // changes rule); from here on it is read only.
  const model::Problem problem = io::loadReplanScenario(
      request.solve.scenario, io::ReplanAdditions{request.publishedRoster, request.from, request.absences});
  const DayIdx first = problem.published->from;
  // The published roster seeds the search, with cells that are no longer possible cleared.
  model::Roster seed(problem.staffCount(), problem.days);
  seed.cells = problem.published->cells;
  for (StaffIdx s = 0; s < problem.staffCount(); ++s)
    for (DayIdx d = first; d < problem.days; ++d) {
      if (problem.fixed[problem.cell(s, d)] >= 0)
        seed.at(s, d) = problem.fixed[problem.cell(s, d)];
      else if (problem.absent[problem.cell(s, d)])
        seed.at(s, d) = kOff;
    }

  return searchAndWrite(problem, {seed}, request.solve, "replan");
}

}  // namespace rotaweave::app
