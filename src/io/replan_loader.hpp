/// @brief Loads a scenario for re-planning: the scenario plus what `replan` adds (the published
/// roster, the first re-planned day, absences reported at replan, and the `changes` rule),
/// built into one Problem that is immutable from then on.
///
/// All validation of the additions happens here, as for the scenario itself: errors are
/// InputError values naming the option or the roster file, line and column.
#pragma once
#include <string>
#include <vector>

#include "model/problem.hpp"

namespace rotaweave::io {

/// What `replan` adds to a scenario.
struct ReplanAdditions {
  std::string publishedRoster;        ///< roster CSV published for the scenario's period
  std::string from;                   ///< YYYY-MM-DD: the first day to re-plan
  std::vector<std::string> absences;  ///< STAFF:DATE[..DATE][:REASON], each from `from` on
};

/// The `changes` rule replan adds when the scenario lists none (docs/rules/changes.md):
/// a change costs `weight`, or `earlyWeight` in the first `earlyDays` days from --from, or
/// `farWeight` on a day more than `nearDays` days from every gap day (the highest that applies).
/// Weights in hundredths, as every rule weight.
struct ChangesDefaults {
  static constexpr Cost weight = 2 * kWeightScale;
  static constexpr int earlyDays = 3;
  static constexpr Cost earlyWeight = 10 * kWeightScale;
  static constexpr int nearDays = model::kDefaultNearDays;
  static constexpr Cost farWeight = 6 * kWeightScale;
};

/// The default `changes` rule for a problem (every person in scope).
model::RuleSpec defaultChangesRule(const model::Problem& problem);

/// Loads `scenario` and applies `additions`: the days before `from` are fixed as published,
/// the reported absences are added, `published` is set with its gap distances, and the
/// default `changes` rule is added when the scenario lists none. Notes (a fixed cell that the
/// published roster contradicts, an absence clipped at `from`) go to stderr.
model::Problem loadReplanScenario(const std::string& scenario, const ReplanAdditions& additions);

}  // namespace rotaweave::io
