/// @brief Matching breaches of two rosters by what they are about, and the changed cells.
#include "report/baseline.hpp"

#include <algorithm>
#include <map>
#include <sstream>
#include <tuple>

#include "report/report.hpp"
#include "report/text.hpp"

namespace rotaweave::report {
namespace {

using Key = std::tuple<std::string, bool, StaffIdx, std::vector<DayIdx>, TaskIdx, int>;

Key keyOf(const rules::Breach& b) { return {b.ruleId, b.hard, b.staff, b.days, b.task, static_cast<int>(b.coverPart)}; }

int hardIn(const std::vector<rules::Breach>& list) {
  return static_cast<int>(std::count_if(list.begin(), list.end(), [](const rules::Breach& b) { return b.hard; }));
}

rules::Tally totalOf(const std::vector<rules::Breach>& list) {
  rules::Tally t;
  for (const auto& b : list) (b.hard ? t.hard : t.soft) += b.penalty;
  return t;
}

std::string plural(int n, const char* one, const char* many) { return std::to_string(n) + " " + (n == 1 ? one : many); }

std::string breachLine(const rules::Breach& b, const model::Problem& p) {
  return std::string(b.hard ? "[hard] " : "[soft] ") + b.ruleId + ", " + datesText(p, b.days) + ": " + b.message;
}

}  // namespace

int BaselineDiff::addedHard() const { return hardIn(added); }
int BaselineDiff::goneHard() const { return hardIn(gone); }

BaselineDiff compareWithBaseline(const model::Problem& p, const model::Roster& baseline,
                                 const std::vector<rules::Breach>& baselineBreaches, const model::Roster& roster,
                                 const std::vector<rules::Breach>& breaches, std::string source) {
  BaselineDiff diff;
  diff.source = std::move(source);
  for (StaffIdx s = 0; s < p.staffCount(); ++s) {
    bool any = false;
    for (DayIdx d = 0; d < p.days; ++d)
      if (baseline.at(s, d) != roster.at(s, d)) {
        diff.cells.push_back({s, d, baseline.at(s, d), roster.at(s, d)});
        any = true;
      }
    diff.people += any;
  }

  // Each baseline breach can be matched once; equal keys are paired in order.
  std::map<Key, std::vector<size_t>> open;
  for (size_t i = 0; i < baselineBreaches.size(); ++i) open[keyOf(baselineBreaches[i])].push_back(i);
  std::vector<bool> matched(baselineBreaches.size(), false);
  for (const rules::Breach& b : breaches) {
    auto it = open.find(keyOf(b));
    if (it == open.end() || it->second.empty()) {
      diff.added.push_back(b);
      continue;
    }
    const size_t i = it->second.front();
    it->second.erase(it->second.begin());
    matched[i] = true;
    const rules::Breach& was = baselineBreaches[i];
    if (was.amount != b.amount || was.penalty != b.penalty) diff.changed.push_back({was, b});
  }
  for (size_t i = 0; i < baselineBreaches.size(); ++i)
    if (!matched[i]) diff.gone.push_back(baselineBreaches[i]);
  diff.before = totalOf(baselineBreaches);
  diff.after = totalOf(breaches);
  return diff;
}

std::string baselineLine(const BaselineDiff& d) {
  std::string line = plural(static_cast<int>(d.cells.size()), "cell", "cells") + " changed for " +
                     plural(d.people, "person", "people") + "; " +
                     plural(static_cast<int>(d.added.size()), "new breach", "new breaches");
  if (!d.added.empty()) line += " (" + std::to_string(d.addedHard()) + " hard)";
  line += ", " + std::to_string(d.gone.size()) + " gone";
  if (!d.gone.empty()) line += " (" + std::to_string(d.goneHard()) + " hard)";
  if (!d.changed.empty()) line += ", " + std::to_string(d.changed.size()) + " changed in amount";
  return line;
}

std::string renderBaselineText(const BaselineDiff& d, const model::Problem& p) {
  std::ostringstream out;
  out << "BASELINE (against " << d.source << ")\n"
      << "  " << baselineLine(d) << "\n"
      << "  Penalty: hard " << pointsText(d.before.hard) << " -> " << pointsText(d.after.hard) << ", soft "
      << pointsText(d.before.soft) << " -> " << pointsText(d.after.soft) << "\n";
  out << "  Changed cells:\n";
  if (d.cells.empty()) out << "    (none)\n";
  for (const BaselineCell& c : d.cells)
    out << "    " << p.staff[static_cast<size_t>(c.staff)].id << "  " << p.dateText(c.day) << "  "
        << p.cellText(c.before, c.staff) << " -> " << p.cellText(c.after, c.staff) << "\n";
  out << "  New breaches:\n";
  if (d.added.empty()) out << "    (none)\n";
  for (const auto& b : d.added) out << "    " << breachLine(b, p) << "\n";
  out << "  Gone breaches:\n";
  if (d.gone.empty()) out << "    (none)\n";
  for (const auto& b : d.gone) out << "    " << breachLine(b, p) << "\n";
  if (!d.changed.empty()) {
    out << "  Changed in amount:\n";
    for (const auto& c : d.changed)
      out << "    " << breachLine(c.after, p) << " (was " << amountWithUnit(c.before.kind, c.before.amount) << ", now "
          << amountWithUnit(c.after.kind, c.after.amount) << ")\n";
  }
  return out.str();
}

}  // namespace rotaweave::report
