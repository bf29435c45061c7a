/// @brief What a bench mode can be asked to run, as a scenario file: a benchmark instance
/// (InstanceN.txt, converted to YAML first), a scenario YAML as it is, or `generated:PxD`
/// (the generated scenario with P people and D days). Also where the bench finds the dataset,
/// the `rotaweave` binary and room for scratch files.
#pragma once
#include <filesystem>
#include <string>
#include <vector>

namespace rotaweave::bench {

namespace fs = std::filesystem;

struct Item {
  std::string label;  ///< "Instance13", "generated:300x31", or the YAML path as given
  fs::path yaml;      ///< the scenario to solve
  int instance = 0;   ///< benchmark instance number, 0 for anything else
};

/// Resolves `arg`, writing a converted or generated scenario into `scratch` (which must exist).
/// Throws io::InputError for an unreadable instance, std::invalid_argument for a bad argument.
Item resolveItem(const std::string& arg, const fs::path& scratch);

/// The instance number of "InstanceN.txt" (any folder), or 0.
int instanceNumber(const fs::path& path);

/// The benchmark folder: $ROTAWEAVE_DATASET, else ../shared/benchmarks/shift-scheduling beside
/// the source tree this binary was built in (found by walking up from the binary to a folder
/// holding src/bench), else that path beside the current folder. Not checked for existence.
fs::path datasetFolder();

/// The folder this program lies in (through /proc/self/exe).
fs::path binaryFolder();
/// A program installed next to this one e.g. "rotaweave".
fs::path siblingBinary(const std::string& name);

/// A fresh folder under the system temp folder, removed with everything in it when the value
/// goes out of scope unless release() was called.
class ScratchFolder {
 public:
  explicit ScratchFolder(const std::string& purpose);
  ~ScratchFolder();
  ScratchFolder(const ScratchFolder&) = delete;
  ScratchFolder& operator=(const ScratchFolder&) = delete;
  const fs::path& path() const { return path_; }
  /// Keep the folder: its path is where the caller says the results are.
  void release() { keep_ = true; }

 private:
  fs::path path_;
  bool keep_ = false;
};

}  // namespace rotaweave::bench
