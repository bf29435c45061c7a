/// @brief Forbidden shift pairs as one table.
#include "rules/forbid_pairs.hpp"

#include <algorithm>

namespace rotaweave::rules {

namespace {

model::RuleSpec groupSpec() {
  model::RuleSpec spec;
  spec.id = "forbidden shift pairs";
  spec.kind = model::RuleKind::ForbidSequence;
  return spec;
}

}  // namespace

bool ForbidPairsRule::joins(const RowRule& rule) {
  const model::RuleSpec& spec = rule.spec();
  return spec.kind == model::RuleKind::ForbidSequence && spec.sequence.size() == 2 && spec.sequence[0] != kNoShift &&
         spec.sequence[1] != kNoShift;
}

ForbidPairsRule::ForbidPairsRule(const model::Problem& problem, std::vector<const RowRule*> members)
    : RowRule(groupSpec()), members_(std::move(members)), stride_(static_cast<int>(problem.shifts.size()) + 1) {
  pairCost_.assign(static_cast<size_t>(stride_ * stride_), Tally{});
  for (const RowRule* rule : members_) {
    const model::RuleSpec& spec = rule->spec();
    Tally& cost = pairCost_[static_cast<size_t>((spec.sequence[0] + 1) * stride_ + spec.sequence[1] + 1)];
    (spec.hard ? cost.hard : cost.soft) += kOne * spec.weight;  // one breach of amount 1, as the rule charges
    for (const ShiftIdx sh : spec.sequence)
      if (std::find(observes_.shifts.begin(), observes_.shifts.end(), sh) == observes_.shifts.end()) observes_.shifts.push_back(sh);
  }
}

void ForbidPairsRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  if (out) {  // each rule explains its own breaches
    for (const RowRule* rule : members_) rule->score(row, anchors, tally, out);
    return;
  }
  // Anchored on the pair's first day; pairs wholly in history are not judged.
  const DayIdx from = std::max({anchors.first, row.firstKnown(), DayIdx{-1}});
  const DayIdx to = std::min(anchors.last, row.days - 2);
  const ShiftIdx* sh = row.shifts;
  for (DayIdx a = from; a <= to; ++a) tally += pairCost_[static_cast<size_t>((sh[a] + 1) * stride_ + sh[a + 1] + 1)];
}

}  // namespace rotaweave::rules
