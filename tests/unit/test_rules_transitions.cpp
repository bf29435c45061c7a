/// @brief min-rest and forbid-sequence on hand-built rows, with check values from published rules.
#include <doctest/doctest.h>

#include "fixtures.hpp"

using namespace rotaweave;
using namespace rotaweave::test;

namespace {

std::string onePerson(int days, const std::string& rules, const std::string& person = "{id: ana, skills: [rn]}",
                      const std::string& shifts = "") {
  return header(days, shifts) + "staff:\n  - " + person + "\nrules:\n  list:\n" + rules;
}

}  // namespace

TEST_SUITE("rules") {
  TEST_CASE("min-rest: a Late then an Early gives 9 h rest and breaches 11 h") {
    // Check value: Late ending 22:00, Early starting 07:00 = 9 h < 11 h daily rest
    // (Directive 2003/88/EC Art. 3, EU-03; UK WTR reg. 10, UK-01).
    const auto p = loadYaml(onePerson(3, "    - {kind: min-rest, hours: 11}\n"));
    const auto r = rosterFrom(p, {"L E ."});
    const auto b = breaches(p, r, "min-rest");
    REQUIRE(b.size() == 1);
    CHECK(b[0].amount == kAmountScale);
    CHECK(b[0].days == std::vector<DayIdx>{0, 1});
    CHECK(b[0].message == "ana: 9.0 h rest between L on 2027-03-01 and E on 2027-03-02; the rule needs 11 h");
    CHECK(b[0].hard);
  }

  TEST_CASE("min-rest: exactly 11 h passes, one minute less fails") {
    // Check value (EU-03): a shift ending 21:00 and the next starting 08:00 is exactly 11 h.
    const std::string shifts =
        "  - {id: D, start: \"13:00\", end: \"21:00\"}\n"
        "  - {id: M, start: \"08:00\", end: \"16:00\"}\n"
        "  - {id: M2, start: \"07:59\", end: \"16:00\"}\n";
    const auto p = loadYaml(onePerson(3, "    - {kind: min-rest, hours: 11}\n", "{id: ana, skills: [rn]}", shifts));
    CHECK(breaches(p, rosterFrom(p, {"D M ."}), "min-rest").empty());
    CHECK(breaches(p, rosterFrom(p, {"D M2 ."}), "min-rest").size() == 1);
  }

  TEST_CASE("min-rest: a night that ends the next morning, then a Late, is an 8 h quick return") {
    // Check value (EU-03, OH-04): Night ending 06:00 and a Late at 14:00 the same day = 8 h.
    const auto p = loadYaml(onePerson(3, "    - {kind: min-rest, hours: 11}\n"));
    const auto b = breaches(p, rosterFrom(p, {"N L ."}), "min-rest");
    REQUIRE(b.size() == 1);
    CHECK(b[0].message.find("8.0 h rest between N on 2027-03-01 and L on 2027-03-02") != std::string::npos);
  }

  TEST_CASE("min-rest: rest is measured across days off and from history") {
    const auto p = loadYaml(onePerson(4, "    - {kind: min-rest, hours: 11}\n", "{id: ana, skills: [rn], history: [E, L]}"));
    // History ends with a Late on the day before the period: an Early on day 0 has 9 h.
    CHECK(breaches(p, rosterFrom(p, {"E . . ."}), "min-rest").size() == 1);
    // A day off in between: 33 h, fine.
    CHECK(breaches(p, rosterFrom(p, {". E . ."}), "min-rest").empty());
  }

  TEST_CASE("forbid-sequence: N then E, and patterns with off") {
    const auto p = loadYaml(onePerson(6,
                                      "    - {kind: forbid-sequence, sequence: [N, E]}\n"
                                      "    - {id: n-off-n, kind: forbid-sequence, sequence: [N, off, N], severity: soft, weight: 4}\n"));
    const auto r = rosterFrom(p, {"N E N . N ."});
    const auto all = breaches(p, r, "forbid-sequence");
    REQUIRE(all.size() == 2);
    CHECK(all[0].ruleId == "forbid-sequence");
    CHECK(all[0].days == std::vector<DayIdx>{0, 1});
    CHECK(all[1].ruleId == "n-off-n");
    CHECK(!all[1].hard);
    CHECK(all[1].penalty == 4 * kCostScale);
  }

  TEST_CASE("forbid-sequence: looks into history but not before it") {
    const auto p = loadYaml(onePerson(3, "    - {kind: forbid-sequence, sequence: [N, E]}\n", "{id: ana, skills: [rn], history: [N]}"));
    CHECK(breaches(p, rosterFrom(p, {"E . ."}), "forbid-sequence").size() == 1);
    const auto q = loadYaml(onePerson(3, "    - {kind: forbid-sequence, sequence: [N, E]}\n"));
    CHECK(breaches(q, rosterFrom(q, {"E . ."}), "forbid-sequence").empty());
  }
}
