/// @brief Output set: preflight checks, lock, staging folder, whole-set swap and clean-up.
#include "io/output_folder.hpp"

#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

#include <algorithm>
#include <cerrno>
#include <cstdio>
#include <cstring>

#include "io/input_error.hpp"

namespace rotaweave::io {

namespace fs = std::filesystem;

namespace {

/// The files of the standard set (io/output_writer.cpp) and of earlier versions' per-file
/// temporaries (".roster.csv.tmp123").
bool isTemporaryName(const std::string& name) {
  const size_t tmp = name.rfind(".tmp");
  return name.size() > 1 && name[0] == '.' && tmp != std::string::npos && tmp + 4 < name.size() &&
         name.find_first_not_of("0123456789", tmp + 4) == std::string::npos;
}

bool isCalendarName(const std::string& name) {
  return (name.size() > 4 && name.compare(name.size() - 4, 4, ".ics") == 0) || isTemporaryName(name);
}

/// "a, b and 3 more".
std::string someNames(const std::vector<std::string>& names) {
  std::string out;
  const size_t shown = std::min<size_t>(names.size(), 4);
  for (size_t i = 0; i < shown; ++i) out += (i ? ", " : "") + names[i];
  if (names.size() > shown) out += " and " + std::to_string(names.size() - shown) + " more";
  return out;
}

void syncFolder(const fs::path& dir) {
  const int fd = ::open(dir.c_str(), O_RDONLY | O_DIRECTORY | O_CLOEXEC);
  if (fd < 0) return;
  ::fsync(fd);  // best effort: the files in it were synced as they were written
  ::close(fd);
}

std::string prefixFor(const fs::path& target, const char* kind) {
  return "." + target.filename().string() + kind;
}

}  // namespace

bool OutputFolder::isOutputName(const std::string& name) {
  static const char* const kSet[] = {"roster.csv", "report.json", "report.txt", "roster.xlsx", "changes.csv", "calendars"};
  return std::find(std::begin(kSet), std::end(kSet), name) != std::end(kSet) || isTemporaryName(name);
}

OutputFolder::OutputFolder(const fs::path& out) : shown_(out.string()) {
  try {
    prepare(out);
  } catch (...) {
    discard();
    throw;
  }
}

OutputFolder::~OutputFolder() { discard(); }

void OutputFolder::prepare(const fs::path& out) {
  const std::string cannot = "cannot create the output folder '" + shown_ + "': ";
  std::error_code ec;
  // Absolute, with symbolic links resolved, so that every path to one folder takes one lock.
  fs::path target = fs::absolute(out, ec);
  if (!ec) target = fs::weakly_canonical(target, ec);
  if (ec) throw OutputError(cannot + ec.message() + "; choose another --out");
  if (target.filename().empty()) target = target.parent_path();
  if (target.filename().empty() || target == target.root_path())
    throw OutputError("'" + shown_ + "' cannot be an output folder (it is the root folder); choose another --out");
  target_ = target;

  // The folders above it, created where missing and remembered, so that a failed run can
  // remove them again.
  std::vector<fs::path> missing;
  for (fs::path p = target_.parent_path(); !fs::exists(p, ec); p = p.parent_path()) {
    if (p == p.root_path()) break;
    missing.push_back(p);
  }
  std::reverse(missing.begin(), missing.end());
  for (const fs::path& p : missing) {
    if (!fs::create_directory(p, ec) || ec) throw OutputError(cannot + (ec ? ec.message() : "it exists") + "; choose another --out");
    createdAbove_.push_back(p);
  }
  if (!fs::is_directory(target_.parent_path(), ec))
    throw OutputError(cannot + "a file is in the way at '" + target_.parent_path().string() + "'; choose another --out");

  lock_.emplace(target_, shown_);
  removeLeftovers();
  checkTarget();

  staging_ = target_.parent_path() / (prefixFor(target_, ".new-") + std::to_string(::getpid()));
  fs::remove_all(staging_, ec);
  if (!fs::create_directory(staging_, ec) || ec)
    throw OutputError("cannot write beside the output folder '" + shown_ + "' (in " + target_.parent_path().string() + "): " +
                      (ec ? ec.message() : std::string("a folder of that name is in the way")) +
                      "; a run writes its files there first and then swaps them in, so that folder must be writable; "
                      "choose another --out");
  // The new set keeps the folder's permissions (a folder kept private stays private).
  if (previousMode_ != 0) ::chmod(staging_.c_str(), static_cast<mode_t>(previousMode_));
  // A probe, so that a full or read-only file system is found now rather than after the search.
  const fs::path probe = staging_ / ".probe";
  std::FILE* f = std::fopen(probe.c_str(), "wb");
  const bool ok = f && std::fputs("rotaweave\n", f) >= 0 && std::fflush(f) == 0;
  const int error = errno;
  if (f) std::fclose(f);
  fs::remove(probe, ec);
  if (!ok)
    throw OutputError("cannot write beside the output folder '" + shown_ + "' (in " + target_.parent_path().string() + "): " +
                      std::strerror(error) + "; choose another --out");
}

void OutputFolder::removeLeftovers() const {
  // The lock is held, so whatever a run left here is from a run that was killed: its staging
  // folders are incomplete, and a set it moved aside belongs back in place.
  std::error_code ec;
  const std::string fresh = prefixFor(target_, ".new-"), aside = prefixFor(target_, ".old-");
  std::vector<fs::path> stale, old;
  for (const auto& entry : fs::directory_iterator(target_.parent_path(), ec)) {
    const std::string name = entry.path().filename().string();
    if (name.rfind(fresh, 0) == 0) stale.push_back(entry.path());
    if (name.rfind(aside, 0) == 0) old.push_back(entry.path());
  }
  for (const fs::path& p : stale) fs::remove_all(p, ec);
  if (!fs::exists(target_, ec) && !old.empty()) {
    fs::rename(old.front(), target_, ec);
    old.erase(old.begin());
  }
  for (const fs::path& p : old) fs::remove_all(p, ec);
}

void OutputFolder::checkTarget() {
  struct stat st{}, above{};
  if (::lstat(target_.c_str(), &st) != 0) return;  // a new folder
  if (!S_ISDIR(st.st_mode))
    throw OutputError("cannot create the output folder '" + shown_ + "': a file of that name is in the way; choose another --out");
  // Write permission is asked of the folder even where the system would grant it (root): a
  // folder made read-only is one its owner wants left alone.
  if ((st.st_mode & 0222) == 0 || ::access(target_.c_str(), W_OK) != 0)
    throw OutputError("the output folder '" + shown_ + "' is read-only; make it writable (chmod u+w) or choose another --out");
  previousMode_ = st.st_mode & 07777;
  if (::stat(target_.parent_path().c_str(), &above) == 0 && above.st_dev != st.st_dev)
    throw OutputError("the output folder '" + shown_ + "' is a mount point; a run swaps its folder in whole, so give a folder "
                      "inside it as --out");
  std::error_code ec;
  std::vector<std::string> foreign;
  for (const auto& entry : fs::directory_iterator(target_, ec)) {
    const std::string name = entry.path().filename().string();
    hadPrevious_ = true;
    if (!isOutputName(name)) {
      foreign.push_back(name);
      continue;
    }
    if (name != "calendars") continue;
    if (!entry.is_directory(ec)) {
      foreign.push_back(name);
      continue;
    }
    for (const auto& cal : fs::directory_iterator(entry.path(), ec))
      if (!isCalendarName(cal.path().filename().string()) || !cal.is_regular_file(ec))
        foreign.push_back("calendars/" + cal.path().filename().string());
  }
  if (ec) throw OutputError("cannot read the output folder '" + shown_ + "': " + ec.message() + "; choose another --out");
  if (!foreign.empty()) {
    std::sort(foreign.begin(), foreign.end());
    throw OutputError("the output folder '" + shown_ + "' holds files rotaweave did not write (" + someNames(foreign) +
                      "); a run replaces the folder's whole content, so move them elsewhere, or choose an empty or new --out");
  }
}

void OutputFolder::writeSet(const std::function<void(const fs::path& dir)>& write) {
  try {
    write(staging_);
  } catch (const OutputError& e) {
    // Name the file as it would have been in --out, not in the staging folder.
    std::string message = e.what();
    const std::string from = staging_.string(), to = target_.string();
    for (size_t at = message.find(from); at != std::string::npos; at = message.find(from, at + to.size()))
      message.replace(at, from.size(), to);
    throw OutputError(message + keptNote());
  }
  commit();
}

void OutputFolder::commit() {
  syncFolder(staging_);
  std::error_code ec;
  const bool previous = fs::exists(target_, ec);
  if (!previous) {
    if (::rename(staging_.c_str(), target_.c_str()) != 0)
      throw OutputError("cannot move the new outputs into '" + shown_ + "': " + std::strerror(errno) + keptNote());
  } else if (::renameat2(AT_FDCWD, staging_.c_str(), AT_FDCWD, target_.c_str(), RENAME_EXCHANGE) == 0) {
    fs::remove_all(staging_, ec);  // now the previous set
  } else {
    // File systems without an atomic exchange: move the previous set aside, the new one in,
    // and back again on failure. A run killed between the two is repaired by the next one.
    const fs::path aside = target_.parent_path() / (prefixFor(target_, ".old-") + std::to_string(::getpid()));
    if (::rename(target_.c_str(), aside.c_str()) != 0)
      throw OutputError("cannot replace the outputs in '" + shown_ + "': " + std::strerror(errno) + keptNote());
    if (::rename(staging_.c_str(), target_.c_str()) != 0) {
      const int error = errno;
      ::rename(aside.c_str(), target_.c_str());
      throw OutputError("cannot replace the outputs in '" + shown_ + "': " + std::strerror(error) + keptNote());
    }
    fs::remove_all(aside, ec);
  }
  committed_ = true;
  syncFolder(target_.parent_path());
}

void OutputFolder::discard() noexcept {
  std::error_code ec;
  if (!committed_ && !staging_.empty()) fs::remove_all(staging_, ec);
  lock_.reset();
  if (!committed_)
    for (auto it = createdAbove_.rbegin(); it != createdAbove_.rend(); ++it) fs::remove(*it, ec);  // only if empty
  createdAbove_.clear();
  staging_.clear();
}

std::string OutputFolder::keptNote() const {
  return hadPrevious_ ? "; nothing in '" + shown_ + "' was changed: the previous outputs there are kept as they were"
                      : "; no outputs were written";
}

}  // namespace rotaweave::io
