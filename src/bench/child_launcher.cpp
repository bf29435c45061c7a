/// @brief The helper process and its socket protocol: a request is the argv strings, the log
/// path and the timing fields; the answer is the ChildRun fields as fixed-size numbers.
#include "bench/child_launcher.hpp"

#include <sys/socket.h>
#include <sys/wait.h>
#include <unistd.h>

#include <cerrno>
#include <cstdint>
#include <cstring>
#include <stdexcept>
#include <string>

namespace rotaweave::bench {
namespace {

/// send() with MSG_NOSIGNAL: a helper that died must give an error here, not kill the bench
/// with SIGPIPE.
bool writeAll(int fd, const void* data, size_t size) {
  const char* p = static_cast<const char*>(data);
  while (size > 0) {
    const ssize_t n = ::send(fd, p, size, MSG_NOSIGNAL);
    if (n < 0 && errno == EINTR) continue;
    if (n <= 0) return false;
    p += n;
    size -= static_cast<size_t>(n);
  }
  return true;
}

bool readAll(int fd, void* data, size_t size) {
  char* p = static_cast<char*>(data);
  while (size > 0) {
    const ssize_t n = ::read(fd, p, size);
    if (n < 0 && errno == EINTR) continue;
    if (n <= 0) return false;  // 0: the other side closed the socket
    p += n;
    size -= static_cast<size_t>(n);
  }
  return true;
}

template <class T>
bool writeValue(int fd, const T& value) {
  return writeAll(fd, &value, sizeof value);
}
template <class T>
bool readValue(int fd, T& value) {
  return readAll(fd, &value, sizeof value);
}

bool writeString(int fd, const std::string& s) {
  return writeValue(fd, static_cast<std::uint32_t>(s.size())) && writeAll(fd, s.data(), s.size());
}

bool readString(int fd, std::string& s) {
  std::uint32_t size = 0;
  if (!readValue(fd, size)) return false;
  s.resize(size);
  return readAll(fd, s.data(), size);
}

/// The answer: every ChildRun field as a plain number (the optionals as flag and value).
struct Answer {
  int hasExit, exitStatus, hasSignal, termSignal, killed, signalled;
  double wallSeconds, signalToExitSeconds, peakRssMb;
};

bool readRequest(int fd, ChildSpec& spec) {
  std::uint32_t count = 0;
  if (!readValue(fd, count)) return false;
  spec.argv.assign(count, "");
  for (auto& arg : spec.argv)
    if (!readString(fd, arg)) return false;
  std::string log;
  int hasSignalAfter = 0;
  double signalAfter = 0;
  if (!readString(fd, log) || !readValue(fd, spec.killAfter) || !readValue(fd, hasSignalAfter) ||
      !readValue(fd, signalAfter) || !readValue(fd, spec.signal))
    return false;
  spec.log = log;
  spec.signalAfter.reset();
  if (hasSignalAfter) spec.signalAfter = signalAfter;
  return true;
}

/// The helper's whole life: run what is asked until the bench closes the socket.
[[noreturn]] void serve(int fd) {
  ChildSpec spec;
  while (readRequest(fd, spec)) {
    Answer answer{};
    try {
      const ChildRun run = runChild(spec);
      answer = Answer{run.exitStatus.has_value(),
                      run.exitStatus.value_or(0),
                      run.termSignal.has_value(),
                      run.termSignal.value_or(0),
                      run.killed,
                      run.signalled,
                      run.wallSeconds,
                      run.signalToExitSeconds,
                      run.peakRssMb};
    } catch (const std::exception&) {
      answer.hasExit = 0;  // neither an exit nor a signal: the bench reports the child as not run
    }
    if (!writeValue(fd, answer)) break;
  }
  ::_exit(0);
}

}  // namespace

ChildLauncher::ChildLauncher() {
  int fds[2];
  if (::socketpair(AF_UNIX, SOCK_STREAM | SOCK_CLOEXEC, 0, fds) != 0)
    throw std::runtime_error(std::string("socketpair failed: ") + std::strerror(errno));
  helper_ = ::fork();
  if (helper_ < 0) throw std::runtime_error(std::string("fork failed: ") + std::strerror(errno));
  if (helper_ == 0) {
    ::close(fds[0]);
    serve(fds[1]);
  }
  ::close(fds[1]);
  socket_ = fds[0];
}

ChildLauncher::~ChildLauncher() {
  ::close(socket_);
  int status = 0;
  while (::waitpid(helper_, &status, 0) < 0 && errno == EINTR) {
  }
}

ChildRun ChildLauncher::run(const ChildSpec& spec) {
  bool sent = writeValue(socket_, static_cast<std::uint32_t>(spec.argv.size()));
  for (const auto& arg : spec.argv) sent = sent && writeString(socket_, arg);
  sent = sent && writeString(socket_, spec.log.string()) && writeValue(socket_, spec.killAfter) &&
         writeValue(socket_, static_cast<int>(spec.signalAfter.has_value())) &&
         writeValue(socket_, spec.signalAfter.value_or(0.0)) && writeValue(socket_, spec.signal);
  Answer answer{};
  if (!sent || !readValue(socket_, answer)) throw std::runtime_error("the bench's child launcher stopped");
  ChildRun run;
  if (answer.hasExit) run.exitStatus = answer.exitStatus;
  if (answer.hasSignal) run.termSignal = answer.termSignal;
  run.killed = answer.killed != 0;
  run.signalled = answer.signalled != 0;
  run.wallSeconds = answer.wallSeconds;
  run.signalToExitSeconds = answer.signalToExitSeconds;
  run.peakRssMb = answer.peakRssMb;
  return run;
}

}  // namespace rotaweave::bench
