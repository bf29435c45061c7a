/// @brief Evaluator: row tallies, cover counts and fair-share counts, full and incremental.
#include "eval/evaluator.hpp"

#include <algorithm>
#include <cassert>

namespace rotaweave::eval {

namespace {

/// tryMoveWithin stops early only this far (in 1/kCostScale units) above its limit: far more
/// than the rounding error of summing penalties in doubles, far less than any penalty step.
constexpr double kLimitMargin = 1.0;

}  // namespace

Evaluator::Evaluator(const rules::RuleSet& rules)
    : rules_(&rules), p_(&rules.problem()), days_(p_->days), tasks_(p_->taskCount()), history_(p_->maxHistory) {
  taskShift_.resize(static_cast<size_t>(tasks_));
  for (int t = 0; t < tasks_; ++t) taskShift_[static_cast<size_t>(t)] = p_->tasks[static_cast<size_t>(t)].shift;
  for (const auto& sh : p_->shifts) {
    shiftStart_.push_back(sh.start);
    shiftEnd_.push_back(sh.end);
    shiftPaid_.push_back(sh.paidMinutes());
  }
  taskStart_.assign(static_cast<size_t>(tasks_), 0);
  taskEnd_.assign(static_cast<size_t>(tasks_), 0);
  taskPaid_.assign(static_cast<size_t>(tasks_), 0);
  for (int t = 1; t < tasks_; ++t) {
    const auto sh = static_cast<size_t>(taskShift_[static_cast<size_t>(t)]);
    taskStart_[static_cast<size_t>(t)] = shiftStart_[sh];
    taskEnd_[static_cast<size_t>(t)] = shiftEnd_[sh];
    taskPaid_[static_cast<size_t>(t)] = shiftPaid_[sh];
  }
  const auto span = static_cast<size_t>(history_ + days_);
  shiftBuf_.assign(span, kNoShift);
  startBuf_.assign(span, 0);
  endBuf_.assign(span, 0);
  paidBuf_.assign(span, 0);
  coverScratch_.resize(static_cast<size_t>(days_ * tasks_));
  keyStamp_.assign(static_cast<size_t>(days_ * tasks_), 0);
  fairScratch_.resize(p_->staff.size());
  rowScratch_.resize(static_cast<size_t>(Move::kCapacity * days_));
  tabulateCellRules();
  const size_t fairRules = rules.fairShares().size();
  fairCount_.resize(fairRules);
  fairSum_.resize(fairRules);
  fairTally_.resize(fairRules);
  pendingFair_.resize(fairRules);
  pendingFairCount_.resize(fairRules);
  pendingFairTally_.resize(fairRules);
  pendingFairSum_.resize(fairRules);
}

rules::RowView Evaluator::view(StaffIdx s, const TaskIdx* tasks) {
  const auto& hist = p_->staff[static_cast<size_t>(s)].history;
  const int h = static_cast<int>(hist.size());
  std::copy(hist.begin(), hist.end(), shiftBuf_.begin() + (history_ - h));
  ShiftIdx* shifts = shiftBuf_.data() + history_;
  int* starts = startBuf_.data() + history_;
  int* ends = endBuf_.data() + history_;
  int* paid = paidBuf_.data() + history_;
  for (int d = -h; d < 0; ++d) {
    const ShiftIdx sh = shifts[d];
    const bool on = sh != kNoShift;
    starts[d] = d * kMinutesPerDay + (on ? shiftStart_[static_cast<size_t>(sh)] : 0);
    ends[d] = d * kMinutesPerDay + (on ? shiftEnd_[static_cast<size_t>(sh)] : 0);
    paid[d] = on ? shiftPaid_[static_cast<size_t>(sh)] : 0;
  }
  // Period days: straight table reads per task, no branches (off reads zeros).
  for (int d = 0; d < days_; ++d) {
    const auto t = static_cast<size_t>(tasks[d]);
    shifts[d] = taskShift_[t];
    starts[d] = d * kMinutesPerDay + taskStart_[t];
    ends[d] = d * kMinutesPerDay + taskEnd_[t];
    paid[d] = taskPaid_[t];
  }
  return rules::RowView{p_, s, tasks, shifts, starts, ends, paid, h, days_};
}

void Evaluator::tabulateCellRules() {
  // Cell-local rules charge each cell on its own, so scoring a row that holds task t on every
  // day and reading each breach's day gives the penalty of every (day, t) cell at once.
  cellCost_.assign(static_cast<size_t>(p_->staffCount()) * static_cast<size_t>(days_) * static_cast<size_t>(tasks_), Tally{});
  std::vector<TaskIdx> uniform(static_cast<size_t>(days_));
  std::vector<rules::Breach> found;
  for (StaffIdx s = 0; s < p_->staffCount(); ++s) {
    if (rules_->cellRulesFor(s).empty()) continue;
    for (TaskIdx t = 0; t < tasks_; ++t) {
      std::fill(uniform.begin(), uniform.end(), t);
      const rules::RowView row = view(s, uniform.data());
      found.clear();
      Tally ignored;
      for (const rules::RowRule* rule : rules_->cellRulesFor(s)) rule->score(row, ignored, &found);
      for (const auto& b : found) {
        assert(b.days.size() == 1);
        Tally& cell = cellCost_[(static_cast<size_t>(s) * static_cast<size_t>(days_) + static_cast<size_t>(b.days.front())) * static_cast<size_t>(tasks_) + static_cast<size_t>(t)];
        (b.hard ? cell.hard : cell.soft) += b.penalty;
      }
    }
  }
}

Tally Evaluator::cellSum(StaffIdx s, const TaskIdx* tasks) const {
  Tally t;
  for (DayIdx d = 0; d < days_; ++d) t += cellCost(s, d, tasks[d]);
  return t;
}

Tally Evaluator::sequenceTally(const rules::RowView& row) const {
  Tally t;
  for (const rules::RowRule* rule : rules_->sequenceRulesFor(row.staff)) rule->score(row, t, nullptr);
  return t;
}

Tally Evaluator::fairTally(size_t rule, const int* counts, long sum) const {
  return rules_->fairShares()[rule].groupTally(counts, sum);
}

void Evaluator::countCover(const model::Roster& roster, std::vector<int>& counts) const {
  std::fill(counts.begin(), counts.end(), 0);
  for (StaffIdx s = 0; s < roster.staff; ++s)
    for (DayIdx d = 0; d < days_; ++d) ++counts[static_cast<size_t>(d * tasks_ + roster.at(s, d))];
}

Tally Evaluator::score(const model::Roster& roster) {
  assert(roster.days == days_ && roster.staff == p_->staffCount());
  Tally total;
  const auto& fair = rules_->fairShares();
  std::vector<int>& counts = fairScratch_;
  for (size_t r = 0; r < fair.size(); ++r) {
    long sum = 0;
    const auto& members = fair[r].members();
    for (size_t i = 0; i < members.size(); ++i) {
      counts[i] = fair[r].countRow(view(members[i], roster.row(members[i])));
      sum += counts[i];
    }
    total += fairTally(r, counts.data(), sum);
  }
  for (StaffIdx s = 0; s < roster.staff; ++s) total += rowTally(view(s, roster.row(s)));
  countCover(roster, coverScratch_);
  for (DayIdx d = 0; d < days_; ++d)
    for (TaskIdx t = 1; t < tasks_; ++t)
      total += rules_->cover().cellTally(d, t, coverScratch_[static_cast<size_t>(d * tasks_ + t)]);
  return total;
}

std::vector<rules::Breach> Evaluator::explain(const model::Roster& roster) {
  std::vector<rules::Breach> out;
  for (StaffIdx s = 0; s < roster.staff; ++s) {
    const rules::RowView row = view(s, roster.row(s));
    Tally ignored;
    for (const rules::RowRule* rule : rules_->rulesFor(s)) rule->score(row, ignored, &out);
  }
  countCover(roster, coverScratch_);
  for (DayIdx d = 0; d < days_; ++d)
    for (TaskIdx t = 1; t < tasks_; ++t)
      rules_->cover().explain(d, t, coverScratch_[static_cast<size_t>(d * tasks_ + t)], out);
  const auto& fair = rules_->fairShares();
  for (const auto& rule : fair) {
    std::vector<int> counts;
    long sum = 0;
    for (StaffIdx s : rule.members()) {
      counts.push_back(rule.countRow(view(s, roster.row(s))));
      sum += counts.back();
    }
    rule.explain(*p_, counts.data(), sum, out);
  }
  return out;
}

void Evaluator::load(const model::Roster& roster) {
  roster_ = roster;
  rowTally_.resize(static_cast<size_t>(roster.staff));
  rowCells_.resize(static_cast<size_t>(roster.staff));
  total_ = Tally{};
  for (StaffIdx s = 0; s < roster.staff; ++s) {
    rowCells_[static_cast<size_t>(s)] = cellSum(s, roster_.row(s));
    rowTally_[static_cast<size_t>(s)] = rowCells_[static_cast<size_t>(s)] + sequenceTally(view(s, roster_.row(s)));
    total_ += rowTally_[static_cast<size_t>(s)];
  }
  coverCount_.resize(static_cast<size_t>(days_ * tasks_));
  countCover(roster_, coverCount_);
  coverTotal_ = Tally{};
  for (DayIdx d = 0; d < days_; ++d)
    for (TaskIdx t = 1; t < tasks_; ++t)
      coverTotal_ += rules_->cover().cellTally(d, t, coverCount_[static_cast<size_t>(d * tasks_ + t)]);
  total_ += coverTotal_;
  const auto& fair = rules_->fairShares();
  for (size_t r = 0; r < fair.size(); ++r) {
    const auto& members = fair[r].members();
    fairCount_[r].resize(members.size());
    fairSum_[r] = 0;
    for (size_t i = 0; i < members.size(); ++i) {
      fairCount_[r][i] = fair[r].countRow(view(members[i], roster_.row(members[i])));
      fairSum_[r] += fairCount_[r][i];
    }
    fairTally_[r] = fairTally(r, fairCount_[r].data(), fairSum_[r]);
    total_ += fairTally_[r];
  }
}

Tally Evaluator::tryMove(const Move& move) {
  evaluateMove(move, nullptr);
  return pendingTotal_;
}

bool Evaluator::tryMoveWithin(const Move& move, double hardWeight, double limit) {
  const Limit cap{hardWeight, limit};
  return evaluateMove(move, &cap);
}

bool Evaluator::evaluateMove(const Move& move, const Limit* limit) {
  pending_ = move;
  pendingReady_ = false;
  Tally delta;
  const auto& fair = rules_->fairShares();
  for (size_t r = 0; r < fair.size(); ++r) pendingFairCount_[r] = 0;

  // 1 - Cover: re-score the (day, task) cells whose counts change, then restore the counts.
  std::array<int, 2 * Move::kCapacity> keys;
  int nKeys = 0;
  if (++stamp_ == 0) std::fill(keyStamp_.begin(), keyStamp_.end(), 0), stamp_ = 1;  // wrapped around
  auto touch = [&](int key) {
    if (keyStamp_[static_cast<size_t>(key)] == stamp_) return;
    keyStamp_[static_cast<size_t>(key)] = stamp_;
    keys[static_cast<size_t>(nKeys++)] = key;
  };
  for (const CellChange& c : move) {
    const TaskIdx old = roster_.at(c.staff, c.day);
    if (old == c.task) continue;
    touch(c.day * tasks_ + old);
    touch(c.day * tasks_ + c.task);
  }
  auto keysTally = [&] {
    Tally t;
    for (int k = 0; k < nKeys; ++k) {
      const int key = keys[static_cast<size_t>(k)];
      t += rules_->cover().cellTally(key / tasks_, static_cast<TaskIdx>(key % tasks_), coverCount_[static_cast<size_t>(key)]);
    }
    return t;
  };
  auto shiftCounts = [&](int sign) {
    for (const CellChange& c : move) {
      const TaskIdx old = roster_.at(c.staff, c.day);
      coverCount_[static_cast<size_t>(c.day * tasks_ + old)] -= sign;
      coverCount_[static_cast<size_t>(c.day * tasks_ + c.task)] += sign;
    }
  };
  const Tally coverBefore = keysTally();
  shiftCounts(+1);
  pendingCover_ = keysTally() - coverBefore;
  shiftCounts(-1);
  delta += pendingCover_;

  // 2 - Rows: penalty is additive per person, so only the touched rows are re-scored.
  pendingRowCount_ = 0;
  for (const CellChange& c : move) {
    int i = 0;
    while (i < pendingRowCount_ && pendingRows_[static_cast<size_t>(i)].staff != c.staff) ++i;
    PendingRow& pr = pendingRows_[static_cast<size_t>(i)];
    if (i == pendingRowCount_) {
      ++pendingRowCount_;
      pr.staff = c.staff;
      pr.cells = rowCells_[static_cast<size_t>(c.staff)];
      std::copy_n(roster_.row(c.staff), days_, rowScratch_.data() + i * days_);
    }
    // Cell-local rules: swap the old cell's tabulated penalty for the new one's.
    pr.cells += cellCost(c.staff, c.day, c.task) - cellCost(c.staff, c.day, roster_.at(c.staff, c.day));
    rowScratch_[static_cast<size_t>(i * days_ + c.day)] = c.task;
  }
  // With a limit: the least the total can still come to. Sequence rules not scored yet add
  // nothing below zero, and fair share can at most fall to zero.
  Tally least = total_ + delta;
  if (limit) {
    for (int i = 0; i < pendingRowCount_; ++i) {
      const PendingRow& pr = pendingRows_[static_cast<size_t>(i)];
      least += pr.cells - rowTally_[static_cast<size_t>(pr.staff)];
    }
    for (const Tally& t : fairTally_) least -= t;
  }
  for (int i = 0; i < pendingRowCount_; ++i) {
    PendingRow& pr = pendingRows_[static_cast<size_t>(i)];
    const rules::RowView row = view(pr.staff, rowScratch_.data() + i * days_);
    Tally sequence;
    for (const rules::RowRule* rule : rules_->sequenceRulesFor(pr.staff)) {
      const Tally before = sequence;
      rule->score(row, sequence, nullptr);
      if (!limit) continue;
      least += sequence - before;
      // A margin far above rounding error, so only moves tryMove would reject stop here.
      if (least.weighed(limit->hardWeight) > limit->value + kLimitMargin) return false;
    }
    pr.tally = pr.cells + sequence;
    delta += pr.tally - rowTally_[static_cast<size_t>(pr.staff)];
    for (size_t r = 0; r < fair.size(); ++r) {
      const int member = fair[r].memberIndex(pr.staff);
      if (member < 0) continue;
      const int count = fair[r].countRow(row);
      if (count != fairCount_[r][static_cast<size_t>(member)])
        pendingFair_[r][static_cast<size_t>(pendingFairCount_[r]++)] = PendingFair{member, count};
    }
  }

  // 3 - Fair share: the mean moves with any count, so the group is re-scored whole.
  for (size_t r = 0; r < fair.size(); ++r) {
    if (pendingFairCount_[r] == 0) continue;
    auto& counts = fairCount_[r];
    long sum = fairSum_[r];
    for (int k = 0; k < pendingFairCount_[r]; ++k) {
      PendingFair& pf = pendingFair_[r][static_cast<size_t>(k)];
      sum += pf.count - counts[static_cast<size_t>(pf.member)];
      std::swap(counts[static_cast<size_t>(pf.member)], pf.count);
    }
    pendingFairTally_[r] = fairTally(r, counts.data(), sum);
    pendingFairSum_[r] = sum;
    for (int k = 0; k < pendingFairCount_[r]; ++k) {
      PendingFair& pf = pendingFair_[r][static_cast<size_t>(k)];
      std::swap(counts[static_cast<size_t>(pf.member)], pf.count);  // restore; pf.count holds the new count again
    }
    delta += pendingFairTally_[r] - fairTally_[r];
  }
  pendingTotal_ = total_ + delta;
  if (limit && pendingTotal_.weighed(limit->hardWeight) > limit->value) return false;
  return pendingReady_ = true;
}

void Evaluator::commit() {
  assert(pendingReady_ && "commit() needs a tryMove() or a tryMoveWithin() that returned true");
  pendingReady_ = false;
  for (const CellChange& c : pending_) {
    TaskIdx& cell = roster_.at(c.staff, c.day);
    --coverCount_[static_cast<size_t>(c.day * tasks_ + cell)];
    ++coverCount_[static_cast<size_t>(c.day * tasks_ + c.task)];
    cell = c.task;
  }
  coverTotal_ += pendingCover_;
  for (int i = 0; i < pendingRowCount_; ++i) {
    const PendingRow& pr = pendingRows_[static_cast<size_t>(i)];
    rowTally_[static_cast<size_t>(pr.staff)] = pr.tally;
    rowCells_[static_cast<size_t>(pr.staff)] = pr.cells;
  }
  const auto& fair = rules_->fairShares();
  for (size_t r = 0; r < fair.size(); ++r) {
    if (pendingFairCount_[r] == 0) continue;
    for (int k = 0; k < pendingFairCount_[r]; ++k) {
      const PendingFair& pf = pendingFair_[r][static_cast<size_t>(k)];
      fairCount_[r][static_cast<size_t>(pf.member)] = pf.count;
    }
    fairSum_[r] = pendingFairSum_[r];
    fairTally_[r] = pendingFairTally_[r];
    pendingFairCount_[r] = 0;
  }
  total_ = pendingTotal_;
  pendingRowCount_ = 0;
  pending_.clear();
}

}  // namespace rotaweave::eval
