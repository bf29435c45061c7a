/// @brief Lookups and derived tables of the compiled Problem.
#include "model/problem.hpp"

#include <algorithm>
#include <cstdlib>

namespace rotaweave::model {

std::string Problem::taskText(TaskIdx t, StaffIdx s) const {
  if (t == kOff) return "";
  const Task& task = tasks[static_cast<size_t>(t)];
  std::string text = shifts[static_cast<size_t>(task.shift)].id;
  const Person& person = staff[static_cast<size_t>(s)];
  if (person.skills.size() > 1 || (!person.skills.empty() && person.skills.front() != task.skill))
    text += "/" + skills[static_cast<size_t>(task.skill)];
  return text;
}

StaffIdx Problem::findStaff(const std::string& id) const {
  for (size_t i = 0; i < staff.size(); ++i)
    if (staff[i].id == id) return static_cast<StaffIdx>(i);
  return -1;
}

ShiftIdx Problem::findShift(const std::string& id) const {
  for (size_t i = 0; i < shifts.size(); ++i)
    if (shifts[i].id == id) return static_cast<ShiftIdx>(i);
  return kNoShift;
}

SkillIdx Problem::findSkill(const std::string& id) const {
  for (size_t i = 0; i < skills.size(); ++i)
    if (skills[i] == id) return static_cast<SkillIdx>(i);
  return -1;
}

Published makePublished(const Problem& p, std::vector<TaskIdx> cells, DayIdx from) {
  Published out{std::move(cells), from, {}};
  const int far = p.days;
  out.gapDistance.assign(static_cast<size_t>(p.days), far);
  std::vector<DayIdx> gaps;
  for (DayIdx d = from; d < p.days; ++d)
    for (StaffIdx s = 0; s < p.staffCount(); ++s)
      if (p.absent[p.cell(s, d)] && out.cells[p.cell(s, d)] != kOff) {
        gaps.push_back(d);
        break;
      }
  for (DayIdx d = 0; d < p.days; ++d)
    for (const DayIdx g : gaps) out.gapDistance[static_cast<size_t>(d)] = std::min(out.gapDistance[static_cast<size_t>(d)], std::abs(d - g));
  return out;
}

void buildDerivedTables(Problem& p, const std::vector<int>& weekendDays) {
  p.tasks.assign(1, Task{});
  p.taskOf.assign(p.shifts.size() * p.skills.size(), kOff);
  for (size_t sh = 0; sh < p.shifts.size(); ++sh)
    for (size_t sk = 0; sk < p.skills.size(); ++sk) {
      p.taskOf[sh * p.skills.size() + sk] = static_cast<TaskIdx>(p.tasks.size());
      p.tasks.push_back(Task{static_cast<ShiftIdx>(sh), static_cast<SkillIdx>(sk)});
    }

  const auto n = static_cast<size_t>(p.days);
  p.weekday.resize(n);
  p.weekend.resize(n);
  p.weekendBlock.assign(n, -1);
  if (p.holiday.size() != n) p.holiday.assign(n, 0);
  p.weekendCount = 0;
  for (size_t d = 0; d < n; ++d) {
    p.weekday[d] = static_cast<std::uint8_t>(weekdayOf(p.start + static_cast<int>(d)));
    p.weekend[d] = std::find(weekendDays.begin(), weekendDays.end(), p.weekday[d]) != weekendDays.end();
    if (!p.weekend[d]) continue;
    // A weekend is a maximal run of consecutive weekend days.
    if (d == 0 || !p.weekend[d - 1]) ++p.weekendCount;
    p.weekendBlock[d] = p.weekendCount - 1;
  }
}

}  // namespace rotaweave::model
