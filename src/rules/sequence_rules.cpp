/// @brief Transition rules: rest between shifts and forbidden day-to-day patterns.
#include <algorithm>
#include <string>

#include "rules/row_rules.hpp"

namespace rotaweave::rules {

void MinRestRule::score(const RowView& row, Tally& tally, std::vector<Breach>* out) const {
  const int need = spec().minutes;
  DayIdx prev = kNoShift;
  bool havePrev = false;
  for (DayIdx d = -row.history; d < row.days; ++d) {
    if (!row.worked(d)) continue;
    // Rest runs from the end of the previous worked shift, however many days off lie between.
    if (havePrev && d >= 0) {
      const int rest = row.startMinute(d) - row.endMinute(prev);
      if (rest < need)
        charge(row, tally, out, kOne, {prev, d, true}, [&] {
          return row.personId() + ": " + hoursText(rest) + " h rest between " + row.shiftId(prev) + " on " +
                 row.date(prev) + " and " + row.shiftId(d) + " on " + row.date(d) + "; the rule needs " +
                 boundText(need) + " h";
        });
    }
    prev = d;
    havePrev = true;
  }
}

void ForbidSequenceRule::score(const RowView& row, Tally& tally, std::vector<Breach>* out) const {
  const ShiftIdx* seq = spec().sequence.data();
  const int len = static_cast<int>(spec().sequence.size());
  const ShiftIdx* sh = row.shifts;
  for (DayIdx a = std::max(-row.history, 1 - len); a + len - 1 < row.days; ++a) {  // skip windows wholly in history
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
