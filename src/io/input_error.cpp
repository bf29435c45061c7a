/// @brief Spelling suggestions for unknown keys and ids.
#include "io/input_error.hpp"

#include <algorithm>

namespace rotaweave::io {
namespace {

size_t editDistance(const std::string& a, const std::string& b) {
  std::vector<size_t> prev(b.size() + 1), cur(b.size() + 1);
  for (size_t j = 0; j <= b.size(); ++j) prev[j] = j;
  for (size_t i = 1; i <= a.size(); ++i) {
    cur[0] = i;
    for (size_t j = 1; j <= b.size(); ++j)
      cur[j] = std::min({prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1)});
    std::swap(prev, cur);
  }
  return prev[b.size()];
}

}  // namespace

std::string InputError::format(const std::string& file, int line, int column, const std::string& message) {
  std::string where = file;
  if (line > 0) where.append(":").append(std::to_string(line));
  if (line > 0 && column > 0) where.append(":").append(std::to_string(column));
  return where.append(": ").append(message);
}

std::string closestMatch(const std::string& word, const std::vector<std::string>& candidates) {
  std::string best;
  size_t bestDistance = std::max<size_t>(2, word.size() / 3) + 1;
  for (const auto& c : candidates) {
    const size_t d = editDistance(word, c);
    if (d < bestDistance) bestDistance = d, best = c;
  }
  return best;
}

std::string didYouMean(const std::string& word, const std::vector<std::string>& candidates) {
  const std::string best = closestMatch(word, candidates);
  return best.empty() ? std::string() : " (did you mean '" + best + "'?)";
}

}  // namespace rotaweave::io
