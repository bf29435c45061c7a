/// @brief A small, fast, seedable random engine (xoshiro256**), one per island; no global state.
#pragma once
#include <cstddef>
#include <cstdint>
#include <utility>
#include <vector>

namespace rotaweave::search {

/// Mixes a 64-bit state into a well-spread value; used to derive independent island seeds.
inline std::uint64_t splitmix64(std::uint64_t& x) {
  std::uint64_t z = (x += 0x9E3779B97F4A7C15ULL);
  z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9ULL;
  z = (z ^ (z >> 27)) * 0x94D049BB133111EBULL;
  return z ^ (z >> 31);
}

class Rng {
 public:
  explicit Rng(std::uint64_t seed) {
    for (auto& w : s_) w = splitmix64(seed);
  }
  std::uint64_t next() {
    const std::uint64_t result = rotl(s_[1] * 5, 7) * 9;
    const std::uint64_t t = s_[1] << 17;
    s_[2] ^= s_[0];
    s_[3] ^= s_[1];
    s_[1] ^= s_[2];
    s_[0] ^= s_[3];
    s_[2] ^= t;
    s_[3] = rotl(s_[3], 45);
    return result;
  }
  /// Uniform in [0, n); n > 0.
  int below(int n) { return static_cast<int>((next() >> 32) * static_cast<std::uint64_t>(n) >> 32); }
  /// Uniform in [0, 1).
  double uniform() { return static_cast<double>(next() >> 11) * 0x1.0p-53; }
  bool chance(double p) { return uniform() < p; }
  /// Puts `v` in a uniformly random order (Fisher-Yates).
  template <class T>
  void shuffle(std::vector<T>& v) { shuffle(v.data(), v.data() + v.size()); }
  template <class T>
  void shuffle(T* first, T* last) {
    for (std::ptrdiff_t i = last - first; i > 1; --i) std::swap(first[i - 1], first[below(static_cast<int>(i))]);
  }

 private:
  static std::uint64_t rotl(std::uint64_t x, int k) { return (x << k) | (x >> (64 - k)); }
  std::uint64_t s_[4];
};

}  // namespace rotaweave::search
