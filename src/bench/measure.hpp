/// @brief Clocks and memory figures the bench modes share: wall time by the steady clock, CPU
/// time of the calling thread or the whole process, and peak resident memory.
#pragma once
#include <chrono>

namespace rotaweave::bench {

using Clock = std::chrono::steady_clock;

/// Wall seconds since `since`.
double secondsSince(Clock::time_point since);
/// CPU time of the calling thread: single-core rates stay meaningful on a busy machine.
double threadCpuSeconds();
/// CPU time of the whole process, all threads, user and system.
double processCpuSeconds();
/// Peak resident memory of this process so far, in MiB.
double peakRssMb();

}  // namespace rotaweave::bench
