/// @brief Transition rules: rest between shifts and forbidden day-to-day patterns.
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
  const auto& seq = spec().sequence;
  const int len = static_cast<int>(seq.size());
  for (DayIdx a = -row.history; a + len - 1 < row.days; ++a) {
    if (a + len - 1 < 0) continue;  // wholly in history
    bool match = true;
    for (int i = 0; i < len && match; ++i) match = row.shift(a + i) == seq[static_cast<size_t>(i)];
    if (!match) continue;
    charge(row, tally, out, kOne, {a, a + len - 1}, [&] {
      std::string pattern;
      for (int i = 0; i < len; ++i) {
        if (i) pattern += ", ";
        pattern += row.worked(a + i) ? row.shiftId(a + i) : std::string("off");
      }
      return row.personId() + ": " + pattern + " from " + row.date(a) + " to " + row.date(a + len - 1) +
             " is a forbidden sequence";
    });
  }
}

}  // namespace rotaweave::rules
