/// @brief The simulated full disk behind ROTAWEAVE_FAULT_DISK_BYTES.
#include "io/disk_fault.hpp"

#include <atomic>
#include <cstdint>
#include <cstdlib>
#include <limits>
#include <string>

namespace rotaweave::io {
namespace {

std::atomic<std::int64_t>& bytesLeft() {
  static std::atomic<std::int64_t> left = [] {
    const char* text = std::getenv("ROTAWEAVE_FAULT_DISK_BYTES");
    if (!text || !*text) return std::numeric_limits<std::int64_t>::max();
    try {
      return static_cast<std::int64_t>(std::stoll(text));
    } catch (const std::exception&) {
      return std::numeric_limits<std::int64_t>::max();
    }
  }();
  return left;
}

}  // namespace

size_t claimOutputBytes(size_t bytes) {
  auto& left = bytesLeft();
  if (left.load(std::memory_order_relaxed) == std::numeric_limits<std::int64_t>::max()) return bytes;
  const std::int64_t before = left.fetch_sub(static_cast<std::int64_t>(bytes));
  if (before <= 0) return 0;
  return static_cast<size_t>(std::min<std::int64_t>(before, static_cast<std::int64_t>(bytes)));
}

}  // namespace rotaweave::io
