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

std::vector<AbsenceCredit> defaultAbsenceCredit() {
  // Common practice: paid leave, sick leave and training count as time worked toward
  // contracted hours; unpaid leave does not. Any other reason counts the usual day.
  const char* origin = "built-in default";
  return {{"leave", true, 0, origin}, {"sick", true, 0, origin}, {"training", true, 0, origin},
          {"unpaid", false, 0, origin}, {"default", true, 0, origin}};
}

const AbsenceCredit& creditFor(const Problem& p, const std::string& reason) {
  const AbsenceCredit* fallback = nullptr;
  for (const AbsenceCredit& c : p.absenceCredit) {
    if (c.reason == reason) return c;
    if (c.reason == "default") fallback = &c;
  }
  static const AbsenceCredit kUsualDay{"default", true, 0, "built-in default"};
  return fallback ? *fallback : kUsualDay;
}

bool creditedDay(const Problem& p, DayIdx d) {
  const auto i = static_cast<size_t>(d);
  return !(i < p.weekend.size() && p.weekend[i]) && !(i < p.holiday.size() && p.holiday[i]);
}

void computeAbsenceCredit(Problem& p) {
  int workingDays = 0;
  for (DayIdx d = 0; d < p.days; ++d) workingDays += creditedDay(p, d);
  long long shiftPaid = 0;
  for (const ShiftType& sh : p.shifts) shiftPaid += sh.paidMinutes();
  const int meanShift = p.shifts.empty() ? 0 : static_cast<int>(shiftPaid / static_cast<long long>(p.shifts.size()));
  p.creditByDay.assign(p.staff.size() * static_cast<size_t>(p.days), 0);
  p.creditMinutes.assign(p.staff.size(), 0);
  for (StaffIdx s = 0; s < p.staffCount(); ++s) {
    Person& person = p.staff[static_cast<size_t>(s)];
    // The usual day: the contract's daily_hours; else its hours (the minimum, or the maximum
    // where only that is given) spread over the period's working days; else a mean shift.
    // A share of the contract hours is spread without rounding drift: the k-th credited day
    // gets floor(H (k + 1) / W) - floor(H k / W), so a whole period away credits exactly H.
    person.dailyMinutes = meanShift;
    long long share = 0;  // H where the day is a share of the contract hours, else 0
    if (person.contract >= 0) {
      const Contract& c = p.contracts[static_cast<size_t>(person.contract)];
      const std::optional<int> hours = c.minMinutes ? c.minMinutes : c.maxMinutes;
      if (c.dailyMinutes) {
        person.dailyMinutes = *c.dailyMinutes;
      } else if (hours && workingDays > 0) {
        person.dailyMinutes = *hours / workingDays;
        share = *hours;
      }
    }
    if (p.absent.empty()) continue;
    long long k = 0;
    for (DayIdx d = 0; d < p.days; ++d) {
      const size_t cell = p.cell(s, d);
      if (!p.absent[cell] || !creditedDay(p, d)) continue;
      const AbsenceCredit& rule = creditFor(p, p.absenceReason[cell]);
      int minutes = rule.minutes;
      if (rule.daily) {
        minutes = share > 0 ? static_cast<int>(share * (k + 1) / workingDays - share * k / workingDays) : person.dailyMinutes;
        ++k;
      }
      p.creditByDay[cell] = minutes;
      p.creditMinutes[static_cast<size_t>(s)] += minutes;
    }
  }
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
