/// @brief Breach construction and number formatting shared by all rules.
#include "rules/row_rule.hpp"

#include <algorithm>
#include <cstdio>

namespace rotaweave::rules {

std::vector<DayIdx> RowRule::spanDays(const RowView& row, DaySpan span) {
  std::vector<DayIdx> days;
  auto add = [&](DayIdx d) {
    if (d >= 0 && d < row.days) days.push_back(d);
  };
  if (span.endpointsOnly) {
    add(span.first);
    if (span.last != span.first) add(span.last);
  } else {
    for (DayIdx d = std::max(span.first, 0); d <= std::min(span.last, row.days - 1); ++d) add(d);
  }
  return days;
}

Breach RowRule::makeBreach(const RowView& row, Cost amount, Cost penalty, std::vector<DayIdx> days,
                           std::string message) const {
  Breach b;
  b.ruleId = spec_.id;
  b.kind = model::kindInfo(spec_.kind).name;
  b.hard = spec_.hard;
  b.staff = row.staff;
  b.days = std::move(days);
  b.amount = amount;
  b.penalty = penalty;
  b.message = std::move(message);
  return b;
}

std::string hoursText(int minutes) {
  char buf[32];
  std::snprintf(buf, sizeof buf, minutes % 30 == 0 ? "%.1f" : "%.2f", minutes / 60.0);
  return buf;
}

std::string boundText(int minutes) {
  if (minutes % 60 == 0) return std::to_string(minutes / 60);
  return hoursText(minutes);
}

}  // namespace rotaweave::rules
