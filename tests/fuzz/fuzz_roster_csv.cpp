/// @brief libFuzzer target: any bytes as a roster CSV for a fixed small scenario. The reader may
/// only reject them with io::InputError; a roster it accepts must have valid cells and must
/// read back unchanged after writing.
#include <cstdint>
#include <cstdlib>
#include <string>

#include "fuzz_common.hpp"
#include "io/input_error.hpp"
#include "io/roster_csv.hpp"
#include "io/scenario_loader.hpp"

using namespace rotaweave;

namespace {

// Three people (one with two skills), a week, three shifts; long ids to reach the parser's corners.
const char* kScenario = R"(name: fuzz
period: {start: 2027-03-01, end: 2027-03-07}
shifts:
  - {id: E, start: "07:00", end: "15:00"}
  - {id: L2, start: "14:00", end: "22:00"}
  - {id: N.x, start: "22:00", end: "06:00"}
skills: [rn, hca]
staff:
  - {id: ana, skills: [rn]}
  - {id: ben_2, skills: [hca, rn]}
  - {id: c-3, skills: [hca]}
)";

const model::Problem& problem() {
  static const model::Problem p = [] {
    const std::string text(kScenario);
    return io::loadScenario(fuzz::writeScratch("fixed.yaml", reinterpret_cast<const uint8_t*>(text.data()), text.size()));
  }();
  return p;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const uint8_t* data, size_t size) {
  const model::Problem& p = problem();
  const std::string path = fuzz::writeScratch("roster.csv", data, size);
  model::Roster roster;
  try {
    roster = io::readRosterCsv(path, p);
  } catch (const io::InputError& e) {
    if (e.file() != path) std::abort();  // the message names the roster file
    return 0;
  }
  if (roster.staff != p.staffCount() || roster.days != p.days) std::abort();
  for (TaskIdx t : roster.cells)
    if (t != kOff && (t < 0 || static_cast<size_t>(t) >= p.tasks.size())) std::abort();
  const std::string csv = io::rosterCsvText(roster, p);
  const std::string again = fuzz::writeScratch("again.csv", reinterpret_cast<const uint8_t*>(csv.data()), csv.size());
  if (!(io::readRosterCsv(again, p) == roster)) std::abort();
  return 0;
}
