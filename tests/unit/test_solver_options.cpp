/// @brief The option table: defaults inside their bounds, and setParameter refuses what lies
/// outside with a message naming the allowed range.
#include <doctest/doctest.h>

#include <cmath>
#include <stdexcept>
#include <string>

#include "search/solver_options.hpp"

using namespace rotaweave;

TEST_SUITE("solver options") {
  TEST_CASE("every parameter's default lies within its bounds and setting it is accepted") {
    for (const auto& info : search::parameterTable()) {
      CAPTURE(info.name);
      CHECK(info.min <= info.max);
      CHECK(info.defaultValue >= info.min);
      CHECK(info.defaultValue <= info.max);
      CHECK(std::string(info.help).size() > 10);
      search::SolverOptions o;
      CHECK_NOTHROW(search::setParameter(o, info.name, info.defaultValue));
      CHECK_NOTHROW(search::setParameter(o, info.name, info.max));
    }
  }

  TEST_CASE("values outside the bounds, fractions for whole numbers and unknown names are refused") {
    search::SolverOptions o;
    try {
      search::setParameter(o, "population", 2);
      FAIL("population 2 accepted");
    } catch (const std::invalid_argument& e) {
      CHECK(std::string(e.what()) == "--population must be a whole number in [4, 1000], got 2");
    }
    CHECK_THROWS_AS(search::setParameter(o, "crossover-rate", 1.5), std::invalid_argument);
    CHECK_THROWS_AS(search::setParameter(o, "islands", 2.5), std::invalid_argument);
    CHECK_THROWS_AS(search::setParameter(o, "time-limit", 0), std::invalid_argument);
    CHECK_THROWS_AS(search::setParameter(o, "crossover-rate", std::nan("")), std::invalid_argument);
    CHECK_THROWS_WITH_AS(search::setParameter(o, "no-such", 1), "unknown parameter 'no-such'", std::invalid_argument);
    CHECK(o.population == search::SolverOptions{}.population);  // a refused value changes nothing
  }

  TEST_CASE("a parameter set by name lands in its field") {
    search::SolverOptions o;
    search::setParameter(o, "time-limit", 12.5);
    search::setParameter(o, "generations", 40);
    search::setParameter(o, "local-search", 1234);
    search::setParameter(o, "column-share", 0.2);
    search::setParameter(o, "migrants", 3);
    CHECK(o.timeLimit == 12.5);
    CHECK(o.generations == 40);
    CHECK(o.localSearchMoves == 1234);
    CHECK(o.columnShare == 0.2);
    CHECK(o.migrants == 3);
  }

  TEST_CASE("selection names read back as themselves") {
    for (auto s : {search::Selection::Tournament, search::Selection::Rank, search::Selection::StochasticUniversal,
                   search::Selection::Roulette})
      CHECK(search::parseSelection(search::selectionName(s)) == s);
    CHECK_THROWS_AS(search::parseSelection("best"), std::invalid_argument);
  }
}
