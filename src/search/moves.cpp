/// @brief Move builders: each picks a random change that keeps every cell eligible.
#include "search/moves.hpp"

#include <algorithm>

namespace rotaweave::search {

namespace {

/// Reassigns one cell to another of its options.
void reassignMove(const Eligibility& e, const model::Roster& g, Rng& rng, eval::Move& move, StaffIdx s, DayIdx d) {
  const TaskIdx t = e.begin(s, d)[rng.below(e.count(s, d))];
  if (t != g.at(s, d)) move.add(s, d, t);
}

/// Two people exchange what they do on one day.
void swapDayMove(const Eligibility& e, const model::Roster& g, eval::Move& move, StaffIdx a, StaffIdx b, DayIdx d) {
  const TaskIdx ta = g.at(a, d), tb = g.at(b, d);
  if (a == b || ta == tb || !e.allows(a, d, tb) || !e.allows(b, d, ta)) return;
  move.add(a, d, tb);
  move.add(b, d, ta);
}

/// Two people exchange 2 to 7 consecutive days.
void blockSwapMove(const Eligibility& e, const model::Roster& g, Rng& rng, eval::Move& move) {
  const int len = std::min(g.days, 2 + rng.below(6));
  const DayIdx d0 = rng.below(g.days - len + 1);
  const StaffIdx a = rng.below(g.staff), b = rng.below(g.staff);
  if (a == b) return;
  for (DayIdx d = d0; d < d0 + len; ++d) {
    const TaskIdx ta = g.at(a, d), tb = g.at(b, d);
    if (ta == tb) continue;
    if (!e.allows(a, d, tb) || !e.allows(b, d, ta)) {
      move.clear();
      return;
    }
    move.add(a, d, tb);
    move.add(b, d, ta);
  }
}

/// One person exchanges two of their own days: hours and shift counts stay the same.
void rowSwapMove(const Eligibility& e, const model::Roster& g, eval::Move& move, StaffIdx s, DayIdx a, DayIdx b) {
  const TaskIdx ta = g.at(s, a), tb = g.at(s, b);
  if (ta == tb || !e.allows(s, a, tb) || !e.allows(s, b, ta)) return;
  move.add(s, a, tb);
  move.add(s, b, ta);
}

/// A second day for a row swap: near the first half the time, since shifting a run by a day
/// or two is an exchange of its ends; anywhere in [from, to) otherwise.
DayIdx partnerDay(Rng& rng, DayIdx a, DayIdx from, DayIdx to) {
  constexpr int kNear = 3;
  if (rng.chance(0.5)) return std::clamp(a - kNear + rng.below(2 * kNear + 1), from, to - 1);
  return from + rng.below(to - from);
}

/// One person takes the same option on 2 to 4 consecutive days before `to`: makes or removes
/// whole runs, which single-cell moves cannot do where runs have a minimum length.
void runFillMove(const Eligibility& e, const model::Roster& g, Rng& rng, eval::Move& move, StaffIdx s, DayIdx d0, DayIdx to) {
  const int len = std::min(to - d0, 2 + rng.below(3));
  const TaskIdx t = e.begin(s, d0)[rng.below(e.count(s, d0))];
  for (DayIdx d = d0; d < d0 + len; ++d) {
    if (!e.allows(s, d, t)) break;
    if (g.at(s, d) != t) move.add(s, d, t);
  }
}

}  // namespace

void applyMove(model::Roster& g, const eval::Move& move) {
  for (const auto& c : move) g.at(c.staff, c.day) = c.task;
}

void randomMove(const Eligibility& e, const model::Roster& g, Rng& rng, eval::Move& move) {
  move.clear();
  const auto& cells = e.freeCells();
  if (cells.empty()) return;
  const int cell = cells[static_cast<size_t>(rng.below(static_cast<int>(cells.size())))];
  const StaffIdx s = cell / g.days;
  const DayIdx d = cell % g.days;
  const int kind = rng.below(100);
  if (kind < 40) {
    reassignMove(e, g, rng, move, s, d);
  } else if (kind < 65) {
    const auto& free = e.freeOnDay(d);
    swapDayMove(e, g, move, s, free[static_cast<size_t>(rng.below(static_cast<int>(free.size())))], d);
  } else if (kind < 78) {
    blockSwapMove(e, g, rng, move);
  } else if (kind < 89) {
    rowSwapMove(e, g, move, s, d, partnerDay(rng, d, 0, g.days));
  } else {
    runFillMove(e, g, rng, move, s, d, g.days);
  }
}

}  // namespace rotaweave::search
