/// @brief Hill climbing on the incremental evaluator: random reassign, same-day swap and
/// block-swap moves, accepted when they do not make the roster worse.
#pragma once
#include "eval/evaluator.hpp"
#include "search/eligibility.hpp"
#include "search/rng.hpp"

namespace rotaweave::search {

/// Builds one random move valid under `e` for the roster loaded in `ev`; empty if none was found.
void randomMove(const Eligibility& e, const model::Roster& roster, Rng& rng, eval::Move& move);

/// Tries `moves` random moves on the roster loaded in `ev`, keeping those that do not worsen it.
/// Returns the number of moves accepted. No allocation.
int hillClimb(const Eligibility& e, eval::Evaluator& ev, Rng& rng, int moves);

}  // namespace rotaweave::search
