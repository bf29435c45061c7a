/// @brief Weekend rules and weekly rest.
#include <algorithm>
#include <array>
#include <string>

#include "rules/row_rules.hpp"

namespace rotaweave::rules {

int weekendsWorked(const RowView& row) { return row.totals->weekendsWorked; }

Observes MaxWeekendsRule::observes() const { return Observes::workedDays(); }
Observes CompleteWeekendsRule::observes() const { return Observes::workedDays(); }
Observes WeeklyRestRule::observes() const { return Observes::shiftTimes(); }

AnchorSpan MaxWeekendsRule::reach(const RowView& row, DayIdx first, DayIdx last) const {
  // Only weekend days move the count.
  const auto& block = row.problem->weekendBlock;
  for (DayIdx d = first; d <= last; ++d)
    if (block[static_cast<size_t>(d)] >= 0) return kPeriodReach;
  return kNoAnchors;
}

void MaxWeekendsRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const int worked = weekendsWorked(row);
  if (!anchors.contains(kPeriodAnchor) || worked <= spec().count) return;
  const auto& p = *row.problem;
  chargeDays(row, tally, out, (worked - spec().count) * kOne,
             [&] {
               std::vector<DayIdx> days;
               for (DayIdx d = 0; d < row.days; ++d)
                 if (p.weekendBlock[static_cast<size_t>(d)] >= 0 && row.worked(d)) days.push_back(d);
               return days;
             },
             [&] {
               return row.personId() + ": works on " + std::to_string(worked) + (worked == 1 ? " weekend" : " weekends") + "; at most " +
                      std::to_string(spec().count) + " allowed";
             });
}

AnchorSpan CompleteWeekendsRule::reach(const RowView& row, DayIdx first, DayIdx last) const {
  // Anchored on the weekend's first day in the period.
  const auto& block = row.problem->weekendBlock;
  DayIdx lo = first;
  while (lo > 0 && block[static_cast<size_t>(lo)] >= 0 && block[static_cast<size_t>(lo - 1)] == block[static_cast<size_t>(lo)]) --lo;
  return {lo, last};
}

void CompleteWeekendsRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const auto& p = *row.problem;
  auto blockOf = [&](DayIdx d) { return p.weekendBlock[static_cast<size_t>(d)]; };
  DayIdx d = std::max<DayIdx>(anchors.first, 0);
  while (d > 0 && d < row.days && blockOf(d) >= 0 && blockOf(d - 1) == blockOf(d)) ++d;  // anchored before the span
  while (d < row.days && d <= anchors.last) {
    const int block = blockOf(d);
    if (block < 0) {
      ++d;
      continue;
    }
    const DayIdx first = d;
    int worked = 0;
    while (d < row.days && blockOf(d) == block) worked += row.worked(d++);
    const int len = d - first;
    if (worked == 0 || worked == len) continue;
    charge(row, tally, out, kOne, {first, d - 1}, [&] {
      return row.personId() + ": works " + std::to_string(worked) + " of the " + std::to_string(len) +
             " days of the weekend starting " + row.date(first) + "; a weekend is worked whole or not at all";
    });
    // How far from complete: the fewer days to change (work the rest or free the worked ones).
    if (out) out->back().shortfall = std::min(worked, len - worked) * kOne, out->back().shortfallUnit = "days";
  }
}

namespace {

/// Weekly rest looks at blocks of `blockDays` days from the period start, each judged by the
/// longest free gap between worked shifts that overlaps it (the time before the first known
/// shift and after the last one is unbounded). A block is anchored on its first day.
struct RestBlocks {
  static constexpr int kMaxBlocks = 400;
  static constexpr int kOpen = 1 << 29;  ///< far beyond any period, and still no overflow in to - from

  RestBlocks(const RowView& row, int days)
      : blockDays(days), blocks(std::min(kMaxBlocks, (row.days + days - 1) / days)), blockLen(days * kMinutesPerDay) {}

  /// When the row is free from, just before day d: the latest end of the shifts before d
  /// (only the last two worked days can end latest, since a shift ends within two days of
  /// its date), or -kOpen if none.
  static int freeBefore(const RowView& row, DayIdx d) {
    DayIdx p = d - 1;
    while (p >= row.firstKnown() && !row.worked(p)) --p;
    if (p < row.firstKnown()) return -kOpen;
    int free = row.ends[p];
    if (p - 1 >= row.firstKnown() && row.worked(p - 1)) free = std::max(free, row.ends[p - 1]);
    return free;
  }

  int blockOfMinute(int minute) const { return minute < 0 ? 0 : std::min(blocks - 1, minute / blockLen); }

  int blockDays, blocks, blockLen;
};

}  // namespace

AnchorSpan WeeklyRestRule::reach(const RowView& row, DayIdx first, DayIdx last) const {
  const RestBlocks rb(row, spec().count > 0 ? spec().count : 7);
  // The gaps a change touches run from when the row is free before `first` to the start of
  // the first worked day from last + 2 on (a shift on `last` may outlast one on last + 1).
  const int from = RestBlocks::freeBefore(row, first);
  DayIdx next = last + 2;
  while (next < row.days && !row.worked(next)) ++next;
  const int lastBlock = next < row.days ? rb.blockOfMinute(row.starts[next]) : rb.blocks - 1;
  return {rb.blockOfMinute(from) * rb.blockDays, lastBlock * rb.blockDays};
}

void WeeklyRestRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const int need = spec().minutes;
  const RestBlocks rb(row, spec().count > 0 ? spec().count : 7);
  const int k0 = std::max(0, (std::max<DayIdx>(anchors.first, 0) + rb.blockDays - 1) / rb.blockDays);
  const int k1 = anchors.last < 0 ? -1 : std::min(rb.blocks - 1, anchors.last / rb.blockDays);
  if (k0 > k1) return;
  std::array<int, RestBlocks::kMaxBlocks> best;  // entries k0..k1 are used
  std::fill(best.begin() + k0, best.begin() + k1 + 1, 0);
  const int spanStart = k0 * rb.blockLen, spanEnd = (k1 + 1) * rb.blockLen;

  // Each gap counts, whole, for every block it overlaps. Gaps before the first block's start
  // overlap none of them; gaps come in time order, so the first block a gap can overlap only
  // moves forward.
  int firstBlock = k0, firstBlockEnd = spanStart + rb.blockLen;
  auto gap = [&](int from, int to) {
    while (firstBlockEnd <= from && firstBlock <= k1) ++firstBlock, firstBlockEnd += rb.blockLen;
    for (int k = firstBlock, kStart = firstBlockEnd - rb.blockLen; k <= k1 && kStart < to; ++k, kStart += rb.blockLen)
      best[static_cast<size_t>(k)] = std::max(best[static_cast<size_t>(k)], to - from);
  };
  const DayIdx startDay = k0 * rb.blockDays;
  int freeSince = RestBlocks::freeBefore(row, startDay);
  bool closed = false;
  for (DayIdx d = startDay; d < row.days; ++d) {
    if (!row.worked(d)) continue;
    gap(freeSince, row.starts[d]);
    freeSince = std::max(freeSince, row.ends[d]);
    if (row.starts[d] >= spanEnd) {  // later gaps start after the last block
      closed = true;
      break;
    }
  }
  if (!closed) gap(freeSince, RestBlocks::kOpen);

  for (int k = k0; k <= k1; ++k) {
    const int longest = best[static_cast<size_t>(k)];
    if (longest >= need) continue;
    const DayIdx first = k * rb.blockDays, last = std::min(row.days - 1, first + rb.blockDays - 1);
    charge(row, tally, out, need - longest, {first, last}, [&] {
      return row.personId() + ": longest rest in the " + std::to_string(last - first + 1) + " days from " + row.date(first) +
             " to " + row.date(last) + " is " + hoursText(longest) + " h; the rule needs " + boundText(need) + " h";
    });
  }
}

}  // namespace rotaweave::rules
