/// @brief Property: the incremental score of every move equals a full re-evaluation after it,
/// and the bounded try accepts a move exactly when that score is within its limit.
#include <doctest/doctest.h>

#include <filesystem>

#include "bench/instance_format.hpp"
#include "fixtures.hpp"
#include "io/scenario_loader.hpp"
#include "search/construction.hpp"
#include "search/eligibility.hpp"
#include "search/local_search.hpp"

using namespace rotaweave;

namespace {

/// Applies `moves` random moves, committing about half, and checks delta against full scoring.
void checkDeltas(const model::Problem& p, int moves, std::uint64_t seed) {
  const rules::RuleSet set(p);
  const search::Eligibility elig(p);
  eval::Evaluator inc(set), full(set);
  search::Rng rng(seed);
  model::Roster g(p.staffCount(), p.days);
  search::randomRoster(elig, g, 0.5, rng);
  inc.load(g);
  REQUIRE(inc.total() == full.score(g));
  // The report lists each rule on its own (the evaluator groups some); its penalties add up to the score.
  auto explained = [&](const model::Roster& r) {
    rules::Tally sum;
    for (const auto& b : full.explain(r)) (b.hard ? sum.hard : sum.soft) += b.penalty;
    return sum;
  };
  REQUIRE(explained(g) == full.score(g));
  eval::Move move;
  for (int i = 0; i < moves; ++i) {
    search::randomMove(elig, inc.roster(), rng, move);
    // Also try moves that ignore eligibility (a hand-made roster may hold anything).
    if (i % 7 == 0 && move.size == 0) move.add(rng.below(p.staffCount()), rng.below(p.days), static_cast<TaskIdx>(rng.below(p.taskCount())));
    if (move.size == 0) continue;
    model::Roster after = inc.roster();
    for (const auto& c : move) after.at(c.staff, c.day) = c.task;
    const rules::Tally actual = full.score(after);
    // The bounded try accepts exactly the moves whose weighed total is within its limit.
    const double weight = i % 3 == 0 ? 1.0 : (i % 3 == 1 ? 100.0 : 7919.5);
    const double value = static_cast<double>(actual.hard) * weight + static_cast<double>(actual.soft);
    REQUIRE(inc.tryMoveWithin(move, weight, value));
    REQUIRE_FALSE(inc.tryMoveWithin(move, weight, value - 0.5));
    const double limit = value * 2 * rng.uniform();
    REQUIRE(inc.tryMoveWithin(move, weight, limit) == (value <= limit));
    const bool bounded = rng.chance(0.5);  // commit after the bounded try or after tryMove
    if (bounded) {
      REQUIRE(inc.tryMoveWithin(move, weight, value + 1));
    } else {
      REQUIRE(inc.tryMove(move) == actual);
    }
    if (rng.chance(0.5)) {
      inc.commit();
      REQUIRE(inc.total() == actual);
      REQUIRE(inc.roster() == after);
      if (i % 16 == 0) REQUIRE(explained(after) == actual);
    }
  }
}

}  // namespace

TEST_SUITE("eval") {
  TEST_CASE("incremental and full scores agree on every rule kind") {
    const auto p = test::loadYaml(test::header(21) +
                                  "contracts:\n  ft: {hours: {min: 80, max: 100}}\n"
                                  "staff:\n"
                                  "  - {id: a, contract: ft, skills: [rn], history: [N, N, off], requests: [{date: 2027-03-03, off: true}, {date: 2027-03-04, shift: E, weight: 2}, {date: 2027-03-05, not: N}]}\n"
                                  "  - {id: b, contract: ft, skills: [rn], absences: [{from: 2027-03-08, to: 2027-03-10}, {date: 2027-03-15, reason: training}], fixed: [{date: 2027-03-01, shift: L}]}\n"
                                  "  - {id: c, skills: [rn], history: [E], absences: [{date: 2027-03-16, reason: unpaid}, {date: 2027-03-17, reason: sick}]}\n"
                                  "  - {id: d, skills: [rn]}\n"
                                  "demand:\n  - {shift: E, skill: rn, min: 1, target: 2, max: 2}\n  - {shift: N, skill: rn, min: 1}\n"
                                  "  - {shift: L, skill: rn, min: 1, days: [sat, sun], max: 1}\n"
                                  "rules:\n  list:\n"
                                  "    - {kind: min-rest, hours: 11}\n"
                                  "    - {kind: forbid-sequence, sequence: [N, off, E]}\n"
                                  "    - {kind: min-consecutive-days, days: 2}\n"
                                  "    - {kind: max-consecutive-days, days: 5}\n"
                                  "    - {kind: min-consecutive, shift: N, count: 2}\n"
                                  "    - {kind: max-consecutive, shift: N, count: 3, severity: soft}\n"
                                  "    - {kind: min-consecutive-off, days: 2, severity: soft}\n"
                                  "    - {kind: days-off-after, shift: N, days: 2}\n"
                                  "    - {kind: min-hours, hours: 16, window_days: 7}\n"
                                  "    - {kind: max-hours, hours: 40, window_days: 7}\n"
                                  "    - {kind: max-hours, hours: 90, severity: soft, credit_absences: false}\n"
                                  "    - {kind: min-hours, hours: 60, staff: [c, d]}\n"
                                  "    - {kind: min-count, shift: E, count: 2}\n"
                                  "    - {kind: max-count, count: 15}\n"
                                  "    - {kind: max-weekends, count: 2}\n"
                                  "    - {kind: complete-weekends, severity: soft}\n"
                                  "    - {kind: weekly-rest, hours: 35}\n"
                                  "    - {kind: fair-share, shift: N}\n"
                                  "    - {kind: fair-share, weekends: true, weight: 2}\n");
    REQUIRE(p.credit(1) > 0);  // b's leave and training count toward the period's hours
    REQUIRE(p.credit(2) > 0);  // c's sick day does, the unpaid day does not
    for (std::uint64_t seed = 1; seed <= 5; ++seed) checkDeltas(p, 3000, seed);
  }

  TEST_CASE("incremental and full scores agree on changes against a published roster") {
    auto p = test::loadYaml(test::header(14) +
                            "staff:\n  - {id: a, skills: [rn]}\n  - {id: b, skills: [rn]}\n  - {id: c, skills: [rn]}\n"
                            "demand:\n  - {shift: E, skill: rn, min: 1}\n  - {shift: N, skill: rn, min: 1}\n"
                            "rules:\n  list:\n"
                            "    - {kind: changes, early_days: 3, early_weight: 5, near_days: 2, far_weight: 4}\n"
                            "    - {kind: max-consecutive-days, days: 5}\n");
    // A published roster as re-planning sets one: every cell some task, changes charged from
    // day 2; c is absent on day 6, so days 4-8 are near the absence and the rest far.
    std::vector<TaskIdx> cells;
    search::Rng rng(11);
    for (int i = 0; i < p.staffCount() * p.days; ++i) cells.push_back(static_cast<TaskIdx>(1 + rng.below(p.taskCount() - 1)));
    p.absent[p.cell(2, 6)] = 1;
    p.published = model::makePublished(p, cells, 2);
    CHECK(p.published->gapDistance[6] == 0);
    CHECK(p.published->gapDistance[9] == 3);
    for (std::uint64_t seed = 1; seed <= 3; ++seed) checkDeltas(p, 2000, seed);
  }

  TEST_CASE("incremental and full scores agree on a long horizon with overlapping shifts") {
    // 364 days; X (00:30-04:00) lies inside the night after N, M is a long overnight shift, so
    // rests are negative and a shift can end before the one before it; history of different
    // lengths per person; windows, weekly-rest blocks and weekends of several sizes.
    const std::string extra = "  - {id: X, start: \"00:30\", end: \"04:00\"}\n"
                              "  - {id: M, start: \"16:00\", end: \"04:00\", break_minutes: 45}\n"
                              "  - {id: D, start: \"08:00\", end: \"20:00\", break_minutes: 60}\n";
    const auto p = test::loadYaml(test::header(364, extra) +
                                  "weekend: [fri, sat, sun]\n"
                                  "contracts:\n  ft: {hours: {min: 1500, max: 1700}}\n"
                                  "staff:\n"
                                  "  - {id: a, contract: ft, skills: [rn], history: [N, N, off, M, X, N, N, N, E, L, off, off, D]}\n"
                                  "  - {id: b, contract: ft, skills: [rn], history: [X], absences: [{from: 2027-05-08, to: 2027-05-30}]}\n"
                                  "  - {id: c, skills: [rn], history: [off, M]}\n"
                                  "  - {id: d, skills: [rn]}\n"
                                  "  - {id: e, skills: [rn], history: [D, D, D, D, D, D]}\n"
                                  "demand:\n  - {shift: E, skill: rn, min: 1, target: 2, max: 2}\n  - {shift: N, skill: rn, min: 1}\n"
                                  "  - {shift: D, skill: rn, min: 1, days: [sat, sun], max: 1}\n"
                                  "rules:\n  list:\n"
                                  "    - {kind: min-rest, hours: 11}\n"
                                  "    - {kind: forbid-sequence, sequence: [N, off, E]}\n"
                                  "    - {kind: forbid-sequence, sequence: [M, X]}\n"
                                  "    - {kind: forbid-sequence, sequence: [N, E], severity: soft, weight: 3}\n"
                                  "    - {kind: forbid-sequence, sequence: [N, L], staff: [a, b, c]}\n"
                                  "    - {kind: forbid-sequence, sequence: [M, E], id: no-m-e-1}\n"
                                  "    - {kind: forbid-sequence, sequence: [M, E], id: no-m-e-2, severity: soft}\n"
                                  "    - {kind: min-consecutive-days, days: 3}\n"
                                  "    - {kind: max-consecutive-days, days: 5}\n"
                                  "    - {kind: min-consecutive, shift: N, count: 2}\n"
                                  "    - {kind: max-consecutive, shift: D, count: 2, severity: soft}\n"
                                  "    - {kind: min-consecutive-off, days: 2, severity: soft}\n"
                                  "    - {kind: days-off-after, shift: N, days: 2}\n"
                                  "    - {kind: days-off-after, shift: M, days: 1, severity: soft}\n"
                                  "    - {kind: min-hours, hours: 20, window_days: 7}\n"
                                  "    - {kind: max-hours, hours: 48, window_days: 7}\n"
                                  "    - {kind: max-hours, hours: 20, window_days: 3, severity: soft}\n"
                                  "    - {kind: min-hours, hours: 120, window_days: 30, severity: soft}\n"
                                  "    - {kind: max-hours, hours: 1200, window_days: 200}\n"
                                  "    - {kind: min-count, shift: E, count: 40}\n"
                                  "    - {kind: max-count, shift: N, count: 50}\n"
                                  "    - {kind: max-count, count: 250}\n"
                                  "    - {kind: max-weekends, count: 30}\n"
                                  "    - {kind: complete-weekends, severity: soft}\n"
                                  "    - {kind: weekly-rest, hours: 35}\n"
                                  "    - {kind: weekly-rest, hours: 20, days: 3, severity: soft}\n"
                                  "    - {kind: fair-share, shift: N}\n"
                                  "    - {kind: fair-share, weekends: true, weight: 2}\n");
    for (std::uint64_t seed = 1; seed <= 3; ++seed) checkDeltas(p, 3000, seed);
  }

  TEST_CASE("incremental and full scores agree on short periods and long history") {
    // Fewer known days than a rolling window, and history longer than the period.
    const auto p = test::loadYaml(test::header(5) +
                                  "staff:\n"
                                  "  - {id: a, skills: [rn], history: [N, N, off, E, E, E, L, off, N]}\n"
                                  "  - {id: b, skills: [rn]}\n"
                                  "  - {id: c, skills: [rn], history: [L]}\n"
                                  "demand:\n  - {shift: E, skill: rn, min: 1}\n"
                                  "rules:\n  list:\n"
                                  "    - {kind: min-hours, hours: 30, window_days: 7}\n"
                                  "    - {kind: max-hours, hours: 16, window_days: 7}\n"
                                  "    - {kind: max-hours, hours: 8, window_days: 2, severity: soft}\n"
                                  "    - {kind: weekly-rest, hours: 24, days: 2}\n"
                                  "    - {kind: min-consecutive-off, days: 3}\n"
                                  "    - {kind: days-off-after, shift: N, days: 3}\n"
                                  "    - {kind: complete-weekends}\n");
    for (std::uint64_t seed = 1; seed <= 5; ++seed) checkDeltas(p, 2000, seed);
  }

  TEST_CASE("a change reaches the rest that follows a shift it encloses") {
    // N on day 3 ends at 06:00 on day 4, after X on day 4 (00:30-04:00) ends: taking N away
    // moves the start of the free time before E on day 10 by two hours, which decides the
    // weekly rest of the third 3-day block although the next worked day is inside the second.
    const auto p = test::loadYaml(test::header(12, "  - {id: X, start: \"00:30\", end: \"04:00\"}\n") +
                                  "staff:\n  - {id: a, skills: [rn]}\n"
                                  "rules:\n  list:\n    - {kind: weekly-rest, hours: 146, days: 3}\n");
    const rules::RuleSet set(p);
    eval::Evaluator inc(set), full(set);
    const model::Roster before = test::rosterFrom(p, {"E . N X . . . . . E . ."});
    inc.load(before);
    eval::Move move;
    move.add(0, 2, kOff);
    model::Roster after = before;
    after.at(0, 2) = kOff;
    CHECK(inc.tryMove(move) == full.score(after));
    CHECK_FALSE(full.score(after) == full.score(before));
  }

  TEST_CASE("incremental and full scores agree on converted 182- and 364-day benchmark instances") {
    // Instances 20 and 22 of the open benchmark (Curtois and Qu, 2014), read from the shared
    // dataset folder when it is there: hundreds of forbidden pairs, many shift limits.
    namespace fs = std::filesystem;
    const fs::path dataset = fs::path(ROTAWEAVE_SOURCE_DIR) / ".." / "shared" / "benchmarks" / "shift-scheduling";
    if (!fs::exists(dataset / "Instance20.txt")) {
      MESSAGE("skipped: benchmark dataset not found at " << dataset.string());
      return;
    }
    for (const int n : {20, 22}) {
      CAPTURE(n);
      const std::string name = "Instance" + std::to_string(n);
      const auto instance = bench::parseInstanceFile((dataset / (name + ".txt")).string());
      checkDeltas(test::loadYaml(bench::toScenarioYaml(instance, name)), 800, 11);
    }
  }

  TEST_CASE("incremental and full scores agree on the bundled samples") {
    namespace fs = std::filesystem;
    const fs::path samples = fs::path(ROTAWEAVE_SOURCE_DIR) / "samples";
    int checked = 0;
    for (const auto& entry : fs::directory_iterator(samples)) {
      const fs::path scenario = entry.path() / "scenario.yaml";
      if (!fs::exists(scenario)) continue;
      CAPTURE(scenario.string());
      checkDeltas(io::loadScenario(scenario.string()), 3000, 7);
      ++checked;
    }
    CHECK(checked >= 1);
  }
}
