/// @brief The compiled scenario: dense, index-based tables built once at load time.
///
/// A Problem is immutable after loading and safe to share read-only between threads.
/// Every table is indexed by small integers; strings are kept only for reporting.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "model/calendar.hpp"
#include "model/rule_spec.hpp"
#include "model/types.hpp"

namespace rotaweave::model {

struct ShiftType {
  std::string id;
  std::string label;
  std::string colour;  ///< "#RRGGBB" or empty for the default palette.
  int start = 0;       ///< Minutes after midnight of the day the shift belongs to.
  int end = 0;         ///< Minutes after that midnight; > start, may exceed 1440 (overnight).
  int breakMinutes = 0;
  int paidMinutes() const { return end - start - breakMinutes; }
};

/// A role a person can fill: one shift with one skill. Task 0 is "off".
struct Task {
  ShiftIdx shift = kNoShift;
  SkillIdx skill = -1;
};

struct Contract {
  std::string id;
  std::optional<int> minMinutes;
  std::optional<int> maxMinutes;
  std::optional<int> dailyMinutes;  ///< `daily_hours`: what a day of leave counts for.
  bool hard = false;
  Cost weight = kWeightScale;
  std::string origin;
};

struct Request {
  enum class Kind { Off, Shift, NotShift };
  DayIdx day = 0;
  Kind kind = Kind::Off;
  ShiftIdx shift = kNoShift;
  Cost weight = kWeightScale;
};

struct Person {
  std::string id;
  std::string name;
  int contract = -1;                ///< Index into Problem::contracts, -1 for none.
  std::vector<SkillIdx> skills;     ///< In the order listed; the first is the default role.
  std::uint64_t skillMask = 0;      ///< Bit k set if the person holds skill k.
  std::vector<Request> requests;
  std::vector<ShiftIdx> history;    ///< Days before the period, oldest first; kNoShift = off.
  /// Usual paid minutes of a working day: what a `daily` absence credit is worth (see
  /// computeAbsenceCredit for the default).
  int dailyMinutes = 0;
  bool holds(SkillIdx skill) const { return (skillMask >> skill) & 1U; }
};

/// Cover needed for one (date, shift, skill); `defined` is false where no demand applies.
struct DemandCell {
  bool defined = false;
  int min = 0;
  int target = 0;
  int max = -1;  ///< -1: no upper bound.
  bool minHard = true;
  Cost minWeight = kWeightScale;
  Cost targetWeight = kWeightScale;
  Cost maxWeight = kWeightScale;
  /// People the cell asks for: its target, or its minimum where that is higher.
  int wanted() const { return min > target ? min : target; }
};

/// What an absence reason credits toward hours rules on each absent working day.
struct AbsenceCredit {
  std::string reason;  ///< "default" stands for every reason not listed (and none).
  bool daily = true;   ///< the person's usual daily minutes; otherwise `minutes`.
  int minutes = 0;
  std::string origin;  ///< "file:line", or "built-in default".
};

/// The built-in credits: leave, sick and training count the usual day, unpaid nothing, and any
/// other reason (or none) the usual day. A scenario's `absence_credit:` overrides them.
std::vector<AbsenceCredit> defaultAbsenceCredit();

/// A roster published earlier; re-planning keeps days before `from` and charges changes after.
struct Published {
  std::vector<TaskIdx> cells;  ///< staff * days
  DayIdx from = 0;
  /// Per period day: days to the nearest gap day (a day from `from` on where someone the
  /// roster had working is now absent); `days` when there is none. Empty: every day counts as
  /// near (no distance weight). Built by makePublished; the `changes` rule reads it.
  std::vector<int> gapDistance;
};

struct Problem {
  std::string name;
  std::string sourceFile;
  /// IANA time zone of the shift times (scenario key `timezone`), e.g. "Europe/Berlin"; empty:
  /// none given, calendars use floating local times.
  std::string timezone;

  // Calendar.
  DateSerial start = 0;
  int days = 0;
  std::vector<std::uint8_t> weekday;   ///< 0 = Monday.
  std::vector<std::uint8_t> weekend;   ///< 1 if the date is a weekend day.
  std::vector<std::uint8_t> holiday;   ///< 1 if listed in `holidays`.
  std::vector<int> weekendBlock;       ///< Index of the weekend a date belongs to, or -1.
  int weekendCount = 0;

  std::vector<ShiftType> shifts;
  std::vector<std::string> skills;
  std::vector<Contract> contracts;
  std::vector<Person> staff;

  std::vector<Task> tasks;          ///< tasks[0] is off.
  std::vector<TaskIdx> taskOf;      ///< [shift * skills + skill]

  std::vector<std::uint8_t> absent;        ///< [staff * days + day]
  std::vector<std::string> absenceReason;  ///< [staff * days + day]
  std::vector<TaskIdx> fixed;              ///< [staff * days + day]; -1 none, 0 fixed off.
  std::vector<DemandCell> demand;          ///< [day * tasks + task]

  /// Per reason; see defaultAbsenceCredit().
  std::vector<AbsenceCredit> absenceCredit = defaultAbsenceCredit();
  /// Minutes credited per [staff * days + day] (0 on days not absent, weekend days and holidays)
  /// and their total per person: what hours rules of the period add to the paid minutes.
  /// Derived from `absent`; call computeAbsenceCredit after changing absences.
  std::vector<int> creditByDay;
  std::vector<int> creditMinutes;
  /// Things the loader changed or assumed that the user should know (an absence clipped to
  /// the period, ...); shown on stderr and in the report.
  std::vector<std::string> notes;

  std::vector<RuleSpec> rules;  ///< Listed rules plus those implied by contracts.
  std::optional<Published> published;
  int maxHistory = 0;

  /// Minutes person s's absences credit toward hours rules of the whole period.
  int credit(StaffIdx s) const { return creditMinutes.empty() ? 0 : creditMinutes[static_cast<size_t>(s)]; }
  int staffCount() const { return static_cast<int>(staff.size()); }
  int taskCount() const { return static_cast<int>(tasks.size()); }
  size_t cell(StaffIdx s, DayIdx d) const { return static_cast<size_t>(s) * static_cast<size_t>(days) + static_cast<size_t>(d); }
  TaskIdx task(ShiftIdx shift, SkillIdx skill) const { return taskOf[static_cast<size_t>(shift) * skills.size() + static_cast<size_t>(skill)]; }
  const DemandCell& demandAt(DayIdx d, TaskIdx t) const { return demand[static_cast<size_t>(d) * tasks.size() + static_cast<size_t>(t)]; }
  std::string dateText(DayIdx d) const { return formatIsoDate(start + d); }
  /// "E", or "E/hca" where the person holds more than one skill.
  std::string taskText(TaskIdx t, StaffIdx s) const;
  /// Like taskText, but "off" for a day off: for messages, where an empty cell would be unclear.
  std::string cellText(TaskIdx t, StaffIdx s) const { return t == kOff ? "off" : taskText(t, s); }
  /// Staff index by id, or -1.
  StaffIdx findStaff(const std::string& id) const;
  ShiftIdx findShift(const std::string& id) const;
  SkillIdx findSkill(const std::string& id) const;
};

/// The credit rule of an absence reason (the "default" entry for reasons not listed).
const AbsenceCredit& creditFor(const Problem& p, const std::string& reason);
/// A working day for absence credit: not a weekend day and not a holiday.
bool creditedDay(const Problem& p, DayIdx d);
/// Fills creditByDay and creditMinutes from absent, absenceReason, absenceCredit and each
/// person's dailyMinutes. Cheap (one pass over the cells); call after absences change.
void computeAbsenceCredit(Problem& p);
/// The published roster `cells` with re-planning from `from`, its gap distances computed
/// from the problem's absences (set the absences first).
Published makePublished(const Problem& p, std::vector<TaskIdx> cells, DayIdx from);

/// Fills tasks, taskOf and the per-date weekend tables from shifts, skills and the calendar.
void buildDerivedTables(Problem& p, const std::vector<int>& weekendDays);

}  // namespace rotaweave::model
