/// @brief rotaweave-bench: speed figures, benchmark-instance conversion, benchmark runs, and
/// checks of the CLI from outside (time limits, interruption).
/// Each mode lives in its own mode_*.cpp; this file only dispatches and maps errors to exit 2.
#include <iostream>
#include <stdexcept>
#include <string>
#include <vector>

#include "bench/modes.hpp"
#include "io/input_error.hpp"

namespace {

constexpr const char* kUsage =
    "usage: rotaweave-bench MODE ...\n"
    "  speed [ITEM...]              evaluation and generation rates, phase times; about 30 s an item\n"
    "                               (default generated:50x31)\n"
    "  convert INSTANCE.txt OUT.yaml\n"
    "  run INSTANCE.txt [--time-limit S] [--threads N] [--seed N] [--islands N]\n"
    "  limits [--limits 5,10,60] [--threads N] [--seed N] [ITEM...]\n"
    "                               `rotaweave solve` against its time limit, with peak memory (default:\n"
    "                               the 24 instances of $ROTAWEAVE_DATASET, generated:300x31, generated:1000x31)\n"
    "  interrupt [--at 0.5,2,5] [--threads N] [--seed N] [--phases] ITEM\n"
    "                               SIGINT to `rotaweave solve` at each time: latency and outputs\n"
    "  scaling ITEM [--time-limit S] [--threads 1,2,4,8,16] [--seed N] [--islands N]\n"
    "  table DIR [--time-limit S] [--threads N] [--seeds 1,2,3] [--instances 1-24] [--keep DIR]\n"
    "                               benchmark instances over seeds as a markdown table\n"
    "ITEM: a scenario .yaml, a benchmark InstanceN.txt (converted first) or generated:PxD (P people, D days)\n";

}  // namespace

int main(int argc, char** argv) {
  namespace bench = rotaweave::bench;
  const std::vector<std::string> all(argv + 1, argv + argc);
  if (all.empty()) {
    std::cerr << kUsage;
    return 2;
  }
  const bench::Args args(all.begin() + 1, all.end());
  try {
    if (all[0] == "speed") return bench::speedMode(args);
    if (all[0] == "convert") return bench::convertMode(args);
    if (all[0] == "run") return bench::runMode(args);
    if (all[0] == "limits") return bench::limitsMode(args);
    if (all[0] == "interrupt") return bench::interruptMode(args);
    if (all[0] == "scaling") return bench::scalingMode(args);
    if (all[0] == "table") return bench::tableMode(args);
    std::cerr << "rotaweave-bench: unknown mode '" << all[0] << "'\n" << kUsage;
    return 2;
  } catch (const rotaweave::io::InputError& e) {
    std::cerr << "rotaweave-bench: error: " << e.what() << "\n";
    return 2;
  } catch (const std::exception& e) {
    std::cerr << "rotaweave-bench: " << e.what() << "\n";
    return 2;
  }
}
