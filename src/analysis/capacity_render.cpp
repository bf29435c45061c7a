/// @brief Plain-word and JSON renderings of the capacity analysis.
#include <algorithm>
#include <cstdio>
#include <sstream>
#include <string>

#include "analysis/capacity.hpp"
#include "analysis/wording.hpp"

namespace rotaweave::analysis {
namespace {

using model::Problem;
using wording::hoursText;
using wording::slotText;

constexpr size_t kTextListLimit = 30;  // longer lists are cut in report.txt (report.json has all)

std::string points(Cost cost) {
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.4f", static_cast<double>(cost) / static_cast<double>(kCostScale));
  std::string s = buf;
  while (s.back() == '0') s.pop_back();
  if (s.back() == '.') s.pop_back();
  return s == "-0" ? "0" : s;
}

std::string hoursNumber(long long minutes) {
  char buf[48];
  std::snprintf(buf, sizeof buf, minutes % 60 == 0 ? "%.0f" : "%.2f", static_cast<double>(minutes) / 60.0);
  return buf;
}

std::string jsonText(const std::string& s) {
  std::string out = "\"";
  for (unsigned char c : s) {
    if (c == '"' || c == '\\') out += '\\', out += static_cast<char>(c);
    else if (c == '\n') out += "\\n";
    else if (c < 0x20) {
      char buf[8];
      std::snprintf(buf, sizeof buf, "\\u%04x", c);
      out += buf;
    } else out += static_cast<char>(c);
  }
  return out + "\"";
}

std::string jsonDates(const Problem& p, const std::vector<DayIdx>& days) {
  std::string out = "[";
  for (size_t i = 0; i < days.size(); ++i) out += (i ? ", \"" : "\"") + p.dateText(days[i]) + "\"";
  return out + "]";
}

const char* whyName(Missing::Why why) {
  switch (why) {
    case Missing::Why::Absent: return "absent";
    case Missing::Why::FixedOff: return "fixed off";
    case Missing::Why::FixedElsewhere: return "fixed elsewhere";
  }
  return "";
}

std::string jsonMissing(const Problem& p, const std::vector<Missing>& missing) {
  std::string out = "[";
  for (size_t i = 0; i < missing.size(); ++i) {
    const Missing& m = missing[i];
    out += (i ? ", " : "") + std::string("{\"staff\": ") + jsonText(p.staff[static_cast<size_t>(m.staff)].id) +
           ", \"why\": \"" + whyName(m.why) + "\"";
    if (!m.reason.empty()) out += ", \"reason\": " + jsonText(m.reason);
    if (m.why == Missing::Why::FixedElsewhere) out += ", \"fixed_to\": " + jsonText(p.taskText(m.fixedTask, m.staff));
    out += "}";
  }
  return out + "]";
}

std::string severity(bool hard) { return hard ? "hard" : "soft"; }

}  // namespace

std::string describe(const CellShortfall& s, const Problem& p) {
  const SkillIdx skill = p.tasks[static_cast<size_t>(s.task)].skill;
  std::string out = slotText(p, s.day, s.task) + ": " + (s.target ? "target " : "need ") + std::to_string(s.needed) +
                    (!s.target && !s.hard ? " (soft minimum)" : "") + ", at most " + std::to_string(s.available) + " available";
  const std::string why = wording::missingText(p, s.missing);
  if (!why.empty()) return out + " (" + why + ")";
  int holders = 0;
  for (const auto& person : p.staff) holders += person.holds(skill);
  return out + " (only " + std::to_string(holders) + (holders == 1 ? " person holds " : " people hold ") +
         p.skills[static_cast<size_t>(skill)] + ")";
}

std::string describe(const DayShortfall& s, const Problem& p) {
  std::string slots;
  for (size_t i = 0; i < s.tasks.size(); ++i) {
    const model::Task& t = p.tasks[static_cast<size_t>(s.tasks[i])];
    const int min = p.demandAt(s.day, s.tasks[i]).min;
    slots += (i ? ", " : "") + std::to_string(min) + " " + p.shifts[static_cast<size_t>(t.shift)].id + " " +
             p.skills[static_cast<size_t>(t.skill)];
  }
  std::string out = p.dateText(s.day) + ": the minimums (" + slots + ") need " + std::to_string(s.needed) +
                    " people, at most " + std::to_string(s.fillable) + " can be placed at once (one shift a day each)";
  const std::string why = wording::missingText(p, s.missing);
  return why.empty() ? out : out + "; " + why;
}

std::string describe(const PersonShortfall& s, const Problem& p) {
  const auto& person = p.staff[static_cast<size_t>(s.staff)];
  std::string out = person.id + ": contract " + p.contracts[static_cast<size_t>(s.contract)].id + " asks at least " +
                    hoursText(s.neededMinutes) + (s.creditMinutes > 0 ? " of work (after " + hoursText(s.creditMinutes) + " credited for absences)" : "") +
                    ", at most " + hoursText(s.possibleMinutes) + " possible on " +
                    std::to_string(s.availableDays) + " available day" + (s.availableDays == 1 ? "" : "s") +
                    " (longest shift " + hoursText(s.longestMinutes);
  if (!s.absentDays.empty()) out += "; absent " + wording::daysText(p, s.absentDays);
  if (!s.fixedOffDays.empty()) out += "; fixed off " + wording::daysText(p, s.fixedOffDays);
  return out + ")";
}

std::string renderCapacityText(const CapacityReport& r, const Problem& p) {
  std::ostringstream out;
  std::vector<std::string> unavoidableLines, targetLines;
  for (const auto& c : r.cells) (c.target ? targetLines : unavoidableLines).push_back(std::string(c.hard ? "[hard] " : "[soft] ") + describe(c, p));
  for (const auto& d : r.days) unavoidableLines.push_back("[hard] " + describe(d, p));
  for (const auto& ps : r.people) unavoidableLines.push_back(std::string(ps.hard ? "[hard] " : "[soft] ") + describe(ps, p));
  const Totals& t = r.totals;
  if (t.demandAboveContractMax)
    unavoidableLines.push_back("[period] minimum cover needs " + hoursText(t.demandMin) + ", more than the contracts allow in total (" +
                               hoursText(t.contractMax) + ")");
  if (t.demandAboveAvailable)
    unavoidableLines.push_back("[period] minimum cover needs " + hoursText(t.demandMin) + ", more than the staff can give on their available days (" +
                               hoursText(t.available) + ")");

  auto list = [&](const std::vector<std::string>& lines) {
    for (size_t i = 0; i < lines.size() && i < kTextListLimit; ++i) out << "    " << lines[i] << "\n";
    if (lines.size() > kTextListLimit) out << "    ... and " << lines.size() - kTextListLimit << " more (see report.json)\n";
  };
  if (unavoidableLines.empty()) {
    out << "  No unavoidable shortfall: the staff on hand can meet every minimum and every contract's hours.\n";
  } else {
    out << "  Unavoidable shortfalls (no roster meets these without breaking another hard rule):\n";
    list(unavoidableLines);
  }
  if (!targetLines.empty()) {
    out << "  Targets that cannot be met (soft):\n";
    list(targetLines);
  }
  out << "  Hours: minimum cover needs " << hoursText(t.demandMin) << " (targets " << hoursText(t.demandTarget) << "); contracts ask at least "
      << hoursText(t.contractMin);
  if (t.contractMax >= 0) out << " and allow at most " << hoursText(t.contractMax);
  out << "; the staff can give at most " << hoursText(t.available) << " on their available days\n";

  const Bounds& b = r.bounds;
  out << "  Lower bound on the hard penalty: " << points(b.hard);
  if (b.hard > 0)
    out << " (cover: " << b.coverUnits << " person-shift" << (b.coverUnits == 1 ? "" : "s") << " of minimum cover cannot be filled, "
        << points(b.coverHard) << "; contract hours: " << points(b.contractHard)
        << (b.contractHard > 0 ? ", the cheaper of the missing hours and calling the person in on days away" : "") << ")";
  if (r.roster) out << "; this roster has " << points(r.roster->hard);
  out << "\n";
  if (r.roster) {
    out << "  Lower bound on the soft cover-target penalty: " << points(r.roster->coverSoftBound) << " (for this roster's hard total)"
        << "; this roster has " << points(r.roster->coverSoft) << "\n";
    if (b.coverUnits > 0 || r.roster->coverHardUnits > 0)
      out << "  At least " << b.coverUnits << " person-shift" << (b.coverUnits == 1 ? "" : "s")
          << " of minimum cover cannot be filled by available people; this roster leaves " << r.roster->coverHardUnits << " unfilled\n";
  } else {
    out << "  Lower bound on the soft cover-target penalty of a roster with no hard breach: " << points(b.coverSoftIfNoHard) << "\n";
  }

  if (r.roster && !r.roster->tags.empty()) {
    int un = 0;
    for (const auto& tag : r.roster->tags) un += tag.unavoidable;
    out << "  Hard breaches of this roster: " << un << " unavoidable, " << r.roster->tags.size() - static_cast<size_t>(un) << " avoidable\n";
    size_t shown = 0;
    for (const auto& tag : r.roster->tags) {
      if (shown++ == kTextListLimit) {
        out << "    ... and " << r.roster->tags.size() - kTextListLimit << " more (see report.json)\n";
        break;
      }
      out << "    " << (tag.unavoidable ? "unavoidable: " : "avoidable:   ") << tag.cause << "\n"
          << "      what would help: " << tag.remedy << "\n";
    }
  }
  return out.str();
}

std::string renderCapacityJson(const CapacityReport& r, const Problem& p) {
  std::ostringstream out;
  out << "{\"unavoidable\": " << (r.anyUnavoidable() ? "true" : "false") << ",\n    \"shortfalls\": [";
  bool first = true;
  auto open = [&] {
    out << (first ? "\n      " : ",\n      ");
    first = false;
  };
  for (const auto& c : r.cells) {
    const model::Task& t = p.tasks[static_cast<size_t>(c.task)];
    open();
    out << "{\"type\": \"slot\", \"part\": \"" << (c.target ? "target" : "min") << "\", \"severity\": \"" << severity(c.hard)
        << "\", \"dates\": " << jsonDates(p, {c.day}) << ", \"shift\": " << jsonText(p.shifts[static_cast<size_t>(t.shift)].id)
        << ", \"skill\": " << jsonText(p.skills[static_cast<size_t>(t.skill)]) << ", \"unit\": \"persons\", \"needed\": " << c.needed
        << ", \"available\": " << c.available << ", \"short\": " << c.shortBy() << ", \"missing\": " << jsonMissing(p, c.missing)
        << ", \"message\": " << jsonText(describe(c, p)) << "}";
  }
  for (const auto& d : r.days) {
    open();
    out << "{\"type\": \"day\", \"part\": \"min\", \"severity\": \"hard\", \"dates\": " << jsonDates(p, {d.day})
        << ", \"shift\": null, \"skill\": null, \"unit\": \"persons\", \"needed\": " << d.needed << ", \"available\": " << d.fillable
        << ", \"short\": " << d.shortBy() << ", \"missing\": " << jsonMissing(p, d.missing) << ", \"message\": " << jsonText(describe(d, p)) << "}";
  }
  for (const auto& ps : r.people) {
    std::vector<DayIdx> away = ps.absentDays;
    away.insert(away.end(), ps.fixedOffDays.begin(), ps.fixedOffDays.end());
    std::sort(away.begin(), away.end());
    open();
    out << "{\"type\": \"contract\", \"part\": \"min-hours\", \"severity\": \"" << severity(ps.hard) << "\", \"staff\": "
        << jsonText(p.staff[static_cast<size_t>(ps.staff)].id) << ", \"contract\": " << jsonText(p.contracts[static_cast<size_t>(ps.contract)].id)
        << ", \"dates\": " << jsonDates(p, away) << ", \"unit\": \"hours\", \"needed\": " << hoursNumber(ps.neededMinutes)
        << ", \"available\": " << hoursNumber(ps.possibleMinutes) << ", \"short\": " << hoursNumber(ps.shortMinutes())
        << ", \"available_days\": " << ps.availableDays << ", \"message\": " << jsonText(describe(ps, p)) << "}";
  }
  out << (first ? "],\n" : "\n    ],\n");
  const Totals& t = r.totals;
  out << "    \"hours\": {\"demand_min\": " << hoursNumber(t.demandMin) << ", \"demand_target\": " << hoursNumber(t.demandTarget)
      << ", \"contract_min\": " << hoursNumber(t.contractMin) << ", \"contract_max\": " << (t.contractMax >= 0 ? hoursNumber(t.contractMax) : "null")
      << ", \"available\": " << hoursNumber(t.available) << ", \"demand_above_contract_max\": " << (t.demandAboveContractMax ? "true" : "false")
      << ", \"demand_above_available\": " << (t.demandAboveAvailable ? "true" : "false") << "},\n";
  const Bounds& b = r.bounds;
  out << "    \"bounds\": {\"hard\": " << points(b.hard) << ", \"cover_hard\": " << points(b.coverHard) << ", \"contract_hard\": "
      << points(b.contractHard) << ", \"cover_units\": " << b.coverUnits << ", \"cover_soft_if_no_hard\": " << points(b.coverSoftIfNoHard);
  if (r.roster) out << ", \"cover_soft\": " << points(r.roster->coverSoftBound);
  out << "}";
  if (r.roster) {
    const RosterComparison& c = *r.roster;
    out << ",\n    \"roster\": {\"hard\": " << points(c.hard) << ", \"cover_hard\": " << points(c.coverHard) << ", \"cover_hard_units\": "
        << c.coverHardUnits << ", \"cover_soft\": " << points(c.coverSoft) << ", \"hard_breaches\": [";
    for (size_t i = 0; i < c.tags.size(); ++i) {
      const auto& tag = c.tags[i];
      out << (i ? ",\n      " : "\n      ") << "{\"violation\": " << tag.breach << ", \"unavoidable\": " << (tag.unavoidable ? "true" : "false")
          << ", \"cause\": " << jsonText(tag.cause) << ", \"remedy\": " << jsonText(tag.remedy) << "}";
    }
    out << (c.tags.empty() ? "]}" : "\n    ]}");
  }
  out << "\n  }";
  return out.str();
}

}  // namespace rotaweave::analysis
