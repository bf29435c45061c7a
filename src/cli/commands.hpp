/// @brief Runs a parsed command and maps its outcome and errors to messages and exit codes.
#pragma once
#include "cli/options.hpp"

namespace rotaweave::cli {

int run(const Parsed& parsed);

}  // namespace rotaweave::cli
