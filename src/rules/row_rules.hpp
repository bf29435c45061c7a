/// @brief Declarations of every row rule kind (one class per kind).
///
/// Each class judges one person's row (history included) and is registered in registry.cpp.
/// Amount units and edge cases are documented per kind in docs/rules/.
#pragma once
#include <algorithm>

#include "rules/row_rule.hpp"

namespace rotaweave::rules {

#define ROTAWEAVE_ROW_RULE(Name)                                                                            \
  class Name final : public RowRule {                                                                       \
   public:                                                                                                  \
    using RowRule::RowRule;                                                                                 \
    void score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const override; \
    AnchorSpan reach(const RowView& row, DayIdx first, DayIdx last) const override;                        \
    Observes observes() const override;                                                                     \
  }

// Shift-to-shift transitions (sequence_rules.cpp).
ROTAWEAVE_ROW_RULE(MinRestRule);
ROTAWEAVE_ROW_RULE(ForbidSequenceRule);
// Runs of days (run_rules.cpp).
ROTAWEAVE_ROW_RULE(MinConsecutiveDaysRule);
ROTAWEAVE_ROW_RULE(MaxConsecutiveDaysRule);
ROTAWEAVE_ROW_RULE(MinConsecutiveRule);
ROTAWEAVE_ROW_RULE(MaxConsecutiveRule);
ROTAWEAVE_ROW_RULE(MinConsecutiveOffRule);
ROTAWEAVE_ROW_RULE(DaysOffAfterRule);
// Totals over the period or a window (total_rules.cpp).
ROTAWEAVE_ROW_RULE(MinHoursRule);
ROTAWEAVE_ROW_RULE(MaxHoursRule);
ROTAWEAVE_ROW_RULE(MinCountRule);
ROTAWEAVE_ROW_RULE(MaxCountRule);
// Weekends and weekly rest (weekend_rules.cpp).
ROTAWEAVE_ROW_RULE(MaxWeekendsRule);
ROTAWEAVE_ROW_RULE(CompleteWeekendsRule);
ROTAWEAVE_ROW_RULE(WeeklyRestRule);

#define ROTAWEAVE_CELL_RULE(Name)                                                                           \
  class Name final : public RowRule {                                                                       \
   public:                                                                                                  \
    using RowRule::RowRule;                                                                                 \
    void score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const override; \
    AnchorSpan reach(const RowView&, DayIdx first, DayIdx last) const override { return {first, last}; }   \
    Observes observes() const override { return {}; }                                                       \
    bool cellLocal() const override { return true; }                                                        \
  }

// Always on, judged cell by cell (always_on.cpp).
ROTAWEAVE_CELL_RULE(SkillRule);
ROTAWEAVE_CELL_RULE(AbsenceRule);
ROTAWEAVE_CELL_RULE(FixedRule);
ROTAWEAVE_CELL_RULE(RequestRule);
ROTAWEAVE_CELL_RULE(ChangesRule);

#undef ROTAWEAVE_CELL_RULE
#undef ROTAWEAVE_ROW_RULE

/// Number of weekends in the period on which the row has any shift (shared with fair-share).
int weekendsWorked(const RowView& row);

/// Calls onRun(first, last, touchesFirstKnownDay, touchesPeriodEnd) for every maximal run of
/// days where inRun(d) holds that starts in `anchors`; runs wholly in history are skipped.
template <class InRun, class OnRun>
void forEachRun(const RowView& row, AnchorSpan anchors, InRun&& inRun, OnRun&& onRun) {
  const DayIdx firstKnown = row.firstKnown();
  const DayIdx last = row.days - 1;
  DayIdx d = std::max(anchors.first, firstKnown);
  if (d > firstKnown && inRun(d - 1))
    while (d <= last && inRun(d)) ++d;  // a run anchored before the span
  const DayIdx stop = std::min(anchors.last, last);
  while (d <= stop) {
    if (!inRun(d)) {
      ++d;
      continue;
    }
    const DayIdx start = d;
    while (d <= last && inRun(d)) ++d;
    if (d - 1 >= 0) onRun(start, d - 1, start == firstKnown, d - 1 == last);
  }
}

/// Anchors of the runs that include or border a day in [first, last]: the run ending just
/// before `first` (found by walking back) up to a run starting just after `last`.
template <class InRun>
AnchorSpan runReach(const RowView& row, DayIdx first, DayIdx last, InRun&& inRun) {
  DayIdx lo = first;
  while (lo > row.firstKnown() && inRun(lo - 1)) --lo;
  return {lo, last + 1};
}

/// Terms judged on the whole period may move with any change.
inline constexpr AnchorSpan kPeriodReach{kPeriodAnchor, kPeriodAnchor};

}  // namespace rotaweave::rules
