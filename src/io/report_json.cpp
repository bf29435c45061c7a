/// @brief JSON rendering of the report value.
#include "io/report_json.hpp"

#include <cstdio>
#include <sstream>

namespace rotaweave::io {

std::string jsonString(const std::string& s) {
  std::string out = "\"";
  for (unsigned char c : s) {
    switch (c) {
      case '"': out += "\\\""; break;
      case '\\': out += "\\\\"; break;
      case '\n': out += "\\n"; break;
      case '\r': out += "\\r"; break;
      case '\t': out += "\\t"; break;
      default:
        if (c < 0x20) {
          char buf[8];
          std::snprintf(buf, sizeof buf, "\\u%04x", c);
          out += buf;
        } else {
          out += static_cast<char>(c);
        }
    }
  }
  return out + "\"";
}

namespace {

std::string gapText(std::optional<double> gap) {
  if (!gap) return "null";
  char text[32];
  std::snprintf(text, sizeof text, "%.2f", *gap);
  return text;
}

/// One breach as a violation record (the contract fields).
std::string breachJson(const rules::Breach& b, const model::Problem& p) {
  std::ostringstream out;
  out << "{\"rule\": " << jsonString(b.ruleId) << ", \"kind\": " << jsonString(b.kind) << ", \"severity\": \"" << (b.hard ? "hard" : "soft")
      << "\", \"staff\": " << (b.staff >= 0 ? jsonString(p.staff[static_cast<size_t>(b.staff)].id) : std::string("null")) << ", \"dates\": [";
  for (size_t k = 0; k < b.days.size(); ++k) out << (k ? ", " : "") << "\"" << p.dateText(b.days[k]) << "\"";
  out << "], \"amount\": " << report::amountText(b.amount) << ", \"penalty\": " << report::pointsText(b.penalty)
      << ", \"shortfall\": " << report::amountText(b.shortfall >= 0 ? b.shortfall : b.amount)
      << ", \"shortfall_unit\": " << jsonString(report::shortfallUnit(b));
  if (b.windowLast >= 0)
    out << ", \"window_start\": \"" << p.dateText(b.windowFirst) << "\", \"window_end\": \"" << p.dateText(b.windowLast) << "\"";
  if (b.kind == "cover" && b.task > 0) {
    const model::Task& t = p.tasks[static_cast<size_t>(b.task)];
    out << ", \"shift\": " << jsonString(p.shifts[static_cast<size_t>(t.shift)].id)
        << ", \"skill\": " << jsonString(p.skills[static_cast<size_t>(t.skill)]);
  }
  out << ", \"message\": " << jsonString(b.message) << "}";
  return out.str();
}

std::string breachListJson(const std::vector<rules::Breach>& list, const model::Problem& p) {
  std::string out = "[";
  for (size_t i = 0; i < list.size(); ++i) out += (i ? ",\n      " : "\n      ") + breachJson(list[i], p);
  return out + (list.empty() ? "]" : "\n    ]");
}

std::string baselineJson(const report::BaselineDiff& d, const model::Problem& p) {
  using report::pointsText;
  std::ostringstream out;
  out << "{\"file\": " << jsonString(d.source) << ", \"before\": {\"hard\": " << pointsText(d.before.hard) << ", \"soft\": "
      << pointsText(d.before.soft) << "}, \"after\": {\"hard\": " << pointsText(d.after.hard) << ", \"soft\": " << pointsText(d.after.soft)
      << "}, \"people\": " << d.people << ",\n    \"cells\": [";
  for (size_t i = 0; i < d.cells.size(); ++i) {
    const auto& c = d.cells[i];
    out << (i ? ",\n      " : "\n      ") << "{\"staff\": " << jsonString(p.staff[static_cast<size_t>(c.staff)].id) << ", \"date\": \""
        << p.dateText(c.day) << "\", \"before\": " << jsonString(p.cellText(c.before, c.staff))
        << ", \"after\": " << jsonString(p.cellText(c.after, c.staff)) << "}";
  }
  out << (d.cells.empty() ? "]" : "\n    ]") << ",\n    \"new\": " << breachListJson(d.added, p) << ",\n    \"gone\": " << breachListJson(d.gone, p)
      << ",\n    \"changed\": [";
  for (size_t i = 0; i < d.changed.size(); ++i)
    out << (i ? ",\n      " : "\n      ") << "{\"before\": " << breachJson(d.changed[i].before, p) << ",\n       \"after\": " << breachJson(d.changed[i].after, p)
        << "}";
  out << (d.changed.empty() ? "]}" : "\n    ]}");
  return out.str();
}

}  // namespace

std::string reportJson(const report::Report& r, const model::Problem& p) {
  using report::amountText;
  using report::pointsText;
  std::ostringstream out;
  out << "{\n  \"scenario\": " << jsonString(p.name) << ",\n"
      << "  \"period\": {\"start\": \"" << p.dateText(0) << "\", \"end\": \"" << p.dateText(p.days - 1) << "\"},\n"
      << "  \"summary\": {\"hard\": " << pointsText(r.total.hard) << ", \"soft\": " << pointsText(r.total.soft)
      << ", \"violations\": " << r.breaches.size() << ", \"hard_violations\": " << r.hardCount
      << ", \"soft_violations\": " << r.breaches.size() - static_cast<size_t>(r.hardCount)
      << ", \"lower_bound\": " << (r.run.lowerBound ? report::boundPointsText(*r.run.lowerBound) : std::string("null"))
      << ", \"gap_percent\": " << gapText(report::gapPercent(r)) << "},\n";
  out << "  \"run\": {\"command\": " << jsonString(r.run.command) << ", \"seed\": " << r.run.seed << ", \"islands\": " << r.run.islands
      << ", \"threads\": " << r.run.threads << ", \"generations\": " << r.run.generations << ", \"seconds\": " << r.run.seconds
      << ", \"stop\": " << jsonString(r.run.stopReason) << "},\n";
  out << "  \"by_rule\": [";
  for (size_t i = 0; i < r.byRule.size(); ++i) {
    const auto& s = r.byRule[i];
    out << (i ? ",\n    " : "\n    ") << "{\"rule\": " << jsonString(s.ruleId) << ", \"kind\": " << jsonString(s.kind)
        << ", \"severity\": \"" << (s.hard ? "hard" : "soft") << "\", \"count\": " << s.count << ", \"amount\": " << amountText(s.amount)
        << ", \"penalty\": " << pointsText(s.penalty) << "}";
  }
  out << (r.byRule.empty() ? "],\n" : "\n  ],\n");
  out << "  \"violations\": [";
  for (size_t i = 0; i < r.breaches.size(); ++i) {
    const auto& b = r.breaches[i];
    out << (i ? ",\n    " : "\n    ") << breachJson(b, p);
  }
  out << (r.breaches.empty() ? "],\n" : "\n  ],\n");
  if (r.changes) {
    out << "  \"changes\": {\"cells\": " << r.changes->cellCount() << ", \"people\": " << r.changes->people << ", \"from\": \""
        << p.dateText(r.changes->from) << "\", \"list\": [";
    for (size_t i = 0; i < r.changes->cells.size(); ++i) {
      const auto& c = r.changes->cells[i];
      out << (i ? ",\n    " : "\n    ") << "{\"staff\": " << jsonString(p.staff[static_cast<size_t>(c.staff)].id) << ", \"date\": \""
          << p.dateText(c.day) << "\", \"was\": " << jsonString(p.cellText(c.was, c.staff))
          << ", \"now\": " << jsonString(p.cellText(c.now, c.staff)) << ", \"reason\": " << jsonString(c.reason) << "}";
    }
    out << (r.changes->cells.empty() ? "]},\n" : "\n  ]},\n");
  }
  if (r.baseline) out << "  \"baseline\": " << baselineJson(*r.baseline, p) << ",\n";
  out << "  \"people\": [";
  for (size_t i = 0; i < r.byPerson.size(); ++i) {
    const auto& ps = r.byPerson[i];
    out << (i ? ",\n    " : "\n    ") << "{\"staff\": " << jsonString(p.staff[static_cast<size_t>(ps.staff)].id)
        << ", \"worked_hours\": " << amountText(ps.paidMinutes) << ", \"credited_hours\": " << amountText(ps.creditMinutes)
        << ", \"counted_hours\": " << amountText(ps.paidMinutes + ps.creditMinutes) << ", \"absent_days\": " << ps.absentDays
        << ", \"shifts\": " << ps.shiftsWorked << ", \"weekends\": " << ps.weekendsWorked << "}";
  }
  out << (r.byPerson.empty() ? "],\n" : "\n  ],\n");
  out << "  \"notes\": [";
  for (size_t i = 0; i < r.notes.size(); ++i) out << (i ? ", " : "") << jsonString(r.notes[i]);
  out << "],\n";
  if (r.capacity) out << "  \"capacity\": " << analysis::renderCapacityJson(*r.capacity, p) << ",\n";
  out << "  \"caution\": " << jsonString(report::cautionText()) << "\n}\n";
  return out.str();
}

}  // namespace rotaweave::io
