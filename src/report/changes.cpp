/// @brief Changed cells against the published roster and the reason for each.
#include "report/changes.hpp"

#include <algorithm>
#include <sstream>

#include "eval/evaluator.hpp"

namespace rotaweave::report {
namespace {

std::string pad(const std::string& s, size_t width) {
  return s.size() >= width ? s + " " : s + std::string(width - s.size(), ' ');
}

std::string plural(int n, const char* one, const char* many) { return std::to_string(n) + " " + (n == 1 ? one : many); }

/// "L rn": the slot a task names, shift and role.
std::string slotWords(const model::Problem& p, TaskIdx t) {
  const model::Task& task = p.tasks[static_cast<size_t>(t)];
  return p.shifts[static_cast<size_t>(task.shift)].id + " " + p.skills[static_cast<size_t>(task.skill)];
}

/// Traces the reasons of one summary's changes.
class Tracer {
 public:
  Tracer(const rules::RuleSet& rules, const model::Roster& roster, ChangeSummary& out)
      : p_(rules.problem()), roster_(roster), out_(out), evaluator_(rules), cache_(out.cells.size()) {}

  void run() {
    const model::Published& published = *p_.published;
    const size_t cells = static_cast<size_t>(p_.staffCount()) * static_cast<size_t>(p_.days);
    index_.assign(cells, -1);
    taken_.assign(cells, 0);
    std::vector<std::vector<size_t>> byDay(static_cast<size_t>(p_.days));
    for (size_t i = 0; i < out_.cells.size(); ++i) {
      index_[p_.cell(out_.cells[i].staff, out_.cells[i].day)] = static_cast<int>(i);
      byDay[static_cast<size_t>(out_.cells[i].day)].push_back(i);
    }
    // Each revert check explains the whole roster: fewer of them on larger rosters.
    budget_ = static_cast<int>(
        std::min<size_t>(kMaxRevertChecks, std::max<size_t>(20, 4'000'000 / std::max<size_t>(cells, 1))));
    // Slots: a changed cell that now works t on day d took the slot of someone published to
    // work t that day who no longer does. Those left by an absence are matched first.
    for (DayIdx d = published.from; d < p_.days; ++d)
      for (int pass = 0; pass < 2; ++pass)
        for (const size_t i : byDay[static_cast<size_t>(d)]) {
          CellChange& c = out_.cells[i];
          if (c.now == kOff || c.tookFrom >= 0) continue;
          for (const size_t j : byDay[static_cast<size_t>(d)]) {  // only changed cells can have left a slot
            const CellChange& left = out_.cells[j];
            const size_t cell = p_.cell(left.staff, d);
            if (left.was != c.now || taken_[cell]) continue;
            if (pass == 0 && !(p_.absent[cell] && left.now == kOff)) continue;
            c.tookFrom = left.staff;
            taken_[cell] = 1;
            break;
          }
        }
    for (CellChange& c : out_.cells) c.reason = reason(c);
  }

 private:
  const std::string& id(StaffIdx s) const { return p_.staff[static_cast<size_t>(s)].id; }
  const CellChange* changeAt(StaffIdx s, DayIdx d) const {
    const int i = index_[p_.cell(s, d)];
    return i < 0 ? nullptr : &out_.cells[static_cast<size_t>(i)];
  }
  bool newlyAbsent(StaffIdx s, DayIdx d) const { return p_.absent[p_.cell(s, d)] && roster_.at(s, d) == kOff; }

  std::string reason(const CellChange& c) {
    const size_t cell = p_.cell(c.staff, c.day);
    if (c.now == kOff && p_.absent[cell]) {
      const std::string& why = p_.absenceReason[cell];
      return why.empty() ? "absent" : "absent (" + why + ")";
    }
    if (p_.fixed[cell] >= 0 && c.now == p_.fixed[cell]) return "fixed in the scenario";
    if (c.tookFrom >= 0) return took(c, 0, {c.staff});
    std::string text = "rebalanced " + ruleNeeding(c);
    if (c.now == kOff)  // who took this slot, if anyone
      for (const CellChange& other : out_.cells)
        if (other.day == c.day && other.tookFrom == c.staff)
          text += "; " + id(other.staff) + " takes the " + slotWords(p_, c.was);
    return text;
  }

  /// "covers X's absence (L rn)" or "takes X's L rn; X moved to ..." for a cell with tookFrom.
  std::string took(const CellChange& c, int depth, std::vector<StaffIdx> seen) {
    const StaffIdx x = c.tookFrom;
    const std::string slot = slotWords(p_, c.now);
    const SkillIdx skill = p_.tasks[static_cast<size_t>(c.now)].skill;
    const std::string noSkill = p_.staff[static_cast<size_t>(c.staff)].holds(skill)
                                    ? ""
                                    : " without holding " + p_.skills[static_cast<size_t>(skill)];
    if (newlyAbsent(x, c.day)) {
      if (!noSkill.empty()) return "takes " + id(x) + "'s " + slot + noSkill + " (" + id(x) + " is absent)";
      return "covers " + id(x) + "'s absence (" + slot + ")";
    }
    std::string text = "takes " + id(x) + "'s " + slot + noSkill;
    const CellChange* next = changeAt(x, c.day);
    if (!next || next->now == kOff)
      return text + "; " + id(x) + " is off now" + (next ? " (" + ruleNeeding(*next) + ")" : "");
    if (std::find(seen.begin(), seen.end(), x) != seen.end())
      return text + "; " + id(x) + " moved to " + slotWords(p_, next->now);
    seen.push_back(x);
    return text + "; " + id(x) + " moved to " + movedTo(*next, depth + 1, seen);
  }

  /// What a moved person's new cell does, as the end of "X moved to ...".
  std::string movedTo(const CellChange& c, int depth, const std::vector<StaffIdx>& seen) {
    const std::string slot = slotWords(p_, c.now);
    if (p_.fixed[p_.cell(c.staff, c.day)] >= 0 && c.now == p_.fixed[p_.cell(c.staff, c.day)])
      return slot + ", fixed in the scenario";
    if (c.tookFrom < 0) return slot + " (" + ruleNeeding(c) + ")";
    if (newlyAbsent(c.tookFrom, c.day)) return "cover " + id(c.tookFrom) + "'s absence (" + slot + ")";
    if (depth >= 3) return "take " + id(c.tookFrom) + "'s " + slot;
    std::string inner = took(c, depth, seen);  // "takes Y's ...; Y moved to ..."
    return "take" + inner.substr(5);
  }

  /// "to meet rule 'R'": the rule whose penalty rises most (hard first) if this one cell is
  /// put back as published; "with the other changes" when none rises.
  std::string ruleNeeding(const CellChange& c) {
    std::string& cached = cache_[static_cast<size_t>(&c - out_.cells.data())];
    if (!cached.empty()) return cached;
    std::string text = "with the other changes";
    if (checks_ < budget_) {
      ++checks_;
      if (base_.empty()) base_ = totals(roster_);
      model::Roster reverted = roster_;
      reverted.at(c.staff, c.day) = c.was;
      const auto after = totals(reverted);
      const RuleTotal* best = nullptr;
      Cost bestRise = 0;
      bool bestHard = false;
      for (const RuleTotal& r : after) {
        if (r.kind == model::RuleKind::Changes) continue;
        Cost before = 0;
        for (const RuleTotal& b : base_)
          if (b.id == r.id && b.hard == r.hard) before = b.penalty;
        const Cost rise = r.penalty - before;
        if (rise <= 0) continue;
        if (!best || (r.hard && !bestHard) || (r.hard == bestHard && rise > bestRise))
          best = &r, bestRise = rise, bestHard = r.hard;
      }
      if (best) text = "to meet rule '" + best->id + "'";
    }
    cached = text;
    return text;
  }

  struct RuleTotal {
    std::string id;
    model::RuleKind kind;
    bool hard;
    Cost penalty;
  };
  std::vector<RuleTotal> totals(const model::Roster& roster) {
    std::vector<RuleTotal> out;
    for (const rules::Breach& b : evaluator_.explain(roster)) {
      auto it = std::find_if(out.begin(), out.end(),
                             [&](const RuleTotal& r) { return r.id == b.ruleId && r.hard == b.hard; });
      if (it == out.end()) {
        const auto kind = model::kindFromName(b.kind);
        out.push_back({b.ruleId, kind ? *kind : model::RuleKind::Cover, b.hard, 0});
        it = out.end() - 1;
      }
      it->penalty += b.penalty;
    }
    return out;
  }

  const model::Problem& p_;
  const model::Roster& roster_;
  ChangeSummary& out_;
  eval::Evaluator evaluator_;
  std::vector<int> index_;           ///< per cell: its index in out_.cells, or -1
  std::vector<std::uint8_t> taken_;  ///< per cell: 1 if some change took its published slot
  std::vector<RuleTotal> base_;      ///< per rule totals of the roster itself
  std::vector<std::string> cache_;   ///< per change: what ruleNeeding found, once
  int checks_ = 0;
  int budget_ = 0;
};

}  // namespace

bool isChanged(const model::Problem& p, const model::Roster& roster, StaffIdx s, DayIdx d) {
  if (!p.published || d < p.published->from) return false;
  return p.published->cells[p.cell(s, d)] != roster.at(s, d);
}

ChangeSummary computeChanges(const rules::RuleSet& ruleSet, const model::Roster& roster) {
  const model::Problem& p = ruleSet.problem();
  ChangeSummary out;
  if (!p.published) return out;
  const model::Published& published = *p.published;
  out.from = published.from;
  for (StaffIdx s = 0; s < p.staffCount(); ++s) {
    bool any = false;
    for (DayIdx d = published.from; d < p.days; ++d) {
      if (!isChanged(p, roster, s, d)) continue;
      out.cells.push_back({s, d, published.cells[p.cell(s, d)], roster.at(s, d), "", -1});
      any = true;
    }
    out.people += any ? 1 : 0;
  }
  Tracer(ruleSet, roster, out).run();
  return out;
}

std::string changesLine(const ChangeSummary& changes, const model::Problem& p) {
  return plural(changes.cellCount(), "cell", "cells") + " changed for " + plural(changes.people, "person", "people") +
         " from " + p.dateText(changes.from);
}

std::string renderChangesText(const ChangeSummary& changes, const model::Problem& p) {
  std::ostringstream out;
  out << "CHANGES AGAINST THE PUBLISHED ROSTER (days before " << p.dateText(changes.from) << " are kept as published)\n"
      << "  " << changesLine(changes, p) << "\n";
  if (changes.cells.empty()) return out.str();
  out << "  " << pad("person", 14) << pad("date", 12) << pad("was", 8) << pad("now", 8) << "reason\n";
  for (const CellChange& c : changes.cells)
    out << "  " << pad(p.staff[static_cast<size_t>(c.staff)].id, 14) << pad(p.dateText(c.day), 12)
        << pad(p.cellText(c.was, c.staff), 8) << pad(p.cellText(c.now, c.staff), 8) << c.reason << "\n";
  return out.str();
}

}  // namespace rotaweave::report
