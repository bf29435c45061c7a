/// @brief Test helpers.
#include "fixtures.hpp"

#include <atomic>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <unistd.h>

#include "io/scenario_loader.hpp"

namespace rotaweave::test {

std::string writeTemp(const std::string& text, const std::string& suffix) {
  static std::atomic<int> counter{0};
  const auto dir = std::filesystem::temp_directory_path() / ("rotaweave-tests-" + std::to_string(::getpid()));
  std::filesystem::create_directories(dir);
  const auto path = dir / ("f" + std::to_string(counter++) + suffix);
  std::ofstream(path, std::ios::binary) << text;
  return path.string();
}

model::Problem loadYaml(const std::string& yaml, std::string* path) {
  const std::string file = writeTemp(yaml, ".yaml");
  if (path) *path = file;
  return io::loadScenario(file);
}

model::Roster rosterFrom(const model::Problem& p, const std::vector<std::string>& rows) {
  model::Roster r(p.staffCount(), p.days);
  for (size_t s = 0; s < rows.size(); ++s) {
    std::istringstream in(rows[s]);
    std::string cell;
    for (DayIdx d = 0; in >> cell && d < p.days; ++d) {
      if (cell == ".") continue;
      const size_t slash = cell.find('/');
      const ShiftIdx sh = p.findShift(cell.substr(0, slash));
      const SkillIdx sk = slash == std::string::npos ? p.staff[s].skills.front() : p.findSkill(cell.substr(slash + 1));
      if (sh < 0 || sk < 0) throw std::runtime_error("bad test cell " + cell);
      r.at(static_cast<StaffIdx>(s), d) = p.task(sh, sk);
    }
  }
  return r;
}

std::vector<rules::Breach> breaches(const model::Problem& p, const model::Roster& r, const std::string& kind) {
  const rules::RuleSet set(p);
  eval::Evaluator ev(set);
  std::vector<rules::Breach> out;
  for (auto& b : ev.explain(r))
    if (kind.empty() || b.kind == kind) out.push_back(std::move(b));
  return out;
}

double amountOf(const model::Problem& p, const model::Roster& r, const std::string& kind) {
  double total = 0;
  for (const auto& b : breaches(p, r, kind)) total += static_cast<double>(b.amount) / kAmountScale;
  return total;
}

std::string header(int days, const std::string& extraShifts) {
  return "name: test\nperiod: {start: 2027-03-01, end: " + model::formatIsoDate(model::serialFromCivil(2027, 3, 1) + days - 1) +
         "}\nshifts:\n"
         "  - {id: E, start: \"07:00\", end: \"15:00\"}\n"
         "  - {id: L, start: \"14:00\", end: \"22:00\"}\n"
         "  - {id: N, start: \"22:00\", end: \"06:00\"}\n" +
         extraShifts + "skills: [rn]\n";
}

}  // namespace rotaweave::test
