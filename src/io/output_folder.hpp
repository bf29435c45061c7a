/// @brief The outputs of a run as one set: written into a fresh folder beside `--out`, then
/// swapped in whole, under a lock, after checks made before any input is read.
///
/// A run never leaves a mix of two runs' files or a half-written set: the previous complete
/// set stays in place until the new one is complete, and survives any failure untouched.
#pragma once
#include <filesystem>
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "io/output_lock.hpp"

namespace rotaweave::io {

class OutputFolder {
 public:
  /// Prepares `out` for a run, before any input is read or any search starts, and throws
  /// OutputError (exit status 2) with what to do when it cannot be used:
  ///  - creates the folders above `out` that are missing (removed again if the run fails);
  ///  - locks `out` (`.NAME.lock` beside it): a run already writing there refuses this one;
  ///  - removes what runs killed while writing left beside `out` (`.NAME.new-*`, and puts back
  ///    a previous set left at `.NAME.old-*`);
  ///  - refuses `out` when it is a file, a read-only folder, a mount point, or holds files
  ///    rotaweave did not write (a run replaces the folder's whole content);
  ///  - creates the staging folder `.NAME.new-PID` beside `out` and writes a probe into it.
  explicit OutputFolder(const std::filesystem::path& out);
  /// Unless the set was committed: removes the staging folder and the folders created above
  /// `out`; then releases the lock.
  ~OutputFolder();
  OutputFolder(const OutputFolder&) = delete;
  OutputFolder& operator=(const OutputFolder&) = delete;

  /// Runs `write` into the staging folder, then replaces the previous set with it in one step
  /// (renameat2 RENAME_EXCHANGE, or two renames where the file system lacks it). On failure
  /// throws OutputError saying that the previous set was kept (or that none was written).
  void writeSet(const std::function<void(const std::filesystem::path& dir)>& write);

  const std::filesystem::path& target() const { return target_; }    ///< `out`, absolute.
  const std::filesystem::path& staging() const { return staging_; }  ///< Where the set is written.

  /// Whether `name` (a file or folder directly in an output folder) is one rotaweave writes.
  static bool isOutputName(const std::string& name);

 private:
  void prepare(const std::filesystem::path& out);
  void checkTarget();
  void removeLeftovers() const;
  void commit();
  void discard() noexcept;
  std::string keptNote() const;

  std::string shown_;                       ///< `--out` as given, for messages.
  std::filesystem::path target_, staging_;  ///< Absolute.
  std::vector<std::filesystem::path> createdAbove_;  ///< Folders above `out` this run created, outermost first.
  std::optional<OutputLock> lock_;
  unsigned previousMode_ = 0;  ///< Permission bits of the existing `out`, given to the new set.
  bool hadPrevious_ = false, committed_ = false;
};

}  // namespace rotaweave::io
