/// @brief An advisory lock on an output folder, so that two runs never write one `--out` at once.
#pragma once
#include <filesystem>
#include <string>

namespace rotaweave::io {

/// Holds an exclusive flock(2) on the file `.NAME.lock` beside the folder NAME for its lifetime;
/// the file holds the holder's process id and is removed on release.
class OutputLock {
 public:
  /// Locks `folder` (absolute and normalised; its parent must exist). Throws OutputError at
  /// once, naming `shown` (the folder as the user wrote it) and the other run's process id,
  /// when another run holds the lock; it never waits.
  OutputLock(const std::filesystem::path& folder, const std::string& shown);
  ~OutputLock();
  OutputLock(const OutputLock&) = delete;
  OutputLock& operator=(const OutputLock&) = delete;

  static std::filesystem::path lockPathFor(const std::filesystem::path& folder);

 private:
  std::filesystem::path path_;
  int fd_ = -1;
};

}  // namespace rotaweave::io
