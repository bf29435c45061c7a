/// @brief `run INSTANCE.txt [--time-limit S] [--threads N] [--seed N] [--islands N] ...`: one
/// benchmark instance solved in-process (any solver parameter may be given), printed with the
/// published figures for it.
#include <cctype>
#include <cstdio>
#include <filesystem>
#include <stdexcept>
#include <string>

#include "bench/instance_format.hpp"
#include "bench/modes.hpp"
#include "bench/published_results.hpp"
#include "io/atomic_file.hpp"
#include "io/report_json.hpp"
#include "io/scenario_loader.hpp"
#include "report/report.hpp"
#include "search/solver.hpp"

namespace rotaweave::bench {

namespace fs = std::filesystem;

int runMode(const Args& args) {
  if (args.empty()) throw std::invalid_argument("usage: rotaweave-bench run INSTANCE.txt [--time-limit S] [--threads N] [--seed N] [--islands N]");
  search::SolverOptions o;
  o.seed = 1;
  o.timeLimit = 60;
  o.stallGenerations = 0;
  for (size_t i = 1; i + 1 < args.size(); i += 2) {
    if (args[i].rfind("--", 0) != 0) throw std::invalid_argument("expected an option such as --time-limit, got '" + args[i] + "'");
    search::setParameter(o, args[i].substr(2), std::stod(args[i + 1]));
  }
  const std::string stem = fs::path(args[0]).stem().string();
  const fs::path yaml = fs::temp_directory_path() / ("rotaweave-bench-" + stem + ".yaml");
  io::writeFileAtomic(yaml, toScenarioYaml(parseInstanceFile(args[0]), stem));
  const model::Problem p = io::loadScenario(yaml.string());
  const rules::RuleSet set(p);
  const auto result = search::solve(set, o, {}, nullptr);
  int number = 0;
  for (char c : stem)
    if (std::isdigit(static_cast<unsigned char>(c))) number = number * 10 + (c - '0');
  std::string published = "null";
  for (const auto& r : kPublishedResults)
    if (r.instance == number) {
      published = "{\"optimum\": " + (r.optimum ? std::to_string(*r.optimum) : std::string("null")) +
                  ", \"best_upper\": " + std::to_string(r.bestUpper) +
                  ", \"best_lower\": " + (r.bestLower ? std::to_string(*r.bestLower) : std::string("null")) + "}";
    }
  std::printf("{\"instance\": %s, \"best_hard\": %s, \"best_soft\": %s, \"seconds\": %.1f, \"generations\": %ld, \"threads\": %d, \"published\": %s}\n",
              io::jsonString(stem).c_str(), report::pointsText(result.score.hard).c_str(),
              report::pointsText(result.score.soft).c_str(), result.seconds, result.generations, result.threads, published.c_str());
  return 0;
}

}  // namespace rotaweave::bench
