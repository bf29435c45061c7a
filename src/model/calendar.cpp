/// @brief Civil-date arithmetic (days-from-civil) and ISO week numbering.
#include "model/calendar.hpp"

#include <array>
#include <cctype>
#include <cstdio>

namespace rotaweave::model {
namespace {

bool isLeap(int y) { return (y % 4 == 0 && y % 100 != 0) || y % 400 == 0; }

int daysInMonth(int y, int m) {
  static constexpr std::array<int, 12> kDays{31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
  return m == 2 && isLeap(y) ? 29 : kDays[static_cast<size_t>(m - 1)];
}

std::optional<int> digits(std::string_view s) {
  if (s.empty()) return std::nullopt;
  int v = 0;
  for (char c : s) {
    if (!std::isdigit(static_cast<unsigned char>(c))) return std::nullopt;
    v = v * 10 + (c - '0');
  }
  return v;
}

void civilFromSerial(DateSerial z, int& y, int& m, int& d) {
  z += 719468;
  const int era = (z >= 0 ? z : z - 146096) / 146097;
  const int doe = z - era * 146097;
  const int yoe = (doe - doe / 1460 + doe / 36524 - doe / 146096) / 365;
  const int doy = doe - (365 * yoe + yoe / 4 - yoe / 100);
  const int mp = (5 * doy + 2) / 153;
  d = doy - (153 * mp + 2) / 5 + 1;
  m = mp < 10 ? mp + 3 : mp - 9;
  y = yoe + era * 400 + (m <= 2 ? 1 : 0);
}

}  // namespace

DateSerial serialFromCivil(int y, int m, int d) {
  y -= m <= 2 ? 1 : 0;
  const int era = (y >= 0 ? y : y - 399) / 400;
  const int yoe = y - era * 400;
  const int doy = (153 * (m > 2 ? m - 3 : m + 9) + 2) / 5 + d - 1;
  const int doe = yoe * 365 + yoe / 4 - yoe / 100 + doy;
  return era * 146097 + doe - 719468;
}

std::optional<DateSerial> parseIsoDate(std::string_view t) {
  if (t.size() != 10 || t[4] != '-' || t[7] != '-') return std::nullopt;
  auto y = digits(t.substr(0, 4)), m = digits(t.substr(5, 2)), d = digits(t.substr(8, 2));
  if (!y || !m || !d || *y < 1900 || *y > 2999 || *m < 1 || *m > 12) return std::nullopt;
  if (*d < 1 || *d > daysInMonth(*y, *m)) return std::nullopt;
  return serialFromCivil(*y, *m, *d);
}

std::string formatIsoDate(DateSerial serial) {
  int y, m, d;
  civilFromSerial(serial, y, m, d);
  char buf[48];
  std::snprintf(buf, sizeof buf, "%04d-%02d-%02d", y, m, d);
  return buf;
}

int weekdayOf(DateSerial serial) {
  // 1970-01-01 was a Thursday (ISO weekday index 3).
  return ((serial % 7) + 7 + 3) % 7;
}

IsoWeek isoWeekOf(DateSerial serial) {
  // The ISO week-year is the calendar year of this week's Thursday.
  const DateSerial thursday = serial - weekdayOf(serial) + 3;
  int y, m, d;
  civilFromSerial(thursday, y, m, d);
  const DateSerial jan1 = serialFromCivil(y, 1, 1);
  return IsoWeek{y, (thursday - jan1) / 7 + 1};
}

std::optional<int> parseWeekday(std::string_view text) {
  static constexpr std::array<const char*, 7> kNames{"mon", "tue", "wed", "thu", "fri", "sat", "sun"};
  if (text.size() != 3) return std::nullopt;
  std::string lower;
  for (char c : text) lower += static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  for (int i = 0; i < 7; ++i)
    if (lower == kNames[static_cast<size_t>(i)]) return i;
  return std::nullopt;
}

const char* weekdayName(int weekday) {
  static constexpr std::array<const char*, 7> kNames{"mon", "tue", "wed", "thu", "fri", "sat", "sun"};
  return kNames[static_cast<size_t>(weekday)];
}

std::optional<int> parseClockTime(std::string_view t) {
  if (t.size() != 5 || t[2] != ':') return std::nullopt;
  auto h = digits(t.substr(0, 2)), m = digits(t.substr(3, 2));
  if (!h || !m || *m > 59 || *h > 24 || (*h == 24 && *m != 0)) return std::nullopt;
  return *h * 60 + *m;
}

std::string formatClockTime(int minutes) {
  minutes = ((minutes % 1440) + 1440) % 1440;
  char buf[8];
  std::snprintf(buf, sizeof buf, "%02d:%02d", minutes / 60, minutes % 60);
  return buf;
}

}  // namespace rotaweave::model
