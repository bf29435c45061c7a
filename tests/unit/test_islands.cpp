/// @brief Islands and migration: a population stays sorted, emigrants are the best, and
/// immigrants replace the worst.
#include <doctest/doctest.h>

#include <algorithm>

#include "fixtures.hpp"
#include "search/island.hpp"

using namespace rotaweave;

namespace {

model::Problem islandWard() {
  return test::loadYaml(test::header(7) +
                        "staff:\n  - {id: a, skills: [rn]}\n  - {id: b, skills: [rn]}\n  - {id: c, skills: [rn]}\n"
                        "demand:\n  - {shift: E, skill: rn, min: 1}\n  - {shift: L, skill: rn, min: 1}\n"
                        "rules:\n  list:\n    - {kind: min-rest, hours: 11}\n");
}

search::SolverOptions smallIsland() {
  search::SolverOptions o;
  o.population = 6;
  o.localSearchMoves = 200;
  o.lagrangianRounds = 0;
  o.columnShare = 0;
  return o;
}

bool sortedByScore(const std::vector<search::Individual>& v) {
  return std::is_sorted(v.begin(), v.end(), [](const auto& a, const auto& b) { return a.score < b.score; });
}

}  // namespace

TEST_SUITE("islands") {
  TEST_CASE("emigrants are the island's best, in order") {
    const auto p = islandWard();
    const rules::RuleSet set(p);
    const search::Eligibility e(p);
    search::Island island(set, e, smallIsland(), 7);
    island.initialize({}, {}, std::chrono::steady_clock::time_point::max());
    const auto all = island.emigrants(100);  // more than the population: all of it
    REQUIRE(all.size() == 6);
    CHECK(sortedByScore(all));
    const auto two = island.emigrants(2);
    REQUIRE(two.size() == 2);
    CHECK(two[0].genome == island.best().genome);
    CHECK(two[1].score == all[1].score);
  }

  TEST_CASE("immigrants replace the worst and the population stays sorted") {
    const auto p = islandWard();
    const rules::RuleSet set(p);
    const search::Eligibility e(p);
    search::Island island(set, e, smallIsland(), 8);
    island.initialize({}, {}, std::chrono::steady_clock::time_point::max());
    const auto before = island.emigrants(6);

    // A perfect roster (E and L covered daily, no quick returns) arrives from another island.
    search::Individual perfect{test::rosterFrom(p, {"E E E E E E E", "L L L L L L L", ". . . . . . ."}), {}};
    eval::Evaluator ev(set);
    perfect.score = ev.score(perfect.genome);
    REQUIRE(perfect.score == rules::Tally{});
    island.immigrate({perfect});

    const auto after = island.emigrants(6);
    CHECK(sortedByScore(after));
    CHECK(island.best().score == rules::Tally{});  // it, or an equally perfect roster already there
    CHECK(std::any_of(after.begin(), after.end(), [&](const auto& x) { return x.genome == perfect.genome; }));
    // The worst individual left; the other five are still there.
    for (size_t i = 0; i + 1 < before.size(); ++i)
      CHECK(std::any_of(after.begin(), after.end(), [&](const auto& x) { return x.genome == before[i].genome; }));
  }

  TEST_CASE("an island's generations never lose its best roster") {
    const auto p = islandWard();
    const rules::RuleSet set(p);
    const search::Eligibility e(p);
    auto options = smallIsland();
    options.elite = 1;
    search::Island island(set, e, options, 9);
    island.initialize({}, {}, std::chrono::steady_clock::time_point::max());
    rules::Tally best = island.best().score;
    for (int g = 0; g < 5; ++g) {
      CHECK(island.evolve(1, [] { return false; }) == 1);
      CHECK_FALSE(best < island.best().score);
      best = island.best().score;
    }
    eval::Evaluator ev(set);
    CHECK(ev.score(island.best().genome) == island.best().score);
  }
}
