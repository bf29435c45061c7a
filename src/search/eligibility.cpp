/// @brief Building the option lists per cell.
#include "search/eligibility.hpp"

#include <algorithm>

namespace rotaweave::search {

Eligibility::Eligibility(const model::Problem& p) : days_(p.days), tasks_(p.tasks.size()) {
  const size_t cells = p.staff.size() * static_cast<size_t>(p.days);
  start_.reserve(cells + 1);
  allowed_.assign(cells * tasks_, 0);
  freeByDay_.resize(static_cast<size_t>(p.days));
  bool anyDemand = false;
  for (const auto& c : p.demand) anyDemand = anyDemand || c.defined;

  // A hard limit of no shifts of a type (or of any) rules that type out for the person: any
  // roster that gives them one breaks a hard rule.
  std::vector<std::uint8_t> ruledOut(p.shifts.size());
  for (StaffIdx s = 0; s < p.staffCount(); ++s) {
    const auto& person = p.staff[static_cast<size_t>(s)];
    std::fill(ruledOut.begin(), ruledOut.end(), 0);
    for (const model::RuleSpec& r : p.rules)
      if (r.kind == model::RuleKind::MaxCount && r.hard && r.count == 0 && r.inScope[static_cast<size_t>(s)]) {
        if (r.shift == kNoShift) std::fill(ruledOut.begin(), ruledOut.end(), 1);
        else ruledOut[static_cast<size_t>(r.shift)] = 1;
      }
    for (DayIdx d = 0; d < p.days; ++d) {
      start_.push_back(static_cast<int>(options_.size()));
      auto add = [&](TaskIdx t) {
        options_.push_back(t);
        allowed_[index(s, d) * tasks_ + static_cast<size_t>(t)] = 1;
      };
      const TaskIdx fixed = p.fixed[p.cell(s, d)];
      if (fixed >= 0) {
        add(fixed);
        continue;
      }
      add(kOff);
      if (p.absent[p.cell(s, d)]) continue;
      for (TaskIdx t = 1; t < p.taskCount(); ++t) {
        const model::Task& task = p.tasks[static_cast<size_t>(t)];
        if (!person.holds(task.skill) || ruledOut[static_cast<size_t>(task.shift)]) continue;
        // Only roles someone asked for or that the demand needs that day are worth trying.
        bool requested = false;
        for (const auto& r : person.requests)
          requested = requested || (r.day == d && r.kind == model::Request::Kind::Shift && r.shift == task.shift &&
                                    task.skill == person.skills.front());
        if (!anyDemand || p.demandAt(d, t).defined || requested) add(t);
        else complete_ = false;
      }
      if (options_.size() - static_cast<size_t>(start_.back()) > 1) {
        free_.push_back(static_cast<int>(index(s, d)));
        freeByDay_[static_cast<size_t>(d)].push_back(s);
      }
    }
  }
  start_.push_back(static_cast<int>(options_.size()));
}

}  // namespace rotaweave::search
