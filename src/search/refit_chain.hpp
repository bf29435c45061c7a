/// @brief Refit chains: a compound move that forces one person's row to change on one day,
/// re-fits that row around the change, and lets everyone else re-fit theirs in answer.
///
/// Each re-fit is the cheapest row for that person with everyone else as they are (RowRefit),
/// so the chain moves whole patterns at once, such as which weekend someone works, where
/// single-cell moves would have to pass through many worse rosters.
#pragma once
#include <vector>

#include "eval/evaluator.hpp"
#include "search/eligibility.hpp"
#include "search/rng.hpp"
#include "search/row_refit.hpp"

namespace rotaweave::search {

/// The previous cells of every row a chain changed, in the order they changed.
/// Reused from chain to chain, so a chain allocates nothing once the buffers have grown.
struct RefitUndo {
  std::vector<RowChange> rows;
  int size = 0;
  std::vector<StaffIdx> order;  ///< scratch: the order people answer in
  std::vector<TaskIdx> needs;       ///< scratch: the forced day
  RowChange change;                 ///< scratch: a re-fit
};

/// Runs one chain on the roster loaded in `ev`: one forced re-fit, then `passes` rounds in
/// which every other person re-fits in a random order; leaves the result loaded. Returns false
/// if nothing changed.
bool refitChain(const Eligibility& e, eval::Evaluator& ev, RowRefit& refit, Rng& rng, double hardWeight, int passes,
                RefitUndo& undo);
/// Restores the roster a chain started from.
void undoRefitChain(eval::Evaluator& ev, const RefitUndo& undo);

}  // namespace rotaweave::search
