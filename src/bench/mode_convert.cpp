/// @brief `convert INSTANCE.txt OUT.yaml`: a benchmark instance as our scenario format.
#include <filesystem>
#include <stdexcept>

#include "bench/instance_format.hpp"
#include "bench/modes.hpp"
#include "io/atomic_file.hpp"

namespace rotaweave::bench {

int convertMode(const Args& args) {
  if (args.size() != 2) throw std::invalid_argument("usage: rotaweave-bench convert INSTANCE.txt OUT.yaml");
  const auto instance = parseInstanceFile(args[0]);
  io::writeFileAtomic(args[1], toScenarioYaml(instance, std::filesystem::path(args[0]).stem().string()));
  return 0;
}

}  // namespace rotaweave::bench
