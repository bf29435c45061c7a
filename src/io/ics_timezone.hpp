/// @brief VTIMEZONE components (RFC 5545 section 3.6.5) written from a TZif zone.
#pragma once
#include <cstdint>
#include <string>
#include <vector>

#include "io/tzif.hpp"

namespace rotaweave::io {

/// The content lines (unfolded, without line ends) of a VTIMEZONE for `zone` that is exact for
/// every time in [from, to) (UTC seconds): one observance for the offset in effect at `from`
/// (its onset is the zone's last change before `from`), then one STANDARD or DAYLIGHT
/// observance per change inside the range, each with DTSTART (the onset on the clock before
/// the change), TZOFFSETFROM, TZOFFSETTO and TZNAME. No RRULE: the range is a roster period,
/// so its few changes are listed one by one, which every reader understands.
std::vector<std::string> vtimezoneLines(const TimeZone& zone, std::int64_t from, std::int64_t to);

/// "+0200", "-0330", or "+053028" where the offset has seconds (RFC 5545 section 3.3.14).
std::string utcOffsetText(std::int32_t seconds);
/// A DATE-TIME without zone, "20271030T220000", for seconds since 1970-01-01 on some clock.
std::string dateTimeText(std::int64_t seconds);

}  // namespace rotaweave::io
