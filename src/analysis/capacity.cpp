/// @brief The capacity analysis and its lower bounds.
///
/// Vocabulary. A person can work a slot (date d, task t) *freely* when they hold t's skill, are
/// not absent on d and are not fixed to anything but t on d. Any other working cell breaks the
/// absence, fixed or skill rule: a "called-in" cell, which costs at least breakUnitCost of hard
/// penalty (those three rules are always hard, one breach per cell).
///
/// Hard bound, cover part. Let F_d be the maximum number of hard minimum slots of day d that can
/// be filled at once by free cells (a b-matching of people to (shift, skill) slots with the
/// minimums as capacities; each person fills at most one) and D_d = (sum of minimums) - F_d.
/// In any roster the free cells filling minimum slots form such a matching, so if k cells of the
/// day are called in, at least D_d - k minimum slots stay empty; and at most P (the staff count)
/// slots can be filled at all. Hence the cover breaches plus the called-in cells of day d cost at
/// least  e*w + (D_d - e)*min(w, c)  with e = max(0, sum of minimums - P), w the least minimum
/// weight of the day and c = breakUnitCost.
///
/// Hard bound, contract part. For a person with a hard contract minimum M: on days with D_d > 0
/// the called-in cells are already charged above, so those days count as free (longest shift);
/// so do days where even staying off breaks a rule (absent and fixed to a shift). The remaining
/// absent or fixed days can still add hours, each at a cost of at least c. The least of
/// weight*max(0, short - gains of the k best such days) + k*c over k bounds the contract breach
/// plus those called-in cells. The cells charged by the two parts are disjoint, so they add.
///
/// Soft bound, cover-target part. As above with targets as capacities: G_d slots can be filled
/// freely, E_d = (sum of targets) - G_d. A roster with K called-in cells fills at most K more, and
/// K <= hard total / c. Independently, at most P people work a day. See coverSoftBound().
#include "analysis/capacity.hpp"

#include <algorithm>
#include <functional>
#include <limits>
#include <string>

namespace rotaweave::analysis {
namespace {

using model::Problem;

/// Maximum b-matching of people to slot groups: options[p] lists the groups p may fill,
/// capacity[g] how many people group g takes. Augmenting paths; sizes here are small
/// (people of one day against that day's slots).
class SlotMatching {
 public:
  SlotMatching(const std::vector<std::vector<int>>& options, const std::vector<int>& capacity)
      : options_(options), capacity_(capacity), members_(capacity.size()), seen_(capacity.size()) {}

  int solve() {
    int matched = 0;
    for (size_t p = 0; p < options_.size(); ++p) {
      if (options_[p].empty()) continue;
      std::fill(seen_.begin(), seen_.end(), 0);
      matched += place(static_cast<int>(p));
    }
    return matched;
  }

 private:
  bool place(int person) {
    for (int g : options_[static_cast<size_t>(person)]) {
      auto& seen = seen_[static_cast<size_t>(g)];
      if (seen) continue;
      seen = 1;
      auto& members = members_[static_cast<size_t>(g)];
      if (static_cast<int>(members.size()) < capacity_[static_cast<size_t>(g)]) {
        members.push_back(person);
        return true;
      }
      for (int& occupant : members)
        if (place(occupant)) {  // the occupant moved to another group; take the seat
          occupant = person;
          return true;
        }
    }
    return false;
  }

  const std::vector<std::vector<int>>& options_;
  const std::vector<int>& capacity_;
  std::vector<std::vector<int>> members_;
  std::vector<char> seen_;
};

int longestPaidMinutes(const Problem& p) {
  int longest = 0;
  for (const auto& s : p.shifts) longest = std::max(longest, s.paidMinutes());
  return longest;
}

int paidOfTask(const Problem& p, TaskIdx t) {
  return p.shifts[static_cast<size_t>(p.tasks[static_cast<size_t>(t)].shift)].paidMinutes();
}

/// Least hard cost of one cell that breaks the absence, fixed or skill rule; 0 if one of them is soft.
Cost breakCost(const Problem& p) {
  Cost least = std::numeric_limits<Cost>::max();
  bool seen = false;
  for (const auto& spec : p.rules) {
    using K = model::RuleKind;
    if (spec.kind != K::Absence && spec.kind != K::Fixed && spec.kind != K::Skill) continue;
    seen = true;
    least = std::min(least, spec.hard ? spec.weight * kAmountScale : Cost{0});
  }
  return seen ? least : 0;
}

bool freeFor(const Problem& p, StaffIdx s, DayIdx d, TaskIdx t) {
  const size_t c = p.cell(s, d);
  if (p.absent[c]) return false;
  const TaskIdx f = p.fixed[c];
  if (f >= 0 && f != t) return false;
  return p.staff[static_cast<size_t>(s)].holds(p.tasks[static_cast<size_t>(t)].skill);
}

/// Why person s cannot work task t on day d freely, if they hold the skill; nullopt otherwise.
std::optional<Missing> missingFrom(const Problem& p, StaffIdx s, DayIdx d, TaskIdx t) {
  const size_t c = p.cell(s, d);
  Missing m;
  m.staff = s;
  if (p.absent[c]) {
    m.why = Missing::Why::Absent;
    m.reason = p.absenceReason[c];
    return m;
  }
  const TaskIdx f = p.fixed[c];
  if (f == kOff) {
    m.why = Missing::Why::FixedOff;
    return m;
  }
  if (f > 0 && f != t) {
    m.why = Missing::Why::FixedElsewhere;
    m.fixedTask = f;
    return m;
  }
  return std::nullopt;
}

struct DayFlows {
  int hardNeeded = 0, hardFillable = 0;
  int targetNeeded = 0, targetFillable = 0;
  Cost minUnit = 0, targetUnit = 0;  // least weight (cost per person) among slots that count
};

DayFlows analyseDay(const Problem& p, DayIdx d, CapacityReport& out) {
  DayFlows flows;
  std::vector<TaskIdx> tasks;
  for (TaskIdx t = 1; t < p.taskCount(); ++t)
    if (p.demandAt(d, t).defined) tasks.push_back(t);

  std::vector<int> hardCap(tasks.size()), targetCap(tasks.size());
  std::vector<std::vector<int>> hardOptions(p.staff.size()), targetOptions(p.staff.size());
  flows.minUnit = flows.targetUnit = std::numeric_limits<Cost>::max();
  int slotShort = 0;
  DayShortfall day;
  day.day = d;
  for (size_t i = 0; i < tasks.size(); ++i) {
    const TaskIdx t = tasks[i];
    const model::DemandCell& cell = p.demandAt(d, t);
    hardCap[i] = cell.minHard ? cell.min : 0;
    targetCap[i] = cell.target;
    if (hardCap[i] > 0) {
      flows.hardNeeded += cell.min;
      flows.minUnit = std::min(flows.minUnit, cell.minWeight * kAmountScale);
      day.tasks.push_back(t);
    }
    if (cell.target > 0) {
      flows.targetNeeded += cell.target;
      flows.targetUnit = std::min(flows.targetUnit, cell.targetWeight * kAmountScale);
    }
    int available = 0;
    std::vector<Missing> missing;
    for (StaffIdx s = 0; s < p.staffCount(); ++s) {
      if (!p.staff[static_cast<size_t>(s)].holds(p.tasks[static_cast<size_t>(t)].skill)) continue;
      if (freeFor(p, s, d, t)) {
        ++available;
        if (hardCap[i] > 0) hardOptions[static_cast<size_t>(s)].push_back(static_cast<int>(i));
        if (targetCap[i] > 0) targetOptions[static_cast<size_t>(s)].push_back(static_cast<int>(i));
      } else if (auto m = missingFrom(p, s, d, t)) {
        missing.push_back(std::move(*m));
      }
    }
    CellShortfall shortfall{d, t, false, cell.minHard, cell.min, available, missing};
    if (cell.min > available) {
      if (cell.minHard) slotShort += cell.min - available;
      out.cells.push_back(shortfall);
    }
    if (cell.target > available && cell.target > cell.min) {
      shortfall.target = true;
      shortfall.hard = false;
      shortfall.needed = cell.target;
      out.cells.push_back(std::move(shortfall));
    }
  }
  flows.hardFillable = SlotMatching(hardOptions, hardCap).solve();
  flows.targetFillable = SlotMatching(targetOptions, targetCap).solve();

  if (flows.hardNeeded - flows.hardFillable > slotShort) {
    day.needed = flows.hardNeeded;
    day.fillable = flows.hardFillable;
    day.slotShort = slotShort;
    // People holding one of the day's skills who cannot work any of its minimum slots.
    for (StaffIdx s = 0; s < p.staffCount(); ++s) {
      const auto& person = p.staff[static_cast<size_t>(s)];
      bool relevant = false, free = false;
      for (TaskIdx t : day.tasks) {
        if (!person.holds(p.tasks[static_cast<size_t>(t)].skill)) continue;
        relevant = true;
        free = free || freeFor(p, s, d, t);
      }
      if (!relevant || free) continue;
      if (auto m = missingFrom(p, s, d, day.tasks.front())) day.missing.push_back(std::move(*m));
    }
    out.days.push_back(std::move(day));
  }
  return flows;
}

}  // namespace

bool CapacityReport::anyUnavoidable() const {
  for (const auto& c : cells)
    if (!c.target) return true;
  return !days.empty() || !people.empty() || totals.demandAboveAvailable || totals.demandAboveContractMax;
}

Cost CapacityReport::coverSoftBound(Cost hardTotal) const {
  // Per day: cost = unit * max(floorUnits, gap - k), k called-in cells spent on that day.
  // The cheapest spread of K = hardTotal / breakUnitCost called-in cells takes the dearest days first.
  struct Day { Cost unit; int removable; int kept; };
  std::vector<Day> ds;
  for (size_t d = 0; d < targetGap.size(); ++d) {
    if (targetGap[d] <= 0) continue;
    const Cost unit = targetUnitCost[d];
    const int floorUnits = unit > 0 ? static_cast<int>(floorCost[d] / unit) : 0;
    ds.push_back({unit, targetGap[d] - floorUnits, floorUnits});
  }
  Cost bound = 0;
  if (breakUnitCost <= 0) {
    for (const auto& d : ds) bound += d.unit * d.kept;
    return bound;
  }
  long long k = hardTotal / breakUnitCost;
  std::sort(ds.begin(), ds.end(), [](const Day& a, const Day& b) { return a.unit > b.unit; });
  for (const auto& d : ds) {
    const long long spent = std::min<long long>(k, d.removable);
    k -= spent;
    bound += d.unit * (d.kept + (d.removable - spent));
  }
  return bound;
}

CapacityReport analyseCapacity(const Problem& p) {
  CapacityReport r;
  r.breakUnitCost = breakCost(p);
  r.hardGap.assign(static_cast<size_t>(p.days), 0);
  r.targetGap.assign(static_cast<size_t>(p.days), 0);
  r.targetUnitCost.assign(static_cast<size_t>(p.days), 0);
  r.floorCost.assign(static_cast<size_t>(p.days), 0);
  const int people = p.staffCount();
  const Cost c = r.breakUnitCost;

  for (DayIdx d = 0; d < p.days; ++d) {
    const DayFlows f = analyseDay(p, d, r);
    const auto di = static_cast<size_t>(d);
    const int gap = f.hardNeeded - f.hardFillable;
    r.hardGap[di] = gap;
    if (gap > 0) {
      const int beyondStaff = std::max(0, f.hardNeeded - people);
      r.bounds.coverUnits += gap;
      r.bounds.coverHard += beyondStaff * f.minUnit + (gap - beyondStaff) * std::min(f.minUnit, c);
    }
    const int tgap = f.targetNeeded - f.targetFillable;
    if (tgap > 0) {
      r.targetGap[di] = tgap;
      r.targetUnitCost[di] = f.targetUnit;
      r.floorCost[di] = std::max(0, f.targetNeeded - people) * f.targetUnit;
    }
    for (TaskIdx t = 1; t < p.taskCount(); ++t) {
      const model::DemandCell& cell = p.demandAt(d, t);
      if (!cell.defined) continue;
      r.totals.demandMin += static_cast<long long>(cell.min) * paidOfTask(p, t);
      r.totals.demandTarget += static_cast<long long>(cell.target) * paidOfTask(p, t);
    }
  }

  const int longest = longestPaidMinutes(p);
  bool everyMax = true;
  long long maxSum = 0;
  for (StaffIdx s = 0; s < people; ++s) {
    const auto& person = p.staff[static_cast<size_t>(s)];
    PersonShortfall ps;
    ps.staff = s;
    ps.contract = person.contract;
    ps.longestMinutes = longest;
    // For the bound: minutes that cost nothing extra, and what each called-in day could add.
    int boundBase = 0;
    std::vector<int> gains;
    for (DayIdx d = 0; d < p.days; ++d) {
      const size_t cell = p.cell(s, d);
      const TaskIdx f = p.fixed[cell];
      const bool absent = p.absent[cell] != 0;
      if (absent) ps.absentDays.push_back(d);
      else if (f == kOff) ps.fixedOffDays.push_back(d);
      const int freeMinutes = absent || f == kOff ? 0 : f > 0 ? paidOfTask(p, f) : longest;
      if (!absent && f != kOff) ++ps.availableDays;
      ps.possibleMinutes += freeMinutes;
      const bool chargedToCover = r.hardGap[static_cast<size_t>(d)] > 0;
      const bool offBreaksToo = absent && f > 0;
      if (chargedToCover || offBreaksToo) {
        boundBase += longest;
      } else {
        boundBase += freeMinutes;
        if (longest > freeMinutes) gains.push_back(longest - freeMinutes);
      }
    }
    r.totals.available += ps.possibleMinutes;
    const model::Contract* contract = person.contract >= 0 ? &p.contracts[static_cast<size_t>(person.contract)] : nullptr;
    // Contract hours count what absences credit, so the minutes to be worked are the
    // contract's bounds less the credit.
    const int credit = p.credit(s);
    ps.creditMinutes = credit;
    if (contract && contract->maxMinutes) maxSum += std::max(0, *contract->maxMinutes - credit);
    else everyMax = false;
    if (!contract || !contract->minMinutes) continue;
    const int needed = std::max(0, *contract->minMinutes - credit);
    r.totals.contractMin += needed;
    ps.hard = contract->hard;
    ps.neededMinutes = needed;
    if (needed == 0) continue;
    if (ps.possibleMinutes < ps.neededMinutes) r.people.push_back(ps);

    const int shortMinutes = ps.neededMinutes - boundBase;
    if (!contract->hard || shortMinutes <= 0) continue;
    std::sort(gains.begin(), gains.end(), std::greater<>());
    Cost best = std::numeric_limits<Cost>::max();
    long long gained = 0;
    for (size_t k = 0; k <= gains.size(); ++k) {
      if (k > 0) gained += gains[k - 1];
      const Cost cost = std::max<long long>(0, shortMinutes - gained) * contract->weight + static_cast<Cost>(k) * c;
      best = std::min(best, cost);
      if (gained >= shortMinutes) break;
    }
    r.bounds.contractHard += best;
  }
  r.totals.contractMax = everyMax ? maxSum : -1;
  r.totals.demandAboveContractMax = everyMax && r.totals.demandMin > maxSum;
  r.totals.demandAboveAvailable = r.totals.demandMin > r.totals.available;
  r.bounds.hard = r.bounds.coverHard + r.bounds.contractHard;
  r.bounds.coverSoftIfNoHard = r.coverSoftBound(0);
  return r;
}

}  // namespace rotaweave::analysis
