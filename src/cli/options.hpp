/// @brief Command-line parsing (Boost.ProgramOptions) into plain requests for app/.
#pragma once
#include <string>
#include <variant>
#include <vector>

#include "app/commands.hpp"

namespace rotaweave::cli {

struct CheckArgs {
  std::string scenario, roster, out = "out";
  std::string baseline;  ///< --baseline: the roster `roster` was edited from (may be empty)
};
struct HelpArgs {
  std::string text;
};

using Parsed = std::variant<HelpArgs, CheckArgs, app::SolveRequest, app::ReplanRequest>;

/// docs/options.md, generated from the solver parameter table.
std::string optionsMarkdown();

/// Throws UsageError on bad usage.
Parsed parseCommandLine(int argc, char** argv);

struct UsageError : std::runtime_error {
  using std::runtime_error::runtime_error;
};

}  // namespace rotaweave::cli
