/// @brief Neighbourhood moves shared by local search and mutation: reassign a cell, swap two
/// people on a day, swap a block of days, swap two days of one person, fill a short run.
/// Every move keeps each cell within its eligible options; building one never allocates.
#pragma once
#include "eval/move.hpp"
#include "model/roster.hpp"
#include "search/eligibility.hpp"
#include "search/rng.hpp"

namespace rotaweave::search {

/// Builds one random move for roster `g` into `move`; empty if the draw was not applicable.
void randomMove(const Eligibility& e, const model::Roster& g, Rng& rng, eval::Move& move);
/// Writes the move's cells into `g`.
void applyMove(model::Roster& g, const eval::Move& move);

}  // namespace rotaweave::search
