/// @brief Evaluator: row tallies, cover counts and fair-share counts, full and incremental.
#include "eval/evaluator.hpp"

#include <algorithm>
#include <bit>
#include <cassert>
#include <utility>

namespace rotaweave::eval {

namespace {

/// tryMoveWithin stops early only this far (in 1/kCostScale units) above its limit: far more
/// than the rounding error of summing penalties in doubles, far less than any penalty step.
constexpr double kLimitMargin = 1.0;
/// Anchor spans one rule may need for one row in one move: one per changed day, before and after.
constexpr int kSpansPerRule = 2 * Move::kCapacity;

/// Sorts spans and merges those that overlap or touch; returns how many remain.
int mergeSpans(rules::AnchorSpan* spans, int n) {
  if (n <= 1) return n;
  std::sort(spans, spans + n, [](const rules::AnchorSpan& a, const rules::AnchorSpan& b) { return a.first < b.first; });
  int out = 0;
  for (int i = 1; i < n; ++i) {
    if (spans[i].first <= spans[out].last + 1) spans[out].last = std::max(spans[out].last, spans[i].last);
    else spans[++out] = spans[i];
  }
  return out + 1;
}

}  // namespace

Evaluator::Evaluator(const rules::RuleSet& rules)
    : rules_(&rules), p_(&rules.problem()), days_(p_->days), tasks_(p_->taskCount()), history_(p_->maxHistory),
      span_(p_->maxHistory + p_->days), tables_(*p_), buffer_(*p_) {
  coverScratch_.resize(static_cast<size_t>(days_ * tasks_));
  keyStamp_.assign(static_cast<size_t>(days_ * tasks_), 0);
  fairScratch_.resize(p_->staff.size());
  spans_.resize(rules.maxSequenceRules() * kSpansPerRule);
  asked_.resize(Move::kCapacity * rules.maxSequenceRules());
  newRuleTally_.resize(Move::kCapacity * rules.maxSequenceRules());
  askedStamp_.assign(rules.maxSequenceRules(), 0);
  spanCount_.resize(rules.maxSequenceRules());
  const size_t fairRules = rules.fairShares().size();
  fairCount_.resize(fairRules);
  fairSum_.resize(fairRules);
  fairTally_.resize(fairRules);
  pendingFair_.resize(fairRules);
  pendingFairCount_.resize(fairRules);
  pendingFairTally_.resize(fairRules);
  pendingFairSum_.resize(fairRules);
}

Tally Evaluator::cellSum(StaffIdx s, const TaskIdx* tasks) const {
  Tally t;
  for (DayIdx d = 0; d < days_; ++d) t += cellCost(s, d, tasks[d]);
  return t;
}

Tally Evaluator::sequenceTally(const rules::RowView& row) const {
  Tally t;
  for (const rules::RowRule* rule : rules_->sequenceRulesFor(row.staff)) rule->scoreRow(row, t, nullptr);
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
      counts[i] = fair[r].countRow(buffer_.fill(members[i], roster.row(members[i])));
      sum += counts[i];
    }
    total += fairTally(r, counts.data(), sum);
  }
  for (StaffIdx s = 0; s < roster.staff; ++s) total += rowTally(buffer_.fill(s, roster.row(s)));
  countCover(roster, coverScratch_);
  for (DayIdx d = 0; d < days_; ++d)
    for (TaskIdx t = 1; t < tasks_; ++t)
      total += rules_->cover().cellTally(d, t, coverScratch_[static_cast<size_t>(d * tasks_ + t)]);
  return total;
}

std::vector<rules::Breach> Evaluator::explain(const model::Roster& roster) {
  std::vector<rules::Breach> out;
  for (StaffIdx s = 0; s < roster.staff; ++s) {
    const rules::RowView row = buffer_.fill(s, roster.row(s));
    Tally ignored;
    for (const rules::RowRule* rule : rules_->rulesFor(s)) rule->scoreRow(row, ignored, &out);
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
      counts.push_back(rule.countRow(buffer_.fill(s, roster.row(s))));
      sum += counts.back();
    }
    rule.explain(*p_, counts.data(), sum, out);
  }
  return out;
}

std::vector<rules::Breach> Evaluator::explainLoadedRow(StaffIdx s) const {
  std::vector<rules::Breach> out;
  const rules::RowView row = loadedView(s);
  Tally ignored;
  for (const rules::RowRule* rule : rules_->rulesFor(s)) rule->scoreRow(row, ignored, &out);
  return out;
}

rules::RowView Evaluator::loadedView(StaffIdx s) const {
  const size_t base = static_cast<size_t>(s) * static_cast<size_t>(span_) + static_cast<size_t>(history_);
  return rules::RowView{p_, s, roster_.row(s), rowShift_.data() + base, rowStart_.data() + base, rowEnd_.data() + base,
                        rowPaid_.data() + base, &rowTotals_[static_cast<size_t>(s)],
                        static_cast<int>(p_->staff[static_cast<size_t>(s)].history.size()), days_};
}

void Evaluator::fillLoadedRow(StaffIdx s) {
  const size_t base = static_cast<size_t>(s) * static_cast<size_t>(span_) + static_cast<size_t>(history_);
  ShiftIdx* shifts = rowShift_.data() + base;
  int *starts = rowStart_.data() + base, *ends = rowEnd_.data() + base, *paid = rowPaid_.data() + base;
  const auto& hist = p_->staff[static_cast<size_t>(s)].history;
  const int h = static_cast<int>(hist.size());
  for (int i = 0; i < h; ++i) rules::setDay(tables_, shifts, starts, ends, paid, i - h, hist[static_cast<size_t>(i)]);
  for (DayIdx d = 0; d < days_; ++d) rules::setDay(tables_, shifts, starts, ends, paid, d, kNoShift);
  rules::RowTotals& totals = rowTotals_[static_cast<size_t>(s)];
  const size_t shiftTypes = p_->shifts.size();
  totals = rules::RowTotals{0, 0, 0, rowShiftCount_.data() + static_cast<size_t>(s) * shiftTypes};
  std::fill_n(rowShiftCount_.begin() + static_cast<std::ptrdiff_t>(static_cast<size_t>(s) * shiftTypes), shiftTypes, 0);
  std::fill_n(blockWorked_.begin() + static_cast<std::ptrdiff_t>(static_cast<size_t>(s) * static_cast<size_t>(p_->weekendCount)),
              p_->weekendCount, std::uint16_t{0});
  // Start from an empty row and add each day, so totals are built by the same code as moves.
  for (DayIdx d = 0; d < days_; ++d) setLoadedDay(s, d, std::exchange(roster_.at(s, d), kOff));
}

void Evaluator::setLoadedDay(StaffIdx s, DayIdx d, TaskIdx t) {
  TaskIdx& cell = roster_.at(s, d);
  const TaskIdx old = cell;
  if (old == t) return;
  cell = t;
  const ShiftIdx was = tables_.taskShift[static_cast<size_t>(old)], now = tables_.taskShift[static_cast<size_t>(t)];
  const size_t base = static_cast<size_t>(s) * static_cast<size_t>(span_) + static_cast<size_t>(history_);
  rules::setDay(tables_, rowShift_.data() + base, rowStart_.data() + base, rowEnd_.data() + base, rowPaid_.data() + base, d, now);
  rules::RowTotals& totals = rowTotals_[static_cast<size_t>(s)];
  totals.paidMinutes += tables_.taskPaid[static_cast<size_t>(t)] - tables_.taskPaid[static_cast<size_t>(old)];
  int* counts = rowShiftCount_.data() + static_cast<size_t>(s) * p_->shifts.size();
  if (was != kNoShift) --counts[was];
  if (now != kNoShift) ++counts[now];
  const int worked = (now != kNoShift) - (was != kNoShift);
  if (worked == 0) return;
  totals.workedDays += worked;
  const int block = p_->weekendBlock[static_cast<size_t>(d)];
  if (block < 0) return;
  std::uint16_t& inBlock = blockWorked_[static_cast<size_t>(s) * static_cast<size_t>(p_->weekendCount) + static_cast<size_t>(block)];
  const bool before = inBlock > 0;
  inBlock = static_cast<std::uint16_t>(inBlock + worked);
  totals.weekendsWorked += (inBlock > 0) - before;
}

void Evaluator::load(const model::Roster& roster) {
  roster_ = roster;
  const auto staff = static_cast<size_t>(roster.staff);
  rowShift_.resize(staff * static_cast<size_t>(span_));
  rowStart_.resize(staff * static_cast<size_t>(span_));
  rowEnd_.resize(staff * static_cast<size_t>(span_));
  rowPaid_.resize(staff * static_cast<size_t>(span_));
  rowShiftCount_.resize(staff * p_->shifts.size());
  blockWorked_.resize(staff * static_cast<size_t>(p_->weekendCount));
  rowTotals_.resize(staff);
  rowTally_.resize(staff);
  rowCells_.resize(staff);
  total_ = Tally{};
  const size_t rulesPerRow = rules_->maxSequenceRules();
  ruleTally_.assign(staff * rulesPerRow, Tally{});
  for (StaffIdx s = 0; s < roster.staff; ++s) {
    fillLoadedRow(s);
    rowCells_[static_cast<size_t>(s)] = cellSum(s, roster_.row(s));
    const rules::RowView row = loadedView(s);
    Tally& tally = rowTally_[static_cast<size_t>(s)];
    tally = rowCells_[static_cast<size_t>(s)];
    const auto& sequence = rules_->sequenceRulesFor(s);
    for (size_t k = 0; k < sequence.size(); ++k) {
      Tally& rule = ruleTally_[static_cast<size_t>(s) * rulesPerRow + k];
      sequence[k]->scoreRow(row, rule, nullptr);
      tally += rule;
    }
    total_ += tally;
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
      fairCount_[r][i] = fair[r].countRow(loadedView(members[i]));
      fairSum_[r] += fairCount_[r][i];
    }
    fairTally_[r] = fairTally(r, fairCount_[r].data(), fairSum_[r]);
    total_ += fairTally_[r];
  }
}

int Evaluator::rulesToAsk(StaffIdx s, const CellChange* changes, int count, std::uint32_t* asked) {
  const rules::RuleObservers& observers = rules_->observersFor(s);
  // What the changes alter: which shifts days hold, whether they are worked, paid minutes, times.
  bool worked = false, paid = false, times = false;
  std::array<ShiftIdx, 2 * Move::kCapacity> shifts;
  int shiftCount = 0;
  for (int j = 0; j < count; ++j) {
    const auto was = static_cast<size_t>(roster_.at(s, changes[j].day)), now = static_cast<size_t>(changes[j].task);
    const ShiftIdx from = tables_.taskShift[was], to = tables_.taskShift[now];
    if (from == to) continue;  // another skill on the same shift: no sequence rule can tell
    worked |= (from == kNoShift) != (to == kNoShift);
    paid |= tables_.taskPaid[was] != tables_.taskPaid[now];
    times |= tables_.taskStart[was] != tables_.taskStart[now] || tables_.taskEnd[was] != tables_.taskEnd[now] ||
             (from == kNoShift) != (to == kNoShift);
    if (from != kNoShift) shifts[static_cast<size_t>(shiftCount++)] = from;
    if (to != kNoShift) shifts[static_cast<size_t>(shiftCount++)] = to;
  }
  // The rules reading any of that, in declaration order, so the bounded try meets them in the
  // same order every time.
  int n = 0;
  if (observers.masked) {
    std::uint64_t mask = (worked ? observers.workedMask : 0) | (paid ? observers.paidMask : 0) | (times ? observers.timesMask : 0);
    for (int j = 0; j < shiftCount; ++j) mask |= observers.shiftMask[static_cast<size_t>(shifts[static_cast<size_t>(j)])];
    for (; mask != 0; mask &= mask - 1) asked[n++] = static_cast<std::uint32_t>(std::countr_zero(mask));
    return n;
  }
  if (++askStamp_ == 0) std::fill(askedStamp_.begin(), askedStamp_.end(), 0), askStamp_ = 1;  // wrapped around
  auto ask = [&](const std::vector<std::uint32_t>& rules) {
    for (const std::uint32_t k : rules)
      if (askedStamp_[k] != askStamp_) askedStamp_[k] = askStamp_, asked[n++] = k;
  };
  for (int j = 0; j < shiftCount; ++j) ask(observers.byShift[static_cast<size_t>(shifts[static_cast<size_t>(j)])]);
  if (worked) ask(observers.worked);
  if (paid) ask(observers.paid);
  if (times) ask(observers.times);
  std::sort(asked, asked + n);
  return n;
}

bool Evaluator::overLimit(const Limit* limit, const Tally& least) {
  return limit && least.weighed(limit->hardWeight) > limit->value + kLimitMargin;
}

bool Evaluator::scoreRowChange(int i, const Limit* limit, Tally& least, Tally& change) {
  PendingRow& pr = pendingRows_[static_cast<size_t>(i)];
  const StaffIdx s = pr.staff;
  const CellChange* changes = &rowChanges_[static_cast<size_t>(i) * Move::kCapacity];
  const auto& sequence = rules_->sequenceRulesFor(s);
  const size_t rulesPerRow = rules_->maxSequenceRules();
  const std::uint32_t* asked = asked_.data() + static_cast<size_t>(i) * rulesPerRow;
  Tally* after = newRuleTally_.data() + static_cast<size_t>(i) * rulesPerRow;
  const Tally* before = ruleTally_.data() + static_cast<size_t>(s) * rulesPerRow;
  const rules::RowView row = loadedView(s);  // sees the patch below
  auto patch = [&] {
    for (int j = 0; j < pr.changes; ++j) {
      saved_[static_cast<size_t>(j)] = SavedDay{changes[j].day, roster_.at(s, changes[j].day)};
      setLoadedDay(s, changes[j].day, changes[j].task);
    }
  };
  auto unpatch = [&] {
    for (int j = pr.changes - 1; j >= 0; --j) setLoadedDay(s, saved_[static_cast<size_t>(j)].day, saved_[static_cast<size_t>(j)].task);
  };
  auto noteFairCounts = [&] {
    const auto& fair = rules_->fairShares();
    for (size_t r = 0; r < fair.size(); ++r) {
      const int member = fair[r].memberIndex(s);
      if (member < 0) continue;
      const int count = fair[r].countRow(row);
      if (count != fairCount_[r][static_cast<size_t>(member)])
        pendingFair_[r][static_cast<size_t>(pendingFairCount_[r]++)] = PendingFair{member, count};
    }
  };
  change = Tally{};

  // Each rule re-scores only the anchors the changed days reach. Runs of changed days are each
  // asked for their reach; a reach reads only days outside its run, so where there is one
  // run, asking before the change is enough, else it is asked after it too.
  std::array<rules::AnchorSpan, Move::kCapacity> runs;  // first and last day of each run
  int runCount = 0;
  for (int a = 0; a < pr.changes;) {
    int b = a;
    while (b + 1 < pr.changes && changes[b + 1].day == changes[b].day + 1) ++b;
    runs[static_cast<size_t>(runCount++)] = {changes[a].day, changes[b].day};
    a = b + 1;
  }
  const bool oneRun = runCount == 1;
  auto addReach = [&](int q) {
    const rules::RowRule& rule = *sequence[asked[q]];
    rules::AnchorSpan* spans = spans_.data() + static_cast<size_t>(q) * kSpansPerRule;
    int& n = spanCount_[static_cast<size_t>(q)];
    for (int r = 0; r < runCount; ++r) {
      const rules::AnchorSpan reach = rule.reach(row, runs[static_cast<size_t>(r)].first, runs[static_cast<size_t>(r)].last);
      if (!reach.empty()) spans[n++] = reach;
    }
  };
  for (int q = 0; q < pr.asked; ++q) {
    spanCount_[static_cast<size_t>(q)] = 0;
    addReach(q);
  }
  patch();
  bool rejected = false;
  for (int q = 0; q < pr.asked && !rejected; ++q) {
    if (!oneRun) addReach(q);
    rules::AnchorSpan* spans = spans_.data() + static_cast<size_t>(q) * kSpansPerRule;
    int& n = spanCount_[static_cast<size_t>(q)];
    n = mergeSpans(spans, n);
    Tally part;
    for (int j = 0; j < n; ++j) sequence[asked[q]]->score(row, spans[j], part, nullptr);
    after[q] = part;  // the new terms for now; the rest of the total below
    // The rule's new total is at least what its re-scored terms come to.
    least += part;
    rejected = overLimit(limit, least);
  }
  if (!rejected) noteFairCounts();
  unpatch();
  if (rejected) return false;
  for (int q = 0; q < pr.asked; ++q) {
    const std::uint32_t k = asked[q];
    Tally removed;  // the old terms; none where the rule cost nothing
    if (!(before[k] == Tally{})) {
      const rules::AnchorSpan* spans = spans_.data() + static_cast<size_t>(q) * kSpansPerRule;
      for (int j = 0; j < spanCount_[static_cast<size_t>(q)]; ++j) sequence[k]->score(row, spans[j], removed, nullptr);
    }
    const Tally part = after[q];
    after[q] = before[k] - removed + part;
    change += after[q] - before[k];
    least += before[k] - removed;  // the terms no change reached
  }
  return !overLimit(limit, least);
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
  pending_.size = move.size;
  std::copy(move.begin(), move.end(), pending_.cells.begin());
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

  // 2 - Rows: penalty is additive per person, so only the touched rows are re-scored. Each
  // row's changed cells are kept in day order.
  pendingRowCount_ = 0;
  for (const CellChange& c : move) {
    int i = 0;
    while (i < pendingRowCount_ && pendingRows_[static_cast<size_t>(i)].staff != c.staff) ++i;
    PendingRow& pr = pendingRows_[static_cast<size_t>(i)];
    if (i == pendingRowCount_) {
      ++pendingRowCount_;
      pr.staff = c.staff;
      pr.cells = rowCells_[static_cast<size_t>(c.staff)];
      pr.changes = 0;
    }
    // Cell-local rules: swap the old cell's tabulated penalty for the new one's.
    pr.cells += cellCost(c.staff, c.day, c.task) - cellCost(c.staff, c.day, roster_.at(c.staff, c.day));
    CellChange* changes = &rowChanges_[static_cast<size_t>(i) * Move::kCapacity];
    int at = pr.changes++;
    for (; at > 0 && changes[at - 1].day > c.day; --at) changes[at] = changes[at - 1];
    changes[at] = c;
  }
  // The rules that can see each row's changes. With a limit: the least the total can still
  // come to, each rule asked counted at zero until it is scored (as fair share, which can at
  // most fall to zero).
  const size_t rulesPerRow = rules_->maxSequenceRules();
  Tally least = total_ + delta;
  for (int i = 0; i < pendingRowCount_; ++i) {
    PendingRow& pr = pendingRows_[static_cast<size_t>(i)];
    std::uint32_t* asked = asked_.data() + static_cast<size_t>(i) * rulesPerRow;
    pr.asked = rulesToAsk(pr.staff, &rowChanges_[static_cast<size_t>(i) * Move::kCapacity], pr.changes, asked);
    if (!limit) continue;
    least += pr.cells - rowCells_[static_cast<size_t>(pr.staff)];
    const Tally* before = ruleTally_.data() + static_cast<size_t>(pr.staff) * rulesPerRow;
    for (int q = 0; q < pr.asked; ++q) least -= before[asked[q]];
  }
  if (limit)
    for (const Tally& t : fairTally_) least -= t;
  for (int i = 0; i < pendingRowCount_; ++i) {
    PendingRow& pr = pendingRows_[static_cast<size_t>(i)];
    Tally change;
    if (!scoreRowChange(i, limit, least, change)) return false;
    pr.tally = rowTally_[static_cast<size_t>(pr.staff)] - rowCells_[static_cast<size_t>(pr.staff)] + change + pr.cells;
    delta += pr.tally - rowTally_[static_cast<size_t>(pr.staff)];
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
    --coverCount_[static_cast<size_t>(c.day * tasks_ + roster_.at(c.staff, c.day))];
    ++coverCount_[static_cast<size_t>(c.day * tasks_ + c.task)];
    setLoadedDay(c.staff, c.day, c.task);
  }
  coverTotal_ += pendingCover_;
  const size_t rulesPerRow = rules_->maxSequenceRules();
  for (int i = 0; i < pendingRowCount_; ++i) {
    const PendingRow& pr = pendingRows_[static_cast<size_t>(i)];
    rowTally_[static_cast<size_t>(pr.staff)] = pr.tally;
    rowCells_[static_cast<size_t>(pr.staff)] = pr.cells;
    for (int q = 0; q < pr.asked; ++q)
      ruleTally_[static_cast<size_t>(pr.staff) * rulesPerRow + asked_[static_cast<size_t>(i) * rulesPerRow + static_cast<size_t>(q)]] =
          newRuleTally_[static_cast<size_t>(i) * rulesPerRow + static_cast<size_t>(q)];
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
