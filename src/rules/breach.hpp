/// @brief One rule breach, as found by a rule and shown in every report format.
#pragma once
#include <string>
#include <vector>

#include "model/types.hpp"

namespace rotaweave::rules {

/// Which bound of a cover cell a cover breach misses (None for every other kind).
enum class CoverPart { None, Min, Target, Max };

struct Breach {
  std::string ruleId;
  std::string kind;
  bool hard = true;
  StaffIdx staff = -1;          ///< -1 when the breach belongs to no single person.
  std::vector<DayIdx> days;     ///< Period days involved, ascending.
  Cost amount = 0;              ///< In 1/kAmountScale units.
  Cost penalty = 0;             ///< In 1/kCostScale units.
  std::string message;
  TaskIdx task = kOff;                 ///< cover: the (shift, skill) cell
  CoverPart coverPart = CoverPart::None;
  /// How far the roster is from the rule's bound, in 1/kAmountScale units of `shortfallUnit`
  /// (hours short of a rest, hours over a limit, days over a run); -1: the amount, in the
  /// kind's unit. Reported only; the penalty stays amount x weight.
  Cost shortfall = -1;
  const char* shortfallUnit = nullptr;
  /// Rolling-hours breaches: the window with the largest excess (or shortfall), first and last day.
  DayIdx windowFirst = -1, windowLast = -1;
};

/// Hard and soft penalty totals, in 1/kCostScale units. Lower is better, hard first.
struct Tally {
  Cost hard = 0;
  Cost soft = 0;
  Tally& operator+=(const Tally& o) { hard += o.hard; soft += o.soft; return *this; }
  Tally& operator-=(const Tally& o) { hard -= o.hard; soft -= o.soft; return *this; }
  friend Tally operator+(Tally a, const Tally& b) { return a += b; }
  friend Tally operator-(Tally a, const Tally& b) { return a -= b; }
  friend bool operator==(const Tally&, const Tally&) = default;
  /// Lexicographic: fewer hard penalty points first, then fewer soft.
  friend bool operator<(const Tally& a, const Tally& b) {
    return a.hard != b.hard ? a.hard < b.hard : a.soft < b.soft;
  }
  /// Hard and soft as one value, a hard unit counting `hardWeight` soft ones (local search
  /// and Evaluator::tryMoveWithin must weigh alike, so both call this).
  double weighed(double hardWeight) const { return static_cast<double>(hard) * hardWeight + static_cast<double>(soft); }
};

}  // namespace rotaweave::rules
