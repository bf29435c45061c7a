/// @brief Fair-share counting, group amount and its message.
#include "rules/fair_share_rule.hpp"

#include <cstdio>
#include <cstdlib>

#include "rules/row_rules.hpp"

namespace rotaweave::rules {

FairShareRule::FairShareRule(const model::Problem& problem, model::RuleSpec spec)
    : spec_(std::move(spec)), memberIndex_(problem.staff.size(), -1) {
  for (StaffIdx s = 0; s < problem.staffCount(); ++s)
    if (spec_.inScope[static_cast<size_t>(s)]) {
      memberIndex_[static_cast<size_t>(s)] = static_cast<int>(members_.size());
      members_.push_back(s);
    }
}

int FairShareRule::countRow(const RowView& row) const {
  return spec_.weekends ? weekendsWorked(row) : row.count(spec_.shift);
}

Cost FairShareRule::amountOf(const int* counts, long sum) const {
  const long n = static_cast<long>(members_.size());
  if (n == 0) return 0;
  // sum |c - sum/n| = (1/n) sum |n c - sum|, kept in integers until the final rounding.
  long dev = 0;
  for (long i = 0; i < n; ++i) dev += std::labs(n * counts[i] - sum);
  return (dev * kAmountScale + n / 2) / n;
}

Tally FairShareRule::groupTally(const int* counts, long sum) const {
  Tally t;
  (spec_.hard ? t.hard : t.soft) = amountOf(counts, sum) * spec_.weight;
  return t;
}

void FairShareRule::explain(const model::Problem& problem, const int* counts, long sum, std::vector<Breach>& out) const {
  const Cost amount = amountOf(counts, sum);
  if (amount == 0) return;
  size_t most = 0, fewest = 0;
  for (size_t i = 1; i < members_.size(); ++i) {
    if (counts[i] > counts[most]) most = i;
    if (counts[i] < counts[fewest]) fewest = i;
  }
  const std::string what = spec_.weekends ? "worked weekends"
                           : spec_.shift == kNoShift ? "shifts"
                                                     : problem.shifts[static_cast<size_t>(spec_.shift)].id + " shifts";
  char mean[32];
  std::snprintf(mean, sizeof mean, "%.1f", static_cast<double>(sum) / static_cast<double>(members_.size()));
  Breach b;
  b.ruleId = spec_.id;
  b.kind = "fair-share";
  b.hard = spec_.hard;
  b.amount = amount;
  b.penalty = amount * spec_.weight;
  b.shortfallUnit = spec_.weekends ? "weekends" : "shifts";
  b.message = what + " spread unevenly across " + std::to_string(members_.size()) + " people: mean " + mean +
              ", most " + std::to_string(counts[most]) + " (" + problem.staff[static_cast<size_t>(members_[most])].id +
              "), fewest " + std::to_string(counts[fewest]) + " (" +
              problem.staff[static_cast<size_t>(members_[fewest])].id + ")";
  out.push_back(std::move(b));
}

}  // namespace rotaweave::rules
