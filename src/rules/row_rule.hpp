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
  int history = 0;
  int days = 0;

  ShiftIdx shift(DayIdx d) const { return shifts[d]; }
  bool worked(DayIdx d) const { return shifts[d] != kNoShift; }
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

class RowRule {
 public:
  explicit RowRule(model::RuleSpec spec) : spec_(std::move(spec)) {}
  virtual ~RowRule() = default;
  RowRule(const RowRule&) = delete;
  RowRule& operator=(const RowRule&) = delete;

  /// Adds this rule's penalty for the row to `tally`; appends breaches to `out` if non-null.
  virtual void score(const RowView& row, Tally& tally, std::vector<Breach>* out) const = 0;

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
