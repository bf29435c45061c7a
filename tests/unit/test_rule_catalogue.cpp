/// @brief The rule catalogue is the one place a kind is declared: every kind there has a docs
/// page, a unit, a declared row-optimiser treatment that matches the re-fit's brute-force
/// scenario, and a case in the incremental-against-full property tests.
#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>
#include <set>
#include <sstream>

#include "fixtures.hpp"
#include "model/rule_spec.hpp"

namespace rw = rotaweave;
using rw::model::RowOptimiser;

namespace {

std::string sourceText(const std::string& relative) {
  std::ifstream in(std::filesystem::path(ROTAWEAVE_SOURCE_DIR) / relative);
  std::stringstream text;
  text << in.rdbuf();
  return text.str();
}

}  // namespace

TEST_SUITE("model") {
  TEST_CASE("every rule kind declares its docs page, unit and row-optimiser treatment") {
    const std::string index = sourceText("docs/rules/README.md");
    for (const auto& info : rw::model::ruleCatalogue()) {
      CAPTURE(info.name);
      CHECK(std::filesystem::exists(std::filesystem::path(ROTAWEAVE_SOURCE_DIR) / rw::model::docsPage(info)));
      CHECK(index.find(std::string("(") + info.name + ".md)") != std::string::npos);  // listed in the index
      REQUIRE(info.unit != nullptr);
      CHECK(info.rowOptimiser != RowOptimiser::Undeclared);
      CHECK(rw::model::kindFromName(info.name) == info.kind);
      CHECK(&rw::model::kindInfo(info.kind) == &info);
    }
  }

  TEST_CASE("every kind the row optimiser models is in its brute-force scenario") {
    // tests/unit/test_row_refit.cpp checks the re-fit against brute force on this scenario;
    // a kind declared Exact or Partly must be in it, or that check says nothing about it.
    const auto p = rw::test::rowRulesScenario("[off]");
    std::set<rw::model::RuleKind> present;
    for (const auto& r : p.rules) present.insert(r.kind);
    for (const auto& info : rw::model::ruleCatalogue()) {
      if (info.rowOptimiser != RowOptimiser::Exact && info.rowOptimiser != RowOptimiser::Partly) continue;
      CAPTURE(info.name);
      CHECK(present.count(info.kind) == 1);
    }
  }

  TEST_CASE("every listable kind has an incremental-against-full case") {
    // The property tests judge moves against full scoring on scenarios written in their
    // source; a kind missing from them has no check that its incremental score is right.
    const std::string tests = sourceText("tests/unit/test_incremental.cpp");
    for (const auto& info : rw::model::ruleCatalogue()) {
      if (!info.listable) continue;  // the always-on kinds are in every scenario there
      CAPTURE(info.name);
      CHECK(tests.find(std::string("kind: ") + info.name) != std::string::npos);
    }
  }
}
