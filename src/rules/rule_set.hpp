/// @brief The compiled rules of one Problem: row rules per person, cover, and fair-share groups.
///
/// Built once from Problem::rules through the kind registry; immutable and shareable between threads.
#pragma once
#include <cstdint>
#include <memory>
#include <vector>

#include "model/problem.hpp"
#include "rules/cover_rule.hpp"
#include "rules/fair_share_rule.hpp"
#include "rules/row_rule.hpp"

namespace rotaweave::rules {

/// Registry: the row rule class for a spec's kind; nullptr for kinds judged elsewhere (cover, fair-share).
std::unique_ptr<RowRule> makeRowRule(const model::RuleSpec& spec);

/// For one person, which of their sequence rules (indices into RuleSet::sequenceRulesFor) read
/// what, so that a change is scored only by the rules that can see it.
struct RuleObservers {
  std::vector<std::vector<std::uint32_t>> byShift;  ///< [shift]: rules reading which days hold it
  std::vector<std::uint32_t> worked, paid, times;
  /// The same as bit sets, where the person has at most 64 sequence rules (bit k: rule k).
  bool masked = false;
  std::vector<std::uint64_t> shiftMask;
  std::uint64_t workedMask = 0, paidMask = 0, timesMask = 0;
};

class RuleSet {
 public:
  explicit RuleSet(const model::Problem& problem);

  const model::Problem& problem() const { return *problem_; }
  /// Row rules that apply to person s, in declaration order (cell-local ones included).
  const std::vector<const RowRule*>& rulesFor(StaffIdx s) const { return perStaff_[static_cast<size_t>(s)]; }
  /// The rules of rulesFor(s) that are not cell-local, as the evaluator asks them (forbidden
  /// pairs of shifts grouped into one table); and those that are.
  const std::vector<const RowRule*>& sequenceRulesFor(StaffIdx s) const { return sequence_[static_cast<size_t>(s)]; }
  const std::vector<const RowRule*>& cellRulesFor(StaffIdx s) const { return cell_[static_cast<size_t>(s)]; }
  const CoverRule& cover() const { return cover_; }
  const std::vector<FairShareRule>& fairShares() const { return fairShares_; }

  /// Penalty of the cell-local rules (requests, skills, absences, fixed cells, changes) if s
  /// takes task t on day d. Tabulated once, shared by every evaluator.
  const Tally& cellCost(StaffIdx s, DayIdx d, TaskIdx t) const {
    return cellCost_[(static_cast<size_t>(s) * static_cast<size_t>(problem_->days) + static_cast<size_t>(d)) * problem_->tasks.size() + static_cast<size_t>(t)];
  }
  const RuleObservers& observersFor(StaffIdx s) const { return observers_[static_cast<size_t>(s)]; }
  /// The most sequence rules any one person has (for scratch sizes).
  size_t maxSequenceRules() const { return maxSequenceRules_; }

 private:
  const model::Problem* problem_;
  std::vector<std::unique_ptr<RowRule>> rowRules_;
  std::vector<std::vector<const RowRule*>> perStaff_, sequence_, cell_;
  CoverRule cover_;
  std::vector<FairShareRule> fairShares_;
  std::vector<RuleObservers> observers_;
  std::vector<Tally> cellCost_;  ///< [(staff * days + day) * tasks + task]
  size_t maxSequenceRules_ = 0;

  void tabulateCellRules();
  /// Replaces each person's forbidden pairs of shifts by one table (rules/forbid_pairs.hpp).
  void groupForbiddenPairs();
};

}  // namespace rotaweave::rules
