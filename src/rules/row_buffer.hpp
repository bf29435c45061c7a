/// @brief Builds the dense per-day arrays and totals of one person's row that rules read.
///
/// Used wherever a whole row is judged at once (full scoring, explaining, tabulating cell
/// rules); the evaluator keeps its loaded rows in the same layout and patches them in place.
#pragma once
#include <vector>

#include "rules/row_rule.hpp"

namespace rotaweave::rules {

/// Per-task and per-shift tables for filling rows: start, end and paid minutes.
struct ShiftTables {
  explicit ShiftTables(const model::Problem& p);
  std::vector<ShiftIdx> taskShift;                   ///< per task, kNoShift for off
  std::vector<int> taskStart, taskEnd, taskPaid;     ///< per task (off: all zero)
  std::vector<int> shiftStart, shiftEnd, shiftPaid;  ///< per shift type
};

class RowBuffer {
 public:
  explicit RowBuffer(const model::Problem& p);
  /// Fills the buffer with person s's history and `tasks` (one per period day); the view
  /// stays valid until the next fill.
  RowView fill(StaffIdx s, const TaskIdx* tasks);

 private:
  const model::Problem* p_;
  ShiftTables tables_;
  std::vector<ShiftIdx> shifts_;
  std::vector<int> starts_, ends_, paid_, shiftCount_;
  RowTotals totals_;
};

/// Writes the values of day d (of a row whose arrays start at day 0) for a shift; history days
/// and period days alike.
inline void setDay(const ShiftTables& t, ShiftIdx* shifts, int* starts, int* ends, int* paid, DayIdx d, ShiftIdx sh) {
  const bool on = sh != kNoShift;
  shifts[d] = sh;
  starts[d] = d * kMinutesPerDay + (on ? t.shiftStart[static_cast<size_t>(sh)] : 0);
  ends[d] = d * kMinutesPerDay + (on ? t.shiftEnd[static_cast<size_t>(sh)] : 0);
  paid[d] = on ? t.shiftPaid[static_cast<size_t>(sh)] : 0;
}

}  // namespace rotaweave::rules
