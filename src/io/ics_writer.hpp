/// @brief calendars/<staff-id>.ics: one iCalendar file (RFC 5545) per person.
#pragma once
#include <ctime>
#include <string>

#include "io/output_writer.hpp"

namespace rotaweave::io {

/// Writes one calendar per person with a VEVENT per worked shift, at the scenario's times as
/// floating local times. UIDs depend only on staff id, date and shift id, so re-importing an
/// updated roster replaces events instead of duplicating them.
class IcsWriter final : public OutputWriter {
 public:
  void write(const std::filesystem::path& dir, const OutputBundle& bundle) const override;
};

/// The calendar text of one person; `stamp` is the DTSTAMP (UTC). Exposed for tests.
std::string personCalendar(const OutputBundle& bundle, StaffIdx staff, std::time_t stamp);
/// Escapes a TEXT value: backslash, semicolon, comma and newlines.
std::string icsEscape(const std::string& text);
/// Folds one content line to at most 75 octets per line (never inside a UTF-8 character) and
/// ends every line with CRLF.
std::string icsFold(const std::string& line);

}  // namespace rotaweave::io
