/// @brief Test helpers: scenarios from YAML text, rosters from compact strings, breach queries.
#pragma once
#include <string>
#include <vector>

#include "eval/evaluator.hpp"
#include "model/problem.hpp"
#include "model/roster.hpp"

namespace rotaweave::test {

/// Writes `yaml` to a fresh temporary file (name returned via `path` if given) and loads it.
model::Problem loadYaml(const std::string& yaml, std::string* path = nullptr);
/// Writes text to a new temporary file and returns its path.
std::string writeTemp(const std::string& text, const std::string& suffix);

/// One row per person: space-separated cells, each a shift id, SHIFT/skill, or "." for off.
model::Roster rosterFrom(const model::Problem& p, const std::vector<std::string>& rows);

/// Breaches of one kind (or all, with kind empty) of a roster.
std::vector<rules::Breach> breaches(const model::Problem& p, const model::Roster& r, const std::string& kind = "");
/// Sum of amounts (in rule units) of the breaches of one kind.
double amountOf(const model::Problem& p, const model::Roster& r, const std::string& kind);

/// A scenario header: 2027-03-01 (a Monday) for `days` days, the shifts of the labour-facts
/// check values (Early 07:00-15:00, Late 14:00-22:00, Night 22:00-06:00, no breaks), skill rn.
std::string header(int days, const std::string& extraShifts = "");

}  // namespace rotaweave::test
