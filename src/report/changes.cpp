/// @brief Changed cells against the published roster and the reason for each.
#include "report/changes.hpp"

#include <sstream>

namespace rotaweave::report {
namespace {

std::string pad(const std::string& s, size_t width) { return s.size() >= width ? s + " " : s + std::string(width - s.size(), ' '); }

std::string plural(int n, const char* one, const char* many) { return std::to_string(n) + " " + (n == 1 ? one : many); }

/// A working cell left empty because its person is now absent: the hole someone may fill.
struct Vacancy {
  StaffIdx staff;
  TaskIdx task;
  bool filled = false;
};

bool newlyAbsent(const model::Problem& p, const model::Roster& roster, StaffIdx s, DayIdx d) {
  const size_t c = p.cell(s, d);
  return p.absent[c] && p.published->cells[c] != kOff && roster.at(s, d) == kOff;
}

ShiftIdx shiftOf(const model::Problem& p, TaskIdx t) { return p.tasks[static_cast<size_t>(t)].shift; }

}  // namespace

bool isChanged(const model::Problem& p, const model::Roster& roster, StaffIdx s, DayIdx d) {
  if (!p.published || d < p.published->from) return false;
  return p.published->cells[p.cell(s, d)] != roster.at(s, d);
}

ChangeSummary computeChanges(const model::Problem& p, const model::Roster& roster) {
  ChangeSummary out;
  if (!p.published) return out;
  const model::Published& published = *p.published;
  out.from = published.from;
  for (StaffIdx s = 0; s < p.staffCount(); ++s) {
    bool any = false;
    for (DayIdx d = published.from; d < p.days; ++d) {
      if (!isChanged(p, roster, s, d)) continue;
      out.cells.push_back({s, d, published.cells[p.cell(s, d)], roster.at(s, d), ""});
      any = true;
    }
    out.people += any ? 1 : 0;
  }

  // Reasons, day by day. A person who was published to work and is now absent and off is
  // "absent"; the holes they leave are matched one to one with the changed cells that now
  // work that shift, the same role first; the rest is rebalancing.
  for (DayIdx d = published.from; d < p.days; ++d) {
    std::vector<Vacancy> vacancies;
    for (StaffIdx s = 0; s < p.staffCount(); ++s)
      if (newlyAbsent(p, roster, s, d)) vacancies.push_back({s, published.cells[p.cell(s, d)]});
    std::vector<CellChange*> today;
    for (CellChange& c : out.cells)
      if (c.day == d) today.push_back(&c);
    for (CellChange* c : today) {
      const size_t cell = p.cell(c->staff, d);
      if (c->now == kOff && p.absent[cell]) {
        const std::string& why = p.absenceReason[cell];
        c->reason = why.empty() ? "absent" : "absent (" + why + ")";
      } else if (p.fixed[cell] >= 0 && c->now == p.fixed[cell]) {
        c->reason = "fixed in the scenario";
      }
    }
    for (int pass = 0; pass < 2; ++pass)  // pass 0: same task; pass 1: same shift, another role
      for (CellChange* c : today) {
        if (!c->reason.empty() || c->now == kOff) continue;
        for (Vacancy& v : vacancies) {
          if (v.filled) continue;
          const bool match = pass == 0 ? v.task == c->now : shiftOf(p, v.task) == shiftOf(p, c->now);
          if (!match) continue;
          v.filled = true;
          c->reason = "covers " + p.staff[static_cast<size_t>(v.staff)].id + "'s absence";
          break;
        }
      }
    for (CellChange* c : today)
      if (c->reason.empty()) c->reason = "rebalanced";
  }
  return out;
}

std::string changesLine(const ChangeSummary& changes, const model::Problem& p) {
  return plural(changes.cellCount(), "cell", "cells") + " changed for " + plural(changes.people, "person", "people") + " from " +
         p.dateText(changes.from);
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
