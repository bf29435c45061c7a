/// @brief iCalendar output: escaping, folding, one VEVENT per worked shift.
#include "io/ics_writer.hpp"

#include <algorithm>
#include <cstdio>
#include <cstdlib>
#include <optional>

#include "io/atomic_file.hpp"
#include "io/calendar_revision.hpp"
#include "io/ics_timezone.hpp"
#include "io/input_error.hpp"
#include "io/tzif.hpp"

namespace rotaweave::io {
namespace {

/// "20270301" for period day `d`, `offsetDays` later.
std::string basicDate(const model::Problem& p, DayIdx d, int offsetDays) {
  std::string iso = model::formatIsoDate(p.start + d + offsetDays);
  std::string out;
  for (char c : iso)
    if (c != '-') out += c;
  return out;
}

/// Floating local date-time "20270301T070000" for `minutes` after midnight of day `d`
/// (minutes may exceed a day for a shift that ends the next morning).
std::string localTime(const model::Problem& p, DayIdx d, int minutes) {
  char buf[16];
  const int m = minutes % kMinutesPerDay;
  std::snprintf(buf, sizeof buf, "T%02d%02d00", m / 60, m % 60);
  return basicDate(p, d, minutes / kMinutesPerDay) + buf;
}

std::string utcStamp(std::time_t t) {
  std::tm tm{};
  gmtime_r(&t, &tm);
  char buf[32];
  std::strftime(buf, sizeof buf, "%Y%m%dT%H%M%SZ", &tm);
  return buf;
}

/// The time the calendars are stamped with: SOURCE_DATE_EPOCH if set (reproducible builds), else now.
std::time_t stampTime() {
  if (const char* e = std::getenv("SOURCE_DATE_EPOCH")) {
    char* end = nullptr;
    const long long v = std::strtoll(e, &end, 10);
    if (end && *end == '\0' && v >= 0) return static_cast<std::time_t>(v);
  }
  return std::time(nullptr);
}

/// A UID part: letters, digits, '.', '_' and '-' kept, other bytes as %XX, so distinct ids stay distinct.
std::string uidPart(const std::string& s) {
  std::string out;
  for (unsigned char c : s) {
    if ((c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9') || c == '.' || c == '_' || c == '-') {
      out += static_cast<char>(c);
    } else {
      char buf[4];
      std::snprintf(buf, sizeof buf, "%%%02X", c);
      out += buf;
    }
  }
  return out;
}

std::string hoursText(int minutes) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.1f h", minutes / 60.0);
  return buf;
}

/// Eight hex digits of FNV-1a over the scenario's name: the UID part that keeps events of
/// different rosters apart when one person's calendars meet in one app.
std::string scenarioKey(const std::string& name) {
  std::uint32_t h = 2166136261u;
  for (unsigned char c : name) h = (h ^ c) * 16777619u;
  char buf[16];
  std::snprintf(buf, sizeof buf, "%08x", h);
  return buf;
}

/// The zone of the scenario's `timezone`, or null for floating times. The loader checked the
/// name; a zone file gone since is an output error.
std::optional<TimeZone> scenarioZone(const model::Problem& p) {
  if (p.timezone.empty()) return std::nullopt;
  std::string why;
  std::optional<TimeZone> zone = loadTimeZone(p.timezone, &why);
  if (!zone) throw OutputError("calendars: cannot read time zone " + p.timezone + " (" + why + ")");
  return zone;
}

constexpr std::int64_t kDaySeconds = 86400;

/// The VEVENT of `task` worked by `s` on day `d`, at SEQUENCE 0.
CalendarEvent shiftEvent(const model::Problem& p, const TimeZone* zone, StaffIdx s, DayIdx d, TaskIdx t) {
  const model::Person& person = p.staff[static_cast<size_t>(s)];
  const model::Task& task = p.tasks[static_cast<size_t>(t)];
  const model::ShiftType& shift = p.shifts[static_cast<size_t>(task.shift)];
  const std::string& skill = p.skills[static_cast<size_t>(task.skill)];
  std::string summary = shift.label.empty() ? shift.id : shift.label;
  if (person.skills.size() > 1) summary += " (" + skill + ")";
  CalendarEvent ev;
  ev.uid = uidPart(person.id) + "-" + basicDate(p, d, 0) + "-" + scenarioKey(p.name) + "@rotaweave";
  const std::string tzid = zone ? ";TZID=" + zone->name() : std::string();
  ev.lines.push_back("DTSTART" + tzid + ":" + localTime(p, d, shift.start));
  ev.lines.push_back("DTEND" + tzid + ":" + localTime(p, d, shift.end));
  ev.lines.push_back("SUMMARY:" + icsEscape(summary));
  std::string clock;
  if (zone) {
    // Start and end are read on the wall clock (RFC 5545 section 3.3.5); across a clock
    // change the shift lasts an hour more or less than its nominal length.
    const std::int64_t day = static_cast<std::int64_t>(p.start + d) * kDaySeconds;
    const std::int64_t length = zone->toUtc(day + shift.end * 60) - zone->toUtc(day + shift.start * 60);
    const int nominal = (shift.end - shift.start) * 60;
    if (length != nominal)
      clock = std::string(", ") + hoursText(static_cast<int>(length / 60)) + " on the clock (the clocks go " +
              (length > nominal ? "back" : "forward") + " during it)";
  }
  ev.lines.push_back("DESCRIPTION:" + icsEscape("Shift " + shift.id + " as " + skill + ", " + model::formatClockTime(shift.start) + " to " +
                                                model::formatClockTime(shift.end) + (shift.end > kMinutesPerDay ? " next day" : "") +
                                                clock + ", break " + std::to_string(shift.breakMinutes) + " min, " +
                                                hoursText(shift.paidMinutes()) + " paid.\nRoster: " + p.name));
  ev.lines.push_back("CATEGORIES:" + icsEscape(shift.label.empty() ? shift.id : shift.label));
  ev.lines.push_back("TRANSP:OPAQUE");
  return ev;
}

/// The TZID parameter of a content line, or "".
std::string tzidOf(const std::string& line) {
  const size_t at = line.find(";TZID=");
  if (at == std::string::npos || at > line.find(':')) return {};
  const size_t from = at + 6;
  return line.substr(from, line.find_first_of(";:", from) - from);
}

}  // namespace

std::string calendarFileName(const std::string& id) {
  std::string out;
  for (size_t i = 0; i < id.size(); ++i) {
    const unsigned char c = static_cast<unsigned char>(id[i]);
    const bool unsafe = c < 0x20 || c == '/' || c == '\\' || c == '%' || c == ':' || c == '*' || c == '?' || c == '"' ||
                        c == '<' || c == '>' || c == '|' || c == 0x7F || (i == 0 && c == '.');
    if (unsafe) {
      char buf[4];
      std::snprintf(buf, sizeof buf, "%%%02X", c);
      out += buf;
    } else {
      out += static_cast<char>(c);
    }
  }
  return out + ".ics";
}

std::string icsEscape(const std::string& text) {
  std::string out;
  for (size_t i = 0; i < text.size(); ++i) {
    const char c = text[i];
    if (c == '\\' || c == ';' || c == ',') out += '\\', out += c;
    else if (c == '\r' && i + 1 < text.size() && text[i + 1] == '\n') continue;
    else if (c == '\n' || c == '\r') out += "\\n";
    else out += c;
  }
  return out;
}

std::string icsFold(const std::string& line) {
  std::string out;
  size_t used = 0;  // octets on the current physical line
  for (size_t i = 0; i < line.size();) {
    size_t len = 1;  // length of the UTF-8 character starting at i
    const unsigned char c = static_cast<unsigned char>(line[i]);
    if (c >= 0xF0) len = 4;
    else if (c >= 0xE0) len = 3;
    else if (c >= 0xC0) len = 2;
    len = std::min(len, line.size() - i);
    if (used + len > 75) {
      out += "\r\n ";
      used = 1;
    }
    out.append(line, i, len);
    used += len;
    i += len;
  }
  return out + "\r\n";
}

std::string personCalendar(const OutputBundle& b, StaffIdx s, std::time_t stamp) {
  const model::Problem& p = b.problem;
  const model::Person& person = p.staff[static_cast<size_t>(s)];
  const std::optional<TimeZone> zone = scenarioZone(p);
  const TimeZone* z = zone ? &*zone : nullptr;

  // 1. The shifts of the new roster, then what was published before: the calendar found
  //    beside the published roster, else the published roster's own shifts.
  std::vector<CalendarEvent> current, previous;
  for (DayIdx d = 0; d < p.days; ++d)
    if (const TaskIdx t = b.roster.at(s, d); t != kOff) current.push_back(shiftEvent(p, z, s, d, t));
  const std::vector<CalendarEvent>* found = nullptr;
  if (b.previousCalendars)
    if (const auto it = b.previousCalendars->byStaff.find(person.id); it != b.previousCalendars->byStaff.end()) found = &it->second;
  if (found) {
    previous = *found;
  } else if (p.published) {
    for (DayIdx d = 0; d < p.days; ++d)
      if (const TaskIdx t = p.published->cells[p.cell(s, d)]; t != kOff) previous.push_back(shiftEvent(p, z, s, d, t));
  }
  const std::vector<CalendarEvent> events = reviseEvents(previous, current);

  // 2. One VTIMEZONE per zone the events name (RFC 5545 section 3.6.5: each TZID needs one),
  //    exact from the day before the period to two days after it (nights end the next day).
  std::vector<std::string> zones;
  if (z) zones.push_back(z->name());
  for (const CalendarEvent& ev : events)
    for (const std::string& l : ev.lines)
      if (const std::string id = tzidOf(l); !id.empty() && std::find(zones.begin(), zones.end(), id) == zones.end()) zones.push_back(id);

  const std::string dtstamp = utcStamp(stamp);
  std::string out;
  auto line = [&](const std::string& text) { out += icsFold(text); };
  line("BEGIN:VCALENDAR");
  line("VERSION:2.0");
  line("PRODID:-//rotaweave//rotaweave roster//EN");
  line("CALSCALE:GREGORIAN");
  line("METHOD:PUBLISH");
  line("X-WR-CALNAME:" + icsEscape(person.name + " - " + p.name));
  if (z) line("X-WR-TIMEZONE:" + z->name());
  const std::int64_t from = static_cast<std::int64_t>(p.start - 1) * kDaySeconds - 14 * 3600;
  const std::int64_t to = static_cast<std::int64_t>(p.start + p.days + 2) * kDaySeconds + 14 * 3600;
  for (const std::string& id : zones) {
    // A zone other than the scenario's comes from an earlier calendar's cancelled events; one
    // this system does not know is left without VTIMEZONE (readers then guess from the name).
    const std::optional<TimeZone> other = z && id == z->name() ? std::nullopt : loadTimeZone(id);
    const TimeZone* tz = z && id == z->name() ? z : (other ? &*other : nullptr);
    if (tz)
      for (const std::string& l : vtimezoneLines(*tz, from, to)) line(l);
  }

  // 3. The events: UID, stamp, SEQUENCE and STATUS, then the content compared between runs.
  for (const CalendarEvent& ev : events) {
    line("BEGIN:VEVENT");
    line("UID:" + ev.uid);
    line("DTSTAMP:" + dtstamp);
    line("SEQUENCE:" + std::to_string(ev.sequence));  // RFC 5545 section 3.8.7.4
    line(ev.cancelled ? "STATUS:CANCELLED" : "STATUS:CONFIRMED");  // RFC 5545 section 3.8.1.11
    for (const std::string& l : ev.lines) line(l);
    line("END:VEVENT");
  }
  line("END:VCALENDAR");
  return out;
}

void IcsWriter::write(const std::filesystem::path& dir, const OutputBundle& b) const {
  const std::filesystem::path folder = dir / "calendars";
  ensureDirectory(folder);
  const std::time_t stamp = stampTime();
  // A person with no shifts still gets a (then empty) calendar, so a subscribed copy is cleared.
  for (StaffIdx s = 0; s < b.problem.staffCount(); ++s)
    writeFileAtomic(folder / calendarFileName(b.problem.staff[static_cast<size_t>(s)].id), personCalendar(b, s, stamp));
}

}  // namespace rotaweave::io
