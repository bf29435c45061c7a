/// @brief Shared helpers of the fuzz targets: a private scratch folder and whole-file writes.
#pragma once
#include <unistd.h>

#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <string>

namespace rotaweave::fuzz {

/// A folder of this process's own under the system temporary folder, created once.
inline const std::filesystem::path& scratchDir() {
  static const std::filesystem::path dir = [] {
    auto d = std::filesystem::temp_directory_path() / ("rotaweave-fuzz-" + std::to_string(::getpid()));
    std::filesystem::create_directories(d);
    return d;
  }();
  return dir;
}

/// Replaces `name` in the scratch folder with exactly these bytes; returns its path.
inline std::string writeScratch(const char* name, const uint8_t* data, size_t size) {
  const std::string path = (scratchDir() / name).string();
  std::FILE* f = std::fopen(path.c_str(), "wb");
  if (!f) std::abort();
  if (size && std::fwrite(data, 1, size, f) != size) std::abort();
  std::fclose(f);
  return path;
}

}  // namespace rotaweave::fuzz
