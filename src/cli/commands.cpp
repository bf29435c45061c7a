/// @brief Dispatch to app/ and print the summary.
#include "cli/commands.hpp"

#include <iostream>

#include "report/text.hpp"

namespace rotaweave::cli {
namespace {

int finish(const app::Outcome& outcome, const std::string& out, bool quiet) {
  if (!quiet) std::cout << report::renderSummary(outcome.report) << "outputs written to " << out << "/\n";
  return outcome.exitCode;
}

}  // namespace

int run(const Parsed& parsed) {
  if (const auto* help = std::get_if<HelpArgs>(&parsed)) {
    std::cout << help->text;
    return 0;
  }
  if (const auto* c = std::get_if<CheckArgs>(&parsed)) return finish(app::check(c->scenario, c->roster, c->out, c->baseline), c->out, false);
  if (const auto* s = std::get_if<app::SolveRequest>(&parsed)) return finish(app::solve(*s), s->out.string(), s->options.quiet);
  const auto& r = std::get<app::ReplanRequest>(parsed);
  return finish(app::replan(r), r.solve.out.string(), r.solve.options.quiet);
}

}  // namespace rotaweave::cli
