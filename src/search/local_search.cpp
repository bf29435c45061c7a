/// @brief Acceptance rules for local search: hill climbing and late acceptance.
#include "search/local_search.hpp"

#include <algorithm>

#include "search/moves.hpp"

namespace rotaweave::search {

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

void lateAcceptance(const Eligibility& e, eval::Evaluator& ev, Rng& rng, int moves, LateAcceptanceScratch& scratch) {
  // Late acceptance: a move is taken if it is no worse than the current roster or than the
  // roster of `history` steps ago, so the search can climb out of local optima gradually.
  auto& late = scratch.late;
  const size_t history = late.size();
  std::fill(late.begin(), late.end(), ev.total());
  scratch.best = ev.roster();
  rules::Tally best = ev.total();
  eval::Move move;
  for (int i = 0; i < moves; ++i) {
    randomMove(e, ev.roster(), rng, move);
    if (move.size == 0) continue;
    const rules::Tally candidate = ev.tryMove(move);
    rules::Tally& slot = late[static_cast<size_t>(i) % history];
    if (!(ev.total() < candidate) || !(slot < candidate)) {
      ev.commit();
      if (candidate < best) {
        best = candidate;
        scratch.best.cells = ev.roster().cells;  // same size: a copy, no allocation
      }
    }
    if (ev.total() < slot) slot = ev.total();
  }
  if (best < ev.total()) ev.load(scratch.best);
}

}  // namespace rotaweave::search
