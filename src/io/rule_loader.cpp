/// @brief The `rules:` section: included rule files, listed rules and rules implied by contracts.
#include <algorithm>
#include <filesystem>

#include "io/loader_context.hpp"

namespace rotaweave::io::detail {
namespace {

namespace fs = std::filesystem;
using model::ParamType;
using model::RuleKind;
using model::RuleSpec;

std::vector<std::string> listableKinds() {
  std::vector<std::string> out;
  for (const auto& k : model::ruleCatalogue())
    if (k.listable) out.push_back(k.name);
  return out;
}

/// Narrowing by staff, contracts and skills: a person is in scope if every given filter matches.
std::vector<uint8_t> loadScope(LoadContext& ctx, const Field& entry) {
  const auto& p = ctx.problem;
  std::vector<uint8_t> scope(p.staff.size(), 1);
  if (entry.has("staff")) {
    std::vector<uint8_t> listed(p.staff.size(), 0);
    for (const Field& f : entry.get("staff").items()) listed[static_cast<size_t>(ctx.staff(f))] = 1;
    for (size_t i = 0; i < scope.size(); ++i) scope[i] &= listed[i];
  }
  if (entry.has("contracts")) {
    std::vector<int> contracts;
    for (const Field& f : entry.get("contracts").items()) contracts.push_back(ctx.contract(f));
    for (size_t i = 0; i < scope.size(); ++i)
      scope[i] &= std::find(contracts.begin(), contracts.end(), p.staff[i].contract) != contracts.end();
  }
  if (entry.has("skills")) {
    std::vector<SkillIdx> skills;
    for (const Field& f : entry.get("skills").items()) skills.push_back(ctx.skill(f));
    for (size_t i = 0; i < scope.size(); ++i) {
      bool any = false;
      for (SkillIdx sk : skills) any = any || p.staff[i].holds(sk);
      scope[i] &= any;
    }
  }
  return scope;
}

void loadParam(LoadContext& ctx, const model::ParamInfo& info, const Field& f, RuleSpec& spec) {
  const std::string key = info.key;
  switch (info.type) {
    case ParamType::Shift:
    case ParamType::OptionalShift:
      spec.shift = ctx.shift(f);
      break;
    case ParamType::ShiftSequence: {
      const auto items = f.items();
      if (items.size() < static_cast<size_t>(info.min) || items.size() > static_cast<size_t>(info.max))
        f.fail("a sequence needs " + std::to_string(static_cast<int>(info.min)) + " to " +
               std::to_string(static_cast<int>(info.max)) + " items");
      for (const Field& item : items) spec.sequence.push_back(item.text() == "off" ? kNoShift : ctx.shift(item));
      break;
    }
    case ParamType::Count: {
      const int v = f.integer(static_cast<int>(info.min), static_cast<int>(info.max));
      if (key == "window_days") spec.windowDays = v;
      else if (key == "early_days") spec.earlyDays = v;
      else if (key == "near_days") spec.nearDays = v;
      else spec.count = v;
      break;
    }
    case ParamType::Hours:
      spec.minutes = f.minutesFromHours(info.min, info.max);
      break;
    case ParamType::Weight:
      (key == "far_weight" ? spec.farWeight : spec.earlyWeight) = f.weight();
      break;
    case ParamType::Bool:
      if (key == "credit_absences") spec.creditAbsences = f.boolean();
      else spec.weekends = f.boolean();
      break;
  }
}

RuleSpec loadRule(LoadContext& ctx, const Field& entry) {
  if (!entry.isMap()) entry.fail("a rule is a map such as {kind: min-rest, hours: 11, severity: hard}");
  const Field kindField = entry.require("kind");
  const std::string kindName = kindField.text();
  const auto kind = model::kindFromName(kindName);
  if (!kind || !model::kindInfo(*kind).listable)
    kindField.fail("unknown rule kind '" + kindName + "'" + didYouMean(kindName, listableKinds()) +
                   "; see docs/rules/ for the catalogue");
  const model::KindInfo& info = model::kindInfo(*kind);

  std::vector<std::string> allowed{"kind", "id", "severity", "weight", "staff", "contracts", "skills", "legal"};
  for (const auto& param : info.params) allowed.push_back(param.key);
  entry.allowOnly(allowed);

  RuleSpec spec;
  spec.kind = *kind;
  spec.id = entry.has("id") ? entry.get("id").id() : kindName;
  spec.hard = info.defaultHard;
  spec.origin = entry.file() + ":" + std::to_string(entry.node().Mark().line + 1);
  if (entry.has("severity")) {
    const std::string sev = entry.get("severity").text();
    if (sev != "hard" && sev != "soft") entry.get("severity").fail("severity must be hard or soft");
    spec.hard = sev == "hard";
  }
  if (entry.has("weight")) spec.weight = entry.get("weight").weight();
  // `legal: true` marks a legal minimum (daily rest, weekly rest, ...): advice after a breach
  // never suggests relaxing it.
  if (entry.has("legal")) spec.legal = entry.get("legal").boolean();
  spec.inScope = loadScope(ctx, entry);
  for (const auto& param : info.params) {
    if (entry.has(param.key))
      loadParam(ctx, param, entry.get(param.key), spec);
    else if (param.required)
      entry.fail("rule '" + kindName + "' needs '" + param.key + "' (" + param.help + ")");
  }
  if (spec.windowDays > 0) {
    // A rolling window limits hours actually worked (fatigue); leave does not tire anyone.
    if (entry.has("credit_absences") && spec.creditAbsences)
      entry.get("credit_absences").fail("absence credit counts toward totals of the whole period only; a rolling window "
                                        "counts hours worked: leave credit_absences out or drop window_days");
    spec.creditAbsences = false;
  }
  if (spec.kind == RuleKind::FairShare && spec.weekends == (spec.shift != kNoShift))
    entry.fail("fair-share needs either shift: ID or weekends: true");
  return spec;
}

void loadRuleFile(LoadContext& ctx, const Field& rules, std::vector<std::string>& includeStack);

void loadInclude(LoadContext& ctx, const Field& item, std::vector<std::string>& includeStack) {
  const fs::path base = fs::path(item.file()).parent_path();
  const fs::path target = base / item.text();
  std::error_code ec;
  if (!fs::is_regular_file(target, ec)) item.fail("included rule file '" + target.string() + "' does not exist; paths are relative to the including file");
  const std::string canonical = fs::weakly_canonical(target, ec).string();
  if (std::find(includeStack.begin(), includeStack.end(), canonical) != includeStack.end())
    item.fail("include cycle: '" + target.string() + "' includes itself through this chain; remove one include");
  const std::string& name = ctx.fileNames.emplace_back(target.lexically_normal().string());
  const Field root(Field::parseFile(name), "", &name);
  if (!root.isMap()) root.fail("a rule file is a map with a `list:` of rules (and optionally `include:`)");
  root.allowOnly({"name", "description", "include", "list"});
  includeStack.push_back(canonical);
  loadRuleFile(ctx, root, includeStack);
  includeStack.pop_back();
}

void loadRuleFile(LoadContext& ctx, const Field& rules, std::vector<std::string>& includeStack) {
  if (rules.has("include"))
    for (const Field& item : rules.get("include").items()) loadInclude(ctx, item, includeStack);
  if (rules.has("list"))
    for (const Field& entry : rules.get("list").items()) ctx.problem.rules.push_back(loadRule(ctx, entry));
}

}  // namespace

void loadRules(LoadContext& ctx, const Field& rules) {
  if (!rules.isMap()) rules.fail("rules is a map with `include:` and/or `list:`");
  rules.allowOnly({"include", "list"});
  std::error_code ec;
  std::vector<std::string> stack{fs::weakly_canonical(ctx.scenarioFile, ec).string()};
  loadRuleFile(ctx, rules, stack);
}

void addImpliedRules(model::Problem& p) {
  const std::vector<uint8_t> everyone(p.staff.size(), 1);
  for (RuleKind kind : {RuleKind::Skill, RuleKind::Absence, RuleKind::Fixed, RuleKind::Request}) {
    RuleSpec spec;
    spec.kind = kind;
    spec.id = model::kindInfo(kind).name;
    spec.hard = model::kindInfo(kind).defaultHard;
    spec.inScope = everyone;
    spec.origin = "always on";
    p.rules.push_back(std::move(spec));
  }
  for (size_t c = 0; c < p.contracts.size(); ++c) {
    const model::Contract& contract = p.contracts[c];
    std::vector<uint8_t> scope(p.staff.size(), 0);
    for (size_t s = 0; s < p.staff.size(); ++s) scope[s] = p.staff[s].contract == static_cast<int>(c);
    auto add = [&](RuleKind kind, int minutes, const char* suffix) {
      RuleSpec spec;
      spec.kind = kind;
      spec.id = "contract-" + contract.id + suffix;
      spec.hard = contract.hard;
      spec.weight = contract.weight;
      spec.minutes = minutes;
      spec.inScope = scope;
      spec.origin = contract.origin;
      p.rules.push_back(std::move(spec));
    };
    if (contract.minMinutes) add(RuleKind::MinHours, *contract.minMinutes, "-min-hours");
    if (contract.maxMinutes) add(RuleKind::MaxHours, *contract.maxMinutes, "-max-hours");
  }
}

}  // namespace rotaweave::io::detail
