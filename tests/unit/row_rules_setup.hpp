/// @brief The row-rules scenario with everything a re-fit needs, shared by the re-fit and relaxation tests.
#pragma once
#include <string>

#include "fixtures.hpp"
#include "search/eligibility.hpp"
#include "search/row_refit.hpp"

namespace rotaweave::test {

struct RowRulesSetup {
  explicit RowRulesSetup(const std::string& history) : p(rowRulesScenario(history)), set(p), e(p), refit(set, e), ev(set) {}
  const model::Problem p;
  const rules::RuleSet set;
  const search::Eligibility e;
  search::RowRefit refit;
  eval::Evaluator ev;
};

}  // namespace rotaweave::test
