/// @brief Changes of a re-planned roster against the published one: which cells differ from
/// the re-plan date on, and in plain words why.
#pragma once
#include <string>
#include <vector>

#include "model/problem.hpp"
#include "model/roster.hpp"
#include "rules/rule_set.hpp"

namespace rotaweave::report {

/// One cell that differs from the published roster.
struct CellChange {
  StaffIdx staff = 0;
  DayIdx day = 0;
  TaskIdx was = kOff;  ///< the published task
  TaskIdx now = kOff;  ///< the task in the new roster
  std::string reason;  ///< "absent (sick)", "covers ana's absence (L rn)", "rebalanced to meet rule 'daily-rest'", ...
  /// Whose slot this cell took: the person published to work `now` that day who no longer
  /// does (-1 when nobody left that slot).
  StaffIdx tookFrom = -1;
};

/// Every change of a re-plan, in staff order then date order.
struct ChangeSummary {
  DayIdx from = 0;  ///< first re-planned day
  std::vector<CellChange> cells;
  int people = 0;  ///< people with at least one changed cell
  int cellCount() const { return static_cast<int>(cells.size()); }
};

/// True if the cell is re-planned (on or after the re-plan date) and differs from the
/// published roster. False when the problem has no published roster.
bool isChanged(const model::Problem& problem, const model::Roster& roster, StaffIdx staff, DayIdx day);

/// The changes of `roster` against `problem.published` with their reasons, traced cell by
/// cell: a changed cell that now works task t on day d took the slot of someone published to
/// work t that day who no longer does (absent: "covers X's absence (L rn)"; moved: "takes X's
/// L rn; X moved to ..." along the chain; now off: "takes X's L rn; X is off now"). A cell
/// that took nobody's slot, or was left for no absence, is "rebalanced to meet rule 'R'",
/// where R is the rule whose penalty rises most if that one cell is put back as published,
/// or "rebalanced with the other changes" when no rule needs that cell alone.
/// Requires ruleSet.problem().published. Explains at most kMaxRevertChecks reverted rosters,
/// fewer on large ones (4,000,000 / cells, at least 20): a count, not a time, so the reasons do
/// not depend on machine speed.
ChangeSummary computeChanges(const rules::RuleSet& ruleSet, const model::Roster& roster);

/// Beyond this many checks, the remaining changes without a traced slot are "rebalanced with
/// the other changes" (each rule named costs one full explanation of the roster).
inline constexpr int kMaxRevertChecks = 400;

/// "12 cells changed for 5 people from 2027-03-15" (one line, no newline).
std::string changesLine(const ChangeSummary& changes, const model::Problem& problem);

/// The CHANGES section of report.txt (ends with a newline).
std::string renderChangesText(const ChangeSummary& changes, const model::Problem& problem);

}  // namespace rotaweave::report
