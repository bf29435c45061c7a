/// @brief report.txt layout.
#include "report/text.hpp"

#include <cstdio>
#include <sstream>

namespace rotaweave::report {
namespace {

std::string pad(const std::string& s, size_t width) { return s.size() >= width ? s + " " : s + std::string(width - s.size(), ' '); }

std::string hoursOf(int minutes) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.1f h", minutes / 60.0);
  return buf;
}

std::string runLine(const RunInfo& run) {
  if (run.command == "check") return "Made by: check of a given roster";
  char buf[256];
  std::snprintf(buf, sizeof buf, "Made by: %s (seed %llu, %d islands, %d threads, %ld generations, %.1f s; stopped: %s)",
                run.command.c_str(), static_cast<unsigned long long>(run.seed), run.islands, run.threads, run.generations,
                run.seconds, run.stopReason.c_str());
  return buf;
}

}  // namespace

std::string datesText(const model::Problem& p, const std::vector<DayIdx>& days) {
  if (days.empty()) return "-";
  bool contiguous = true;
  for (size_t i = 1; i < days.size(); ++i) contiguous = contiguous && days[i] == days[i - 1] + 1;
  if (days.size() == 1) return p.dateText(days.front());
  if (contiguous) return p.dateText(days.front()) + ".." + p.dateText(days.back());
  std::string out;
  for (size_t i = 0; i < days.size(); ++i) out += (i ? ", " : "") + p.dateText(days[i]);
  return out;
}

std::string renderSummary(const Report& r) {
  std::ostringstream out;
  int soft = static_cast<int>(r.breaches.size()) - r.hardCount;
  out << "hard violations: " << r.hardCount << " (penalty " << pointsText(r.total.hard) << ")\n"
      << "soft violations: " << soft << " (penalty " << pointsText(r.total.soft) << ")\n";
  for (const auto& s : r.byRule)
    out << "  " << pad(s.hard ? "hard" : "soft", 5) << pad(s.ruleId, 28) << s.count << (s.count == 1 ? " breach" : " breaches") << "\n";
  if (r.changes) out << "changes against the published roster: " << r.changes->cellCount() << " cells, " << r.changes->people << " people\n";
  if (r.baseline) out << "against the baseline: " << baselineLine(*r.baseline) << "\n";
  return out.str();
}

std::string renderText(const Report& r, const model::Problem& p) {
  std::ostringstream out;
  out << "rotaweave report: " << p.name << "\n"
      << "Period: " << p.dateText(0) << " to " << p.dateText(p.days - 1) << " (" << p.days << " days), "
      << p.staff.size() << " staff\n"
      << runLine(r.run) << "\n\n";

  const int soft = static_cast<int>(r.breaches.size()) - r.hardCount;
  out << "TOTALS\n"
      << "  Hard rules: " << r.hardCount << (r.hardCount == 1 ? " breach" : " breaches") << ", penalty "
      << pointsText(r.total.hard) << (r.hardCount == 0 ? "  (no hard rule is broken)" : "  (must be fixed before publishing)") << "\n"
      << "  Soft rules: " << soft << (soft == 1 ? " breach" : " breaches") << ", penalty " << pointsText(r.total.soft) << "\n";
  if (const std::string bound = lowerBoundText(r); !bound.empty()) out << "  Lower bound: " << bound << "\n";
  out << "\n";

  out << "BY RULE\n";
  if (r.byRule.empty()) out << "  (none)\n";
  else out << "  " << pad("severity", 10) << pad("rule", 30) << pad("kind", 22) << pad("breaches", 10) << pad("amount", 12) << "penalty\n";
  for (const auto& s : r.byRule)
    out << "  " << pad(s.hard ? "hard" : "soft", 10) << pad(s.ruleId, 30) << pad(s.kind, 22) << pad(std::to_string(s.count), 10)
        << pad(amountWithUnit(s.kind, s.amount), 12) << pointsText(s.penalty) << "\n";

  out << "\nBY PERSON\n";
  for (const auto& ps : r.byPerson) {
    const auto& person = p.staff[static_cast<size_t>(ps.staff)];
    out << "  " << pad(person.id, 14) << pad(person.name, 24) << pad(std::to_string(ps.hardCount) + " hard", 9)
        << pad(std::to_string(ps.softCount) + " soft", 9) << pad(hoursOf(ps.paidMinutes), 10)
        << pad(std::to_string(ps.shiftsWorked) + (ps.shiftsWorked == 1 ? " shift" : " shifts"), 11) << ps.weekendsWorked
        << (ps.weekendsWorked == 1 ? " weekend" : " weekends");
    // Hours absences credit toward contract and period hours rules, beside the hours worked.
    if (ps.creditMinutes > 0 || ps.absentDays > 0)
      out << "; absent " << ps.absentDays << (ps.absentDays == 1 ? " day" : " days") << ", " << hoursOf(ps.creditMinutes)
          << " credited, " << hoursOf(ps.paidMinutes + ps.creditMinutes) << " counted";
    out << "\n";
  }
  if (!r.notes.empty()) {
    out << "\nNOTES\n";
    for (const auto& note : r.notes) out << "  " << note << "\n";
  }

  if (r.changes) out << "\n" << renderChangesText(*r.changes, p);
  if (r.baseline) out << "\n" << renderBaselineText(*r.baseline, p);

  if (r.capacity) out << "\nCAPACITY (what the staff on hand can cover at best, whatever the roster)\n" << analysis::renderCapacityText(*r.capacity, p);

  out << "\nEVERY BREACH (hard first)\n";
  if (r.breaches.empty()) out << "  (none)\n";
  for (const auto& b : r.breaches) {
    const std::string who = b.staff >= 0 ? p.staff[static_cast<size_t>(b.staff)].id : "-";
    out << "  " << pad(b.hard ? "HARD" : "soft", 5) << pad(b.ruleId, 24) << pad(who, 12) << pad(datesText(p, b.days), 24)
        << "amount " << pad(amountWithUnit(b.kind, b.amount), 11) << "penalty " << pointsText(b.penalty) << "\n"
        << "        " << b.message << "\n";
  }
  out << "\n" << cautionText() << "\n";
  return out.str();
}

}  // namespace rotaweave::report
