/// @brief Move generation and acceptance.
#include "search/local_search.hpp"

#include <algorithm>

namespace rotaweave::search {

void randomMove(const Eligibility& e, const model::Roster& g, Rng& rng, eval::Move& move) {
  move.clear();
  const auto& cells = e.freeCells();
  if (cells.empty()) return;
  const int kind = rng.below(100);
  if (kind < 50) {
    // Reassign one cell to another of its options.
    const int cell = cells[static_cast<size_t>(rng.below(static_cast<int>(cells.size())))];
    const StaffIdx s = cell / g.days;
    const DayIdx d = cell % g.days;
    const TaskIdx t = e.begin(s, d)[rng.below(e.count(s, d))];
    if (t != g.at(s, d)) move.add(s, d, t);
    return;
  }
  if (kind < 85) {
    // Same-day swap: two people exchange what they do that day.
    const int cell = cells[static_cast<size_t>(rng.below(static_cast<int>(cells.size())))];
    const DayIdx d = cell % g.days;
    const StaffIdx a = cell / g.days;
    const auto& free = e.freeOnDay(d);
    const StaffIdx b = free[static_cast<size_t>(rng.below(static_cast<int>(free.size())))];
    const TaskIdx ta = g.at(a, d), tb = g.at(b, d);
    if (a == b || ta == tb || !e.allows(a, d, tb) || !e.allows(b, d, ta)) return;
    move.add(a, d, tb);
    move.add(b, d, ta);
    return;
  }
  // Block swap: two people exchange 2 to 7 consecutive days.
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

int hillClimb(const Eligibility& e, eval::Evaluator& ev, Rng& rng, int moves) {
  eval::Move move;
  int accepted = 0;
  for (int i = 0; i < moves; ++i) {
    randomMove(e, ev.roster(), rng, move);
    if (move.size == 0) continue;
    // Sideways moves are accepted too: they let the search drift across plateaus.
    if (!(ev.total() < ev.tryMove(move))) {
      ev.commit();
      ++accepted;
    }
  }
  return accepted;
}

}  // namespace rotaweave::search
