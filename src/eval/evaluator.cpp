/// @brief Evaluator: row tallies, cover counts and fair-share counts, full and incremental.
#include "eval/evaluator.hpp"

#include <algorithm>
#include <cassert>

namespace rotaweave::eval {

Evaluator::Evaluator(const rules::RuleSet& rules)
    : rules_(&rules), p_(&rules.problem()), days_(p_->days), tasks_(p_->taskCount()), history_(p_->maxHistory) {
  taskShift_.resize(static_cast<size_t>(tasks_));
  for (int t = 0; t < tasks_; ++t) taskShift_[static_cast<size_t>(t)] = p_->tasks[static_cast<size_t>(t)].shift;
  shiftBuf_.assign(static_cast<size_t>(history_ + days_), kNoShift);
  coverScratch_.resize(static_cast<size_t>(days_ * tasks_));
  fairScratch_.resize(p_->staff.size());
  rowScratch_.resize(static_cast<size_t>(Move::kCapacity * days_));
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
  ShiftIdx* day0 = shiftBuf_.data() + history_;
  for (int d = 0; d < days_; ++d) day0[d] = taskShift_[static_cast<size_t>(tasks[d])];
  return rules::RowView{p_, s, tasks, day0, h, days_};
}

Tally Evaluator::rowTally(const rules::RowView& row, std::vector<rules::Breach>* out) const {
  Tally t;
  for (const rules::RowRule* rule : rules_->rulesFor(row.staff)) rule->score(row, t, out);
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
  for (StaffIdx s = 0; s < roster.staff; ++s) total += rowTally(view(s, roster.row(s)), nullptr);
  countCover(roster, coverScratch_);
  for (DayIdx d = 0; d < days_; ++d)
    for (TaskIdx t = 1; t < tasks_; ++t)
      total += rules_->cover().cellTally(d, t, coverScratch_[static_cast<size_t>(d * tasks_ + t)]);
  return total;
}

std::vector<rules::Breach> Evaluator::explain(const model::Roster& roster) {
  std::vector<rules::Breach> out;
  for (StaffIdx s = 0; s < roster.staff; ++s) rowTally(view(s, roster.row(s)), &out);
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
  total_ = Tally{};
  for (StaffIdx s = 0; s < roster.staff; ++s) {
    rowTally_[static_cast<size_t>(s)] = rowTally(view(s, roster_.row(s)), nullptr);
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
  pending_ = move;
  Tally delta;
  const auto& fair = rules_->fairShares();
  for (size_t r = 0; r < fair.size(); ++r) pendingFairCount_[r] = 0;

  // 1 - Rows: penalty is additive per person, so only the touched rows are re-scored.
  pendingRowCount_ = 0;
  for (const CellChange& c : move) {
    int i = 0;
    while (i < pendingRowCount_ && pendingRows_[static_cast<size_t>(i)].staff != c.staff) ++i;
    if (i == pendingRowCount_) {
      pendingRows_[static_cast<size_t>(pendingRowCount_++)].staff = c.staff;
      std::copy_n(roster_.row(c.staff), days_, rowScratch_.data() + i * days_);
    }
    rowScratch_[static_cast<size_t>(i * days_ + c.day)] = c.task;
  }
  for (int i = 0; i < pendingRowCount_; ++i) {
    PendingRow& pr = pendingRows_[static_cast<size_t>(i)];
    const rules::RowView row = view(pr.staff, rowScratch_.data() + i * days_);
    pr.tally = rowTally(row, nullptr);
    delta += pr.tally - rowTally_[static_cast<size_t>(pr.staff)];
    for (size_t r = 0; r < fair.size(); ++r) {
      const int member = fair[r].memberIndex(pr.staff);
      if (member < 0) continue;
      const int count = fair[r].countRow(row);
      if (count != fairCount_[r][static_cast<size_t>(member)])
        pendingFair_[r][static_cast<size_t>(pendingFairCount_[r]++)] = PendingFair{member, count};
    }
  }

  // 2 - Cover: re-score the (day, task) cells whose counts change, then restore the counts.
  std::array<int, 2 * Move::kCapacity> keys;
  int nKeys = 0;
  auto touch = [&](int key) {
    for (int k = 0; k < nKeys; ++k)
      if (keys[static_cast<size_t>(k)] == key) return;
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
  return pendingTotal_;
}

void Evaluator::commit() {
  for (const CellChange& c : pending_) {
    TaskIdx& cell = roster_.at(c.staff, c.day);
    --coverCount_[static_cast<size_t>(c.day * tasks_ + cell)];
    ++coverCount_[static_cast<size_t>(c.day * tasks_ + c.task)];
    cell = c.task;
  }
  coverTotal_ += pendingCover_;
  for (int i = 0; i < pendingRowCount_; ++i) rowTally_[static_cast<size_t>(pendingRows_[static_cast<size_t>(i)].staff)] = pendingRows_[static_cast<size_t>(i)].tally;
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
