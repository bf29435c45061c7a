/// @brief iCalendar output: escaping, folding, one VEVENT per worked shift.
#include "io/ics_writer.hpp"

#include <algorithm>
#include <cstdio>
#include <cstdlib>

#include "io/atomic_file.hpp"

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

/// A safe file name for a staff id: path separators, control bytes and a leading dot as %XX.
std::string fileNameFor(const std::string& id) {
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

std::string hoursText(int minutes) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.1f h", minutes / 60.0);
  return buf;
}

}  // namespace

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
  const std::string dtstamp = utcStamp(stamp);
  std::string out;
  auto line = [&](const std::string& text) { out += icsFold(text); };
  line("BEGIN:VCALENDAR");
  line("VERSION:2.0");
  line("PRODID:-//rotaweave//rotaweave roster//EN");
  line("CALSCALE:GREGORIAN");
  line("METHOD:PUBLISH");
  line("X-WR-CALNAME:" + icsEscape(person.name + " - " + p.name));
  for (DayIdx d = 0; d < p.days; ++d) {
    const TaskIdx t = b.roster.at(s, d);
    if (t == kOff) continue;
    const model::Task& task = p.tasks[static_cast<size_t>(t)];
    const model::ShiftType& shift = p.shifts[static_cast<size_t>(task.shift)];
    const std::string& skill = p.skills[static_cast<size_t>(task.skill)];
    std::string summary = shift.label.empty() ? shift.id : shift.label;
    if (person.skills.size() > 1) summary += " (" + skill + ")";
    line("BEGIN:VEVENT");
    line("UID:" + uidPart(person.id) + "-" + basicDate(p, d, 0) + "-" + uidPart(shift.id) + "@rotaweave");
    line("DTSTAMP:" + dtstamp);
    line("DTSTART:" + localTime(p, d, shift.start));
    line("DTEND:" + localTime(p, d, shift.end));
    line("SUMMARY:" + icsEscape(summary));
    line("DESCRIPTION:" + icsEscape("Shift " + shift.id + " as " + skill + ", " + model::formatClockTime(shift.start) + " to " +
                                    model::formatClockTime(shift.end) + (shift.end > kMinutesPerDay ? " next day" : "") +
                                    ", break " + std::to_string(shift.breakMinutes) + " min, " + hoursText(shift.paidMinutes()) +
                                    " paid.\nRoster: " + p.name));
    line("CATEGORIES:" + icsEscape(shift.label.empty() ? shift.id : shift.label));
    line("TRANSP:OPAQUE");
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
    writeFileAtomic(folder / fileNameFor(b.problem.staff[static_cast<size_t>(s)].id), personCalendar(b, s, stamp));
}

}  // namespace rotaweave::io
