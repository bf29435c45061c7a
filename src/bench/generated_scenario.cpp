/// @brief Scenario generator for benchmarks.
#include "bench/generated_scenario.hpp"

#include <algorithm>
#include <sstream>

#include "model/calendar.hpp"
#include "search/rng.hpp"

namespace rotaweave::bench {

std::string generatedScenarioYaml(int people, int days, int shifts) {
  shifts = std::clamp(shifts, 3, 6);
  search::Rng rng(static_cast<std::uint64_t>(people * 1000 + days * 10 + shifts));
  const auto start = model::serialFromCivil(2027, 3, 1);
  auto date = [&](int d) { return model::formatIsoDate(start + d); };
  static const char* kIds[] = {"E", "L", "N", "D", "T", "S"};
  static const char* kStart[] = {"07:00", "14:30", "22:00", "09:00", "11:00", "17:00"};
  static const char* kEnd[] = {"15:00", "22:30", "07:30", "17:00", "19:00", "23:00"};

  std::ostringstream y;
  y << "name: Generated " << people << " x " << days << " x " << shifts << "\n"
    << "period: {start: " << date(0) << ", end: " << date(days - 1) << "}\n"
    << "shifts:\n";
  for (int s = 0; s < shifts; ++s)
    y << "  - {id: " << kIds[s] << ", start: \"" << kStart[s] << "\", end: \"" << kEnd[s] << "\", break_minutes: 30}\n";
  const int hoursMax = days * 40 / 7;
  y << "skills: [rn, hca]\n"
    << "contracts:\n  full-time: {hours: {min: " << hoursMax * 3 / 4 << ", max: " << hoursMax << "}}\n"
    << "  part-time: {hours: {min: " << hoursMax / 3 << ", max: " << hoursMax * 2 / 3 << "}}\n"
    << "staff:\n";
  for (int i = 0; i < people; ++i) {
    const bool rn = i % 3 != 2;
    y << "  - id: p" << i << "\n    contract: " << (i % 4 == 3 ? "part-time" : "full-time") << "\n    skills: "
      << (rn ? (i % 5 == 0 ? "[rn, hca]" : "[rn]") : "[hca]") << "\n";
    if (rng.chance(0.3)) {
      const int from = rng.below(days);
      y << "    absences: [{from: " << date(from) << ", to: " << date(std::min(days - 1, from + rng.below(5))) << ", reason: leave}]\n";
    }
    y << "    requests:\n";
    for (int k = 0; k < 2; ++k) y << "      - {date: " << date(rng.below(days)) << ", off: true, weight: " << 1 + rng.below(3) << "}\n";
    y << "      - {date: " << date(rng.below(days)) << ", not: " << kIds[rng.below(shifts)] << ", weight: 2}\n";
  }
  // Demand sized to roughly 80 % of the staff's capacity.
  const int rnPeople = people - people / 3;
  const int perShiftRn = std::max(1, rnPeople * 5 / 7 * 8 / 10 / shifts);
  const int perShiftHca = std::max(1, (people / 3) * 5 / 7 * 8 / 10 / shifts);
  y << "demand:\n";
  for (int s = 0; s < shifts; ++s) {
    y << "  - {shift: " << kIds[s] << ", skill: rn, min: " << std::max(1, perShiftRn - 1) << ", target: " << perShiftRn << "}\n";
    y << "  - {shift: " << kIds[s] << ", skill: hca, min: " << std::max(0, perShiftHca - 1) << ", target: " << perShiftHca << "}\n";
  }
  y << "rules:\n  list:\n"
    << "    - {kind: min-rest, hours: 11}\n"
    << "    - {kind: weekly-rest, hours: 35}\n"
    << "    - {kind: max-hours, hours: 48, window_days: 7}\n"
    << "    - {kind: max-consecutive-days, days: 6}\n"
    << "    - {kind: max-consecutive, shift: N, count: 4, severity: soft, weight: 10}\n"
    << "    - {kind: days-off-after, shift: N, days: 2, severity: soft, weight: 5}\n"
    << "    - {kind: forbid-sequence, sequence: [N, E]}\n"
    << "    - {kind: max-weekends, count: " << std::max(1, days / 14) << ", severity: soft, weight: 20}\n"
    << "    - {kind: fair-share, shift: N, weight: 2}\n";
  return y.str();
}

}  // namespace rotaweave::bench
