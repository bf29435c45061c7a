/// @brief Totals: paid hours over the period or a rolling window, and shift counts.
#include <algorithm>
#include <string>

#include "rules/row_rules.hpp"

namespace rotaweave::rules {
namespace {

int paidOn(const RowView& row, DayIdx d) { return row.paid[d]; }

int periodMinutes(const RowView& row) {
  int total = 0;
  for (DayIdx d = 0; d < row.days; ++d) total += paidOn(row, d);
  return total;
}

/// Slides a window of `w` days over the known days and merges adjacent breaching windows.
/// excess(sum) > 0 marks a breach; each merged group is charged its largest excess.
template <class Excess, class Charge>
void slideWindows(const RowView& row, int w, Excess&& excess, Charge&& chargeGroup) {
  const DayIdx firstKnown = -row.history;
  const DayIdx lastStart = std::max(firstKnown, row.days - w);
  int sum = 0;
  for (DayIdx d = firstKnown; d < std::min(firstKnown + w, row.days); ++d) sum += paidOn(row, d);
  DayIdx groupFirst = 0, groupLast = 0;
  int groupExcess = 0, groupSum = 0;
  bool open = false;
  for (DayIdx a = firstKnown; a <= lastStart; ++a) {
    if (a > firstKnown) sum += paidOn(row, a + w - 1) - paidOn(row, a - 1);
    const bool counts = a + w - 1 >= 0;  // the window reaches the period
    const int e = counts ? excess(sum) : 0;
    if (e > 0) {
      if (!open) groupFirst = a, groupExcess = 0, open = true;
      groupLast = a;
      if (e > groupExcess) groupExcess = e, groupSum = sum;
    } else if (open) {
      chargeGroup(groupFirst, groupLast, groupExcess, groupSum);
      open = false;
    }
  }
  if (open) chargeGroup(groupFirst, groupLast, groupExcess, groupSum);
}

std::string windowText(const RowView& row, DayIdx first, DayIdx lastStart, int w) {
  const DayIdx end = std::min(lastStart + w - 1, row.days - 1);
  if (first == lastStart) return "the " + std::to_string(w) + " days from " + row.date(first) + " to " + row.date(end);
  return std::to_string(w) + "-day windows between " + row.date(first) + " and " + row.date(end);
}

int countShifts(const RowView& row, ShiftIdx s) {
  int n = 0;
  for (DayIdx d = 0; d < row.days; ++d) n += s == kNoShift ? row.worked(d) : row.shift(d) == s;
  return n;
}

std::string shiftsText(const RowView& row, ShiftIdx s, int n) {
  const std::string what = s == kNoShift ? "shift" : row.problem->shifts[static_cast<size_t>(s)].id + " shift";
  return std::to_string(n) + " " + what + (n == 1 ? "" : "s");
}

}  // namespace

void MaxHoursRule::score(const RowView& row, Tally& tally, std::vector<Breach>* out) const {
  const int bound = spec().minutes;
  const int w = spec().windowDays;
  if (w == 0) {
    const int total = periodMinutes(row);
    if (total > bound)
      charge(row, tally, out, total - bound, {0, row.days - 1}, [&] {
        return row.personId() + ": " + hoursText(total) + " h in the period; at most " + boundText(bound) + " h allowed";
      });
    return;
  }
  slideWindows(row, w, [&](int sum) { return sum - bound; }, [&](DayIdx a, DayIdx b, int excess, int sum) {
    charge(row, tally, out, excess, {a, b + w - 1}, [&] {
      return row.personId() + ": " + hoursText(sum) + " h in " + windowText(row, a, b, w) + "; at most " +
             boundText(bound) + " h allowed";
    });
  });
}

void MinHoursRule::score(const RowView& row, Tally& tally, std::vector<Breach>* out) const {
  const int bound = spec().minutes;
  const int w = spec().windowDays;
  if (w == 0) {
    const int total = periodMinutes(row);
    if (total < bound)
      charge(row, tally, out, bound - total, {0, row.days - 1}, [&] {
        return row.personId() + ": " + hoursText(total) + " h in the period; at least " + boundText(bound) + " h needed";
      });
    return;
  }
  if (row.history + row.days < w) return;  // no full window is known
  slideWindows(row, w, [&](int sum) { return bound - sum; }, [&](DayIdx a, DayIdx b, int shortfall, int sum) {
    charge(row, tally, out, shortfall, {a, b + w - 1}, [&] {
      return row.personId() + ": " + hoursText(sum) + " h in " + windowText(row, a, b, w) + "; at least " +
             boundText(bound) + " h needed";
    });
  });
}

void MaxCountRule::score(const RowView& row, Tally& tally, std::vector<Breach>* out) const {
  const int n = countShifts(row, spec().shift);
  if (n <= spec().count) return;
  charge(row, tally, out, (n - spec().count) * kOne, {0, row.days - 1}, [&] {
    return row.personId() + ": " + shiftsText(row, spec().shift, n) + " in the period; at most " +
           std::to_string(spec().count) + " allowed";
  });
}

void MinCountRule::score(const RowView& row, Tally& tally, std::vector<Breach>* out) const {
  const int n = countShifts(row, spec().shift);
  if (n >= spec().count) return;
  charge(row, tally, out, (spec().count - n) * kOne, {0, row.days - 1}, [&] {
    return row.personId() + ": " + shiftsText(row, spec().shift, n) + " in the period; at least " +
           std::to_string(spec().count) + " needed";
  });
}

}  // namespace rotaweave::rules
