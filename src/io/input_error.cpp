/// @brief Spelling suggestions for unknown keys and ids.
#include "io/input_error.hpp"

#include <algorithm>
#include <cctype>

#include "io/control_chars.hpp"

namespace rotaweave::io {
namespace {

/// Edits (insert, delete, replace, swap of two neighbours) to turn a into b.
size_t editDistance(const std::string& a, const std::string& b) {
  std::vector<std::vector<size_t>> d(a.size() + 1, std::vector<size_t>(b.size() + 1));
  for (size_t i = 0; i <= a.size(); ++i) d[i][0] = i;
  for (size_t j = 0; j <= b.size(); ++j) d[0][j] = j;
  for (size_t i = 1; i <= a.size(); ++i)
    for (size_t j = 1; j <= b.size(); ++j) {
      d[i][j] = std::min({d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1)});
      if (i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1]) d[i][j] = std::min(d[i][j], d[i - 2][j - 2] + 1);
    }
  return d[a.size()][b.size()];
}

std::string lowered(std::string s) {
  for (char& c : s) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return s;
}

}  // namespace

std::string InputError::format(const std::string& file, int line, int column, const std::string& message) {
  // Control characters are shown escaped, so that a message is never cut short at a NUL.
  std::string where = escapeControlChars(file);
  if (line > 0) where.append(":").append(std::to_string(line));
  if (line > 0 && column > 0) where.append(":").append(std::to_string(column));
  return where.append(": ").append(escapeControlChars(message));
}

int badUtf8Line(std::string_view s) {
  int line = 1;
  for (size_t i = 0; i < s.size();) {
    const auto c = static_cast<unsigned char>(s[i]);
    if (c == '\n') ++line;
    const size_t len = c < 0x80 ? 1 : (c >> 5) == 0x6 ? 2 : (c >> 4) == 0xE ? 3 : (c >> 3) == 0x1E ? 4 : 0;
    if (len == 0 || i + len > s.size()) return line;
    for (size_t k = 1; k < len; ++k)
      if ((static_cast<unsigned char>(s[i + k]) >> 6) != 0x2) return line;
    i += len;
  }
  return 0;
}

std::string closestMatch(const std::string& word, const std::vector<std::string>& candidates) {
  // Long words (and whole-word input such as a pasted cell) are not worth comparing.
  if (word.empty() || word.size() > 64) return "";
  for (const auto& c : candidates)
    if (lowered(c) == lowered(word)) return c;  // differs only in upper / lower case
  std::string best;
  // At most two edits (one per three letters in long words), and never a suggestion that
  // shares nothing with the word: 'X' is not a misspelt 'E'.
  size_t bestDistance = std::min(std::max<size_t>(2, word.size() / 3), word.size() - 1) + 1;
  for (const auto& c : candidates) {
    if (c.size() > 64) continue;
    const size_t d = editDistance(word, c);
    if (d < bestDistance && d < std::max(word.size(), c.size())) bestDistance = d, best = c;
  }
  return best;
}

std::string didYouMean(const std::string& word, const std::vector<std::string>& candidates) {
  const std::string best = closestMatch(word, candidates);
  return best.empty() ? std::string() : " (did you mean '" + best + "'?)";
}

}  // namespace rotaweave::io
