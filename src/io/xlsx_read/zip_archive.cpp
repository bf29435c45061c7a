/// @brief minizip behind ZipArchive: locate a part, check its declared size, inflate in chunks.
#include "io/xlsx_read/zip_archive.hpp"

#include <unzip.h>

#include <cstdio>
#include <vector>

namespace rotaweave::io::xlsx_read {
namespace {

constexpr size_t kChunk = 64 * 1024;

std::string mib(size_t bytes) { return std::to_string(bytes / (1024 * 1024)) + " MiB"; }

}  // namespace

bool startsLikeZip(const std::string& path) {
  std::FILE* f = std::fopen(path.c_str(), "rb");
  if (!f) return false;
  unsigned char magic[4] = {0, 0, 0, 0};
  const size_t got = std::fread(magic, 1, 4, f);
  std::fclose(f);
  return got == 4 && magic[0] == 'P' && magic[1] == 'K' && magic[2] == 3 && magic[3] == 4;
}

ZipArchive::ZipArchive(const std::string& path) : zip_(unzOpen64(path.c_str())) {
  if (!zip_) throw ZipError{"not a readable zip container (the file may be damaged or only partly copied)"};
}

ZipArchive::~ZipArchive() { unzClose(static_cast<unzFile>(zip_)); }

bool ZipArchive::has(const std::string& name) { return unzLocateFile(static_cast<unzFile>(zip_), name.c_str(), 1) == UNZ_OK; }

void ZipArchive::stream(const std::string& name, size_t maxBytes, const std::function<bool(std::string_view)>& sink) {
  auto* zip = static_cast<unzFile>(zip_);
  if (unzLocateFile(zip, name.c_str(), 1) != UNZ_OK) throw ZipError{"the part " + name + " is missing"};
  unz_file_info64 info{};
  if (unzGetCurrentFileInfo64(zip, &info, nullptr, 0, nullptr, 0, nullptr, 0) != UNZ_OK)
    throw ZipError{"the entry of " + name + " is damaged"};
  // The declared size is checked first (an honest bomb is refused at once) and the inflated
  // bytes are counted as well, since a declared size may lie.
  if (info.uncompressed_size > maxBytes)
    throw ZipError{"the part " + name + " unpacks to " + mib(static_cast<size_t>(info.uncompressed_size)) + ", over the limit of " +
                   mib(maxBytes) + " (a damaged or hostile file, or far more than a roster)"};
  if (unzOpenCurrentFile(zip) != UNZ_OK) throw ZipError{"the part " + name + " cannot be opened (compression method not supported or damaged)"};
  std::vector<char> buffer(kChunk);
  size_t total = 0;
  bool stopped = false;
  for (;;) {
    const int got = unzReadCurrentFile(zip, buffer.data(), static_cast<unsigned>(buffer.size()));
    if (got < 0) {
      unzCloseCurrentFile(zip);
      throw ZipError{"the part " + name + " is damaged (inflate error " + std::to_string(got) + ")"};
    }
    if (got == 0) break;
    total += static_cast<size_t>(got);
    if (total > maxBytes) {
      unzCloseCurrentFile(zip);
      throw ZipError{"the part " + name + " unpacks to more than " + mib(maxBytes) + " (a damaged or hostile file, or far more than a roster)"};
    }
    if (!sink(std::string_view(buffer.data(), static_cast<size_t>(got)))) {
      stopped = true;
      break;
    }
  }
  const int closed = unzCloseCurrentFile(zip);
  if (!stopped && closed == UNZ_CRCERROR) throw ZipError{"the part " + name + " fails its checksum (the file is damaged)"};
}

std::string ZipArchive::read(const std::string& name, size_t maxBytes) {
  std::string out;
  stream(name, maxBytes, [&](std::string_view chunk) {
    out.append(chunk);
    return true;
  });
  return out;
}

}  // namespace rotaweave::io::xlsx_read
