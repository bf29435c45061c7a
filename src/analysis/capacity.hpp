/// @brief Capacity analysis: what the staff on hand can cover at best, before any roster exists.
///
/// For every date, shift and skill with demand, the people who could work it (holding the skill,
/// not absent, not fixed to something else that day) are set against the demand; per day a
/// matching of people to the day's (shift, skill) slots gives the exact number of slots that can
/// be filled at once (each person works at most one shift a day); per person the hours a contract
/// asks are set against the days the person is available. Shortfalls found here are unavoidable:
/// no roster fills them without breaking another hard rule (calling someone in on a leave day,
/// moving a fixed shift, or giving a role to someone without the skill).
///
/// From the same analysis come lower bounds on the hard total and on the cover-target part of the
/// soft total. Both are valid: no roster scores below them (the argument is written out beside
/// each computation in capacity.cpp).
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "model/problem.hpp"
#include "model/roster.hpp"
#include "rules/breach.hpp"

namespace rotaweave::analysis {

/// Why a person holding the skill cannot work a slot on a given day.
struct Missing {
  enum class Why { Absent, FixedOff, FixedElsewhere };
  StaffIdx staff = 0;
  Why why = Why::Absent;
  TaskIdx fixedTask = kOff;  ///< For FixedElsewhere: the task the person is fixed to.
  std::string reason;        ///< Absence reason as given ("leave"), may be empty.
};

/// One (date, shift, skill) whose demand exceeds the people who could work it.
struct CellShortfall {
  DayIdx day = 0;
  TaskIdx task = kOff;
  bool target = false;  ///< false: the minimum is short; true: only the target is.
  bool hard = true;     ///< The short part is a hard breach (a hard minimum).
  int needed = 0;       ///< min (or target)
  int available = 0;    ///< People who could work this slot that day.
  std::vector<Missing> missing;  ///< Holders of the skill who cannot work it, in staff order.
  int shortBy() const { return needed - available; }
};

/// A day whose minimums, taken together, cannot all be met: people are shared between shifts
/// and skills, so the day can be short even when no single slot is.
struct DayShortfall {
  DayIdx day = 0;
  bool hard = true;         ///< Counts hard minimums only (soft minimums are judged with targets).
  int needed = 0;           ///< Sum of the minimums of the day.
  int fillable = 0;         ///< Most minimum slots that can be filled at once (matching).
  int slotShort = 0;        ///< Part of the gap already explained by single-slot shortfalls.
  std::vector<TaskIdx> tasks;    ///< Slots with a minimum that day.
  std::vector<Missing> missing;  ///< People holding one of those skills who cannot work that day.
  int shortBy() const { return needed - fillable; }
};

/// A person whose contract asks more hours than the available days can give.
struct PersonShortfall {
  StaffIdx staff = 0;
  int contract = -1;
  bool hard = false;         ///< The contract's hours are a hard rule.
  int neededMinutes = 0;     ///< Contract minimum less what absences credit (minutes to be worked).
  int creditMinutes = 0;     ///< Credited by absences (Problem::credit).
  int possibleMinutes = 0;   ///< Most paid minutes on the available days.
  int availableDays = 0;
  int longestMinutes = 0;    ///< Longest paid shift the person can work.
  std::vector<DayIdx> absentDays, fixedOffDays;
  int shortMinutes() const { return neededMinutes - possibleMinutes; }
};

/// Period totals (minutes). contractMax is -1 when some person has no upper bound.
struct Totals {
  long long demandMin = 0;     ///< Sum of minimums times the paid length of their shift.
  long long demandTarget = 0;
  long long contractMin = 0;   ///< Sum of contract minimums over the staff, less what absences credit.
  long long contractMax = -1;  ///< Sum of contract maximums, less credit (each at least 0).
  long long available = 0;     ///< Most paid minutes all staff could give on their available days.
  bool demandAboveContractMax = false;  ///< Minimum cover needs more hours than the contracts allow.
  bool demandAboveAvailable = false;
};

/// Lower bounds, in cost units (1/kCostScale points).
struct Bounds {
  Cost hard = 0;          ///< coverHard + contractHard.
  Cost coverHard = 0;     ///< From hard minimums that cannot all be met.
  Cost contractHard = 0;  ///< From hard contract minimums above what the available days allow.
  int coverUnits = 0;     ///< Person-shifts of hard minimum cover that cannot be filled freely.
  /// Cover-target part of the soft total for a roster whose hard total is 0; see coverSoftBound().
  Cost coverSoftIfNoHard = 0;
};

/// A hard breach of a roster, set against the analysis.
struct BreachTag {
  size_t breach = 0;         ///< Index into the breach list given to compareWithRoster().
  bool unavoidable = false;  ///< Implied by the analysis: no roster can avoid it (or its like).
  std::string cause;         ///< Plain words: why it is (un)avoidable.
  std::string remedy;        ///< Plain words: what would remove it.
};

/// The roster's own figures, next to the bounds.
struct RosterComparison {
  Cost hard = 0;
  Cost coverHard = 0;
  int coverHardUnits = 0;    ///< Persons short on hard minimums in this roster.
  Cost coverSoft = 0;        ///< Penalty of the roster's soft cover-target breaches.
  Cost coverSoftBound = 0;   ///< Valid for this roster's hard total (see coverSoftBound()).
  std::vector<BreachTag> tags;  ///< One per hard breach, in breach order.
};

struct CapacityReport {
  std::vector<CellShortfall> cells;    ///< By date, then task; minimums before targets.
  std::vector<DayShortfall> days;      ///< Days short beyond what the cells explain.
  std::vector<PersonShortfall> people; ///< In staff order.
  Totals totals;
  Bounds bounds;
  std::optional<RosterComparison> roster;

  // Data for the soft bound: per day, target slots that cannot be filled freely, their cheapest
  // weight (cost units per person), and a floor that holds whatever hard rules are broken.
  std::vector<int> hardGap;        ///< Per day: hard minimum slots that cannot be filled freely.
  std::vector<int> targetGap;
  std::vector<Cost> targetUnitCost;
  std::vector<Cost> floorCost;
  Cost breakUnitCost = 0;  ///< Least hard cost of one cell that breaks absence, fixed or skill.

  bool anyUnavoidable() const;
  /// Lower bound on the cover-target soft penalty of any roster whose hard total is at most
  /// `hardTotal`: each person called in against an absence, fixed cell or skill costs at least
  /// breakUnitCost of hard penalty, so such a roster can fill at most hardTotal / breakUnitCost
  /// target slots beyond the free ones.
  Cost coverSoftBound(Cost hardTotal) const;
};

/// Runs the analysis. Cheap: one matching per day; safe to call before every solve.
CapacityReport analyseCapacity(const model::Problem& problem);

/// For each breach: true when it is hard and implied by the analysis (an unavoidable shortfall
/// on its date and slot, an unavoidable contract shortfall of its person, or a person called in
/// on a day the analysis shows short).
/// Per day at most that day's gap is tagged, so the count of unavoidable cover units never exceeds
/// what the analysis proves.
std::vector<bool> unavoidable(const CapacityReport& report, const model::Problem& problem, const model::Roster& roster,
                              const std::vector<rules::Breach>& breaches);

/// Fills report.roster: the roster's cover figures, the soft bound for its hard total and a tag
/// with cause and remedy for every hard breach. `breaches` is the roster's full breach list.
void compareWithRoster(CapacityReport& report, const model::Problem& problem, const model::Roster& roster,
                       const std::vector<rules::Breach>& breaches);

/// The report.txt section (several lines, each indented two spaces, ending in a newline).
std::string renderCapacityText(const CapacityReport& report, const model::Problem& problem);
/// The value of report.json's "capacity" key (a JSON object, indented to sit at level one).
std::string renderCapacityJson(const CapacityReport& report, const model::Problem& problem);

/// "2027-03-14 N rn: need 2, at most 1 available (ana and ben absent)"
std::string describe(const CellShortfall& s, const model::Problem& problem);
std::string describe(const DayShortfall& s, const model::Problem& problem);
std::string describe(const PersonShortfall& s, const model::Problem& problem);

}  // namespace rotaweave::analysis
