/// @brief Local search on the incremental evaluator with the moves of moves.hpp.
#pragma once
#include <chrono>
#include <vector>

#include "eval/evaluator.hpp"
#include "search/eligibility.hpp"
#include "search/moves.hpp"
#include "search/refit_chain.hpp"
#include "search/rng.hpp"

namespace rotaweave::search {

/// How late acceptance searches (from SolverOptions).
struct LateAcceptanceSettings {
  int chainInterval = 300;         ///< moves between ejection chains; 0: none
  int chainLinks = 5;              ///< longest chain
  double hardWeightFloor = 100;    ///< least soft cost charged per unit of hard cost
  RowRefit* refit = nullptr;       ///< the island's row re-fitter, for refit chains; none: no chains
  int refitInterval = 0;           ///< moves between refit chains; 0: none
  int refitPasses = 1;             ///< rounds in which everyone else re-fits in answer to the forced row
  /// The search returns early at this time or on a stop request (SIGINT/SIGTERM).
  std::chrono::steady_clock::time_point deadline = std::chrono::steady_clock::time_point::max();
};

/// Buffers reused across calls, so late acceptance allocates nothing per child.
struct LateAcceptanceScratch {
  std::vector<rules::Tally> late;  ///< history length = size()
  model::Roster best;
  RefitUndo refitUndo;
  /// Soft cost charged per unit of hard cost while searching. It rises while the search stays
  /// among infeasible rosters and falls back towards the floor once it is feasible again
  /// (strategic oscillation); kept from one call to the next.
  double hardWeight = 0;
};

/// Late-acceptance hill climbing for `moves` moves, with an ejection chain every
/// `chainInterval` moves; leaves the best roster seen (hard first) loaded in `ev`.
void lateAcceptance(const Eligibility& e, eval::Evaluator& ev, Rng& rng, int moves, const LateAcceptanceSettings& settings,
                    LateAcceptanceScratch& scratch);

}  // namespace rotaweave::search
