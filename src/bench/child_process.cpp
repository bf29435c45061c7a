/// @brief fork/exec and a wait4 polling loop.
#include "bench/child_process.hpp"

#include <fcntl.h>
#include <signal.h>
#include <sys/resource.h>
#include <sys/wait.h>
#include <unistd.h>

#include <cerrno>
#include <cstdio>
#include <cstring>
#include <stdexcept>
#include <thread>

#include "bench/measure.hpp"

namespace rotaweave::bench {
namespace {

/// How often the parent looks at the child: the resolution of the times it reports.
constexpr auto kPollPeriod = std::chrono::milliseconds(1);

[[noreturn]] void execChild(const std::vector<char*>& argv, const char* log) {
  const int fd = ::open(log, O_WRONLY | O_CREAT | O_TRUNC | O_CLOEXEC, 0644);
  if (fd >= 0) {
    ::dup2(fd, 1);
    ::dup2(fd, 2);
  }
  ::execv(argv[0], argv.data());
  // Only async-signal-safe calls between fork and exec: write, not printf or strerror.
  static const char kMessage[] = "rotaweave-bench: cannot execute the program (missing, or not executable)\n";
  [[maybe_unused]] const auto written = ::write(2, kMessage, sizeof kMessage - 1);
  ::_exit(127);
}

}  // namespace

ChildRun runChild(const ChildSpec& spec) {
  if (spec.argv.empty()) throw std::invalid_argument("runChild: no program");
  std::vector<char*> argv;
  for (const auto& a : spec.argv) argv.push_back(const_cast<char*>(a.c_str()));
  argv.push_back(nullptr);
  const std::string log = spec.log.string();

  ChildRun run;
  const auto started = Clock::now();
  const pid_t pid = ::fork();
  if (pid < 0) throw std::runtime_error(std::string("fork failed: ") + std::strerror(errno));
  if (pid == 0) execChild(argv, log.c_str());

  Clock::time_point signalledAt{};
  int status = 0;
  rusage usage{};
  while (true) {
    // Blocking once the child has been killed: nothing is left to do but reap it.
    const pid_t done = ::wait4(pid, &status, run.killed ? 0 : WNOHANG, &usage);
    if (done == pid) break;
    if (done < 0 && errno != EINTR) throw std::runtime_error(std::string("wait4 failed: ") + std::strerror(errno));
    const double elapsed = secondsSince(started);
    if (spec.signalAfter && !run.signalled && elapsed >= *spec.signalAfter) {
      ::kill(pid, spec.signal);
      run.signalled = true;
      signalledAt = Clock::now();
    }
    if (!run.killed && elapsed >= spec.killAfter) {
      ::kill(pid, SIGKILL);
      run.killed = true;
    }
    if (!run.killed) std::this_thread::sleep_for(kPollPeriod);
  }
  run.wallSeconds = secondsSince(started);
  if (run.signalled) run.signalToExitSeconds = secondsSince(signalledAt);
  if (WIFEXITED(status)) run.exitStatus = WEXITSTATUS(status);
  if (WIFSIGNALED(status)) run.termSignal = WTERMSIG(status);
  run.peakRssMb = static_cast<double>(usage.ru_maxrss) / 1024.0;  // KiB on Linux
  return run;
}

}  // namespace rotaweave::bench
