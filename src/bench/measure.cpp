/// @brief Clocks and memory figures from clock_gettime and getrusage.
#include "bench/measure.hpp"

#include <sys/resource.h>
#include <time.h>

namespace rotaweave::bench {
namespace {

rusage selfUsage() {
  rusage u{};
  getrusage(RUSAGE_SELF, &u);
  return u;
}

}  // namespace

double secondsSince(Clock::time_point since) { return std::chrono::duration<double>(Clock::now() - since).count(); }

double threadCpuSeconds() {
  timespec ts{};
  clock_gettime(CLOCK_THREAD_CPUTIME_ID, &ts);
  return static_cast<double>(ts.tv_sec) + static_cast<double>(ts.tv_nsec) * 1e-9;
}

double processCpuSeconds() {
  const rusage u = selfUsage();
  return static_cast<double>(u.ru_utime.tv_sec + u.ru_stime.tv_sec) +
         static_cast<double>(u.ru_utime.tv_usec + u.ru_stime.tv_usec) * 1e-6;
}

double peakRssMb() { return static_cast<double>(selfUsage().ru_maxrss) / 1024.0; }  // ru_maxrss is in KiB on Linux

}  // namespace rotaweave::bench
