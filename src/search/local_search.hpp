/// @brief Local search on the incremental evaluator with the moves of moves.hpp.
#pragma once
#include <vector>

#include "eval/evaluator.hpp"
#include "search/eligibility.hpp"
#include "search/moves.hpp"
#include "search/rng.hpp"

namespace rotaweave::search {

/// Tries `moves` random moves on the roster loaded in `ev`, keeping those that do not worsen it.
/// Returns the number of moves accepted. No allocation.
int hillClimb(const Eligibility& e, eval::Evaluator& ev, Rng& rng, int moves);

/// Buffers reused across calls, so late acceptance allocates nothing per child.
struct LateAcceptanceScratch {
  std::vector<rules::Tally> late;  ///< history length = size()
  model::Roster best;
};

/// Late-acceptance hill climbing for `moves` moves; leaves the best roster seen loaded in `ev`.
void lateAcceptance(const Eligibility& e, eval::Evaluator& ev, Rng& rng, int moves, LateAcceptanceScratch& scratch);

}  // namespace rotaweave::search
