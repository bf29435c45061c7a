/// @brief Read-only access to the parts of a zip container (an xlsx workbook) through minizip,
/// with every part's uncompressed size capped, so a zip bomb is refused rather than unpacked.
#pragma once
#include <cstddef>
#include <functional>
#include <string>
#include <string_view>

namespace rotaweave::io::xlsx_read {

/// Thrown for a container that cannot be read; the caller adds the file name and the fix.
struct ZipError {
  std::string message;
};

/// True when the file starts with the zip local-header signature "PK\3\4".
bool startsLikeZip(const std::string& path);

/// One open zip file. Not copyable; not thread-safe (minizip keeps a current entry).
class ZipArchive {
 public:
  /// Opens `path`; throws ZipError when it is not a readable zip.
  explicit ZipArchive(const std::string& path);
  ~ZipArchive();
  ZipArchive(const ZipArchive&) = delete;
  ZipArchive& operator=(const ZipArchive&) = delete;

  /// Whether the archive holds a part of exactly this name (as stored: "xl/workbook.xml").
  bool has(const std::string& name);
  /// The whole part; throws ZipError when it is absent, damaged or larger than `maxBytes`
  /// uncompressed (checked against the declared size first, then against what is inflated).
  std::string read(const std::string& name, size_t maxBytes);
  /// Streams the part in chunks of at most 64 KiB to `sink`, which returns false to stop early.
  /// The same size cap as read(); memory stays at one chunk.
  void stream(const std::string& name, size_t maxBytes, const std::function<bool(std::string_view)>& sink);

 private:
  void* zip_;  ///< unzFile
};

}  // namespace rotaweave::io::xlsx_read
