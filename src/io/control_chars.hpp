/// @brief Control characters in input text: found with their position, named as "U+0000".
///
/// Names, ids and every other text a scenario or roster gives end up in the outputs (CSV,
/// report, workbook, calendars), where a NUL or an escape byte cuts or garbles them. Input is
/// refused at the first control character instead: C0 (U+0000 to U+001F) other than tab, line
/// feed and carriage return, DEL (U+007F) and C1 (U+0080 to U+009F, written in UTF-8).
#pragma once
#include <cstddef>
#include <optional>
#include <string>
#include <string_view>

namespace rotaweave::io {

struct ControlChar {
  size_t offset = 0;     ///< Byte offset of the character in the text.
  char32_t code = 0;     ///< Its code point.
  int line = 1;          ///< 1-based line (counting line feeds before it).
  int column = 1;        ///< 1-based column in characters (UTF-8 sequences count once).
};

/// The first control character in `text`, or nothing. Tab, line feed and carriage return are
/// allowed only when `allowLayout` is true.
std::optional<ControlChar> findControlChar(std::string_view text, bool allowLayout = true);

/// "U+0000".
std::string codePointName(char32_t code);

/// Throws InputError naming `file` and the character's line and column if `text` (a whole
/// file, valid UTF-8) holds a control character other than tab, line feed and carriage return.
void rejectControlChars(std::string_view text, const std::string& file);

/// `text` with every control character written as \\xHH, so that a message is never cut short.
std::string escapeControlChars(std::string_view text);

}  // namespace rotaweave::io
