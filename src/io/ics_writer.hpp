/// @brief calendars/<staff-id>.ics: one iCalendar file (RFC 5545) per person.
#pragma once
#include <ctime>
#include <string>

#include "io/output_writer.hpp"

namespace rotaweave::io {

/// Writes one calendar per person with a VEVENT per worked shift. With the scenario's
/// `timezone`, times carry TZID and the file a VTIMEZONE for the period's clock changes;
/// without it they are floating local times. A UID depends only on the scenario's name, the
/// staff id and the date, so an updated roster's event replaces the earlier one. After a
/// replan every event published before is published again: unchanged ones with their
/// SEQUENCE, changed ones with the next, removed ones with STATUS:CANCELLED and the next
/// (see calendar_revision.hpp); where the bundle has no earlier calendars, the published
/// roster's shifts stand for them at SEQUENCE 0.
class IcsWriter final : public OutputWriter {
 public:
  void write(const std::filesystem::path& dir, const OutputBundle& bundle) const override;
};

/// The calendar text of one person; `stamp` is the DTSTAMP (UTC). Exposed for tests.
std::string personCalendar(const OutputBundle& bundle, StaffIdx staff, std::time_t stamp);
/// The file name of a person's calendar: "<staff-id>.ics", unsafe bytes as %XX.
std::string calendarFileName(const std::string& staffId);
/// Escapes a TEXT value: backslash, semicolon, comma and newlines.
std::string icsEscape(const std::string& text);
/// Folds one content line to at most 75 octets per line (never inside a UTF-8 character) and
/// ends every line with CRLF.
std::string icsFold(const std::string& line);

}  // namespace rotaweave::io
