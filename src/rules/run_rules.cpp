/// @brief Run-length rules: consecutive worked days, consecutive shifts, days off, recovery.
#include <algorithm>
#include <string>

#include "rules/row_rules.hpp"

namespace rotaweave::rules {
namespace {

/// "1 day", "3 days"; "1 N shift", "2 N shifts".
std::string countText(int n, const std::string& one) { return std::to_string(n) + " " + one + (n == 1 ? "" : "s"); }

/// Where a run lies: "on 2027-10-05" for one day, "from 2027-10-05 to 2027-10-07" for more.
std::string spanText(const RowView& row, DayIdx first, DayIdx last) {
  return first == last ? "on " + row.date(first) : "from " + row.date(first) + " to " + row.date(last);
}

std::string shiftName(const RowView& row, ShiftIdx s) {
  return row.problem->shifts[static_cast<size_t>(s)].id;
}

}  // namespace

Observes MaxConsecutiveDaysRule::observes() const { return Observes::workedDays(); }
Observes MinConsecutiveDaysRule::observes() const { return Observes::workedDays(); }
Observes MaxConsecutiveRule::observes() const { return Observes::shift(spec().shift); }
Observes MinConsecutiveRule::observes() const { return Observes::shift(spec().shift); }
Observes MinConsecutiveOffRule::observes() const { return Observes::workedDays(); }
Observes DaysOffAfterRule::observes() const { return Observes::shift(spec().shift, true); }

AnchorSpan MaxConsecutiveDaysRule::reach(const RowView& row, DayIdx first, DayIdx last) const {
  return runReach(row, first, last, [&](DayIdx d) { return row.worked(d); });
}

void MaxConsecutiveDaysRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const int bound = spec().count;
  forEachRun(row, anchors, [&](DayIdx d) { return row.worked(d); }, [&](DayIdx a, DayIdx b, bool, bool) {
    const int len = b - a + 1;
    if (len <= bound) return;
    charge(row, tally, out, (len - bound) * kOne, {a, b}, [&] {
      return row.personId() + ": works " + countText(b - a + 1, "day") + " in a row, " + spanText(row, a, b) + "; at most " + std::to_string(bound) + " allowed";
    });
  });
}

AnchorSpan MinConsecutiveDaysRule::reach(const RowView& row, DayIdx first, DayIdx last) const {
  return runReach(row, first, last, [&](DayIdx d) { return row.worked(d); });
}

void MinConsecutiveDaysRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const int bound = spec().count;
  forEachRun(row, anchors, [&](DayIdx d) { return row.worked(d); }, [&](DayIdx a, DayIdx b, bool atStart, bool atEnd) {
    const int len = b - a + 1;
    if (len >= bound || atStart || atEnd) return;  // a run cut by the edge of what we know may go on
    charge(row, tally, out, (bound - len) * kOne, {a, b}, [&] {
      return row.personId() + ": works only " + countText(b - a + 1, "day") + " in a row, " + spanText(row, a, b) + "; at least " + std::to_string(bound) + " needed";
    });
  });
}

AnchorSpan MaxConsecutiveRule::reach(const RowView& row, DayIdx first, DayIdx last) const {
  return runReach(row, first, last, [&](DayIdx d) { return row.shift(d) == spec().shift; });
}

void MaxConsecutiveRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const int bound = spec().count;
  const ShiftIdx s = spec().shift;
  forEachRun(row, anchors, [&](DayIdx d) { return row.shift(d) == s; }, [&](DayIdx a, DayIdx b, bool, bool) {
    const int len = b - a + 1;
    if (len <= bound) return;
    charge(row, tally, out, (len - bound) * kOne, {a, b}, [&] {
      return row.personId() + ": " + countText(len, shiftName(row, s) + " shift") + " in a row, " + spanText(row, a, b) +
             "; at most " + std::to_string(bound) + " allowed";
    });
  });
}

AnchorSpan MinConsecutiveRule::reach(const RowView& row, DayIdx first, DayIdx last) const {
  return runReach(row, first, last, [&](DayIdx d) { return row.shift(d) == spec().shift; });
}

void MinConsecutiveRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const int bound = spec().count;
  const ShiftIdx s = spec().shift;
  forEachRun(row, anchors, [&](DayIdx d) { return row.shift(d) == s; }, [&](DayIdx a, DayIdx b, bool atStart, bool atEnd) {
    const int len = b - a + 1;
    if (len >= bound || atStart || atEnd) return;
    charge(row, tally, out, (bound - len) * kOne, {a, b}, [&] {
      return row.personId() + ": only " + countText(len, shiftName(row, s) + " shift") + " in a row, " + spanText(row, a, b) +
             "; at least " + std::to_string(bound) + " needed";
    });
  });
}

AnchorSpan MinConsecutiveOffRule::reach(const RowView& row, DayIdx first, DayIdx last) const {
  return runReach(row, first, last, [&](DayIdx d) { return !row.worked(d); });
}

void MinConsecutiveOffRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const int bound = spec().count;
  forEachRun(row, anchors, [&](DayIdx d) { return !row.worked(d); }, [&](DayIdx a, DayIdx b, bool atStart, bool atEnd) {
    const int len = b - a + 1;
    if (len >= bound || atStart || atEnd) return;
    charge(row, tally, out, (bound - len) * kOne, {a, b}, [&] {
      return row.personId() + ": only " + countText(b - a + 1, "day") + " off in a row, " + spanText(row, a, b) + "; at least " + std::to_string(bound) + " needed";
    });
  });
}

AnchorSpan DaysOffAfterRule::reach(const RowView&, DayIdx first, DayIdx last) const {
  // A series ending on day b is judged on days b to b + count + 1 at most.
  return {first - spec().count - 1, last};
}

void DaysOffAfterRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const int need = spec().count;
  const ShiftIdx s = spec().shift;
  // Anchored on the last day of the series.
  for (DayIdx b = std::max(anchors.first, row.firstKnown()); b < row.days - 1 && b <= anchors.last; ++b) {
    if (row.shift(b) != s || row.shift(b + 1) == s) continue;  // b ends a series of s
    DayIdx next = b + 1;
    while (next < row.days && !row.worked(next) && next - b - 1 < need) ++next;
    const int off = next - b - 1;
    // Judged only when the next worked day is inside the period: later days are unknown.
    if (off >= need || next >= row.days || next < 0) continue;
    charge(row, tally, out, (need - off) * kOne, {b, next}, [&] {
      return row.personId() + ": " + std::to_string(off) + (off == 1 ? " day" : " days") + " off after the " +
             shiftName(row, s) + " series ending " + row.date(b) + " before " + row.shiftId(next) + " on " +
             row.date(next) + "; " + std::to_string(need) + " needed";
    });
  }
}

}  // namespace rotaweave::rules
