/// @brief Setting a roster's hard breaches against the capacity analysis: unavoidable or not,
/// why, and what would remove them.
#include <algorithm>
#include <memory>
#include <string>

#include "analysis/capacity.hpp"
#include "analysis/fill_candidates.hpp"
#include "analysis/wording.hpp"

namespace rotaweave::analysis {
namespace {

using model::Problem;
using wording::namesText;
using wording::slotText;

/// The task of a cover breach; kOff if none.
TaskIdx coverTask(const Problem&, const rules::Breach& b) { return b.kind == "cover" ? b.task : kOff; }

bool isContractMinimum(const Problem& p, const rules::Breach& b) {
  if (b.kind != "min-hours" || b.staff < 0) return false;
  const int c = p.staff[static_cast<size_t>(b.staff)].contract;
  return c >= 0 && b.ruleId == "contract-" + p.contracts[static_cast<size_t>(c)].id + "-min-hours";
}

bool isCalledInKind(const std::string& kind) { return kind == "absence" || kind == "fixed" || kind == "skill"; }

/// True if a rule with this id is marked `legal: true`: advice never suggests relaxing it.
bool isLegal(const Problem& p, const std::string& ruleId) {
  return std::any_of(p.rules.begin(), p.rules.end(), [&](const model::RuleSpec& r) { return r.id == ruleId && r.legal; });
}

/// Fill candidates on demand: the rule set and evaluator are built only when a breach asks.
class Candidates {
 public:
  Candidates(const Problem& p, const model::Roster& roster) : p_(p), roster_(roster) {}
  std::vector<std::string> ids(DayIdx d, TaskIdx t, StaffIdx except = -1) {
    if (!evaluator_) {
      rules_ = std::make_unique<rules::RuleSet>(p_);
      evaluator_ = std::make_unique<eval::Evaluator>(*rules_);
    }
    return fillCandidateIds(*evaluator_, roster_, d, t, except);
  }
  /// "ana and ben could have taken it (qualified, not absent, no hard rule broken)" or that
  /// nobody could.
  std::string line(DayIdx d, TaskIdx t, StaffIdx except = -1) {
    const auto who = ids(d, t, except);
    if (who.empty()) return "nobody off that day could take " + slotText(p_, d, t) + " without breaking a hard rule";
    return namesText(who, 6) + (who.size() == 1 ? " was" : " were") + " off and could have taken " + slotText(p_, d, t) +
           " (qualified, not absent, no hard rule broken)";
  }

 private:
  const Problem& p_;
  const model::Roster& roster_;
  std::unique_ptr<rules::RuleSet> rules_;
  std::unique_ptr<eval::Evaluator> evaluator_;
};

/// "ana", "ana or ben", "ana, ben or cat": any one of a few people.
std::string anyOf(const std::vector<std::string>& ids, size_t limit = 3) {
  std::string out;
  const size_t shown = std::min(ids.size(), limit);
  for (size_t i = 0; i < shown; ++i) out += (i == 0 ? "" : i + 1 == shown && ids.size() <= limit ? " or " : ", ") + ids[i];
  if (ids.size() > limit) out += " or " + std::to_string(ids.size() - limit) + " others";
  return out;
}

/// The last day of the breach on which the person works, or -1.
DayIdx workedDay(const model::Roster& roster, const rules::Breach& b) {
  for (auto it = b.days.rbegin(); it != b.days.rend(); ++it)
    if (roster.at(b.staff, *it) != kOff) return *it;
  return -1;
}

std::string outsideCover(const Problem& p, DayIdx d, TaskIdx t, int persons) {
  const model::Task& task = p.tasks[static_cast<size_t>(t)];
  return "add " + std::to_string(persons) + " " + p.skills[static_cast<size_t>(task.skill)] + " from outside (bank, agency or another team) for " +
         p.shifts[static_cast<size_t>(task.shift)].id + " on " + p.dateText(d);
}

std::string leaveRemedy(const std::vector<std::string>& absent, DayIdx d, const Problem& p) {
  if (absent.empty()) return "";
  return ", or move the leave of " + namesText(absent, 4) + " away from " + p.dateText(d);
}

std::vector<BreachTag> tagBreaches(const CapacityReport& r, const Problem& p, const model::Roster& roster,
                                   const std::vector<rules::Breach>& breaches) {
  std::vector<BreachTag> tags(breaches.size());
  for (size_t i = 0; i < breaches.size(); ++i) tags[i].breach = i;
  Candidates candidates(p, roster);
  std::vector<int> budget = r.hardGap;  // unavoidable units per day still to explain
  budget.resize(static_cast<size_t>(p.days), 0);
  std::vector<TaskIdx> task(breaches.size(), kOff);
  for (size_t i = 0; i < breaches.size(); ++i)
    if (breaches[i].hard && breaches[i].kind == "cover") task[i] = coverTask(p, breaches[i]);

  auto findCell = [&](DayIdx d, TaskIdx t) -> const CellShortfall* {
    for (const auto& c : r.cells)
      if (c.day == d && c.task == t && !c.target && c.hard) return &c;
    return nullptr;
  };
  auto findDay = [&](DayIdx d) -> const DayShortfall* {
    for (const auto& ds : r.days)
      if (ds.day == d) return &ds;
    return nullptr;
  };
  auto spend = [&](DayIdx d, int units) {
    int& b = budget[static_cast<size_t>(d)];
    const int used = std::min(b, units);
    b -= used;
    return used;
  };

  // 1. Cover breaches on slots that are short on their own.
  for (size_t i = 0; i < breaches.size(); ++i) {
    const auto& b = breaches[i];
    if (task[i] == kOff) continue;
    const DayIdx d = b.days.front();
    const CellShortfall* cell = findCell(d, task[i]);
    if (!cell) continue;
    const int units = static_cast<int>(b.amount / kAmountScale);
    const int proven = spend(d, std::min(units, cell->shortBy()));
    if (proven <= 0) continue;
    auto& tag = tags[i];
    tag.unavoidable = true;
    tag.cause = describe(*cell, p);
    if (units > proven) tag.cause += "; this roster is short by " + std::to_string(units) + ", so " + std::to_string(units - proven) + " could be avoided";
    tag.remedy = outsideCover(p, d, task[i], proven) + leaveRemedy(wording::absentIds(p, cell->missing), d, p) +
                 ", or lower the minimum for that slot";
  }
  // 2. People called in (absent, fixed elsewhere, without the skill) to a minimum slot on a short day.
  for (size_t i = 0; i < breaches.size(); ++i) {
    const auto& b = breaches[i];
    if (!b.hard || !isCalledInKind(b.kind) || b.staff < 0 || b.days.size() != 1) continue;
    const DayIdx d = b.days.front();
    const TaskIdx worked = roster.at(b.staff, d);
    if (worked == kOff) continue;
    const model::DemandCell& cell = p.demandAt(d, worked);
    if (!cell.defined || !cell.minHard || cell.min <= 0 || spend(d, 1) == 0) continue;
    auto& tag = tags[i];
    tag.unavoidable = true;
    const std::string& id = p.staff[static_cast<size_t>(b.staff)].id;
    tag.cause = id + " is called in to " + slotText(p, d, worked) + ", a day whose minimums cannot all be met otherwise";
    tag.remedy = outsideCover(p, d, worked, 1) + " and let " + id + " off";
  }
  // 3. Other cover breaches on a day that is short as a whole.
  for (size_t i = 0; i < breaches.size(); ++i) {
    const auto& b = breaches[i];
    if (task[i] == kOff || tags[i].unavoidable) continue;
    const DayIdx d = b.days.front();
    const int units = static_cast<int>(b.amount / kAmountScale);
    const int proven = spend(d, units);
    auto& tag = tags[i];
    if (proven > 0) {
      tag.unavoidable = true;
      const DayShortfall* day = findDay(d);
      tag.cause = day ? describe(*day, p) : p.dateText(d) + ": the day's minimums cannot all be met at once";
      if (units > proven) tag.cause += "; this roster is short by " + std::to_string(units) + " here, " + std::to_string(units - proven) + " of them avoidable";
      tag.remedy = outsideCover(p, d, task[i], proven) + (day ? leaveRemedy(wording::absentIds(p, day->missing), d, p) : "");
      continue;
    }
    const auto idle = candidates.ids(d, task[i]);
    tag.cause = idle.empty() ? "nobody off that day could take " + slotText(p, d, task[i]) +
                                   " without breaking a hard rule; the qualified people work elsewhere in this roster"
                             : candidates.line(d, task[i]);
    tag.remedy = idle.empty() ? "move someone qualified from another slot that day, or search longer (--time-limit)"
                              : "give the slot to " + anyOf(idle) +
                                    ", or search longer (--time-limit)";
  }
  // 4. Everything else.
  for (size_t i = 0; i < breaches.size(); ++i) {
    const auto& b = breaches[i];
    auto& tag = tags[i];
    if (!b.hard || tag.unavoidable || task[i] != kOff) continue;
    const std::string who = b.staff >= 0 ? p.staff[static_cast<size_t>(b.staff)].id : "";
    if (isContractMinimum(p, b)) {
      const auto it = std::find_if(r.people.begin(), r.people.end(), [&](const PersonShortfall& ps) { return ps.staff == b.staff; });
      if (it != r.people.end()) {
        tag.unavoidable = true;
        tag.cause = describe(*it, p);
        const Cost rosterShort = b.amount;  // minutes
        if (rosterShort > it->shortMinutes())
          tag.cause += "; this roster is short by " + wording::hoursText(rosterShort) + ", so " +
                       wording::hoursText(rosterShort - it->shortMinutes()) + " of it could be avoided";
        tag.remedy = "lower the contract minimum for " + who + " in this period to at most " + wording::hoursText(it->possibleMinutes) +
                     (it->absentDays.empty() ? "" : ", or move " + who + "'s leave so more days are available");
      } else {
        tag.cause = who + " has enough available days to reach the contract minimum";
        tag.remedy = "give " + who + " more shifts, or search longer (--time-limit)";
      }
      continue;
    }
    // Who could have taken the breaching person's shift on the breach's last worked day.
    const DayIdx d = b.staff >= 0 ? workedDay(roster, b) : -1;
    const TaskIdx t = d >= 0 ? roster.at(b.staff, d) : kOff;
    const std::string others = t != kOff ? "; " + candidates.line(d, t, b.staff) : "";
    const auto helpers = t != kOff ? candidates.ids(d, t, b.staff) : std::vector<std::string>{};
    const std::string handOver = helpers.empty() ? "" : "give " + who + "'s " + slotText(p, d, t) + " to " + anyOf(helpers) + ", or ";
    if (b.kind == "absence") {
      tag.cause = who + " works on an absence day that the analysis does not show as short" + others;
      tag.remedy = handOver + "give the shift to someone available, or move " + who + "'s leave";
    } else if (b.kind == "fixed") {
      tag.cause = who + "'s pre-assigned cell is not kept" + others;
      tag.remedy = "restore the fixed cell, or remove the fixed entry for " + who;
    } else if (b.kind == "skill") {
      tag.cause = who + " fills a role without holding its skill" + others;
      tag.remedy = handOver + "give the role to someone holding the skill";
    } else if (isLegal(p, b.ruleId)) {
      // A legal minimum is never to be weakened: only staffing remedies.
      tag.cause = "not implied by the capacity analysis" + others;
      tag.remedy = handOver + "change the roster on these dates, add staff from outside (bank, agency or another team)" +
                   (t != kOff ? " for " + slotText(p, d, t) : "") + ", or search longer (--time-limit); rule '" + b.ruleId +
                   "' is marked legal, so keep it as it is";
    } else {
      tag.cause = "not implied by the capacity analysis" + others;
      tag.remedy = handOver + "change the roster on these dates, search longer (--time-limit), or relax rule '" + b.ruleId + "'" +
                   (who.empty() ? "" : " for " + who + " (narrow it with staff: [...] or make it soft)");
    }
  }
  return tags;
}

}  // namespace

std::vector<bool> unavoidable(const CapacityReport& report, const Problem& problem, const model::Roster& roster,
                              const std::vector<rules::Breach>& breaches) {
  std::vector<bool> out;
  for (const auto& tag : tagBreaches(report, problem, roster, breaches)) out.push_back(tag.unavoidable);
  return out;
}

void compareWithRoster(CapacityReport& report, const Problem& problem, const model::Roster& roster,
                       const std::vector<rules::Breach>& breaches) {
  RosterComparison cmp;
  for (const auto& b : breaches) {
    if (b.hard) cmp.hard += b.penalty;
    if (b.kind != "cover") continue;
    if (b.hard) cmp.coverHard += b.penalty, cmp.coverHardUnits += static_cast<int>(b.amount / kAmountScale);
    else if (b.coverPart == rules::CoverPart::Target)
      cmp.coverSoft += b.penalty;
  }
  cmp.coverSoftBound = report.coverSoftBound(cmp.hard);
  for (auto& tag : tagBreaches(report, problem, roster, breaches))
    if (breaches[tag.breach].hard) cmp.tags.push_back(std::move(tag));
  report.roster = std::move(cmp);
}

}  // namespace rotaweave::analysis
