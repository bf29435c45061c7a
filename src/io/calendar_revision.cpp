/// @brief Reading published calendars back, and the SEQUENCE and STATUS of each new event.
#include "io/calendar_revision.hpp"

#include <algorithm>
#include <fstream>
#include <iterator>
#include <unordered_map>

#include "io/ics_writer.hpp"
#include "io/input_error.hpp"

namespace rotaweave::io {
namespace {

/// Property name of a content line: up to the first ';' or ':'.
std::string_view propertyName(std::string_view line) { return line.substr(0, line.find_first_of(";:")); }

/// Value of a content line: after the first ':' outside a quoted parameter value.
std::string_view propertyValue(std::string_view line) {
  bool quoted = false;
  for (size_t i = 0; i < line.size(); ++i) {
    if (line[i] == '"') quoted = !quoted;
    else if (line[i] == ':' && !quoted) return line.substr(i + 1);
  }
  return {};
}

}  // namespace

std::string CalendarEvent::start() const {
  for (const std::string& l : lines)
    if (propertyName(l) == "DTSTART") return std::string(propertyValue(l));
  return {};
}

std::vector<std::string> unfoldLines(std::string_view text) {
  std::vector<std::string> out;
  size_t i = 0;
  while (i < text.size()) {
    size_t end = text.find('\n', i);
    if (end == std::string_view::npos) end = text.size();
    std::string_view line = text.substr(i, end - i);
    if (!line.empty() && line.back() == '\r') line.remove_suffix(1);
    if (!line.empty() && (line.front() == ' ' || line.front() == '\t') && !out.empty())
      out.back().append(line.substr(1));
    else
      out.emplace_back(line);
    i = end + 1;
  }
  while (!out.empty() && out.back().empty()) out.pop_back();
  return out;
}

std::vector<CalendarEvent> parseCalendarEvents(std::string_view text, const std::string& file) {
  const std::vector<std::string> lines = unfoldLines(text);
  auto fail = [&file](size_t index, const std::string& why) {
    // Line numbers are of unfolded lines; close to the file's for our own output.
    throw InputError(file, static_cast<int>(index + 1), 0,
                     why + "; this calendar was expected to be one published with the roster (move the calendars folder away to start afresh)");
  };
  if (lines.empty() || lines.front() != "BEGIN:VCALENDAR") fail(0, "not an iCalendar file (it does not begin with BEGIN:VCALENDAR)");
  std::vector<CalendarEvent> events;
  bool inEvent = false;
  int nested = 0;  // components inside the event (VALARM), kept as lines
  size_t begin = 0;
  for (size_t i = 0; i < lines.size(); ++i) {
    const std::string& l = lines[i];
    if (!inEvent) {
      if (l == "BEGIN:VEVENT") inEvent = true, begin = i, events.emplace_back();
      continue;
    }
    CalendarEvent& ev = events.back();
    if (l == "END:VEVENT" && nested == 0) {
      if (ev.uid.empty()) fail(begin, "an event without a UID");
      inEvent = false;
      continue;
    }
    if (l.rfind("BEGIN:", 0) == 0) ++nested;
    if (l.rfind("END:", 0) == 0) --nested;
    const std::string_view name = propertyName(l);
    const std::string value(propertyValue(l));
    if (name == "UID") ev.uid = value;
    else if (name == "SEQUENCE") {
      if (value.empty() || value.size() > 9 || !std::all_of(value.begin(), value.end(), [](char c) { return c >= '0' && c <= '9'; }))
        fail(i, "SEQUENCE '" + value + "' is not a whole number");
      ev.sequence = std::stoi(value);
    } else if (name == "STATUS") ev.cancelled = value == "CANCELLED";
    else if (name != "DTSTAMP") ev.lines.push_back(l);
  }
  if (inEvent) fail(begin, "an event without END:VEVENT");
  return events;
}

CalendarHistory loadCalendarHistory(const std::filesystem::path& folder, const model::Problem& p) {
  CalendarHistory history;
  history.folder = folder;
  for (const model::Person& person : p.staff) {
    const std::filesystem::path path = folder / calendarFileName(person.id);
    std::ifstream f(path, std::ios::binary);
    if (!f) continue;
    const std::string text((std::istreambuf_iterator<char>(f)), std::istreambuf_iterator<char>());
    history.byStaff[person.id] = parseCalendarEvents(text, path.string());
  }
  return history;
}

std::vector<CalendarEvent> reviseEvents(const std::vector<CalendarEvent>& previous, const std::vector<CalendarEvent>& current) {
  std::unordered_map<std::string, const CalendarEvent*> before;
  for (const CalendarEvent& e : previous) before[e.uid] = &e;
  std::vector<CalendarEvent> out;
  std::unordered_map<std::string, bool> kept;
  for (const CalendarEvent& e : current) {
    CalendarEvent now = e;
    now.cancelled = false;
    const auto it = before.find(e.uid);
    if (it == before.end()) now.sequence = 0;  // first published
    else if (!it->second->cancelled && it->second->lines == e.lines) now.sequence = it->second->sequence;  // unchanged
    else now.sequence = it->second->sequence + 1;  // changed, or worked again after a cancellation
    kept[e.uid] = true;
    out.push_back(std::move(now));
  }
  for (const CalendarEvent& e : previous) {
    if (kept.count(e.uid)) continue;
    CalendarEvent gone = e;
    if (!e.cancelled) gone.cancelled = true, gone.sequence = e.sequence + 1;  // newly cancelled
    kept[e.uid] = true;  // a UID listed twice before is published once
    out.push_back(std::move(gone));
  }
  std::stable_sort(out.begin(), out.end(), [](const CalendarEvent& a, const CalendarEvent& b) {
    const std::string sa = a.start(), sb = b.start();
    return sa != sb ? sa < sb : a.uid < b.uid;
  });
  return out;
}

}  // namespace rotaweave::io
