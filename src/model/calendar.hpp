/// @brief Civil dates as day serials, ISO 8601 parsing, weekdays and ISO weeks.
#pragma once
#include <optional>
#include <string>
#include <string_view>

namespace rotaweave::model {

/// Days since 1970-01-01 in the proleptic Gregorian calendar.
using DateSerial = int;

/// Parses "YYYY-MM-DD"; nullopt if malformed or impossible (2027-02-30).
std::optional<DateSerial> parseIsoDate(std::string_view text);
std::string formatIsoDate(DateSerial serial);
DateSerial serialFromCivil(int year, int month, int day);

/// ISO weekday: 0 = Monday ... 6 = Sunday.
int weekdayOf(DateSerial serial);

struct IsoWeek {
  int year;  ///< ISO week-year, which may differ from the calendar year near 1 January.
  int week;  ///< 1..53
};
IsoWeek isoWeekOf(DateSerial serial);

/// Parses "mon".."sun" (any case); nullopt otherwise.
std::optional<int> parseWeekday(std::string_view text);
const char* weekdayName(int weekday);  ///< "mon".."sun"

/// Parses "HH:MM" (00:00..24:00) into minutes; nullopt if malformed.
std::optional<int> parseClockTime(std::string_view text);
std::string formatClockTime(int minutes);  ///< minutes modulo a day, as HH:MM

}  // namespace rotaweave::model
