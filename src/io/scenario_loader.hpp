/// @brief Loads a scenario YAML file (and the rule files it includes) into a model::Problem.
///
/// All validation happens here: once a Problem exists it is consistent, and later stages
/// only assert. Errors are InputError values naming the file, line, column and key path.
#pragma once
#include <string>

#include "model/problem.hpp"

namespace rotaweave::io {

model::Problem loadScenario(const std::string& path);

}  // namespace rotaweave::io
