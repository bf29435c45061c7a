/// @brief Totals: paid hours over the period or a rolling window, and shift counts.
#include <algorithm>
#include <string>

#include "rules/row_rules.hpp"

namespace rotaweave::rules {
namespace {

/// The rolling windows of `w` days over the known days: window a covers days a to a + w - 1,
/// for a from the first known day to max(first known, days - w) (one short window when fewer
/// days than w are known). Only windows that reach the period are judged.
class Windows {
 public:
  Windows(const RowView& row, int w) : row_(row), w_(w), first_(row.firstKnown()), lastStart_(std::max(first_, row.days - w)) {}

  DayIdx first() const { return first_; }
  DayIdx lastStart() const { return lastStart_; }
  bool judged(DayIdx a) const { return a + w_ - 1 >= 0; }
  int sum(DayIdx a) const {
    int total = 0;
    for (DayIdx d = a; d <= std::min(a + w_ - 1, row_.days - 1); ++d) total += row_.paid[d];
    return total;
  }
  /// Sums of neighbouring windows (both must exist: they are then full).
  int next(DayIdx a, int sumA) const { return sumA - row_.paid[a] + row_.paid[a + w_]; }
  int previous(DayIdx a, int sumA) const { return sumA + row_.paid[a - 1] - row_.paid[a + w_ - 1]; }

 private:
  const RowView& row_;
  int w_;
  DayIdx first_, lastStart_;
};

/// Neighbouring windows that break the bound form one breach, charged its largest excess.
/// Anchored on its first window. excess(sum) > 0 marks a breaking window.
template <class Excess>
AnchorSpan windowReach(const RowView& row, int w, DayIdx first, DayIdx last, Excess&& excess) {
  const Windows win(row, w);
  // Windows holding a changed day start in [first - w + 1, last]; the breach that holds the
  // window just before them may reach back further, and one may start just after them.
  DayIdx lo = std::max(first - w + 1, win.first());
  if (lo > win.first() && lo - 1 <= win.lastStart()) {
    DayIdx a = lo - 1;
    int sum = win.sum(a);
    while (win.judged(a) && excess(sum) > 0) {
      lo = a;
      if (a == win.first()) break;
      sum = win.previous(a, sum);
      --a;
    }
  }
  return {lo, last + 1};
}

/// Charges each breach (run of breaking windows) whose first window starts in `anchors`.
template <class Excess, class Charge>
void scoreWindows(const RowView& row, int w, AnchorSpan anchors, Excess&& excess, Charge&& chargeGroup) {
  const Windows win(row, w);
  DayIdx a = std::max(anchors.first, win.first());
  const DayIdx stop = std::min(anchors.last, win.lastStart());
  if (a > stop) return;
  int sum = win.sum(a);
  auto breaks = [&](DayIdx at, int s) { return win.judged(at) && excess(s) > 0; };
  auto advance = [&] {
    if (a < win.lastStart()) sum = win.next(a, sum);
    ++a;
  };
  // A breach that holds the window before the span is anchored before it: skip its windows.
  if (a > win.first() && breaks(a - 1, win.previous(a, sum)))
    while (a <= win.lastStart() && breaks(a, sum)) advance();
  while (a <= stop) {
    if (!breaks(a, sum)) {
      advance();
      continue;
    }
    const DayIdx groupFirst = a;
    DayIdx groupLast = a, worst = a;
    int groupExcess = 0, groupSum = 0;
    while (a <= win.lastStart() && breaks(a, sum)) {
      groupLast = a;
      if (const int e = excess(sum); e > groupExcess) groupExcess = e, groupSum = sum, worst = a;
      advance();
    }
    chargeGroup(groupFirst, groupLast, groupExcess, groupSum, worst);
  }
}

std::string windowText(const RowView& row, DayIdx first, DayIdx lastStart, int w) {
  const DayIdx end = std::min(lastStart + w - 1, row.days - 1);
  if (first == lastStart) return "the " + std::to_string(w) + " days from " + row.date(first) + " to " + row.date(end);
  return std::to_string(w) + "-day windows between " + row.date(first) + " and " + row.date(end);
}

std::string shiftsText(const RowView& row, ShiftIdx s, int n) {
  const std::string what = s == kNoShift ? "shift" : row.problem->shifts[static_cast<size_t>(s)].id + " shift";
  return std::to_string(n) + " " + what + (n == 1 ? "" : "s");
}

/// Paid minutes of the period plus what absences credit, where the rule counts credit.
int periodMinutes(const RowView& row, const model::RuleSpec& spec) {
  return row.totals->paidMinutes + (spec.creditAbsences ? row.problem->credit(row.staff) : 0);
}

/// "150.0 h in the period", or "120.0 h worked + 30.0 h credited for absences = 150.0 h in the period".
std::string periodHoursText(const RowView& row, const model::RuleSpec& spec) {
  const int credit = spec.creditAbsences ? row.problem->credit(row.staff) : 0;
  if (credit == 0) return hoursText(row.totals->paidMinutes) + " h in the period";
  return hoursText(row.totals->paidMinutes) + " h worked + " + hoursText(credit) + " h credited for absences = " +
         hoursText(row.totals->paidMinutes + credit) + " h in the period";
}

/// Marks a rolling-window breach with its worst window.
void markWindow(std::vector<Breach>* out, const RowView& row, DayIdx worst, int w) {
  if (!out) return;
  out->back().windowFirst = worst;  // may lie in history: a date before the period
  out->back().windowLast = std::min(worst + w - 1, row.days - 1);
}

}  // namespace

Observes MaxHoursRule::observes() const { return Observes::paidMinutes(); }
Observes MinHoursRule::observes() const { return Observes::paidMinutes(); }
Observes MaxCountRule::observes() const { return Observes::shift(spec().shift); }
Observes MinCountRule::observes() const { return Observes::shift(spec().shift); }

AnchorSpan MaxHoursRule::reach(const RowView& row, DayIdx first, DayIdx last) const {
  const int bound = spec().minutes;
  if (spec().windowDays == 0) return kPeriodReach;
  return windowReach(row, spec().windowDays, first, last, [&](int sum) { return sum - bound; });
}

void MaxHoursRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const int bound = spec().minutes;
  const int w = spec().windowDays;
  if (w == 0) {
    const int total = periodMinutes(row, spec());
    if (anchors.contains(kPeriodAnchor) && total > bound)
      charge(row, tally, out, total - bound, {0, row.days - 1}, [&] {
        return row.personId() + ": " + periodHoursText(row, spec()) + "; at most " + boundText(bound) + " h allowed";
      });
    return;
  }
  scoreWindows(row, w, anchors, [&](int sum) { return sum - bound; }, [&](DayIdx a, DayIdx b, int excess, int sum, DayIdx worst) {
    charge(row, tally, out, excess, {a, b + w - 1}, [&] {
      return row.personId() + ": " + hoursText(sum) + " h in " + windowText(row, a, b, w) + "; at most " +
             boundText(bound) + " h allowed";
    });
    markWindow(out, row, worst, w);
  });
}

AnchorSpan MinHoursRule::reach(const RowView& row, DayIdx first, DayIdx last) const {
  const int bound = spec().minutes;
  if (spec().windowDays == 0) return kPeriodReach;
  if (row.history + row.days < spec().windowDays) return kNoAnchors;  // no full window is known
  return windowReach(row, spec().windowDays, first, last, [&](int sum) { return bound - sum; });
}

void MinHoursRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const int bound = spec().minutes;
  const int w = spec().windowDays;
  if (w == 0) {
    const int total = periodMinutes(row, spec());
    if (anchors.contains(kPeriodAnchor) && total < bound)
      charge(row, tally, out, bound - total, {0, row.days - 1}, [&] {
        return row.personId() + ": " + periodHoursText(row, spec()) + "; at least " + boundText(bound) + " h needed";
      });
    return;
  }
  if (row.history + row.days < w) return;  // no full window is known
  scoreWindows(row, w, anchors, [&](int sum) { return bound - sum; }, [&](DayIdx a, DayIdx b, int shortfall, int sum, DayIdx worst) {
    charge(row, tally, out, shortfall, {a, b + w - 1}, [&] {
      return row.personId() + ": " + hoursText(sum) + " h in " + windowText(row, a, b, w) + "; at least " +
             boundText(bound) + " h needed";
    });
    markWindow(out, row, worst, w);
  });
}

AnchorSpan MaxCountRule::reach(const RowView&, DayIdx, DayIdx) const { return kPeriodReach; }

void MaxCountRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const int n = row.count(spec().shift);
  if (!anchors.contains(kPeriodAnchor) || n <= spec().count) return;
  charge(row, tally, out, (n - spec().count) * kOne, {0, row.days - 1}, [&] {
    return row.personId() + ": " + shiftsText(row, spec().shift, n) + " in the period; at most " +
           std::to_string(spec().count) + " allowed";
  });
}

AnchorSpan MinCountRule::reach(const RowView&, DayIdx, DayIdx) const { return kPeriodReach; }

void MinCountRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const int n = row.count(spec().shift);
  if (!anchors.contains(kPeriodAnchor) || n >= spec().count) return;
  charge(row, tally, out, (spec().count - n) * kOne, {0, row.days - 1}, [&] {
    return row.personId() + ": " + shiftsText(row, spec().shift, n) + " in the period; at least " +
           std::to_string(spec().count) + " needed";
  });
}

}  // namespace rotaweave::rules
