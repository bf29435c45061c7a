/// @brief Shared state of one scenario load: the problem being built and name lookups.
#pragma once
#include <deque>
#include <string>
#include <vector>

#include "io/yaml_reader.hpp"
#include "model/problem.hpp"

namespace rotaweave::io::detail {

struct LoadContext {
  model::Problem& problem;
  std::string scenarioFile;
  std::deque<std::string> fileNames;  ///< Included files; a deque keeps the addresses Fields point to.

  ShiftIdx shift(const Field& f) const;                ///< A known shift id.
  SkillIdx skill(const Field& f) const;                ///< A known skill id.
  StaffIdx staff(const Field& f) const;                ///< A known staff id.
  int contract(const Field& f) const;                  ///< A known contract id.
  DayIdx periodDay(const Field& f) const;              ///< A date inside the period.
  std::vector<std::string> shiftIds() const;
};

/// Parses `rules:` (include and list) into problem.rules; staff must be loaded already.
void loadRules(LoadContext& ctx, const Field& rules);
/// Adds the rules that always apply and those implied by contract hours.
void addImpliedRules(model::Problem& problem);

}  // namespace rotaweave::io::detail
