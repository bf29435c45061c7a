/// @brief The compiled rules of one Problem: row rules per person, cover, and fair-share groups.
///
/// Built once from Problem::rules through the kind registry; immutable and shareable between threads.
#pragma once
#include <memory>
#include <vector>

#include "model/problem.hpp"
#include "rules/cover_rule.hpp"
#include "rules/fair_share_rule.hpp"
#include "rules/row_rule.hpp"

namespace rotaweave::rules {

/// Registry: the row rule class for a spec's kind; nullptr for kinds judged elsewhere (cover, fair-share).
std::unique_ptr<RowRule> makeRowRule(const model::RuleSpec& spec);

class RuleSet {
 public:
  explicit RuleSet(const model::Problem& problem);

  const model::Problem& problem() const { return *problem_; }
  /// Row rules that apply to person s, in declaration order (cell-local ones included).
  const std::vector<const RowRule*>& rulesFor(StaffIdx s) const { return perStaff_[static_cast<size_t>(s)]; }
  /// The subsets of rulesFor(s) that are and are not cell-local.
  const std::vector<const RowRule*>& sequenceRulesFor(StaffIdx s) const { return sequence_[static_cast<size_t>(s)]; }
  const std::vector<const RowRule*>& cellRulesFor(StaffIdx s) const { return cell_[static_cast<size_t>(s)]; }
  const CoverRule& cover() const { return cover_; }
  const std::vector<FairShareRule>& fairShares() const { return fairShares_; }

 private:
  const model::Problem* problem_;
  std::vector<std::unique_ptr<RowRule>> rowRules_;
  std::vector<std::vector<const RowRule*>> perStaff_, sequence_, cell_;
  CoverRule cover_;
  std::vector<FairShareRule> fairShares_;
};

}  // namespace rotaweave::rules
