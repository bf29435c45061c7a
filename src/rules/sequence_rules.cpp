/// @brief Transition rules: rest between shifts and forbidden day-to-day patterns.
#include <algorithm>
#include <string>

#include "rules/row_rules.hpp"

namespace rotaweave::rules {

Observes MinRestRule::observes() const { return Observes::shiftTimes(); }

Observes ForbidSequenceRule::observes() const {
  Observes o;
  for (const ShiftIdx sh : spec().sequence) {
    if (sh == kNoShift) o.worked = true;
    else o.shifts.push_back(sh);
  }
  return o;
}

AnchorSpan MinRestRule::reach(const RowView& row, DayIdx first, DayIdx last) const {
  // A rest is anchored on its later shift: those in [first, last] and the first one after.
  DayIdx next = last + 1;
  while (next < row.days && !row.worked(next)) ++next;
  return {first, std::min(next, row.days - 1)};
}

void MinRestRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const int need = spec().minutes;
  const DayIdx from = std::max<DayIdx>(anchors.first, 0), to = std::min(anchors.last, row.days - 1);
  if (from > to) return;
  // Rest runs from the end of the previous worked shift, however many days off lie between.
  DayIdx prev = from - 1;
  while (prev >= row.firstKnown() && !row.worked(prev)) --prev;
  bool havePrev = prev >= row.firstKnown();
  for (DayIdx d = from; d <= to; ++d) {
    if (!row.worked(d)) continue;
    if (havePrev) {
      const int rest = row.startMinute(d) - row.endMinute(prev);
      if (rest < need)
        charge(row, tally, out, kOne, {prev, d, true}, [&] {
          return row.personId() + ": " + hoursText(rest) + " h rest between " + row.shiftId(prev) + " on " +
                 row.date(prev) + " and " + row.shiftId(d) + " on " + row.date(d) + "; the rule needs " +
                 boundText(need) + " h";
        });
      if (rest < need && out) out->back().shortfall = need - rest, out->back().shortfallUnit = "h";
    }
    prev = d;
    havePrev = true;
  }
}

AnchorSpan ForbidSequenceRule::reach(const RowView&, DayIdx first, DayIdx last) const {
  // Anchored on the pattern's first day.
  return {first - static_cast<DayIdx>(spec().sequence.size()) + 1, last};
}

void ForbidSequenceRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const ShiftIdx* seq = spec().sequence.data();
  const int len = static_cast<int>(spec().sequence.size());
  const ShiftIdx* sh = row.shifts;
  const DayIdx from = std::max({anchors.first, -row.history, 1 - len});  // skip windows wholly in history
  for (DayIdx a = from; a + len - 1 < row.days && a <= anchors.last; ++a) {
    if (sh[a] != seq[0]) continue;
    int i = 1;
    while (i < len && sh[a + i] == seq[i]) ++i;
    if (i < len) continue;
    charge(row, tally, out, kOne, {a, a + len - 1}, [&] {
      std::string pattern;
      for (int k = 0; k < len; ++k) {
        if (k) pattern += ", ";
        pattern += row.worked(a + k) ? row.shiftId(a + k) : std::string("off");
      }
      return row.personId() + ": " + pattern + " from " + row.date(a) + " to " + row.date(a + len - 1) +
             " is a forbidden sequence";
    });
  }
}

}  // namespace rotaweave::rules
