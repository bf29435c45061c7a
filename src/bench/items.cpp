/// @brief Item resolution and the paths the bench needs.
#include "bench/items.hpp"

#include <unistd.h>

#include <cstdlib>
#include <stdexcept>
#include <system_error>

#include "bench/arguments.hpp"
#include "bench/generated_scenario.hpp"
#include "bench/instance_format.hpp"
#include "io/atomic_file.hpp"

namespace rotaweave::bench {
namespace {

constexpr const char* kGeneratedPrefix = "generated:";
/// Shift types of a generated item: the speed bench has always measured with three.
constexpr int kGeneratedShifts = 3;

Item generatedItem(const std::string& arg, const fs::path& scratch) {
  const std::string size = arg.substr(std::string(kGeneratedPrefix).size());
  const size_t x = size.find('x');
  if (x == std::string::npos) throw std::invalid_argument("expected generated:PxD (people x days), got '" + arg + "'");
  const long people = wholeNumber(size.substr(0, x), arg), days = wholeNumber(size.substr(x + 1), arg);
  if (people < 1 || people > 100000 || days < 1 || days > 366)
    throw std::invalid_argument(arg + ": people must be 1-100000 and days 1-366");
  Item item{arg, scratch / ("generated-" + size + ".yaml"), 0};
  io::writeFileAtomic(item.yaml,
                      generatedScenarioYaml(static_cast<int>(people), static_cast<int>(days), kGeneratedShifts));
  return item;
}

}  // namespace

int instanceNumber(const fs::path& path) {
  const std::string stem = path.stem().string();
  if (stem.rfind("Instance", 0) != 0 || stem.size() == 8 || stem.size() > 11) return 0;
  for (size_t i = 8; i < stem.size(); ++i)
    if (stem[i] < '0' || stem[i] > '9') return 0;
  return std::stoi(stem.substr(8));
}

Item resolveItem(const std::string& arg, const fs::path& scratch) {
  if (arg.rfind(kGeneratedPrefix, 0) == 0) return generatedItem(arg, scratch);
  const fs::path path(arg);
  if (path.extension() == ".txt") {
    const std::string stem = path.stem().string();
    Item item{stem, scratch / (stem + ".yaml"), instanceNumber(path)};
    io::writeFileAtomic(item.yaml, toScenarioYaml(parseInstanceFile(arg), stem));
    return item;
  }
  if (path.extension() == ".yaml" || path.extension() == ".yml") {
    if (!fs::is_regular_file(path)) throw std::invalid_argument("no scenario file '" + arg + "'");
    return Item{arg, fs::absolute(path), 0};
  }
  throw std::invalid_argument("expected InstanceN.txt, a scenario .yaml or generated:PxD, got '" + arg + "'");
}

fs::path datasetFolder() {
  if (const char* env = std::getenv("ROTAWEAVE_DATASET"); env && *env) return env;
  const fs::path relative = fs::path("..") / "shared" / "benchmarks" / "shift-scheduling";
  std::error_code ec;
  for (fs::path dir = binaryFolder(); !dir.empty() && dir != dir.root_path(); dir = dir.parent_path())
    if (fs::is_directory(dir / "src" / "bench", ec)) return (dir / relative).lexically_normal();
  return fs::absolute(relative).lexically_normal();
}

fs::path binaryFolder() {
  std::error_code ec;
  const fs::path self = fs::read_symlink("/proc/self/exe", ec);
  if (ec) throw std::runtime_error("cannot read /proc/self/exe: " + ec.message());
  return self.parent_path();
}

fs::path siblingBinary(const std::string& name) { return binaryFolder() / name; }

ScratchFolder::ScratchFolder(const std::string& purpose) {
  std::string pattern = (fs::temp_directory_path() / ("rotaweave-bench-" + purpose + "-XXXXXX")).string();
  if (!::mkdtemp(pattern.data())) throw std::runtime_error("cannot make a temporary folder " + pattern);
  path_ = pattern;
}

ScratchFolder::~ScratchFolder() {
  std::error_code ec;  // a folder left behind in /tmp is no reason to fail a finished run
  if (!keep_) fs::remove_all(path_, ec);
}

}  // namespace rotaweave::bench
