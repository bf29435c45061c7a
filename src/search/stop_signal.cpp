/// @brief Async-signal-safe stop flag.
#include "search/stop_signal.hpp"

#include <atomic>
#include <csignal>

namespace rotaweave::search {
namespace {

std::atomic<bool> gStop{false};

extern "C" void onStopSignal(int sig) {
  gStop.store(true, std::memory_order_relaxed);
  std::signal(sig, SIG_DFL);  // a second Ctrl-C ends the process at once
}

}  // namespace

void installStopSignals() {
  std::signal(SIGINT, onStopSignal);
  std::signal(SIGTERM, onStopSignal);
}
bool stopRequested() { return gStop.load(std::memory_order_relaxed); }
void requestStop() { gStop.store(true, std::memory_order_relaxed); }
void clearStopRequest() { gStop.store(false, std::memory_order_relaxed); }

}  // namespace rotaweave::search
