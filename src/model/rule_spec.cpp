/// @brief The rule catalogue table: declared once, used by the loader, the CLI help and docs.
#include "model/rule_spec.hpp"

#include <stdexcept>

namespace rotaweave::model {

const std::vector<KindInfo>& ruleCatalogue() {
  using P = ParamType;
  constexpr double kBig = 1e6;
  static const std::vector<KindInfo> kCatalogue{
      {RuleKind::Cover, "cover", false, true, {}, "people per shift, skill and date (from demand)"},
      {RuleKind::Skill, "skill", false, true, {}, "a person works only roles they hold"},
      {RuleKind::Absence, "absence", false, true, {}, "no work on absence days"},
      {RuleKind::Fixed, "fixed", false, true, {}, "pre-assigned cells are kept"},
      {RuleKind::Request, "request", false, false, {}, "day-off and shift requests"},
      {RuleKind::MinRest, "min-rest", true, true,
       {{"hours", P::Hours, true, 0, 48, "minimum hours between the end of one shift and the start of the next"}},
       "rest between consecutive shifts"},
      {RuleKind::ForbidSequence, "forbid-sequence", true, true,
       {{"sequence", P::ShiftSequence, true, 2, 14, "shift ids or `off` on consecutive days"}},
       "a pattern of shifts on consecutive days"},
      {RuleKind::MinConsecutiveDays, "min-consecutive-days", true, true,
       {{"days", P::Count, true, 1, 366, "shortest allowed run of worked days"}},
       "runs of worked days at least this long"},
      {RuleKind::MaxConsecutiveDays, "max-consecutive-days", true, true,
       {{"days", P::Count, true, 1, 366, "longest allowed run of worked days"}},
       "runs of worked days at most this long"},
      {RuleKind::MinConsecutive, "min-consecutive", true, true,
       {{"shift", P::Shift, true, 0, 0, "the shift"},
        {"count", P::Count, true, 1, 366, "shortest allowed run of this shift"}},
       "runs of one shift at least this long"},
      {RuleKind::MaxConsecutive, "max-consecutive", true, true,
       {{"shift", P::Shift, true, 0, 0, "the shift"},
        {"count", P::Count, true, 1, 366, "longest allowed run of this shift"}},
       "runs of one shift at most this long"},
      {RuleKind::MinConsecutiveOff, "min-consecutive-off", true, true,
       {{"days", P::Count, true, 1, 366, "shortest allowed run of days off"}},
       "runs of days off at least this long"},
      {RuleKind::DaysOffAfter, "days-off-after", true, true,
       {{"shift", P::Shift, true, 0, 0, "the shift whose series needs recovery"},
        {"days", P::Count, true, 1, 14, "days off required after the series"}},
       "days off after a series of one shift"},
      {RuleKind::MinHours, "min-hours", true, true,
       {{"hours", P::Hours, true, 0, kBig, "least paid hours"},
        {"window_days", P::Count, false, 1, 366, "rolling window length; omitted: the whole period"}},
       "paid hours at least this many"},
      {RuleKind::MaxHours, "max-hours", true, true,
       {{"hours", P::Hours, true, 0, kBig, "most paid hours"},
        {"window_days", P::Count, false, 1, 366, "rolling window length; omitted: the whole period"}},
       "paid hours at most this many"},
      {RuleKind::MinCount, "min-count", true, true,
       {{"shift", P::OptionalShift, false, 0, 0, "the shift; omitted: any shift"},
        {"count", P::Count, true, 0, 366, "least number of such shifts in the period"}},
       "at least this many shifts in the period"},
      {RuleKind::MaxCount, "max-count", true, true,
       {{"shift", P::OptionalShift, false, 0, 0, "the shift; omitted: any shift"},
        {"count", P::Count, true, 0, 366, "most such shifts in the period"}},
       "at most this many shifts in the period"},
      {RuleKind::MaxWeekends, "max-weekends", true, true,
       {{"count", P::Count, true, 0, 60, "most weekends with any work"}},
       "weekends worked at most this many"},
      {RuleKind::CompleteWeekends, "complete-weekends", true, true, {},
       "a weekend is worked on all its days or on none"},
      {RuleKind::WeeklyRest, "weekly-rest", true, true,
       {{"hours", P::Hours, true, 0, 168, "continuous free hours needed in each block"},
        {"days", P::Count, false, 1, 28, "block length in days (default 7)"}},
       "a long continuous rest in every block of days"},
      {RuleKind::FairShare, "fair-share", true, false,
       {{"shift", P::OptionalShift, false, 0, 0, "the shift to share out"},
        {"weekends", P::Bool, false, 0, 0, "share out worked weekends instead of a shift"}},
       "even spread of a shift or of weekends across a group"},
      {RuleKind::Changes, "changes", true, false,
       {{"early_days", P::Count, false, 0, 366, "days from the re-plan date with the early weight"},
        {"early_weight", P::Weight, false, 0, kBig, "weight of a change within early_days"}},
       "cells changed against the published roster (re-planning)"},
  };
  return kCatalogue;
}

const KindInfo& kindInfo(RuleKind kind) {
  for (const auto& info : ruleCatalogue())
    if (info.kind == kind) return info;
  throw std::logic_error("rule kind missing from the catalogue");
}

std::optional<RuleKind> kindFromName(std::string_view name) {
  for (const auto& info : ruleCatalogue())
    if (name == info.name) return info.kind;
  return std::nullopt;
}

}  // namespace rotaweave::model
