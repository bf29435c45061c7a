/// @brief Atomic output: write a sibling temporary file, flush it, rename it over the target.
#include "io/atomic_file.hpp"

#include <unistd.h>

#include <cstdio>

#include "io/input_error.hpp"

namespace rotaweave::io {

namespace fs = std::filesystem;

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
  fs::rename(temporary, path, ec);
  if (ec) {
    fs::remove(temporary, ec);
    throw OutputError("cannot write '" + path.string() + "'; check that the folder is writable");
  }
}

void writeFileAtomic(const fs::path& path, const std::string& content) {
  const fs::path tmp = temporaryPathFor(path);
  std::FILE* f = std::fopen(tmp.c_str(), "wb");
  if (!f) throw OutputError("cannot write '" + path.string() + "'; check that the folder is writable");
  const bool ok = std::fwrite(content.data(), 1, content.size(), f) == content.size() && std::fflush(f) == 0 &&
                  ::fsync(fileno(f)) == 0;
  if (std::fclose(f) != 0 || !ok) {
    std::error_code ec;
    fs::remove(tmp, ec);
    throw OutputError("cannot write '" + path.string() + "' (disk full?)");
  }
  commitTemporary(tmp, path);
}

}  // namespace rotaweave::io
