/// @brief Base of the rules that judge one person's row of the roster on its own.
///
/// Each rule scores a row into a Tally and, when given a breach list, explains every breach.
/// Scoring and explaining share one code path, so the report always matches the score.
/// Rules are immutable after construction and safe to use from several threads at once.
#pragma once
#include <string>
#include <utility>
#include <vector>

#include "model/problem.hpp"
#include "rules/breach.hpp"

namespace rotaweave::rules {

/// Totals of one person's row over the period days. The evaluator keeps them up to date as
/// cells change, so rules judged on the whole period (hours, counts, weekends) read them in
/// constant time instead of walking the row.
struct RowTotals {
  int paidMinutes = 0;
  int workedDays = 0;
  int weekendsWorked = 0;           ///< weekend blocks with at least one worked day
  const int* shiftCount = nullptr;  ///< per shift type
};

/// One person's row, with history in front: the per-day arrays are valid for -history <= d < days.
/// The evaluator fills them once per row, so rules read dense integers, never shift records.
struct RowView {
  const model::Problem* problem = nullptr;
  StaffIdx staff = 0;
  const TaskIdx* tasks = nullptr;    ///< days entries.
  const ShiftIdx* shifts = nullptr;  ///< Shift per day, kNoShift when off.
  const int* starts = nullptr;       ///< Absolute start minute of the day's shift (from period start).
  const int* ends = nullptr;         ///< Absolute end minute.
  const int* paid = nullptr;         ///< Paid minutes, 0 when off.
  const RowTotals* totals = nullptr;
  int history = 0;
  int days = 0;

  ShiftIdx shift(DayIdx d) const { return shifts[d]; }
  bool worked(DayIdx d) const { return shifts[d] != kNoShift; }
  /// Period days on shift s, or worked at all for kNoShift.
  int count(ShiftIdx s) const { return s == kNoShift ? totals->workedDays : totals->shiftCount[s]; }
  DayIdx firstKnown() const { return -history; }
  const model::ShiftType& shiftType(DayIdx d) const { return problem->shifts[static_cast<size_t>(shifts[d])]; }
  int startMinute(DayIdx d) const { return starts[d]; }
  int endMinute(DayIdx d) const { return ends[d]; }
  const std::string& personId() const { return problem->staff[static_cast<size_t>(staff)].id; }
  std::string date(DayIdx d) const { return problem->dateText(d); }
  const std::string& shiftId(DayIdx d) const { return shiftType(d).id; }
};

/// Inclusive span of days a breach involves (may start in history; clipped when reported).
struct DaySpan {
  DayIdx first;
  DayIdx last;
  bool endpointsOnly = false;  ///< Only the two ends are involved (a rest between two shifts).
};

/// Inclusive range of anchor days; empty when last < first.
///
/// A rule's penalty is a sum of terms (a run, a rest, a window, a weekend, the period total),
/// each anchored on one day: the run's first day, the later shift of a rest, and so on; terms
/// judged on the whole period are anchored on day 0. Scoring the anchors a change can reach,
/// before and after it, gives the change in penalty without reading the rest of the row.
struct AnchorSpan {
  DayIdx first;
  DayIdx last;
  bool empty() const { return last < first; }
  bool contains(DayIdx d) const { return first <= d && d <= last; }
};

inline constexpr AnchorSpan kNoAnchors{0, -1};
/// Where terms judged on the whole period are anchored.
inline constexpr DayIdx kPeriodAnchor = 0;

/// What a rule reads of a row. A change that alters none of it leaves the rule's penalty as
/// it was, so the evaluator does not ask the rule at all.
struct Observes {
  bool worked = false;           ///< whether each day is worked
  bool paid = false;             ///< paid minutes of each day
  bool times = false;            ///< start and end of each day's shift (and whether it is worked)
  std::vector<ShiftIdx> shifts;  ///< whether each day holds one of these shifts

  static Observes workedDays() { return make(true, false, false, {}); }
  static Observes paidMinutes() { return make(false, true, false, {}); }
  static Observes shiftTimes() { return make(false, false, true, {}); }
  /// Which days hold shift s (kNoShift: which days are worked); `worked` adds whether days are worked.
  static Observes shift(ShiftIdx s, bool worked = false) {
    return s == kNoShift ? workedDays() : make(worked, false, false, {s});
  }
  static Observes make(bool worked, bool paid, bool times, std::vector<ShiftIdx> shifts) {
    Observes o;
    o.worked = worked, o.paid = paid, o.times = times, o.shifts = std::move(shifts);
    return o;
  }
};

class RowRule {
 public:
  explicit RowRule(model::RuleSpec spec) : spec_(std::move(spec)) {}
  virtual ~RowRule() = default;
  RowRule(const RowRule&) = delete;
  RowRule& operator=(const RowRule&) = delete;

  /// Adds the penalty of this rule's terms anchored in `anchors` to `tally`, each term judged
  /// whole whatever days it spans; appends their breaches to `out` if non-null.
  virtual void score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const = 0;
  /// The anchors of every term that depends on any of the period days [first, last]; every other
  /// term stays the same whatever those days hold. Reads only days outside [first, last], so
  /// the answer is the same before and after a change to those days; where a move changes
  /// several stretches of a row, the evaluator asks before and after and scores the union.
  virtual AnchorSpan reach(const RowView& row, DayIdx first, DayIdx last) const = 0;

  /// What the penalty depends on (cell-local rules: nothing the evaluator needs to know).
  virtual Observes observes() const = 0;

  /// Adds this rule's penalty for the whole row to `tally`; appends breaches to `out` if non-null.
  void scoreRow(const RowView& row, Tally& tally, std::vector<Breach>* out) const {
    score(row, AnchorSpan{row.firstKnown(), row.days - 1}, tally, out);
  }

  /// True for rules whose penalty is a sum of independent per-cell terms, each charged as one
  /// breach on its own day (skill, absence, fixed, request, changes). The evaluator tabulates
  /// those terms once per (person, day, task) and never re-scores such rules during search.
  virtual bool cellLocal() const { return false; }

  const model::RuleSpec& spec() const { return spec_; }
  bool appliesTo(StaffIdx s) const { return spec_.inScope[static_cast<size_t>(s)] != 0; }

 protected:
  /// Charges one breach. `message` is a callable returning the text; it runs only when explaining.
  /// `amount` is in 1/kAmountScale units; `weight` (hundredths) overrides the rule's weight if >= 0.
  template <class Message>
  void charge(const RowView& row, Tally& tally, std::vector<Breach>* out, Cost amount, DaySpan span,
              Message&& message, Cost weight = -1) const {
    const Cost penalty = amount * (weight < 0 ? spec_.weight : weight);
    (spec_.hard ? tally.hard : tally.soft) += penalty;
    if (out) out->push_back(makeBreach(row, amount, penalty, spanDays(row, span), message()));
  }

  /// As charge(), for breaches whose days are not one span; `days` is a callable giving them.
  template <class Days, class Message>
  void chargeDays(const RowView& row, Tally& tally, std::vector<Breach>* out, Cost amount, Days&& days,
                  Message&& message) const {
    const Cost penalty = amount * spec_.weight;
    (spec_.hard ? tally.hard : tally.soft) += penalty;
    if (out) out->push_back(makeBreach(row, amount, penalty, days(), message()));
  }

 private:
  static std::vector<DayIdx> spanDays(const RowView& row, DaySpan span);
  Breach makeBreach(const RowView& row, Cost amount, Cost penalty, std::vector<DayIdx> days,
                    std::string message) const;
  model::RuleSpec spec_;
};

/// Formats hours given in minutes: "9.0", "10.5", "7.75".
std::string hoursText(int minutes);
/// Formats a bound in hours without needless decimals: "11", "7.5".
std::string boundText(int minutes);
/// One amount unit, for breaches counted in whole units (days, shifts, breaches).
inline constexpr Cost kOne = kAmountScale;

}  // namespace rotaweave::rules
