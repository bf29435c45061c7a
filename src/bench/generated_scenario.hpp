/// @brief A generated ward-like scenario of any size, for speed and scale measurements.
#pragma once
#include <string>

namespace rotaweave::bench {

/// YAML text of a scenario with `people` staff, `days` days from 2027-03-01 and `shifts`
/// shift types (3 to 6), two skills, contracts, absences, requests and working-time rules.
/// Deterministic for the same arguments.
std::string generatedScenarioYaml(int people, int days, int shifts);

}  // namespace rotaweave::bench
