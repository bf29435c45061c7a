/// @brief Cover-driven ejection chains.
#include "search/ejection_chain.hpp"

#include <algorithm>
#include <array>

namespace rotaweave::search {

namespace {

constexpr int kCandidates = 6;  ///< people sampled per link: enough choice, bounded cost
constexpr int kMaxLinks = 8;

/// How many more people (d, t) wants before reaching its target (or minimum).
int gap(const model::Problem& p, const eval::Evaluator& ev, DayIdx d, TaskIdx t) {
  const model::DemandCell& c = p.demandAt(d, t);
  return c.defined ? c.wanted() - ev.coverCount(d, t) : 0;
}

/// A random (day, task) below its target, by reservoir sampling; false if cover is met.
bool randomGap(const model::Problem& p, const eval::Evaluator& ev, Rng& rng, DayIdx& day, TaskIdx& task) {
  int seen = 0;
  for (DayIdx d = 0; d < p.days; ++d)
    for (TaskIdx t = 1; t < p.taskCount(); ++t)
      if (gap(p, ev, d, t) > 0 && rng.below(++seen) == 0) day = d, task = t;
  return seen > 0;
}

}  // namespace

bool ejectionChain(const Eligibility& e, eval::Evaluator& ev, Rng& rng, int maxLinks, eval::Move& undo) {
  const model::Problem& p = ev.rules().problem();
  undo.clear();
  DayIdx d;
  TaskIdx t;
  if (!randomGap(p, ev, rng, d, t)) return false;

  const rules::Tally start = ev.total();
  rules::Tally best = start;
  int bestSize = 0;  // undo entries at the best point of the chain
  std::array<StaffIdx, kMaxLinks> used{};
  eval::Move move, bestMove;
  for (int link = 0; link < std::min(maxLinks, kMaxLinks); ++link) {
    // 1 - Sample people who may take t on day d, and for each, the best day to give up.
    const auto& free = e.freeOnDay(d);
    bool found = false;
    rules::Tally linkBest;
    for (int c = 0; c < kCandidates && !free.empty(); ++c) {
      const StaffIdx s = free[static_cast<size_t>(rng.below(static_cast<int>(free.size())))];
      if (ev.roster().at(s, d) == t || !e.allows(s, d, t) || std::find(used.begin(), used.begin() + link, s) != used.begin() + link) continue;
      for (DayIdx drop = -1; drop < p.days; ++drop) {
        if (drop == d) continue;
        if (drop >= 0 && (ev.roster().at(s, drop) == kOff || !e.allows(s, drop, kOff))) continue;
        move.clear();
        move.add(s, d, t);
        if (drop >= 0) move.add(s, drop, kOff);
        const rules::Tally score = ev.tryMove(move);
        if (!found || score < linkBest) found = true, linkBest = score, bestMove = move;
      }
    }
    if (!found || bestMove.size + undo.size > eval::Move::kCapacity) break;

    // 2 - Take the best link; the next gap is what the person left behind.
    const StaffIdx s = bestMove.cells[0].staff;
    used[static_cast<size_t>(link)] = s;
    const TaskIdx leftOnDay = ev.roster().at(s, d);
    DayIdx nextDay = -1;
    TaskIdx nextTask = kOff;
    for (const auto& cell : bestMove) {
      const TaskIdx old = ev.roster().at(cell.staff, cell.day);
      undo.add(cell.staff, cell.day, old);
      if (cell.day != d && old != kOff) nextDay = cell.day, nextTask = old;
    }
    if (leftOnDay != kOff) nextDay = d, nextTask = leftOnDay;
    ev.tryMove(bestMove);
    ev.commit();
    if (!(best < ev.total())) best = ev.total(), bestSize = undo.size;  // ties: the longer chain
    if (nextDay < 0 || gap(p, ev, nextDay, nextTask) <= 0) break;
    d = nextDay;
    t = nextTask;
  }

  // 3 - Roll back the links after the best point.
  if (bestSize < undo.size) {
    move.clear();
    for (int i = undo.size - 1; i >= bestSize; --i) move.add(undo.cells[static_cast<size_t>(i)].staff, undo.cells[static_cast<size_t>(i)].day, undo.cells[static_cast<size_t>(i)].task);
    ev.tryMove(move);
    ev.commit();
    undo.size = bestSize;
  }
  return undo.size > 0;
}

}  // namespace rotaweave::search
