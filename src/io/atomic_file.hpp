/// @brief Output files written under a temporary name and renamed, so none is ever half-written.
#pragma once
#include <filesystem>
#include <string>

namespace rotaweave::io {

/// Creates `dir` (and parents); throws OutputError if it cannot.
void ensureDirectory(const std::filesystem::path& dir);
/// Writes `content` to `path` atomically; throws OutputError on failure, leaving `path` untouched.
void writeFileAtomic(const std::filesystem::path& path, const std::string& content);
/// A temporary sibling name for `path`, for writers that need a file name (the workbook).
std::filesystem::path temporaryPathFor(const std::filesystem::path& path);
/// Renames a finished temporary file onto `path`; throws OutputError on failure.
void commitTemporary(const std::filesystem::path& temporary, const std::filesystem::path& path);

}  // namespace rotaweave::io
