/// @brief Test helpers: scenarios from YAML text, rosters from compact strings, breach queries.
#pragma once
#include <string>
#include <vector>

#include "eval/evaluator.hpp"
#include "model/problem.hpp"
#include "model/roster.hpp"

namespace rotaweave::test {

/// Writes `yaml` to a fresh temporary file (name returned via `path` if given) and loads it.
model::Problem loadYaml(const std::string& yaml, std::string* path = nullptr);
/// Writes text to a new temporary file and returns its path.
std::string writeTemp(const std::string& text, const std::string& suffix);

/// One row per person: space-separated cells, each a shift id, SHIFT/skill, or "." for off.
model::Roster rosterFrom(const model::Problem& p, const std::vector<std::string>& rows);

/// Breaches of one kind (or all, with kind empty) of a roster.
std::vector<rules::Breach> breaches(const model::Problem& p, const model::Roster& r, const std::string& kind = "");
/// Sum of amounts (in rule units) of the breaches of one kind.
double amountOf(const model::Problem& p, const model::Roster& r, const std::string& kind);

/// A scenario header: 2027-03-01 (a Monday) for `days` days, the shifts of the labour-facts
/// check values (Early 07:00-15:00, Late 14:00-22:00, Night 22:00-06:00, no breaks), skill rn.
std::string header(int days, const std::string& extraShifts = "");

/// Three people over 8 days (Monday to the next Monday) with every rule kind the re-fit models,
/// all hard; cover and requests soft, so a row's cost is soft and its feasibility is hard == 0.
/// `history` is person a's days before the period, e.g. "[L, off]".
inline model::Problem rowRulesScenario(const std::string& history) {
  return loadYaml(header(8) +
                  "staff:\n"
                  "  - {id: a, skills: [rn], history: " + history + ", requests: [{date: 2027-03-03, off: true, weight: 3},"
                  " {date: 2027-03-06, shift: L, weight: 2}]}\n"
                  "  - {id: b, skills: [rn], absences: [{date: 2027-03-02}]}\n"
                  "  - {id: c, skills: [rn]}\n"
                  "demand:\n"
                  "  - {shift: E, skill: rn, min: 1, target: 2, max: 2, severity: soft, min_weight: 4}\n"
                  "  - {shift: L, skill: rn, min: 1, severity: soft, min_weight: 5}\n"
                  "  - {shift: N, skill: rn, min: 0, max: 0, severity: soft}\n"
                  "rules:\n  list:\n"
                  "    - {kind: forbid-sequence, sequence: [L, E], severity: hard}\n"
                  "    - {kind: min-rest, hours: 11, severity: hard}\n"
                  "    - {kind: max-consecutive-days, days: 4, severity: hard}\n"
                  "    - {kind: min-consecutive-days, days: 2, severity: hard}\n"
                  "    - {kind: min-consecutive-off, days: 2, severity: hard}\n"
                  "    - {kind: max-count, shift: L, count: 3, severity: hard}\n"
                  "    - {kind: max-hours, hours: 40, severity: hard}\n"
                  "    - {kind: min-hours, hours: 16, severity: hard}\n"
                  "    - {kind: max-weekends, count: 0, severity: hard, staff: [c]}\n");
}

}  // namespace rotaweave::test
