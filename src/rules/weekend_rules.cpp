/// @brief Weekend rules and weekly rest.
#include <algorithm>
#include <array>
#include <string>

#include "rules/row_rules.hpp"

namespace rotaweave::rules {

int weekendsWorked(const RowView& row) {
  const auto& p = *row.problem;
  int worked = 0, lastBlock = -1;
  for (DayIdx d = 0; d < row.days; ++d) {
    const int block = p.weekendBlock[static_cast<size_t>(d)];
    if (block < 0 || block == lastBlock || !row.worked(d)) continue;
    lastBlock = block;
    ++worked;
  }
  return worked;
}

void MaxWeekendsRule::score(const RowView& row, Tally& tally, std::vector<Breach>* out) const {
  const int worked = weekendsWorked(row);
  if (worked <= spec().count) return;
  const auto& p = *row.problem;
  chargeDays(row, tally, out, (worked - spec().count) * kOne,
             [&] {
               std::vector<DayIdx> days;
               for (DayIdx d = 0; d < row.days; ++d)
                 if (p.weekendBlock[static_cast<size_t>(d)] >= 0 && row.worked(d)) days.push_back(d);
               return days;
             },
             [&] {
               return row.personId() + ": works on " + std::to_string(worked) + " weekends; at most " +
                      std::to_string(spec().count) + " allowed";
             });
}

void CompleteWeekendsRule::score(const RowView& row, Tally& tally, std::vector<Breach>* out) const {
  const auto& p = *row.problem;
  DayIdx d = 0;
  while (d < row.days) {
    const int block = p.weekendBlock[static_cast<size_t>(d)];
    if (block < 0) {
      ++d;
      continue;
    }
    const DayIdx first = d;
    int worked = 0;
    while (d < row.days && p.weekendBlock[static_cast<size_t>(d)] == block) worked += row.worked(d++);
    const int len = d - first;
    if (worked == 0 || worked == len) continue;
    charge(row, tally, out, kOne, {first, d - 1}, [&] {
      return row.personId() + ": works " + std::to_string(worked) + " of the " + std::to_string(len) +
             " days of the weekend starting " + row.date(first) + "; a weekend is worked whole or not at all";
    });
  }
}

void WeeklyRestRule::score(const RowView& row, Tally& tally, std::vector<Breach>* out) const {
  constexpr int kMaxBlocks = 400;
  const int need = spec().minutes;
  const int blockDays = spec().count > 0 ? spec().count : 7;
  const int blocks = std::min(kMaxBlocks, (row.days + blockDays - 1) / blockDays);
  const int blockLen = blockDays * kMinutesPerDay;
  std::array<int, kMaxBlocks> best;  // only the first `blocks` entries are used
  std::fill_n(best.begin(), blocks, 0);

  // Walk the free gaps between worked shifts; the time before the first known shift and after
  // the last one is unbounded. Each gap counts, whole, for every block it overlaps.
  constexpr int kOpen = 1 << 29;  // far beyond any period, and still no overflow in to - from
  // Gaps come in time order, so the first block a gap can overlap only moves forward:
  // tracked with additions instead of a division per gap.
  int firstBlock = 0, firstBlockEnd = blockLen;
  auto gap = [&](int from, int to) {
    const int len = to - from;
    while (firstBlockEnd <= from) ++firstBlock, firstBlockEnd += blockLen;
    for (int k = firstBlock, kStart = firstBlockEnd - blockLen; k < blocks && kStart < to; ++k, kStart += blockLen)
      best[static_cast<size_t>(k)] = std::max(best[static_cast<size_t>(k)], len);
  };
  int freeSince = -kOpen;
  for (DayIdx d = -row.history; d < row.days; ++d) {
    if (!row.worked(d)) continue;
    if (row.starts[d] > 0 || freeSince > 0) gap(freeSince, row.starts[d]);
    freeSince = std::max(freeSince, row.ends[d]);
  }
  gap(freeSince, kOpen);

  for (int k = 0; k < blocks; ++k) {
    const int longest = best[static_cast<size_t>(k)];
    if (longest >= need) continue;
    const DayIdx first = k * blockDays, last = std::min(row.days - 1, first + blockDays - 1);
    charge(row, tally, out, need - longest, {first, last}, [&] {
      return row.personId() + ": longest rest in the " + std::to_string(last - first + 1) + " days from " + row.date(first) +
             " to " + row.date(last) + " is " + hoursText(longest) + " h; the rule needs " + boundText(need) + " h";
    });
  }
}

}  // namespace rotaweave::rules
