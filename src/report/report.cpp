/// @brief Building the report value: ordering breaches and summarising by rule and person.
#include "report/report.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <map>

#include "model/rule_spec.hpp"

namespace rotaweave::report {
namespace {

std::string trimmedNumber(double v) {
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.4f", v);
  std::string s = buf;
  while (s.back() == '0') s.pop_back();
  if (s.back() == '.') s.pop_back();
  return s == "-0" ? "0" : s;
}

}  // namespace

std::string pointsText(Cost cost) { return trimmedNumber(static_cast<double>(cost) / static_cast<double>(kCostScale)); }
std::string amountText(Cost amount) { return trimmedNumber(static_cast<double>(amount) / static_cast<double>(kAmountScale)); }

const char* amountUnit(const std::string& kind) {
  const auto known = model::kindFromName(kind);
  return known ? model::kindInfo(*known).unit : "";
}

std::string amountWithUnit(const std::string& kind, Cost amount) {
  std::string unit = amountUnit(kind);
  if (unit.empty()) return amountText(amount);
  if (amount == kAmountScale) unit = unit == "people" ? "person" : unit == "days" ? "day" : unit == "shifts" ? "shift" : unit == "weekends" ? "weekend" : unit;
  return amountText(amount) + " " + unit;
}

const char* shortfallUnit(const rules::Breach& b) {
  if (b.shortfallUnit) return b.shortfallUnit;
  const char* unit = amountUnit(b.kind);
  return *unit ? unit : "breaches";
}

const char* cautionText() {
  return "Caution: this roster was checked only against the rules given in the scenario. The rule presets are "
         "examples, simplified from typical statutory minimums and published health-and-safety guidance. Labour "
         "law differs between countries, regions and sectors, and collective agreements, contracts and court "
         "decisions change it. \"No violations\" does not mean the roster is lawful or safe for a particular "
         "workplace. Before publishing, check it against the local regulations, agreements and internal policies "
         "that apply, and take licensed professional advice where in doubt. Local law always takes precedence.";
}

Report buildReport(const model::Problem& p, const model::Roster& roster, std::vector<rules::Breach> breaches, RunInfo run) {
  Report r;
  r.run = std::move(run);
  // Rule order follows declaration: cover first, then the scenario's rules.
  std::map<std::string, size_t> ruleOrder{{"cover", 0}};
  for (const auto& spec : p.rules) ruleOrder.emplace(spec.id, ruleOrder.size());
  auto order = [&](const std::string& id) {
    auto it = ruleOrder.find(id);
    return it == ruleOrder.end() ? ruleOrder.size() : it->second;
  };
  std::stable_sort(breaches.begin(), breaches.end(), [&](const rules::Breach& a, const rules::Breach& b) {
    if (a.hard != b.hard) return a.hard;
    if (a.ruleId != b.ruleId) return order(a.ruleId) < order(b.ruleId);
    if (a.staff != b.staff) return a.staff < b.staff;
    const DayIdx da = a.days.empty() ? -1 : a.days.front(), db = b.days.empty() ? -1 : b.days.front();
    return da < db;
  });

  r.byPerson.resize(p.staff.size());
  for (StaffIdx s = 0; s < p.staffCount(); ++s) {
    PersonSummary& ps = r.byPerson[static_cast<size_t>(s)];
    ps.staff = s;
    ps.shiftsByType.assign(p.shifts.size(), 0);
    ps.creditMinutes = p.credit(s);
    for (DayIdx d = 0; d < p.days && !p.absent.empty(); ++d) ps.absentDays += p.absent[p.cell(s, d)] != 0;
    int lastWeekend = -1;
    for (DayIdx d = 0; d < p.days; ++d) {
      const TaskIdx t = roster.at(s, d);
      if (t == kOff) continue;
      const auto& shift = p.shifts[static_cast<size_t>(p.tasks[static_cast<size_t>(t)].shift)];
      ps.paidMinutes += shift.paidMinutes();
      ++ps.shiftsWorked;
      ++ps.shiftsByType[static_cast<size_t>(p.tasks[static_cast<size_t>(t)].shift)];
      const int wb = p.weekendBlock[static_cast<size_t>(d)];
      if (wb >= 0 && wb != lastWeekend) ++ps.weekendsWorked, lastWeekend = wb;
    }
  }

  for (const auto& b : breaches) {
    (b.hard ? r.total.hard : r.total.soft) += b.penalty;
    r.hardCount += b.hard;
    auto it = std::find_if(r.byRule.begin(), r.byRule.end(),
                           [&](const RuleSummary& s) { return s.ruleId == b.ruleId && s.hard == b.hard; });
    if (it == r.byRule.end()) it = r.byRule.insert(r.byRule.end(), RuleSummary{b.ruleId, b.kind, b.hard, 0, 0, 0});
    ++it->count;
    it->amount += b.amount;
    it->penalty += b.penalty;
    if (b.staff >= 0) {
      PersonSummary& ps = r.byPerson[static_cast<size_t>(b.staff)];
      (b.hard ? ps.hardCount : ps.softCount)++;
      (b.hard ? ps.hard : ps.soft) += b.penalty;
    }
  }
  r.breaches = std::move(breaches);
  r.notes = p.notes;
  return r;
}

std::optional<double> gapPercent(const Report& report) {
  const auto& bound = report.run.lowerBound;
  if (!bound || report.total.hard > 0) return std::nullopt;
  if (*bound == 0) return report.total.soft == 0 ? std::optional<double>(0.0) : std::nullopt;
  return 100.0 * static_cast<double>(report.total.soft - *bound) / static_cast<double>(*bound);
}

std::string boundPointsText(Cost bound) {
  return trimmedNumber(std::floor(static_cast<double>(bound) * 100.0 / static_cast<double>(kCostScale)) / 100.0);
}

std::string lowerBoundText(const Report& report) {
  // A bound of zero holds for every roster and tells a reader nothing: report.json keeps it.
  if (!report.run.lowerBound || *report.run.lowerBound <= 0) return "";
  std::string text = "no roster without a hard breach can score below " + boundPointsText(*report.run.lowerBound) + " soft points";
  if (const auto gap = gapPercent(report)) {
    char percent[32];
    std::snprintf(percent, sizeof percent, "%.1f", *gap);
    text += std::string("; this one is at most ") + percent + " % above it";
  }
  return text;
}

}  // namespace rotaweave::report
