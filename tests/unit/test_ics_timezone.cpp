/// @brief The TZif reader, VTIMEZONE, the timezone key and calendar revisions (SEQUENCE, STATUS).
#include <doctest/doctest.h>

#include <algorithm>
#include <fstream>
#include <iterator>
#include <random>

#include "fixtures.hpp"
#include "io/calendar_revision.hpp"
#include "io/ics_timezone.hpp"
#include "io/input_error.hpp"
#include "io/tzif.hpp"

using namespace rotaweave;

namespace {

/// A minimal TZif version 2 file (RFC 8536 section 3): no transitions, one time type, and the
/// footer `tz`, so every time comes from the footer's rule.
std::string footerOnlyTzif(const std::string& tz, std::int32_t utoff, const std::string& abbr) {
  std::string b;
  auto be32 = [&b](std::uint32_t v) {
    for (int s = 24; s >= 0; s -= 8) b += static_cast<char>((v >> s) & 0xFF);
  };
  auto header = [&] {
    b += "TZif2";
    b.append(15, '\0');
    be32(0), be32(0), be32(0), be32(0), be32(1), be32(static_cast<std::uint32_t>(abbr.size() + 1));
  };
  auto block = [&] {
    be32(static_cast<std::uint32_t>(utoff));
    b += '\0', b += '\0';
    b += abbr, b += '\0';
  };
  header(), block();  // version 1 block
  header(), block();  // version 2 block
  b += "\n" + tz + "\n";
  return b;
}

io::TimeZone zone(const std::string& name) {
  const auto z = io::loadTimeZone(name);
  REQUIRE_MESSAGE(z, "zone data missing: install tzdata");
  return *z;
}

std::int64_t utc(int y, int m, int d, int h, int min = 0) { return io::civilSeconds(y, m, d, h * 3600 + min * 60); }

io::CalendarEvent event(const std::string& uid, const std::string& start, int seq = 0, bool cancelled = false) {
  io::CalendarEvent e;
  e.uid = uid;
  e.lines = {"DTSTART;TZID=Europe/Berlin:" + start, "SUMMARY:Night"};
  e.sequence = seq;
  e.cancelled = cancelled;
  return e;
}

const io::CalendarEvent& byUid(const std::vector<io::CalendarEvent>& events, const std::string& uid) {
  const auto it = std::find_if(events.begin(), events.end(), [&](const io::CalendarEvent& e) { return e.uid == uid; });
  REQUIRE(it != events.end());
  return *it;
}

}  // namespace

TEST_SUITE("io") {
  TEST_CASE("TZif: Europe/Berlin's clock changes in 2027") {
    // EU rule (Directive 2000/84/EC): summer time from 01:00 UTC on the last Sunday of March
    // to 01:00 UTC on the last Sunday of October: 2027-03-28 and 2027-10-31.
    const io::TimeZone berlin = zone("Europe/Berlin");
    const auto t = berlin.transitions(utc(2027, 1, 1, 0), utc(2028, 1, 1, 0));
    REQUIRE(t.size() == 2);
    CHECK(t[0].at == utc(2027, 3, 28, 1));
    CHECK(t[0].before.utoff == 3600);
    CHECK(t[0].after.utoff == 7200);
    CHECK(t[0].after.isdst);
    CHECK(t[0].after.abbr == "CEST");
    CHECK(t[1].at == utc(2027, 10, 31, 1));
    CHECK(t[1].after.abbr == "CET");
    CHECK(berlin.typeAt(utc(2027, 7, 1, 12)).utoff == 7200);
    CHECK(berlin.typeAt(utc(2027, 12, 1, 12)).utoff == 3600);
    // RFC 5545 section 3.3.5: a wall time that occurs twice is its first occurrence (CEST) ...
    CHECK(berlin.toUtc(io::civilSeconds(2027, 10, 31, 2 * 3600 + 1800)) == utc(2027, 10, 31, 0, 30));
    // ... and one skipped by the change is read with the offset before the gap (CET).
    CHECK(berlin.toUtc(io::civilSeconds(2027, 3, 28, 2 * 3600 + 1800)) == utc(2027, 3, 28, 1, 30));
    // The nights across the changes: 22:00 to 06:00 is 9 h in October and 7 h in March.
    CHECK(berlin.toUtc(io::civilSeconds(2027, 10, 31, 6 * 3600)) - berlin.toUtc(io::civilSeconds(2027, 10, 30, 22 * 3600)) == 9 * 3600);
    CHECK(berlin.toUtc(io::civilSeconds(2027, 3, 28, 6 * 3600)) - berlin.toUtc(io::civilSeconds(2027, 3, 27, 22 * 3600)) == 7 * 3600);
  }

  TEST_CASE("TZif: the footer's TZ string agrees with the system's table") {
    // RFC 8536 section 3.3: after the last transition the footer rule applies. A file with
    // the rule alone must give the same changes as the system's file for the same zone.
    struct Case {
      const char* name;
      const char* tz;
      std::int32_t std;
      const char* abbr;
    };
    for (const Case c : {Case{"Europe/Berlin", "CET-1CEST,M3.5.0,M10.5.0/3", 3600, "CET"},
                         Case{"Australia/Sydney", "AEST-10AEDT,M10.1.0,M4.1.0/3", 36000, "AEST"},
                         Case{"America/New_York", "EST5EDT,M3.2.0,M11.1.0", -18000, "EST"}}) {
      CAPTURE(c.name);
      const io::TimeZone rule = io::TimeZone::parse(c.name, footerOnlyTzif(c.tz, c.std, c.abbr));
      const io::TimeZone system = zone(c.name);
      const auto a = rule.transitions(utc(2026, 1, 1, 0), utc(2029, 1, 1, 0));
      const auto b = system.transitions(utc(2026, 1, 1, 0), utc(2029, 1, 1, 0));
      REQUIRE(a.size() == 6);
      REQUIRE(a.size() == b.size());
      for (size_t i = 0; i < a.size(); ++i) {
        CHECK(a[i].at == b[i].at);
        CHECK(a[i].after.utoff == b[i].after.utoff);
        CHECK(a[i].after.abbr == b[i].after.abbr);
      }
      for (std::int64_t t = utc(2027, 1, 1, 0); t < utc(2028, 1, 1, 0); t += 86400 * 5 + 3600)
        CHECK(rule.typeAt(t).utoff == system.typeAt(t).utoff);
    }
  }

  TEST_CASE("TZif: malformed data and names are refused") {
    CHECK_THROWS_AS(io::TimeZone::parse("x", "TZxf"), std::invalid_argument);
    CHECK_THROWS_AS(io::TimeZone::parse("x", footerOnlyTzif("CET-1CEST,M13.5.0,M10.5.0", 3600, "CET")), std::invalid_argument);
    std::string cut = footerOnlyTzif("UTC0", 0, "UTC");
    cut.resize(30);
    CHECK_THROWS_AS(io::TimeZone::parse("x", cut), std::invalid_argument);
    CHECK_FALSE(io::plausibleZoneName("../etc/passwd"));
    CHECK_FALSE(io::plausibleZoneName("/etc/localtime"));
    CHECK(io::plausibleZoneName("America/Argentina/Buenos_Aires"));
    CHECK_FALSE(io::loadTimeZone("Europe/Berlni"));
    CHECK(io::loadTimeZone("UTC"));
  }

  TEST_CASE("TZif: damaged copies of a real file are refused, never misread into a crash") {
    std::ifstream f(io::zoneInfoDir() + "/Europe/Berlin", std::ios::binary);
    REQUIRE(f);
    const std::string good((std::istreambuf_iterator<char>(f)), std::istreambuf_iterator<char>());
    std::mt19937 rng(23);
    int refused = 0;
    for (int round = 0; round < 3000; ++round) {
      std::string bad = good;
      const int edits = 1 + static_cast<int>(rng() % 4);
      for (int e = 0; e < edits; ++e) {
        const size_t at = rng() % bad.size();
        if (rng() % 4 == 0) bad.resize(at);
        else bad[at] = static_cast<char>(rng());
        if (bad.empty()) break;
      }
      try {
        const io::TimeZone z = io::TimeZone::parse("x", bad);
        (void)z.typeAt(utc(2027, 10, 31, 1));
        (void)z.transitions(utc(2027, 1, 1, 0), utc(2028, 1, 1, 0));
        (void)z.toUtc(io::civilSeconds(2027, 10, 31, 9000));
      } catch (const std::invalid_argument&) {
        ++refused;
      }
    }
    CHECK(refused > 0);
  }

  TEST_CASE("VTIMEZONE for an October period in Berlin") {
    const io::TimeZone berlin = zone("Europe/Berlin");
    const auto lines = io::vtimezoneLines(berlin, utc(2027, 10, 1, 0), utc(2027, 11, 2, 0));
    // RFC 5545 section 3.6.5: the observance in effect (summer time since 28 March) and the
    // change inside the range; each DTSTART is the onset on the clock before the change.
    const std::vector<std::string> want = {
        "BEGIN:VTIMEZONE",      "TZID:Europe/Berlin",   "BEGIN:DAYLIGHT",  "DTSTART:20270328T020000", "TZOFFSETFROM:+0100",
        "TZOFFSETTO:+0200",     "TZNAME:CEST",          "END:DAYLIGHT",    "BEGIN:STANDARD",          "DTSTART:20271031T030000",
        "TZOFFSETFROM:+0200",   "TZOFFSETTO:+0100",     "TZNAME:CET",      "END:STANDARD",            "END:VTIMEZONE"};
    CHECK(lines == want);
    CHECK(io::utcOffsetText(-12600) == "-0330");
    CHECK(io::utcOffsetText(3208) == "+005328");
    CHECK(io::dateTimeText(io::civilSeconds(1969, 12, 31, 86399)) == "19691231T235959");
  }

  TEST_CASE("the timezone key is checked against the zone files") {
    const std::string base = "name: tz\n"
                             "timezone: Europe/Berlin\n"
                             "period: {start: 2027-10-25, end: 2027-10-31}\n"
                             "shifts:\n  - {id: N, start: \"22:00\", end: \"06:00\"}\n"
                             "skills: [op]\n"
                             "staff:\n  - {id: ana, skills: [op]}\n";
    CHECK(test::loadYaml(base).timezone == "Europe/Berlin");
    CHECK(test::loadYaml(base.substr(0, 9) + base.substr(base.find("period"))).timezone.empty());
    std::string bad = base;
    bad.replace(bad.find("Europe/Berlin"), 13, "Europe/Berlni");
    std::string path;
    try {
      test::loadYaml(bad, &path);
      FAIL("no error for an unknown zone");
    } catch (const io::InputError& e) {
      CAPTURE(e.what());
      CHECK(e.line() == 2);
      CHECK(std::string(e.what()).find("unknown time zone 'Europe/Berlni' (did you mean 'Europe/Berlin'?)") != std::string::npos);
    }
  }

  TEST_CASE("calendar revisions: SEQUENCE and STATUS (RFC 5545 3.8.7.4, 3.8.1.11)") {
    const std::vector<io::CalendarEvent> before = {event("a", "20271028T220000", 0), event("b", "20271029T220000", 2),
                                                   event("c", "20271030T220000", 1), event("d", "20271031T220000", 3, true),
                                                   event("e", "20271101T220000", 4, true)};
    io::CalendarEvent moved = event("b", "20271029T060000");
    const std::vector<io::CalendarEvent> now = {event("a", "20271028T220000"), moved, event("e", "20271101T220000"),
                                                event("f", "20271102T220000")};
    const auto out = io::reviseEvents(before, now);
    REQUIRE(out.size() == 6);
    CHECK(byUid(out, "a").sequence == 0);  // unchanged: keeps its SEQUENCE
    CHECK_FALSE(byUid(out, "a").cancelled);
    CHECK(byUid(out, "b").sequence == 3);  // changed: the next
    CHECK(byUid(out, "b").lines == moved.lines);
    CHECK(byUid(out, "c").sequence == 2);  // removed: cancelled at the next, times kept
    CHECK(byUid(out, "c").cancelled);
    CHECK(byUid(out, "c").start() == "20271030T220000");
    CHECK(byUid(out, "d").sequence == 3);  // cancelled before: carried as it was
    CHECK(byUid(out, "d").cancelled);
    CHECK(byUid(out, "e").sequence == 5);  // worked again after a cancellation
    CHECK_FALSE(byUid(out, "e").cancelled);
    CHECK(byUid(out, "f").sequence == 0);  // new
    CHECK(std::is_sorted(out.begin(), out.end(), [](const auto& x, const auto& y) { return x.start() < y.start(); }));
  }

  TEST_CASE("published calendars read back: folding, parameters, errors") {
    const std::string text =
        "BEGIN:VCALENDAR\r\nVERSION:2.0\r\nBEGIN:VEVENT\r\nUID:ana-20271030-x@rotaweave\r\nDTSTAMP:20261205T000000Z\r\n"
        "SEQUENCE:7\r\nSTATUS:CANCELLED\r\nDTSTART;TZID=Europe/Berlin:20271030T220000\r\nDESCRIPTION:Shift N as op\\, 22:00 to\r\n"
        "  06:00 next day\r\nEND:VEVENT\r\nEND:VCALENDAR\r\n";
    const auto events = io::parseCalendarEvents(text, "ana.ics");
    REQUIRE(events.size() == 1);
    CHECK(events[0].uid == "ana-20271030-x@rotaweave");
    CHECK(events[0].sequence == 7);
    CHECK(events[0].cancelled);
    CHECK(events[0].start() == "20271030T220000");
    CHECK(events[0].lines.back() == "DESCRIPTION:Shift N as op\\, 22:00 to 06:00 next day");
    CHECK_THROWS_AS(io::parseCalendarEvents("hello", "x.ics"), io::InputError);
    CHECK_THROWS_AS(io::parseCalendarEvents("BEGIN:VCALENDAR\nBEGIN:VEVENT\nSEQUENCE:1\nEND:VEVENT\n", "x.ics"), io::InputError);
    CHECK_THROWS_AS(io::parseCalendarEvents("BEGIN:VCALENDAR\nBEGIN:VEVENT\nUID:u\nSEQUENCE:x\nEND:VEVENT\n", "x.ics"), io::InputError);
  }
}
