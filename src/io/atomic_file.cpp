/// @brief Atomic output: write a sibling temporary file, flush it, rename it over the target.
#include "io/atomic_file.hpp"

#include <unistd.h>

#include <cerrno>
#include <cstdio>
#include <cstring>

#include "io/disk_fault.hpp"
#include "io/input_error.hpp"

namespace rotaweave::io {

namespace fs = std::filesystem;

namespace {

void renameIntoPlace(const fs::path& temporary, const fs::path& path) {
  std::error_code ec;
  fs::rename(temporary, path, ec);
  if (ec) {
    fs::remove(temporary, ec);
    throw OutputError("cannot write '" + path.string() + "'; check that the folder is writable");
  }
}

[[noreturn]] void failedWrite(const fs::path& temporary, const fs::path& path, int error) {
  std::error_code ec;
  fs::remove(temporary, ec);
  throw OutputError("cannot write '" + path.string() + "': " + (error ? std::strerror(error) : "write failed") +
                    (error == ENOSPC || error == EDQUOT ? " (disk full)" : ""));
}

}  // namespace

void ensureDirectory(const fs::path& dir) {
  std::error_code ec;
  fs::create_directories(dir, ec);
  if (ec || !fs::is_directory(dir))
    throw OutputError("cannot create the output folder '" + dir.string() + "': " +
                      (ec ? ec.message() : std::string("a file of that name is in the way")) + "; choose another --out");
}

fs::path temporaryPathFor(const fs::path& path) {
  return path.parent_path() / ("." + path.filename().string() + ".tmp" + std::to_string(::getpid()));
}

void commitTemporary(const fs::path& temporary, const fs::path& path) {
  std::error_code ec;
  const auto size = fs::file_size(temporary, ec);
  if (!ec && claimOutputBytes(static_cast<size_t>(size)) < size) failedWrite(temporary, path, ENOSPC);
  renameIntoPlace(temporary, path);
}

void writeFileAtomic(const fs::path& path, const std::string& content) {
  const fs::path tmp = temporaryPathFor(path);
  std::FILE* f = std::fopen(tmp.c_str(), "wb");
  if (!f) throw OutputError("cannot write '" + path.string() + "': " + std::strerror(errno) + "; check that the folder is writable");
  const size_t fits = claimOutputBytes(content.size());
  errno = 0;
  bool ok = std::fwrite(content.data(), 1, fits, f) == fits && std::fflush(f) == 0 && ::fsync(fileno(f)) == 0;
  int error = errno;
  if (ok && fits < content.size()) ok = false, error = ENOSPC;  // the simulated disk is full
  if (std::fclose(f) != 0 && ok) ok = false, error = errno;
  if (!ok) failedWrite(tmp, path, error);
  renameIntoPlace(tmp, path);
}

}  // namespace rotaweave::io
