/// @brief Late-acceptance local search with ejection chains and an adaptive hard weight.
#include "search/local_search.hpp"

#include <algorithm>

#include "search/ejection_chain.hpp"
#include "search/moves.hpp"
#include "search/stop_signal.hpp"

namespace rotaweave::search {

namespace {

constexpr int kWeightPeriod = 256;       ///< moves between hard-weight updates
constexpr int kClockPeriod = 2048;       ///< moves between looks at the clock and stop requests
constexpr double kWeightStep = 1.25;     ///< factor per update
constexpr double kMaxHardWeight = 1e9;   ///< a cap: well before it, hard alone decides

}  // namespace

void lateAcceptance(const Eligibility& e, eval::Evaluator& ev, Rng& rng, int moves, const LateAcceptanceSettings& settings,
                    LateAcceptanceScratch& scratch) {
  // Late acceptance: a move is taken if it is no worse than the current roster or than the
  // roster of `history` steps ago, so the search can climb out of local optima gradually.
  // Hard and soft penalties are weighed into one value with an adaptive hard weight, so the
  // search may pass through rosters that break a hard rule on its way to a better feasible
  // one; the best roster kept is still the best hard first.
  auto& late = scratch.late;
  const size_t history = late.size();
  double& w = scratch.hardWeight;
  w = std::max(w, settings.hardWeightFloor);
  auto value = [&w](const rules::Tally& t) { return t.weighed(w); };
  std::fill(late.begin(), late.end(), ev.total());
  scratch.best = ev.roster();
  rules::Tally best = ev.total();
  eval::Move move, undo;
  int infeasibleSteps = 0;
  for (int i = 0; i < moves; ++i) {
    if (i % kClockPeriod == kClockPeriod - 1 && (std::chrono::steady_clock::now() >= settings.deadline || stopRequested())) break;
    rules::Tally& slot = late[static_cast<size_t>(i) % history];
    const double limit = std::max(value(ev.total()), value(slot));
    // Compound moves are applied already: judged like any other move, undone if over the limit.
    if (settings.refit && settings.refitInterval > 0 && i % settings.refitInterval == settings.refitInterval - 1) {
      if (refitChain(e, ev, *settings.refit, rng, w, settings.refitPasses, scratch.refitUndo) && value(ev.total()) > limit)
        undoRefitChain(ev, scratch.refitUndo);
    } else if (settings.chainInterval > 0 && i % settings.chainInterval == settings.chainInterval - 1) {
      if (ejectionChain(e, ev, rng, settings.chainLinks, undo) && value(ev.total()) > limit) {
        ev.tryMove(undo);
        ev.commit();
      }
      // A chain tries a move per day for each of its people: on a long horizon, thousands.
      if (std::chrono::steady_clock::now() >= settings.deadline || stopRequested()) break;
    } else {
      randomMove(e, ev.roster(), rng, move);
      if (move.size > 0 && ev.tryMoveWithin(move, w, limit)) ev.commit();
    }
    if (ev.total() < best) {
      best = ev.total();
      scratch.best.cells = ev.roster().cells;  // same size: a copy, no allocation
    }
    if (value(ev.total()) < value(slot)) slot = ev.total();
    infeasibleSteps += ev.total().hard > 0;
    if (i % kWeightPeriod == kWeightPeriod - 1) {
      // Infeasible for more than a tenth of the period: hard costs more; otherwise a little less.
      w = infeasibleSteps * 10 > kWeightPeriod ? std::min(w * kWeightStep, kMaxHardWeight) : std::max(w / kWeightStep, settings.hardWeightFloor);
      infeasibleSteps = 0;
    }
  }
  if (best < ev.total()) ev.load(scratch.best);
}

}  // namespace rotaweave::search
