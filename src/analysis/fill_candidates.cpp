/// @brief Fill candidates: each person off that day, scored with and without the slot.
#include "analysis/fill_candidates.hpp"

namespace rotaweave::analysis {

std::vector<StaffIdx> fillCandidates(eval::Evaluator& evaluator, const model::Roster& roster, DayIdx d, TaskIdx t,
                                     StaffIdx except) {
  const model::Problem& p = evaluator.rules().problem();
  std::vector<StaffIdx> out;
  if (t == kOff) return out;
  const SkillIdx skill = p.tasks[static_cast<size_t>(t)].skill;
  std::vector<TaskIdx> row(static_cast<size_t>(p.days));
  for (StaffIdx s = 0; s < p.staffCount(); ++s) {
    if (s == except || roster.at(s, d) != kOff || p.absent[p.cell(s, d)] ||
        !p.staff[static_cast<size_t>(s)].holds(skill))
      continue;
    row.assign(roster.row(s), roster.row(s) + p.days);
    const Cost before = evaluator.rowScore(s, row.data()).hard;
    row[static_cast<size_t>(d)] = t;
    if (evaluator.rowScore(s, row.data()).hard <= before) out.push_back(s);
  }
  return out;
}

std::vector<std::string> fillCandidateIds(eval::Evaluator& evaluator, const model::Roster& roster, DayIdx d, TaskIdx t,
                                          StaffIdx except) {
  std::vector<std::string> ids;
  for (const StaffIdx s : fillCandidates(evaluator, roster, d, t, except))
    ids.push_back(evaluator.rules().problem().staff[static_cast<size_t>(s)].id);
  return ids;
}

}  // namespace rotaweave::analysis
