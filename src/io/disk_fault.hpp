/// @brief Test hook: a simulated full disk for the output writers.
///
/// With ROTAWEAVE_FAULT_DISK_BYTES=N in the environment, output writes fail as on a full disk
/// once N bytes in all have been written by the process (the workbook counts when its finished
/// file is committed). Without it, nothing is limited. Tests use it where no small file system
/// can be mounted.
#pragma once
#include <cstddef>

namespace rotaweave::io {

/// Takes `bytes` from the simulated disk; returns how many of them fit (all of them without
/// the hook). Safe to call from several threads.
size_t claimOutputBytes(size_t bytes);

}  // namespace rotaweave::io
