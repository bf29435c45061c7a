/// @brief Repair of rows that break a hard rule, by re-fitting the days around a breach.
///
/// Local search crosses rosters that break hard rules on purpose (its hard weight adapts),
/// and a child can end its search with a few rows still breaking one: a run too long, a
/// forbidden pair, a weekend too many. Those rules are the person's own, so the cheapest row
/// around the breach that keeps them (RowRefit, with everyone else as they are) usually
/// removes the breach at little cost elsewhere.
#pragma once
#include <chrono>

#include "eval/evaluator.hpp"
#include "search/rng.hpp"
#include "search/row_refit.hpp"

namespace rotaweave::search {

struct RowRepairScratch {
  RowChange change, undo;
  std::vector<StaffIdx> rows;
};

/// For each row of the roster loaded in `ev` that breaks a hard rule (at most `maxRows`, in a
/// random order), re-fits `window` days around its first hard breach and keeps the result if
/// the roster's total, hard weighed by `hardWeight`, does not get worse. Returns the rows
/// changed. Stops at `refit`'s deadline.
int repairRows(eval::Evaluator& ev, RowRefit& refit, Rng& rng, double hardWeight, int window, int maxRows,
               RowRepairScratch& scratch);

}  // namespace rotaweave::search
