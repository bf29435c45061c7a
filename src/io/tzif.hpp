/// @brief Time zones read from the system's TZif files (RFC 8536), for calendars in local time.
///
/// This standard library (libstdc++ 12) has no std::chrono::tzdb, so a small reader of the
/// TZif format does the work: the transition table of version 1, 2, 3 or 4 files, and the
/// POSIX TZ string of the footer (RFC 8536 section 3.3) for times after the table's last
/// transition, as "slim" files carry. Not for the hot path: used once per output.
#pragma once
#include <cstdint>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace rotaweave::io {

/// One local time type: offset east of UTC in seconds, daylight-saving flag, abbreviation.
struct ZoneType {
  std::int32_t utoff = 0;
  bool isdst = false;
  std::string abbr;
  bool operator==(const ZoneType&) const = default;
};

/// A change of local time type at `at` (seconds since 1970-01-01 UTC).
struct ZoneTransition {
  std::int64_t at = 0;
  ZoneType before, after;
};

/// One IANA zone. Immutable after loading; safe to share between threads.
class TimeZone {
 public:
  /// Parses TZif bytes; throws std::invalid_argument with the reason when malformed.
  static TimeZone parse(std::string name, std::string_view bytes);

  const std::string& name() const { return name_; }
  /// The local time type in effect at UTC second `utc`.
  ZoneType typeAt(std::int64_t utc) const;
  /// Every transition with from <= at < to, in order.
  std::vector<ZoneTransition> transitions(std::int64_t from, std::int64_t to) const;
  /// The UTC second of a wall-clock time (`local`: seconds since 1970-01-01 as read on the
  /// clock). As RFC 5545 section 3.3.5 reads a DATE-TIME with TZID: a time that occurs twice
  /// (clocks go back) is its first occurrence; a time skipped (clocks go forward) is read with
  /// the offset before the gap.
  std::int64_t toUtc(std::int64_t local) const;

 private:
  std::vector<ZoneTransition> footerTransitions(int year) const;

  std::string name_;
  std::vector<std::int64_t> times_;
  std::vector<std::uint8_t> typeIndex_;
  std::vector<ZoneType> types_;
  // Footer: standard type, and the daylight type and rule where the zone keeps DST.
  bool hasFooter_ = false;
  ZoneType std_, dst_;
  bool hasDst_ = false;
  struct Date {
    char kind = 'M';  ///< 'M' month.week.day, 'J' Julian 1..365 without 29 Feb, 'n' 0..365
    int month = 0, week = 0, weekday = 0, day = 0;
    std::int32_t time = 7200;  ///< seconds after local midnight, may be negative or over a day
  } start_, end_;
};

/// The zone folder: $TZDIR if set, else /usr/share/zoneinfo (Debian's tzdata package).
std::string zoneInfoDir();
/// True for a name that can be a zone path: no leading '/', no "..", letters, digits, "/_+-".
bool plausibleZoneName(std::string_view name);
/// Loads zone `name` from zoneInfoDir(); nullopt when there is no such zone (or the file is
/// not TZif), with the reason in `why` when given.
std::optional<TimeZone> loadTimeZone(const std::string& name, std::string* why = nullptr);
/// Zone names listed in the zone folder's tzdata.zi (zones and links), for "did you mean".
std::vector<std::string> knownZoneNames();

/// Seconds since 1970-01-01 of a civil date and time (proleptic Gregorian, no zone).
std::int64_t civilSeconds(int year, int month, int day, int seconds);

}  // namespace rotaweave::io
