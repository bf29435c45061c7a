/// @brief Dates, weekdays and ISO 8601 weeks.
#include <doctest/doctest.h>

#include "model/calendar.hpp"

using namespace rotaweave::model;

TEST_SUITE("model") {
  TEST_CASE("ISO week numbers match the published examples (CAL-04)") {
    // CAL-04, recomputed with a standard ISO calendar (PostgreSQL isoyear/week; Db2 WEEK_ISO).
    struct Case { const char* date; int year, week; };
    const Case cases[] = {{"2005-01-01", 2004, 53}, {"2006-01-01", 2005, 52}, {"2012-12-31", 2013, 1},
                          {"2016-01-03", 2015, 53}, {"2014-12-29", 2015, 1},  {"2021-01-03", 2020, 53},
                          {"2021-01-04", 2021, 1},  {"2024-12-30", 2025, 1},  {"2027-01-01", 2026, 53}};
    for (const auto& c : cases) {
      CAPTURE(c.date);
      const IsoWeek w = isoWeekOf(*parseIsoDate(c.date));
      CHECK(w.year == c.year);
      CHECK(w.week == c.week);
    }
    CHECK(weekdayOf(*parseIsoDate("2021-01-03")) == 6);  // 2020-W53-7: a Sunday
    CHECK(weekdayOf(*parseIsoDate("2027-01-01")) == 4);  // 2026-W53-5: a Friday
  }

  TEST_CASE("impossible dates and times are rejected") {
    CHECK(!parseIsoDate("2027-02-29"));
    CHECK(parseIsoDate("2028-02-29"));
    CHECK(!parseIsoDate("2027-02-30"));
    CHECK(!parseIsoDate("2027-13-01"));
    CHECK(!parseIsoDate("27-03-01"));
    CHECK(!parseClockTime("25:00"));
    CHECK(!parseClockTime("07:60"));
    CHECK(parseClockTime("24:00") == 1440);
    CHECK(formatIsoDate(*parseIsoDate("2027-03-31") + 1) == "2027-04-01");
  }
}
