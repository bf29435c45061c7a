/// @brief VTIMEZONE from the transitions of a roster's period.
#include "io/ics_timezone.hpp"

#include <cstdio>
#include <cstdlib>

namespace rotaweave::io {
namespace {

constexpr std::int64_t kDay = 86400;

void civilFromDays(std::int64_t z, int& y, int& m, int& d) {
  z += 719468;
  const std::int64_t era = (z >= 0 ? z : z - 146096) / 146097;
  const std::int64_t doe = z - era * 146097;
  const std::int64_t yoe = (doe - doe / 1460 + doe / 36524 - doe / 146096) / 365;
  const std::int64_t doy = doe - (365 * yoe + yoe / 4 - yoe / 100);
  const std::int64_t mp = (5 * doy + 2) / 153;
  d = static_cast<int>(doy - (153 * mp + 2) / 5 + 1);
  m = static_cast<int>(mp < 10 ? mp + 3 : mp - 9);
  y = static_cast<int>(yoe + era * 400 + (m <= 2 ? 1 : 0));
}

}  // namespace

std::string utcOffsetText(std::int32_t seconds) {
  const char sign = seconds < 0 ? '-' : '+';
  const int a = std::abs(seconds);
  char buf[16];
  if (a % 60)
    std::snprintf(buf, sizeof buf, "%c%02d%02d%02d", sign, a / 3600, a / 60 % 60, a % 60);
  else
    std::snprintf(buf, sizeof buf, "%c%02d%02d", sign, a / 3600, a / 60 % 60);
  return buf;
}

std::string dateTimeText(std::int64_t seconds) {
  std::int64_t days = seconds / kDay, rest = seconds % kDay;
  if (rest < 0) rest += kDay, --days;
  int y, m, d;
  civilFromDays(days, y, m, d);
  char buf[32];
  std::snprintf(buf, sizeof buf, "%04d%02d%02dT%02d%02d%02d", y, m, d, static_cast<int>(rest / 3600), static_cast<int>(rest / 60 % 60),
                static_cast<int>(rest % 60));
  return buf;
}

std::vector<std::string> vtimezoneLines(const TimeZone& zone, std::int64_t from, std::int64_t to) {
  std::vector<std::string> out{"BEGIN:VTIMEZONE", "TZID:" + zone.name()};
  auto observance = [&out](const ZoneTransition& t, std::int64_t onsetOnClock) {
    const char* kind = t.after.isdst ? "DAYLIGHT" : "STANDARD";
    out.push_back(std::string("BEGIN:") + kind);
    out.push_back("DTSTART:" + dateTimeText(onsetOnClock));
    out.push_back("TZOFFSETFROM:" + utcOffsetText(t.before.utoff));
    out.push_back("TZOFFSETTO:" + utcOffsetText(t.after.utoff));
    if (!t.after.abbr.empty()) out.push_back("TZNAME:" + t.after.abbr);
    out.push_back(std::string("END:") + kind);
  };
  // The offset in effect at `from`: from the last change in the two years before, or, where
  // the zone has not changed for that long, as an observance that changes nothing.
  const std::vector<ZoneTransition> earlier = zone.transitions(from - 2 * 366 * kDay, from);
  if (!earlier.empty()) {
    observance(earlier.back(), earlier.back().at + earlier.back().before.utoff);
  } else {
    const ZoneType now = zone.typeAt(from);
    observance(ZoneTransition{0, now, now}, 0);  // onset 1970-01-01T00:00:00
  }
  for (const ZoneTransition& t : zone.transitions(from, to)) observance(t, t.at + t.before.utoff);
  out.push_back("END:VTIMEZONE");
  return out;
}

}  // namespace rotaweave::io
