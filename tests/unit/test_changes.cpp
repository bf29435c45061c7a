/// @brief The `changes` rule's weights (short notice, distance from absences), the replan
/// problem built by the loader, and the traced reasons of a re-plan's changes.
#include <doctest/doctest.h>

#include <fstream>

#include "fixtures.hpp"
#include "io/input_error.hpp"
#include "io/replan_loader.hpp"
#include "report/changes.hpp"

namespace rotaweave {
namespace {

/// Writes a roster CSV for `p` from rows of cells ("E", "E/hca", "" for off).
std::string publishedCsv(const model::Problem& p, const std::vector<std::vector<std::string>>& rows) {
  std::string text = "staff";
  for (DayIdx d = 0; d < p.days; ++d) text += "," + p.dateText(d);
  text += "\n";
  for (size_t s = 0; s < rows.size(); ++s) {
    text += p.staff[s].id;
    for (const auto& c : rows[s]) text += "," + c;
    text += "\n";
  }
  return test::writeTemp(text, ".csv");
}

// Three nurses and an assistant over 10 days; ana works E every day, bea L, cal off.
const std::string kScenario =
    test::header(10) +
    "staff:\n  - {id: ana, skills: [rn]}\n  - {id: bea, skills: [rn]}\n  - {id: cal, skills: [rn]}\n"
    "demand:\n  - {shift: E, skill: rn, min: 1}\n  - {shift: L, skill: rn, min: 1}\n";

}  // namespace

TEST_SUITE("replan") {
  TEST_CASE("the replan loader builds published, absences, frozen days and the default changes rule") {
    std::string path;
    const auto base = test::loadYaml(kScenario, &path);
    const std::string pub = publishedCsv(
        base, {std::vector<std::string>(10, "E"), std::vector<std::string>(10, "L"), std::vector<std::string>(10, "")});
    const model::Problem p = io::loadReplanScenario(path, {pub, "2027-03-03", {"ana:2027-03-05..2027-03-06:sick"}});
    REQUIRE(p.published);
    CHECK(p.published->from == 2);
    CHECK(p.absent[p.cell(0, 4)] == 1);
    CHECK(p.absenceReason[p.cell(0, 5)] == "sick");
    CHECK(p.absent[p.cell(0, 3)] == 0);
    CHECK(p.fixed[p.cell(1, 1)] == p.published->cells[p.cell(1, 1)]);  // days before --from frozen
    CHECK(p.fixed[p.cell(1, 2)] == -1);
    // Gap days 4 and 5 (ana was published to work): distances from them.
    CHECK(p.published->gapDistance[4] == 0);
    CHECK(p.published->gapDistance[2] == 2);
    CHECK(p.published->gapDistance[9] == 4);
    const auto& rule = p.rules.back();
    CHECK(rule.kind == model::RuleKind::Changes);
    CHECK(rule.weight == io::ChangesDefaults::weight);
    CHECK(rule.earlyDays == io::ChangesDefaults::earlyDays);
    CHECK(rule.earlyWeight == io::ChangesDefaults::earlyWeight);
    CHECK(rule.nearDays == io::ChangesDefaults::nearDays);
    CHECK(rule.farWeight == io::ChangesDefaults::farWeight);
    CHECK_THROWS_AS(io::loadReplanScenario(path, {pub, "2027-03-03", {"nobody:2027-03-05"}}), io::InputError);
    CHECK_THROWS_AS(io::loadReplanScenario(path, {pub, "2027-04-03", {}}), io::InputError);
  }

  TEST_CASE("the documented defaults of the changes rule are the loader's") {
    std::ifstream in(std::string(ROTAWEAVE_SOURCE_DIR) + "/docs/rules/changes.md");
    const std::string doc((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
    const auto w = [](Cost c) { return std::to_string(c / kWeightScale); };
    CHECK(doc.find("{id: changes, kind: changes, severity: soft, weight: " + w(io::ChangesDefaults::weight) +
                   ", early_days: " + std::to_string(io::ChangesDefaults::earlyDays) +
                   ", early_weight: " + w(io::ChangesDefaults::earlyWeight) +
                   ", near_days: " + std::to_string(io::ChangesDefaults::nearDays) +
                   ", far_weight: " + w(io::ChangesDefaults::farWeight) + "}") != std::string::npos);
  }

  TEST_CASE("a change costs the highest weight that applies: short notice, far from every absence, or near") {
    auto p = test::loadYaml(kScenario +
                            "rules:\n  list:\n    - {kind: changes, weight: 2, early_days: 1, early_weight: 10, "
                            "near_days: 1, far_weight: 6}\n");
    std::vector<TaskIdx> cells(static_cast<size_t>(p.staffCount() * p.days), kOff);
    for (DayIdx d = 0; d < p.days; ++d) cells[p.cell(0, d)] = p.task(0, 0);  // ana E every day
    p.absent[p.cell(0, 5)] = 1;
    p.published = model::makePublished(p, cells, 2);
    // cal takes E on day 2 (short notice, far: 10), day 4 (near: 2), day 8 (far: 6).
    auto r = test::rosterFrom(p, {"E E E E E . E E E E", ". . . . . . . . . .", ". . E . E . . . E ."});
    std::vector<rules::Breach> found;
    for (const auto& b : test::breaches(p, r, "changes"))
      if (b.staff == 2) found.push_back(b);  // ana's absent day 5 is a change too (near: 2)
    REQUIRE(found.size() == 3);
    Cost total = 0;
    for (const auto& b : found) {
      total += b.penalty;
      const DayIdx d = b.days.front();
      CHECK((b.message.find("far from any absence") != std::string::npos) == (d == 2 || d == 8));
      CHECK((b.message.find("short notice") != std::string::npos) == (d == 2));
      CHECK(b.penalty == (d == 2 ? 10 : d == 4 ? 2 : 6) * kCostScale);
    }
    CHECK(total == 18 * kCostScale);
  }

  TEST_CASE("reasons trace the chain: who took whose slot, on which day, for which skill") {
    // bea holds hca (first) and rn: with ana sick, bea covers ana's E rn and cal takes bea's E hca.
    auto p = test::loadYaml(
        "name: chain\nperiod: {start: 2027-03-01, end: 2027-03-02}\n"
        "shifts:\n  - {id: E, start: \"07:00\", end: \"15:00\"}\nskills: [rn, hca]\n"
        "staff:\n  - {id: ana, skills: [rn]}\n  - {id: bea, skills: [hca, rn]}\n  - {id: cal, skills: [hca]}\n"
        "  - {id: dan, skills: [rn]}\n"
        "demand:\n  - {shift: E, skill: rn, min: 1}\n  - {shift: E, skill: hca, min: 1}\n"
        "rules:\n  list:\n    - {id: dan-one, kind: max-count, count: 1, staff: [dan]}\n");
    const auto published = test::rosterFrom(p, {"E E", "E E", ". .", ". E"});
    p.absent[p.cell(0, 0)] = 1;
    p.absenceReason[p.cell(0, 0)] = "sick";
    p.absent[p.cell(0, 1)] = 1;
    p.published = model::makePublished(p, published.cells, 0);
    // Day 0: bea moves to rn, cal takes her hca slot. Day 1: dan covers ana, so bea's day is
    // unchanged; dan's... (dan was published E on day 1 already: ana's slot needs a second rn).
    const auto roster = test::rosterFrom(p, {". .", "E/rn E", "E .", "E ."});
    const rules::RuleSet rs(p);
    const auto changes = report::computeChanges(rs, roster);
    auto reasonOf = [&](const std::string& id, DayIdx d) {
      for (const auto& c : changes.cells)
        if (p.staff[static_cast<size_t>(c.staff)].id == id && c.day == d) return c.reason;
      return std::string("(unchanged)");
    };
    CHECK(reasonOf("ana", 0) == "absent (sick)");
    CHECK(reasonOf("bea", 0) == "covers ana's absence (E rn)");
    CHECK(reasonOf("cal", 0) == "takes bea's E hca; bea moved to cover ana's absence (E rn)");
    // dan takes ana's E rn on day 0 is not possible (bea took it): dan's day 0 took nobody's slot.
    CHECK(reasonOf("dan", 0).rfind("rebalanced", 0) == 0);
    // dan's day 1 E was published and is now off; putting it back breaks dan-one (one shift).
    CHECK(reasonOf("dan", 1) == "rebalanced to meet rule 'dan-one'");
    CHECK(reasonOf("ana", 1) == "absent");
    for (const auto& c : changes.cells)
      if (c.reason.rfind("covers ", 0) == 0) {
        REQUIRE(c.tookFrom >= 0);
        CHECK(p.absent[p.cell(c.tookFrom, c.day)] == 1);
        CHECK(p.published->cells[p.cell(c.tookFrom, c.day)] == c.now);
        CHECK(p.staff[static_cast<size_t>(c.staff)].holds(p.tasks[static_cast<size_t>(c.now)].skill));
      }
  }
}

}  // namespace rotaweave
