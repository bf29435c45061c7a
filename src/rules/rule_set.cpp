/// @brief The kind registry and RuleSet construction.
#include "rules/rule_set.hpp"

#include <algorithm>
#include <cassert>
#include <map>

#include "rules/forbid_pairs.hpp"
#include "rules/row_buffer.hpp"
#include "rules/row_rules.hpp"

namespace rotaweave::rules {
namespace {

template <class T>
std::unique_ptr<RowRule> create(const model::RuleSpec& spec) {
  return std::make_unique<T>(spec);
}

}  // namespace

std::unique_ptr<RowRule> makeRowRule(const model::RuleSpec& spec) {
  using K = model::RuleKind;
  using Factory = std::unique_ptr<RowRule> (*)(const model::RuleSpec&);
  static const std::map<K, Factory> kRegistry{
      {K::Skill, &create<SkillRule>},
      {K::Absence, &create<AbsenceRule>},
      {K::Fixed, &create<FixedRule>},
      {K::Request, &create<RequestRule>},
      {K::Changes, &create<ChangesRule>},
      {K::MinRest, &create<MinRestRule>},
      {K::ForbidSequence, &create<ForbidSequenceRule>},
      {K::MinConsecutiveDays, &create<MinConsecutiveDaysRule>},
      {K::MaxConsecutiveDays, &create<MaxConsecutiveDaysRule>},
      {K::MinConsecutive, &create<MinConsecutiveRule>},
      {K::MaxConsecutive, &create<MaxConsecutiveRule>},
      {K::MinConsecutiveOff, &create<MinConsecutiveOffRule>},
      {K::DaysOffAfter, &create<DaysOffAfterRule>},
      {K::MinHours, &create<MinHoursRule>},
      {K::MaxHours, &create<MaxHoursRule>},
      {K::MinCount, &create<MinCountRule>},
      {K::MaxCount, &create<MaxCountRule>},
      {K::MaxWeekends, &create<MaxWeekendsRule>},
      {K::CompleteWeekends, &create<CompleteWeekendsRule>},
      {K::WeeklyRest, &create<WeeklyRestRule>},
  };
  auto it = kRegistry.find(spec.kind);
  return it == kRegistry.end() ? nullptr : it->second(spec);
}

RuleSet::RuleSet(const model::Problem& problem)
    : problem_(&problem), perStaff_(problem.staff.size()), sequence_(problem.staff.size()), cell_(problem.staff.size()),
      cover_(problem) {
  for (const auto& spec : problem.rules) {
    if (spec.kind == model::RuleKind::FairShare) {
      fairShares_.emplace_back(problem, spec);
      continue;
    }
    auto rule = makeRowRule(spec);
    if (!rule) continue;  // cover is judged from counts, not rows
    for (StaffIdx s = 0; s < problem.staffCount(); ++s)
      if (rule->appliesTo(s)) {
        perStaff_[static_cast<size_t>(s)].push_back(rule.get());
        (rule->cellLocal() ? cell_ : sequence_)[static_cast<size_t>(s)].push_back(rule.get());
      }
    rowRules_.push_back(std::move(rule));
  }
  groupForbiddenPairs();
  for (const auto& rules : sequence_) maxSequenceRules_ = std::max(maxSequenceRules_, rules.size());
  observers_.resize(problem.staff.size());
  for (size_t s = 0; s < problem.staff.size(); ++s) {
    RuleObservers& o = observers_[s];
    o.byShift.resize(problem.shifts.size());
    for (std::uint32_t k = 0; k < sequence_[s].size(); ++k) {
      const Observes what = sequence_[s][k]->observes();
      if (what.worked) o.worked.push_back(k);
      if (what.paid) o.paid.push_back(k);
      if (what.times) o.times.push_back(k);
      for (const ShiftIdx sh : what.shifts)
        if (sh != kNoShift && (o.byShift[static_cast<size_t>(sh)].empty() || o.byShift[static_cast<size_t>(sh)].back() != k))
          o.byShift[static_cast<size_t>(sh)].push_back(k);
    }
    o.masked = sequence_[s].size() <= 64;
    if (!o.masked) continue;
    auto mask = [](const std::vector<std::uint32_t>& rules) {
      std::uint64_t m = 0;
      for (const std::uint32_t k : rules) m |= std::uint64_t{1} << k;
      return m;
    };
    o.workedMask = mask(o.worked), o.paidMask = mask(o.paid), o.timesMask = mask(o.times);
    for (const auto& rules : o.byShift) o.shiftMask.push_back(mask(rules));
  }
  tabulateCellRules();
}

void RuleSet::groupForbiddenPairs() {
  std::map<std::vector<const RowRule*>, const RowRule*> groups;  // people with the same pairs share one
  for (auto& rules : sequence_) {
    std::vector<const RowRule*> members;
    for (const RowRule* rule : rules)
      if (ForbidPairsRule::joins(*rule)) members.push_back(rule);
    if (members.size() < 2) continue;
    const RowRule*& group = groups[members];
    if (!group) {
      rowRules_.push_back(std::make_unique<ForbidPairsRule>(*problem_, members));
      group = rowRules_.back().get();
    }
    // The group takes the place of its first member.
    const auto first = std::find(rules.begin(), rules.end(), members.front());
    *first = group;
    rules.erase(std::remove_if(first + 1, rules.end(), [](const RowRule* rule) { return ForbidPairsRule::joins(*rule); }), rules.end());
  }
}

void RuleSet::tabulateCellRules() {
  // Cell-local rules charge each cell on its own, so scoring a row that holds task t on every
  // day and reading each breach's day gives the penalty of every (day, t) cell at once.
  const auto& p = *problem_;
  const size_t days = static_cast<size_t>(p.days), tasks = p.tasks.size();
  cellCost_.assign(p.staff.size() * days * tasks, Tally{});
  RowBuffer buffer(p);
  std::vector<TaskIdx> uniform(days);
  std::vector<Breach> found;
  for (StaffIdx s = 0; s < p.staffCount(); ++s) {
    if (cell_[static_cast<size_t>(s)].empty()) continue;
    for (TaskIdx t = 0; t < static_cast<TaskIdx>(tasks); ++t) {
      std::fill(uniform.begin(), uniform.end(), t);
      const RowView row = buffer.fill(s, uniform.data());
      found.clear();
      Tally ignored;
      for (const RowRule* rule : cell_[static_cast<size_t>(s)]) rule->scoreRow(row, ignored, &found);
      for (const auto& b : found) {
        assert(b.days.size() == 1);
        Tally& cell = cellCost_[(static_cast<size_t>(s) * days + static_cast<size_t>(b.days.front())) * tasks + static_cast<size_t>(t)];
        (b.hard ? cell.hard : cell.soft) += b.penalty;
      }
    }
  }
}

}  // namespace rotaweave::rules
