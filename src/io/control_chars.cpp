/// @brief Finding and naming control characters in input text.
#include "io/control_chars.hpp"

#include <cstdio>

#include "io/input_error.hpp"

namespace rotaweave::io {

std::optional<ControlChar> findControlChar(std::string_view text, bool allowLayout) {
  int line = 1, column = 1;
  for (size_t i = 0; i < text.size(); ++i) {
    const auto c = static_cast<unsigned char>(text[i]);
    const bool layout = c == '\t' || c == '\n' || c == '\r';
    if ((c < 0x20 && !(layout && allowLayout)) || c == 0x7F) return ControlChar{i, c, line, column};
    // C1 controls in UTF-8: C2 80 to C2 9F.
    if (c == 0xC2 && i + 1 < text.size()) {
      const auto next = static_cast<unsigned char>(text[i + 1]);
      if (next >= 0x80 && next <= 0x9F) return ControlChar{i, next, line, column};
    }
    if (c == '\n') {
      ++line;
      column = 1;
    } else if ((c & 0xC0) != 0x80) {
      ++column;  // a continuation byte belongs to the character before it
    }
  }
  return std::nullopt;
}

std::string codePointName(char32_t code) {
  char text[16];
  std::snprintf(text, sizeof text, "U+%04X", static_cast<unsigned>(code));
  return text;
}

void rejectControlChars(std::string_view text, const std::string& file) {
  if (const auto found = findControlChar(text))
    throw InputError(file, found->line, found->column,
                     "control character " + codePointName(found->code) +
                         "; names, ids and other text may hold printable characters only (a stray byte of this kind "
                         "is often left by a broken export): remove it");
}

std::string escapeControlChars(std::string_view text) {
  std::string out;
  out.reserve(text.size());
  for (const char ch : text) {
    const auto c = static_cast<unsigned char>(ch);
    if ((c < 0x20 && c != '\n' && c != '\t') || c == 0x7F) {
      char hex[8];
      std::snprintf(hex, sizeof hex, "\\x%02X", static_cast<unsigned>(c));
      out += hex;
    } else {
      out += ch;
    }
  }
  return out;
}

}  // namespace rotaweave::io
