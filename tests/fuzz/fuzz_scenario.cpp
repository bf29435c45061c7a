/// @brief libFuzzer target: any bytes as a scenario file. The loader may only reject them with
/// io::InputError; anything else (another exception, a crash, a sanitizer report) is a bug.
/// A scenario that loads must also survive a round trip of its (empty) roster through CSV.
#include <cstdint>
#include <cstdlib>
#include <string>

#include "fuzz_common.hpp"
#include "io/control_chars.hpp"
#include "io/input_error.hpp"
#include "io/roster_csv.hpp"
#include "io/scenario_loader.hpp"

using namespace rotaweave;

extern "C" int LLVMFuzzerTestOneInput(const uint8_t* data, size_t size) {
  const std::string path = fuzz::writeScratch("scenario.yaml", data, size);
  model::Problem problem;
  try {
    problem = io::loadScenario(path);
  } catch (const io::InputError& e) {
    if (e.file().empty() || std::string(e.what()).empty()) std::abort();  // every message names a file
    return 0;
  }
  // Whatever loads is consistent: a roster written for it reads back unchanged.
  if (problem.staffCount() <= 0 || problem.days <= 0 || problem.shifts.empty()) std::abort();
  // No control character reaches the outputs: every text they print was refused or is clean.
  auto clean = [](const std::string& s) {
    if (io::findControlChar(s)) std::abort();
  };
  clean(problem.name);
  for (const auto& s : problem.shifts) clean(s.id), clean(s.label);
  for (const auto& s : problem.skills) clean(s);
  for (const auto& c : problem.contracts) clean(c.id);
  for (const auto& p : problem.staff) clean(p.id), clean(p.name);
  for (const auto& r : problem.absenceReason) clean(r);
  for (const auto& r : problem.rules) clean(r.id);
  const model::Roster off(problem.staffCount(), problem.days);
  const std::string csv = io::rosterCsvText(off, problem);
  const std::string csvPath = fuzz::writeScratch("roundtrip.csv", reinterpret_cast<const uint8_t*>(csv.data()), csv.size());
  if (!(io::readRosterCsv(csvPath, problem) == off)) std::abort();  // an InputError here escapes: a bug too
  return 0;
}
