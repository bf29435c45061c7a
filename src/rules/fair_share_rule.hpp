/// @brief Fair share: an even spread of one shift, or of worked weekends, across a group.
///
/// The amount is the sum over the group of |count - mean|, rounded to 1/kAmountScale.
/// Counts come per row; the group cost needs every member's count, so the evaluator caches them.
#pragma once
#include <vector>

#include "model/problem.hpp"
#include "rules/breach.hpp"
#include "rules/row_rule.hpp"

namespace rotaweave::rules {

class FairShareRule {
 public:
  FairShareRule(const model::Problem& problem, model::RuleSpec spec);

  const model::RuleSpec& spec() const { return spec_; }
  const std::vector<StaffIdx>& members() const { return members_; }
  /// Position of s in members(), or -1.
  int memberIndex(StaffIdx s) const { return memberIndex_[static_cast<size_t>(s)]; }

  /// What this rule counts in one row: shifts of the kind, or weekends worked.
  int countRow(const RowView& row) const;
  /// Penalty for the members' counts (indexed like members()), with their sum given.
  Tally groupTally(const int* counts, long sum) const;
  void explain(const model::Problem& problem, const int* counts, long sum, std::vector<Breach>& out) const;

 private:
  Cost amountOf(const int* counts, long sum) const;
  model::RuleSpec spec_;
  std::vector<StaffIdx> members_;
  std::vector<int> memberIndex_;
};

}  // namespace rotaweave::rules
