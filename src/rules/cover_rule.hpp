/// @brief Cover: people per (date, shift, skill) against the demand's min, target and max.
///
/// Cover links people, so it is judged per cell from a count, not per row. Cost per call is
/// constant, which lets the evaluator re-score only the cells a move touches.
#pragma once
#include <vector>

#include "model/problem.hpp"
#include "rules/breach.hpp"

namespace rotaweave::rules {

class CoverRule {
 public:
  explicit CoverRule(const model::Problem& problem) : p_(&problem) {}

  /// Penalty of cell (day, task) when `count` people fill it.
  Tally cellTally(DayIdx day, TaskIdx task, int count) const {
    const model::DemandCell& c = p_->demandAt(day, task);
    Tally t;
    if (!c.defined) return t;
    if (count < c.min) (c.minHard ? t.hard : t.soft) += (c.min - count) * kAmountScale * c.minWeight;
    if (count < c.target) t.soft += (c.target - count) * kAmountScale * c.targetWeight;
    if (c.max >= 0 && count > c.max) t.soft += (count - c.max) * kAmountScale * c.maxWeight;
    return t;
  }

  /// Appends one breach per part (min, target, max) the cell misses.
  void explain(DayIdx day, TaskIdx task, int count, std::vector<Breach>& out) const;

 private:
  const model::Problem* p_;
};

}  // namespace rotaweave::rules
