/// @brief Runs a program as a child process and measures it from outside: wall time by the
/// steady clock, peak resident memory from wait4()'s rusage, how it ended. It can send the
/// child a signal after a while (to time an interruption) and kills it outright after a hard
/// limit, so that a run that never ends cannot hang the bench.
#pragma once
#include <csignal>
#include <filesystem>
#include <optional>
#include <string>
#include <vector>

namespace rotaweave::bench {

struct ChildSpec {
  std::vector<std::string> argv;      ///< argv[0] is the program's path
  std::filesystem::path log;          ///< the child's stdout and stderr go here
  double killAfter = 0;               ///< seconds after the start: SIGKILL
  std::optional<double> signalAfter;  ///< seconds after the start: send `signal` once
  int signal = SIGINT;
};

struct ChildRun {
  std::optional<int> exitStatus;   ///< set when the child exited by itself
  std::optional<int> termSignal;   ///< set when a signal ended it
  bool killed = false;             ///< we sent SIGKILL at the hard limit
  bool signalled = false;          ///< `signal` was sent (the child was still running then)
  double wallSeconds = 0;          ///< from just before fork() to the child's exit being reaped
  double signalToExitSeconds = 0;  ///< when signalled: from sending the signal to the exit being reaped
  /// The child's largest resident set. Linux counts the anonymous memory a child inherits at
  /// fork (until exec) in it too, so this is the larger of that and the program's own peak:
  /// start children from a small process (ChildLauncher) for the program's own.
  double peakRssMb = 0;
};

/// Runs the child to its end. Throws std::runtime_error if it cannot be started at all; a
/// program that cannot be executed exits with status 127 and says why in the log.
ChildRun runChild(const ChildSpec& spec);

}  // namespace rotaweave::bench
