/// @brief `replan`: keep the published days before --from, re-plan the rest with few changes.
#include <filesystem>
#include <iostream>
#include <memory>

#include "app/commands.hpp"
#include "app/pipeline.hpp"
#include "io/calendar_revision.hpp"
#include "io/replan_loader.hpp"

namespace rotaweave::app {
namespace {

/// The calendars published with the roster: calendars/ beside it, as solve and replan write
/// them. Read before the search, so a damaged one stops the run before it starts. Without
/// the folder the published roster's shifts stand for them, at SEQUENCE 0.
std::shared_ptr<const io::CalendarHistory> publishedCalendars(const std::string& rosterPath, const model::Problem& p) {
  const std::filesystem::path folder = std::filesystem::path(rosterPath).parent_path() / "calendars";
  std::error_code ec;
  if (!std::filesystem::is_directory(folder, ec)) {
    std::cerr << "note: no calendars/ folder beside " << rosterPath
              << "; the calendars are written as updates of a first publication of that roster (SEQUENCE 0)\n";
    return nullptr;
  }
  return std::make_shared<const io::CalendarHistory>(io::loadCalendarHistory(folder, p));
}

}  // namespace

Outcome replan(const ReplanRequest& request) {
  refuseToOverwrite(request.publishedRoster, request.solve.out);
  io::OutputFolder out(request.solve.out);  // checked and locked before anything is read or searched
  // The loader builds the whole replan problem (published roster, absences, frozen days, the
  // changes rule); from here on it is read only.
  const model::Problem problem = io::loadReplanScenario(
      request.solve.scenario, io::ReplanAdditions{request.publishedRoster, request.from, request.absences});
  printNotes(problem);
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

  SolveRequest solve = request.solve;
  solve.previousCalendars = publishedCalendars(request.publishedRoster, problem);
  return searchAndWrite(problem, {seed}, solve, "replan", out);
}

}  // namespace rotaweave::app
