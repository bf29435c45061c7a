/// @brief The rule catalogue table: declared once, used by the loader, the CLI help and docs.
#include "model/rule_spec.hpp"

#include <stdexcept>

namespace rotaweave::model {

const std::vector<KindInfo>& ruleCatalogue() {
  using P = ParamType;
  using R = RowOptimiser;
  constexpr double kBig = 1e6;
  static const std::vector<KindInfo> kCatalogue{
      {RuleKind::Cover, "cover", false, true, {}, "people per shift, skill and date (from demand)", "people", R::Priced},
      {RuleKind::Skill, "skill", false, true, {}, "a person works only roles they hold", "", R::CellCost},
      {RuleKind::Absence, "absence", false, true, {}, "no work on absence days", "", R::CellCost},
      {RuleKind::Fixed, "fixed", false, true, {}, "pre-assigned cells are kept", "", R::CellCost},
      {RuleKind::Request, "request", false, false, {}, "day-off and shift requests", "", R::CellCost},
      {RuleKind::MinRest, "min-rest", true, true,
       {{"hours", P::Hours, true, 0, 48, "minimum hours between the end of one shift and the start of the next"}},
       "rest between consecutive shifts", "", R::Partly},
      {RuleKind::ForbidSequence, "forbid-sequence", true, true,
       {{"sequence", P::ShiftSequence, true, 2, 14, "shift ids or `off` on consecutive days"}},
       "a pattern of shifts on consecutive days", "", R::Partly},
      {RuleKind::MinConsecutiveDays, "min-consecutive-days", true, true,
       {{"days", P::Count, true, 1, 366, "shortest allowed run of worked days"}},
       "runs of worked days at least this long", "days", R::Exact},
      {RuleKind::MaxConsecutiveDays, "max-consecutive-days", true, true,
       {{"days", P::Count, true, 1, 366, "longest allowed run of worked days"}},
       "runs of worked days at most this long", "days", R::Exact},
      {RuleKind::MinConsecutive, "min-consecutive", true, true,
       {{"shift", P::Shift, true, 0, 0, "the shift"},
        {"count", P::Count, true, 1, 366, "shortest allowed run of this shift"}},
       "runs of one shift at least this long", "days", R::Evaluated},
      {RuleKind::MaxConsecutive, "max-consecutive", true, true,
       {{"shift", P::Shift, true, 0, 0, "the shift"},
        {"count", P::Count, true, 1, 366, "longest allowed run of this shift"}},
       "runs of one shift at most this long", "days", R::Evaluated},
      {RuleKind::MinConsecutiveOff, "min-consecutive-off", true, true,
       {{"days", P::Count, true, 1, 366, "shortest allowed run of days off"}},
       "runs of days off at least this long", "days", R::Exact},
      {RuleKind::DaysOffAfter, "days-off-after", true, true,
       {{"shift", P::Shift, true, 0, 0, "the shift whose series needs recovery"},
        {"days", P::Count, true, 1, 14, "days off required after the series"}},
       "days off after a series of one shift", "days", R::Evaluated},
      {RuleKind::MinHours, "min-hours", true, true,
       {{"hours", P::Hours, true, 0, kBig, "least paid hours"},
        {"window_days", P::Count, false, 1, 366, "rolling window length; omitted: the whole period"},
        {"credit_absences", P::Bool, false, 0, 0, "count the hours absences credit (period totals only; default true)"}},
       "paid hours at least this many", "h", R::Partly},
      {RuleKind::MaxHours, "max-hours", true, true,
       {{"hours", P::Hours, true, 0, kBig, "most paid hours"},
        {"window_days", P::Count, false, 1, 366, "rolling window length; omitted: the whole period"},
        {"credit_absences", P::Bool, false, 0, 0, "count the hours absences credit (period totals only; default true)"}},
       "paid hours at most this many", "h", R::Partly},
      {RuleKind::MinCount, "min-count", true, true,
       {{"shift", P::OptionalShift, false, 0, 0, "the shift; omitted: any shift"},
        {"count", P::Count, true, 0, 366, "least number of such shifts in the period"}},
       "at least this many shifts in the period", "shifts", R::Evaluated},
      {RuleKind::MaxCount, "max-count", true, true,
       {{"shift", P::OptionalShift, false, 0, 0, "the shift; omitted: any shift"},
        {"count", P::Count, true, 0, 366, "most such shifts in the period"}},
       "at most this many shifts in the period", "shifts", R::Partly},
      {RuleKind::MaxWeekends, "max-weekends", true, true,
       {{"count", P::Count, true, 0, 60, "most weekends with any work"}},
       "weekends worked at most this many", "weekends", R::Exact},
      {RuleKind::CompleteWeekends, "complete-weekends", true, true, {},
       "a weekend is worked on all its days or on none", "", R::Evaluated},
      {RuleKind::WeeklyRest, "weekly-rest", true, true,
       {{"hours", P::Hours, true, 0, 168, "continuous free hours needed in each block"},
        {"days", P::Count, false, 1, 28, "block length in days (default 7)"}},
       "a long continuous rest in every block of days", "h", R::Evaluated},
      {RuleKind::FairShare, "fair-share", true, false,
       {{"shift", P::OptionalShift, false, 0, 0, "the shift to share out"},
        {"weekends", P::Bool, false, 0, 0, "share out worked weekends instead of a shift"}},
       "even spread of a shift or of weekends across a group", "", R::Evaluated},
      {RuleKind::Changes, "changes", true, false,
       {{"early_days", P::Count, false, 0, 366, "days from the re-plan date with the early weight"},
        {"early_weight", P::Weight, false, 0, kBig, "weight of a change within early_days"},
        {"near_days", P::Count, false, 0, 366, "days from an absence that count as near it (default 2)"},
        {"far_weight", P::Weight, false, 0, kBig, "weight of a change farther than near_days from every absence"}},
       "cells changed against the published roster (re-planning)", "", R::CellCost},
  };
  return kCatalogue;
}

const KindInfo& kindInfo(RuleKind kind) {
  for (const auto& info : ruleCatalogue())
    if (info.kind == kind) return info;
  throw std::logic_error("rule kind missing from the catalogue");
}

std::string docsPage(const KindInfo& info) { return std::string("docs/rules/") + info.name + ".md"; }

std::optional<RuleKind> kindFromName(std::string_view name) {
  for (const auto& info : ruleCatalogue())
    if (name == info.name) return info.kind;
  return std::nullopt;
}

}  // namespace rotaweave::model
