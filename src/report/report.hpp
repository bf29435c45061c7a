/// @brief The report value: every breach of a roster with summaries, built once and
/// rendered by every output format (text, JSON, workbook), so they always agree.
#pragma once
#include <cstdint>
#include <optional>
#include <string>
#include <vector>

#include "analysis/capacity.hpp"
#include "model/problem.hpp"
#include "model/roster.hpp"
#include "report/baseline.hpp"
#include "report/changes.hpp"
#include "rules/breach.hpp"

namespace rotaweave::report {

/// How the roster was made; shown in the report and the workbook.
struct RunInfo {
  std::string command = "check";   ///< check, solve or replan
  std::uint64_t seed = 0;
  int islands = 0;
  int threads = 0;
  long generations = 0;
  double seconds = 0;
  std::string stopReason;          ///< e.g. "time limit", "generation limit", "interrupted"
  std::vector<std::pair<double, rules::Tally>> progress;  ///< (seconds, best) over the run
  /// Soft penalty no roster without a hard breach can score below, where the search proved one.
  std::optional<Cost> lowerBound;
};

struct RuleSummary {
  std::string ruleId, kind;
  bool hard = true;
  int count = 0;
  Cost amount = 0, penalty = 0;
};

struct PersonSummary {
  StaffIdx staff = 0;
  int hardCount = 0, softCount = 0;
  Cost hard = 0, soft = 0;
  int paidMinutes = 0;              ///< worked: paid minutes of the shifts rostered
  int creditMinutes = 0;            ///< credited by absences toward hours rules of the period
  int absentDays = 0;
  int shiftsWorked = 0;
  std::vector<int> shiftsByType;  ///< per shift type
  int weekendsWorked = 0;
};

struct Report {
  rules::Tally total;
  int hardCount = 0;                   ///< Number of hard breach records.
  std::vector<rules::Breach> breaches; ///< Hard first, then by rule, person and first date.
  std::vector<RuleSummary> byRule;
  std::vector<PersonSummary> byPerson; ///< One per person, in staff order.
  RunInfo run;
  std::optional<analysis::CapacityReport> capacity;  ///< What the staff can cover at best, set against this roster.
  std::optional<ChangeSummary> changes;  ///< replan only: cells changed against the published roster.
  std::optional<BaselineDiff> baseline;  ///< check --baseline only: against the roster it came from.
  std::vector<std::string> notes;        ///< What loading changed or assumed (Problem::notes).
};

Report buildReport(const model::Problem& problem, const model::Roster& roster, std::vector<rules::Breach> breaches,
                   RunInfo run);

/// The caution every report ends with.
const char* cautionText();

/// How far the roster's soft penalty lies above a proven lower bound, in percent; unset without
/// a bound, or where the bound is 0 and the roster is not.
std::optional<double> gapPercent(const Report& report);
/// A lower bound in points, cut (never rounded up) to hundredths: "818.34".
std::string boundPointsText(Cost bound);
/// The sentence report.txt gives the bound, or "" without one.
std::string lowerBoundText(const Report& report);

/// Penalty points as text: "12", "3.5", "0.25".
std::string pointsText(Cost cost);
/// An amount as text, in its rule's unit: "2", "1.5".
std::string amountText(Cost amount);
/// The unit a kind's amount is counted in ("h", "days", "people", ...), or "" for a count of breaches.
const char* amountUnit(const std::string& kind);
/// The unit of a breach's `shortfall`: its own where the rule set one, else the kind's amount
/// unit, else "breaches" (kinds counted one per breach).
const char* shortfallUnit(const rules::Breach& b);
/// amountText with its unit: "2.5 h", "1 people" reads badly, so counts of one use the singular.
std::string amountWithUnit(const std::string& kind, Cost amount);

}  // namespace rotaweave::report
