/// @brief Starts child processes from a small helper process, so that their peak memory is
/// theirs alone.
///
/// Linux counts the anonymous memory a child inherits at fork (until it calls exec) in the
/// child's ru_maxrss. A bench that has solved or scored anything in-process holds tens of MiB
/// of heap, and every child it forked would report at least that much. So the launcher forks
/// one helper while the bench is still small; the helper forks, times and reaps every child
/// (runChild) and sends the figures back over a socket.
#pragma once
#include <sys/types.h>

#include "bench/child_process.hpp"

namespace rotaweave::bench {

class ChildLauncher {
 public:
  /// Forks the helper now: make the launcher before the bench loads or solves anything.
  ChildLauncher();
  /// Ends the helper (it exits when its socket closes) and reaps it.
  ~ChildLauncher();
  ChildLauncher(const ChildLauncher&) = delete;
  ChildLauncher& operator=(const ChildLauncher&) = delete;

  /// runChild(spec), run by the helper. Throws std::runtime_error if the helper is gone.
  ChildRun run(const ChildSpec& spec);

 private:
  int socket_ = -1;
  pid_t helper_ = -1;
};

}  // namespace rotaweave::bench
