/// @brief Every two-shift forbidden sequence of one person, judged as one table lookup a day.
///
/// Converted scenarios forbid hundreds of shift pairs (one rule each); asking each rule about
/// every change would cost more than the rest of a move. This is how the evaluator judges
/// them together: the same terms, anchored on the first day of each pair, with each pair's
/// penalty the sum of the rules that forbid it. Reports still list each rule's own breaches.
#pragma once
#include <vector>

#include "rules/row_rule.hpp"

namespace rotaweave::rules {

class ForbidPairsRule final : public RowRule {
 public:
  /// `members`: forbid-sequence rules of two worked shifts each, in declaration order.
  ForbidPairsRule(const model::Problem& problem, std::vector<const RowRule*> members);

  /// Whether a rule can join a group: a forbidden sequence of two worked shifts.
  static bool joins(const RowRule& rule);

  void score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const override;
  AnchorSpan reach(const RowView&, DayIdx first, DayIdx last) const override { return {first - 1, last}; }
  Observes observes() const override { return observes_; }
  const std::vector<const RowRule*>& members() const { return members_; }

 private:
  std::vector<const RowRule*> members_;
  int stride_;                ///< shifts + 1: pairs are indexed [(a + 1) * stride + b + 1]
  std::vector<Tally> pairCost_;  ///< penalty of one occurrence of each pair
  Observes observes_;
};

}  // namespace rotaweave::rules
