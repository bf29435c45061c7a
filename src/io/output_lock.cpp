/// @brief The output folder's lock: flock on a file beside it, checked to be the file still there.
#include "io/output_lock.hpp"

#include <fcntl.h>
#include <sys/file.h>
#include <sys/stat.h>
#include <unistd.h>

#include <cerrno>
#include <cstring>

#include "io/input_error.hpp"

namespace rotaweave::io {
namespace {

/// " (process 1234)" from the lock file's content, or "".
std::string holderOf(int fd) {
  char text[32] = {};
  const ssize_t n = ::pread(fd, text, sizeof text - 1, 0);
  if (n <= 0) return "";
  std::string pid(text, static_cast<size_t>(n));
  while (!pid.empty() && (pid.back() == '\n' || pid.back() == ' ')) pid.pop_back();
  if (pid.empty() || pid.find_first_not_of("0123456789") != std::string::npos) return "";
  return " (process " + pid + ")";
}

}  // namespace

std::filesystem::path OutputLock::lockPathFor(const std::filesystem::path& folder) {
  return folder.parent_path() / ("." + folder.filename().string() + ".lock");
}

OutputLock::OutputLock(const std::filesystem::path& folder, const std::string& shown) : path_(lockPathFor(folder)) {
  // A run that releases the lock removes the file; one that opened it just before may then
  // lock a file no longer there. So: lock, then check that the file at the path is the one
  // locked, or try again.
  for (int attempt = 0; attempt < 50; ++attempt) {
    const int fd = ::open(path_.c_str(), O_RDWR | O_CREAT | O_CLOEXEC, 0644);
    if (fd < 0)
      throw OutputError("cannot create the lock file '" + path_.string() + "' for the output folder '" + shown +
                        "': " + std::strerror(errno) + "; the folder above it must be writable, or choose another --out");
    if (::flock(fd, LOCK_EX | LOCK_NB) != 0) {
      const int error = errno;
      const std::string holder = holderOf(fd);
      ::close(fd);
      if (error == EWOULDBLOCK)
        throw OutputError("another rotaweave run" + holder + " is writing to the output folder '" + shown +
                          "'; wait until it has finished, or choose another --out (lock file " + path_.string() + ")");
      throw OutputError("cannot lock the output folder '" + shown + "' (lock file " + path_.string() + "): " +
                        std::strerror(error) + "; choose another --out");
    }
    struct stat locked{}, there{};
    if (::fstat(fd, &locked) == 0 && ::stat(path_.c_str(), &there) == 0 && locked.st_dev == there.st_dev &&
        locked.st_ino == there.st_ino) {
      fd_ = fd;
      const std::string pid = std::to_string(::getpid()) + "\n";
      if (::ftruncate(fd, 0) == 0 && ::pwrite(fd, pid.data(), pid.size(), 0) < 0) {
        // The process id is only for the other run's message; the lock holds without it.
      }
      return;
    }
    ::close(fd);
  }
  throw OutputError("cannot lock the output folder '" + shown + "' (lock file " + path_.string() +
                    " keeps changing); choose another --out");
}

OutputLock::~OutputLock() {
  if (fd_ < 0) return;
  ::unlink(path_.c_str());  // while still locked, so that no run locks a removed file
  ::close(fd_);
}

}  // namespace rotaweave::io
