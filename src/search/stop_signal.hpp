/// @brief SIGINT / SIGTERM handling: the search polls a flag and stops at the next safe point.
#pragma once

namespace rotaweave::search {

/// Installs handlers that set the stop flag (a second signal restores the default action).
void installStopSignals();
bool stopRequested();
void requestStop();
void clearStopRequest();

}  // namespace rotaweave::search
