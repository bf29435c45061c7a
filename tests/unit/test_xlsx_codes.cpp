/// @brief Workbook pieces that need no spreadsheet reader: absence codes, the colour clash
/// check and the COUNTIF criteria.
#include <doctest/doctest.h>

#include "fixtures.hpp"
#include "io/absence_codes.hpp"
#include "io/xlsx_sheets.hpp"

using namespace rotaweave;

TEST_SUITE("io") {
  TEST_CASE("absence codes: from the words of the reason, clear of shift ids") {
    const model::Problem p = test::loadYaml(test::header(3) + "staff:\n  - {id: a, skills: [rn]}\n");
    CHECK(io::absenceCode(p, "annual leave") == "LV");
    CHECK(io::absenceCode(p, "sick leave") == "SK");
    CHECK(io::absenceCode(p, "Fire safety TRAINING") == "TR");
    CHECK(io::absenceCode(p, "") == "AB");
    CHECK(io::absenceCode(p, "jury service") == "AB");
    CHECK(io::absenceCodeMeaning(p, "SK") == std::optional<std::string>("sick"));
    CHECK_FALSE(io::absenceCodeMeaning(p, "E").has_value());
    const model::Problem clash = test::loadYaml(test::header(3, "  - {id: lv, start: \"09:00\", end: \"17:00\"}\n") +
                                                "staff:\n  - {id: a, skills: [rn]}\n");
    CHECK(io::absenceCode(clash, "leave") == "(LV)");
    CHECK(io::absenceCodeMeaning(clash, "(LV)") == std::optional<std::string>("leave"));
    CHECK_FALSE(io::absenceCodeMeaning(clash, "LV").has_value());
  }

  TEST_CASE("workbook colours: default shift colours keep clear of the absence fill") {
    const model::Problem p = test::loadYaml(test::header(3) + "staff:\n  - {id: a, skills: [rn]}\n");
    for (size_t s = 0; s < p.shifts.size(); ++s)
      CHECK(io::xlsx::colourDistance(io::xlsx::shiftColour(p, static_cast<ShiftIdx>(s)), io::xlsx::kAbsenceFill) >=
            io::xlsx::kClashDistance);
    CHECK(io::xlsx::colourClashes(p).empty());
    CHECK(io::xlsx::colourDistance(0x000000, 0xFFFFFF) == doctest::Approx(441.67).epsilon(0.001));
  }

  TEST_CASE("workbook formulas: criteria match text exactly, wildcards escaped") {
    CHECK(io::xlsx::exactCriterion("E") == "\"=E\"");
    CHECK(io::xlsx::exactCriterion("E/", true) == "\"=E/*\"");
    CHECK(io::xlsx::exactCriterion("a*b?~\"") == "\"=a~*b~?~~\"\"\"");
    CHECK(io::xlsx::cellRef(3, 2) == "C4");
    CHECK(io::xlsx::rangeRef(3, 2, 27, 32, true) == "$C$4:$AG$28");
  }
}
