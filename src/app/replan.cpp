/// @brief `replan`: keep the published days before --from, re-plan the rest with few changes.
#include <algorithm>

#include "app/commands.hpp"
#include "app/pipeline.hpp"
#include "io/input_error.hpp"
#include "io/roster_csv.hpp"
#include "io/scenario_loader.hpp"

namespace rotaweave::app {
namespace {

/// Parses STAFF:DATE or STAFF:DATE..DATE and marks the days absent.
void applyAbsence(model::Problem& p, const std::string& text) {
  auto bad = [&](const std::string& why) {
    throw io::InputError("--absence " + text, 0, 0, why + "; write STAFF:YYYY-MM-DD or STAFF:YYYY-MM-DD..YYYY-MM-DD");
  };
  const size_t colon = text.find(':');
  if (colon == std::string::npos) bad("missing ':' between the staff id and the date");
  const std::string id = text.substr(0, colon), range = text.substr(colon + 1);
  const StaffIdx s = p.findStaff(id);
  if (s < 0) {
    std::vector<std::string> ids;
    for (const auto& person : p.staff) ids.push_back(person.id);
    bad("unknown staff id '" + id + "'" + io::didYouMean(id, ids));
  }
  const size_t dots = range.find("..");
  const auto from = model::parseIsoDate(range.substr(0, dots));
  const auto to = dots == std::string::npos ? from : model::parseIsoDate(range.substr(dots + 2));
  if (!from || !to) bad("invalid date in '" + range + "'");
  if (*to < *from) bad("the absence ends before it starts");
  if (*from < p.start || *to >= p.start + p.days) bad("the absence is outside the period " + p.dateText(0) + " to " + p.dateText(p.days - 1));
  for (model::DateSerial d = *from; d <= *to; ++d) {
    p.absent[p.cell(s, d - p.start)] = 1;
    p.absenceReason[p.cell(s, d - p.start)] = "absence given to replan";
  }
}

}  // namespace

Outcome replan(const ReplanRequest& request) {
  model::Problem problem = io::loadScenario(request.solve.scenario);
  const model::Roster published = io::readRosterCsv(request.publishedRoster, problem);
  const auto from = model::parseIsoDate(request.from);
  if (!from) throw io::InputError("--from " + request.from, 0, 0, "invalid date; write YYYY-MM-DD");
  if (*from < problem.start || *from >= problem.start + problem.days)
    throw io::InputError("--from " + request.from, 0, 0, "the date is outside the period " + problem.dateText(0) + " to " +
                                                            problem.dateText(problem.days - 1));
  for (const auto& a : request.absences) applyAbsence(problem, a);

  const DayIdx first = *from - problem.start;
  problem.published = model::Published{published.cells, first};
  // Days before --from are frozen exactly as published.
  for (StaffIdx s = 0; s < problem.staffCount(); ++s)
    for (DayIdx d = 0; d < first; ++d) problem.fixed[problem.cell(s, d)] = published.at(s, d);
  const bool listed = std::any_of(problem.rules.begin(), problem.rules.end(),
                                  [](const model::RuleSpec& r) { return r.kind == model::RuleKind::Changes; });
  if (!listed) {
    // Default stability cost: a change costs 2, or 10 within the first 3 days (short notice).
    model::RuleSpec changes;
    changes.kind = model::RuleKind::Changes;
    changes.id = "changes";
    changes.hard = false;
    changes.weight = 2 * kWeightScale;
    changes.earlyDays = 3;
    changes.earlyWeight = 10 * kWeightScale;
    changes.inScope.assign(problem.staff.size(), 1);
    changes.origin = "replan default";
    problem.rules.push_back(std::move(changes));
  }
  // The published roster seeds the search, with cells that are no longer possible cleared.
  model::Roster seed = published;
  for (StaffIdx s = 0; s < problem.staffCount(); ++s)
    for (DayIdx d = first; d < problem.days; ++d) {
      if (problem.fixed[problem.cell(s, d)] >= 0) seed.at(s, d) = problem.fixed[problem.cell(s, d)];
      else if (problem.absent[problem.cell(s, d)]) seed.at(s, d) = kOff;
    }
  return searchAndWrite(problem, {seed}, request.solve, "replan");
}

}  // namespace rotaweave::app
