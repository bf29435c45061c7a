/// @brief Changes of a re-planned roster against the published one: which cells differ from
/// the re-plan date on, and in plain words why.
#pragma once
#include <string>
#include <vector>

#include "model/problem.hpp"
#include "model/roster.hpp"

namespace rotaweave::report {

/// One cell that differs from the published roster.
struct CellChange {
  StaffIdx staff = 0;
  DayIdx day = 0;
  TaskIdx was = kOff;  ///< the published task
  TaskIdx now = kOff;  ///< the task in the new roster
  std::string reason;  ///< "absent (sick)", "covers ana's absence", "rebalanced", ...
};

/// Every change of a re-plan, in staff order then date order.
struct ChangeSummary {
  DayIdx from = 0;                ///< first re-planned day
  std::vector<CellChange> cells;
  int people = 0;                 ///< people with at least one changed cell
  int cellCount() const { return static_cast<int>(cells.size()); }
};

/// True if the cell is re-planned (on or after the re-plan date) and differs from the
/// published roster. False when the problem has no published roster.
bool isChanged(const model::Problem& problem, const model::Roster& roster, StaffIdx staff, DayIdx day);

/// The changes of `roster` against `problem.published` with their reasons.
/// Requires problem.published.
ChangeSummary computeChanges(const model::Problem& problem, const model::Roster& roster);

/// "12 cells changed for 5 people from 2027-03-15" (one line, no newline).
std::string changesLine(const ChangeSummary& changes, const model::Problem& problem);

/// The CHANGES section of report.txt (ends with a newline).
std::string renderChangesText(const ChangeSummary& changes, const model::Problem& problem);

}  // namespace rotaweave::report
