/// @brief An edited roster against the roster it came from (check --baseline): which cells
/// changed, which breaches are new, which are gone and which changed by how much. A pure
/// function of the two rosters and their breaches; report.txt, report.json and the workbook's
/// Baseline sheet render the result.
#pragma once
#include <string>
#include <vector>

#include "model/problem.hpp"
#include "model/roster.hpp"
#include "rules/breach.hpp"

namespace rotaweave::report {

/// One cell whose task differs between the baseline and the checked roster.
struct BaselineCell {
  StaffIdx staff = 0;
  DayIdx day = 0;
  TaskIdx before = kOff;  ///< in the baseline
  TaskIdx after = kOff;   ///< in the checked roster
};

/// A breach found in both rosters (same rule, severity, person, dates and cover cell) whose
/// amount or penalty differs.
struct ChangedBreach {
  rules::Breach before, after;
};

struct BaselineDiff {
  std::string source;                  ///< the baseline file, as given
  std::vector<BaselineCell> cells;     ///< staff order, then date order
  int people = 0;                      ///< people with at least one changed cell
  std::vector<rules::Breach> added;    ///< in the checked roster only ("new")
  std::vector<rules::Breach> gone;     ///< in the baseline only
  std::vector<ChangedBreach> changed;  ///< in both, by a different amount
  rules::Tally before, after;          ///< penalty totals of the baseline and the checked roster
  int addedHard() const;
  int goneHard() const;
};

/// Compares `roster` (with its `breaches`) against `baseline` (with `baselineBreaches`). Breaches
/// are matched by rule id, severity, person, dates, cover cell and part; a match with equal
/// amount and penalty is unchanged and left out. Lists keep the order of the inputs.
BaselineDiff compareWithBaseline(const model::Problem& problem, const model::Roster& baseline,
                                 const std::vector<rules::Breach>& baselineBreaches, const model::Roster& roster,
                                 const std::vector<rules::Breach>& breaches, std::string source);

/// "3 cells changed for 2 people; 1 new breach (1 hard), 2 gone" (one line, no newline).
std::string baselineLine(const BaselineDiff& diff);

/// The BASELINE section of report.txt (ends with a newline).
std::string renderBaselineText(const BaselineDiff& diff, const model::Problem& problem);

}  // namespace rotaweave::report
