/// @brief The rule catalogue as plain data: kinds, their parameters and one compiled rule spec.
#pragma once
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "model/types.hpp"

namespace rotaweave::model {

enum class RuleKind {
  // Always on: derived from demand and staff entries.
  Cover, Skill, Absence, Fixed, Request,
  // Listed in `rules`.
  MinRest, ForbidSequence, MinConsecutiveDays, MaxConsecutiveDays, MinConsecutive,
  MaxConsecutive, MinConsecutiveOff, DaysOffAfter, MinHours, MaxHours, MinCount, MaxCount,
  MaxWeekends, CompleteWeekends, WeeklyRest, FairShare, Changes,
};

/// Parameter value types a rule entry may carry.
enum class ParamType { Shift, OptionalShift, ShiftSequence, Count, Hours, Weight, Bool };

struct ParamInfo {
  const char* key;
  ParamType type;
  bool required;
  double min;  ///< Inclusive bounds for numbers.
  double max;
  const char* help;
};

/// How the exact row optimiser (search/row_refit.cpp) treats a kind. Whatever it does not
/// model, the evaluator still judges in full: a row the optimiser proposes is always scored
/// by the rules themselves.
enum class RowOptimiser {
  Undeclared, ///< a catalogue record that forgot to say (tests/unit/test_rule_catalogue.cpp fails)
  Exact,      ///< kept in the optimiser's state: its rows never break it
  Partly,     ///< the part the optimiser can hold (noted in limitsFor), the rest evaluated
  CellCost,   ///< a cost of single cells: part of the optimiser's cell table
  Priced,     ///< ties people together: priced per cell by the relaxation and the master
  Evaluated,  ///< not in the optimiser: only the evaluator judges it
};

struct KindInfo {
  RuleKind kind;
  const char* name;      ///< The `kind:` string, part of the file contract.
  bool listable;         ///< May appear in `rules.list`.
  bool defaultHard;
  std::vector<ParamInfo> params;
  const char* summary;
  const char* unit;            ///< Unit of a breach's amount in reports ("" for none).
  RowOptimiser rowOptimiser;   ///< How the row optimiser handles it.
};

/// The page describing a kind, relative to the repository root.
std::string docsPage(const KindInfo& info);

/// Every kind, in catalogue order. The loader validates entries against it and the docs list it.
const std::vector<KindInfo>& ruleCatalogue();
const KindInfo& kindInfo(RuleKind kind);
std::optional<RuleKind> kindFromName(std::string_view name);

/// `changes`: a day within this many days of a gap day (someone rostered is now absent)
/// counts as near the absence unless the rule sets `near_days`.
inline constexpr int kDefaultNearDays = 2;

/// One rule after loading: validated, indices resolved, amounts in internal units.
struct RuleSpec {
  std::string id;
  RuleKind kind = RuleKind::MinRest;
  bool hard = true;
  Cost weight = kWeightScale;         ///< In hundredths.
  std::vector<std::uint8_t> inScope;  ///< Per staff: 1 if the rule applies.
  ShiftIdx shift = kNoShift;          ///< kNoShift: any shift (where optional).
  std::vector<ShiftIdx> sequence;     ///< kNoShift entries mean "off".
  int count = 0;                      ///< days or count, depending on kind.
  int minutes = 0;                    ///< hours rules: bound in minutes.
  int windowDays = 0;                 ///< 0: the whole period.
  bool creditAbsences = true;         ///< hours rules of the period: add Problem::credit() to hours worked.
  bool weekends = false;              ///< fair-share of weekends instead of a shift.
  int earlyDays = 0;                  ///< changes: days from --from with a higher weight.
  Cost earlyWeight = kWeightScale;
  int nearDays = kDefaultNearDays;    ///< changes: a day this close to a gap day is near.
  Cost farWeight = -1;                ///< changes: weight of a change on a far day; -1: `weight`.
  /// Marked `legal: true` in the scenario or a preset: a legal minimum. Advice never suggests
  /// relaxing it; it suggests staffing remedies instead.
  bool legal = false;
  std::string origin;                 ///< "file:line" where the rule was declared.
};

}  // namespace rotaweave::model
