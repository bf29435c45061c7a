/// @brief Calendar updates: the events of the calendars published before, and how each new
/// event's SEQUENCE and STATUS follow from them (RFC 5545 sections 3.8.1.11, 3.8.7.4).
///
/// A calendar app that imported or subscribed to a person's calendar keeps its events by UID
/// and replaces one only by a copy with a higher SEQUENCE. So a re-published calendar keeps
/// every UID it ever published: a shift still worked keeps its SEQUENCE while unchanged and
/// gets the next one when its times or text change; a shift no longer worked is published
/// once more with STATUS:CANCELLED and the next SEQUENCE, and then carried as it is.
#pragma once
#include <filesystem>
#include <map>
#include <string>
#include <string_view>
#include <vector>

#include "model/problem.hpp"

namespace rotaweave::io {

/// One VEVENT: its UID, SEQUENCE, whether cancelled, and the rest of its content lines
/// (unfolded, in order) other than UID, DTSTAMP, SEQUENCE and STATUS. Two events of the same
/// UID with the same `lines` show the same thing.
struct CalendarEvent {
  std::string uid;
  std::vector<std::string> lines;
  int sequence = 0;
  bool cancelled = false;
  /// The DTSTART value (e.g. "20271030T220000"), to order events; "" if none.
  std::string start() const;
};

/// The calendars found beside a published roster: staff id -> its events. People without a
/// file there are absent (their previous events come from the published roster instead).
struct CalendarHistory {
  std::filesystem::path folder;
  std::map<std::string, std::vector<CalendarEvent>> byStaff;
};

/// Unfolds content lines (RFC 5545 section 3.1) and splits "NAME;PARAMS:VALUE" lines.
std::vector<std::string> unfoldLines(std::string_view text);
/// The VEVENTs of an iCalendar text. Throws InputError naming `file` and the line when the
/// text is not a VCALENDAR, an event has no UID, or SEQUENCE is not a number.
std::vector<CalendarEvent> parseCalendarEvents(std::string_view text, const std::string& file);
/// Reads `folder`/<staff>.ics for every person of `problem` that has one there.
CalendarHistory loadCalendarHistory(const std::filesystem::path& folder, const model::Problem& problem);

/// The events to publish now, from those published before and the shifts of the new roster
/// (`current`, all at SEQUENCE 0 and not cancelled): as the header describes, ordered by
/// start, then UID.
std::vector<CalendarEvent> reviseEvents(const std::vector<CalendarEvent>& previous, const std::vector<CalendarEvent>& current);

}  // namespace rotaweave::io
