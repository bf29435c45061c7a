/// @brief The kind registry and RuleSet construction.
#include "rules/rule_set.hpp"

#include <map>

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
}

}  // namespace rotaweave::rules
