/// @brief Column generation: a starting roster from the master problem over rows priced by
/// the row re-fit.
///
/// The master problem (search/master_problem.hpp) picks one row per person among candidate
/// rows, with cover costed exactly. Its linear relaxation prices every (day, task) cell; at
/// those prices each person's cheapest row is found by the row re-fit, and added where it
/// would lower the relaxation. When no person's row would, or time is up, a dive fixes the
/// rows the relaxation takes most of, pricing again after each fix, until everyone has one;
/// CBC may then find a better roster among the rows gathered. The relaxation's value plus
/// each person's most negative reduced cost is a lower bound wherever every row was priced
/// exactly.
#pragma once
#include <chrono>
#include <optional>
#include <vector>

#include "eval/evaluator.hpp"
#include "search/row_pool.hpp"
#include "search/row_refit.hpp"

namespace rotaweave::search {

struct ColumnGenerationResult {
  std::optional<model::Roster> roster;  ///< the roster of the dive (then CBC), if it found one
  /// Weighed cost no roster without a hard breach goes below, from a pricing round where
  /// every row was priced exactly (provided Eligibility::complete()).
  std::optional<double> bound;
  int rounds = 0;  ///< pricing rounds before the dive
};

struct ColumnGenerationLimits {
  std::chrono::steady_clock::time_point pricingDeadline;  ///< pricing rounds stop here
  double integerSeconds = 1;                              ///< then the dive and CBC get this long
};

/// Runs column generation from the rows of `pool` and of `incumbent` (any roster), weighing
/// hard cost by `hardWeight`. Rows are priced on as many threads as `refits` holds. `ev`
/// scores rows (its loaded roster is not used). Deterministic unless the deadline cuts it.
ColumnGenerationResult generateColumns(eval::Evaluator& ev, std::vector<RowRefit>& refits, const RowPool& pool,
                                       const model::Roster& incumbent, double hardWeight, const ColumnGenerationLimits& limits);

}  // namespace rotaweave::search
