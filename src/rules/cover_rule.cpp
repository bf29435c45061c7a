/// @brief Cover breach messages.
#include "rules/cover_rule.hpp"

#include <string>

namespace rotaweave::rules {

void CoverRule::explain(DayIdx day, TaskIdx task, int count, std::vector<Breach>& out) const {
  const model::DemandCell& c = p_->demandAt(day, task);
  if (!c.defined) return;
  const model::Task& t = p_->tasks[static_cast<size_t>(task)];
  const std::string where = p_->dateText(day) + " " + p_->shifts[static_cast<size_t>(t.shift)].id + " " +
                            p_->skills[static_cast<size_t>(t.skill)] + ": " + std::to_string(count) + " assigned, ";
  auto add = [&](CoverPart part, bool hard, int persons, Cost weight, std::string what) {
    Breach b;
    b.ruleId = "cover";
    b.kind = "cover";
    b.hard = hard;
    b.days = {day};
    b.amount = persons * kAmountScale;
    b.penalty = b.amount * weight;
    b.message = where + what;
    b.task = task;
    b.coverPart = part;
    out.push_back(std::move(b));
  };
  if (count < c.min) add(CoverPart::Min, c.minHard, c.min - count, c.minWeight, "at least " + std::to_string(c.min) + " needed");
  if (count < c.target) add(CoverPart::Target, false, c.target - count, c.targetWeight, std::to_string(c.target) + " wanted");
  if (c.max >= 0 && count > c.max) add(CoverPart::Max, false, count - c.max, c.maxWeight, "at most " + std::to_string(c.max) + " wanted");
}

}  // namespace rotaweave::rules
