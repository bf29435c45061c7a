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

struct KindInfo {
  RuleKind kind;
  const char* name;      ///< The `kind:` string, part of the file contract.
  bool listable;         ///< May appear in `rules.list`.
  bool defaultHard;
  std::vector<ParamInfo> params;
  const char* summary;
};

/// Every kind, in catalogue order. The loader validates entries against it and the docs list it.
const std::vector<KindInfo>& ruleCatalogue();
const KindInfo& kindInfo(RuleKind kind);
std::optional<RuleKind> kindFromName(std::string_view name);

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
  bool weekends = false;              ///< fair-share of weekends instead of a shift.
  int earlyDays = 0;                  ///< changes: days from --from with a higher weight.
  Cost earlyWeight = kWeightScale;
  std::string origin;                 ///< "file:line" where the rule was declared.
};

}  // namespace rotaweave::model
