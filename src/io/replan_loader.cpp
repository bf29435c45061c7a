/// @brief The replan problem: the scenario plus the published roster, the re-plan date, the
/// absences reported at replan and the `changes` rule, built once.
#include "io/replan_loader.hpp"

#include <algorithm>
#include <iostream>
#include <set>

#include "io/control_chars.hpp"
#include "io/csv.hpp"
#include "io/input_error.hpp"
#include "io/input_limits.hpp"
#include "io/roster_csv.hpp"
#include "io/xlsx_read/zip_archive.hpp"
#include "io/scenario_loader.hpp"

namespace rotaweave::io {
namespace {

std::string periodText(const model::Problem& p) { return p.dateText(0) + " to " + p.dateText(p.days - 1); }

/// "a, b and 3 more": a short list of ids for a message.
std::string someIds(const std::vector<std::string>& ids) {
  std::string out;
  const size_t shown = std::min<size_t>(ids.size(), 5);
  for (size_t i = 0; i < shown; ++i) out += (i ? ", " : "") + ids[i];
  if (ids.size() > shown) out += " and " + std::to_string(ids.size() - shown) + " more";
  return out;
}

/// Before the cell-by-cell reading: is this roster made for the scenario's period and staff?
/// A roster for another month or another team gets one message that says so, rather than an
/// error about its first odd cell.
void checkPublishedFits(const std::string& path, const model::Problem& p) {
  if (xlsx_read::startsLikeZip(path)) return;  // a workbook: readRosterCsv locates the table and explains
  checkRosterCsvShape(path, p.staff.size(), p.days);  // before any row is stored
  const auto rows = readCsvFile(path, "published roster given to --roster");
  if (rows.empty()) return;  // readRosterCsv explains
  const auto& header = rows.front().cells;
  if (header.size() >= 2) {
    const auto first = model::parseIsoDate(trimCell(header[1]));
    const auto last = model::parseIsoDate(trimCell(header.back()));
    if (first && last && (*first != p.start || *last != p.start + p.days - 1))
      throw InputError(path, rows.front().line, 0,
                       "the published roster covers " + model::formatIsoDate(*first) + " to " +
                           model::formatIsoDate(*last) + " but the scenario's period is " + periodText(p) +
                           "; re-plan with the scenario the roster was published for");
  }
  std::vector<std::string> unknown, missing;
  std::set<std::string> listed;
  for (size_t r = 1; r < rows.size(); ++r) {
    if (rows[r].cells.size() == 1 && trimCell(rows[r].cells[0]).empty()) continue;
    const std::string id = trimCell(rows[r].cells[0]);
    listed.insert(id);
    if (p.findStaff(id) < 0) unknown.push_back(id);
  }
  for (const auto& person : p.staff)
    if (!listed.count(person.id)) missing.push_back(person.id);
  // One or two odd ids are likely typos: readRosterCsv names the line and suggests a spelling.
  if (!unknown.empty() && unknown.size() + missing.size() >= 3)
    throw InputError(path, 0, 0,
                     "the published roster is for a different staff list: " + std::to_string(unknown.size()) +
                         " of its people are not in the scenario (" + someIds(unknown) + ")" +
                         (missing.empty() ? std::string()
                                          : " and " + std::to_string(missing.size()) +
                                                " of the scenario's staff have no row (" + someIds(missing) + ")") +
                         "; use the scenario the roster was published for, or add the new staff to both");
}

/// Parses STAFF:DATE[..DATE][:REASON] and marks the days from `first` on absent.
void applyAbsence(model::Problem& p, const std::string& text, DayIdx first) {
  auto wrong = [&](const std::string& why) { throw InputError("--absence " + text, 0, 0, why); };
  auto bad = [&](const std::string& why) {
    wrong(why + "; write STAFF:YYYY-MM-DD or STAFF:YYYY-MM-DD..YYYY-MM-DD (optionally :REASON at the end)");
  };
  if (const auto found = findControlChar(text, false))
    wrong("control character " + codePointName(found->code) + " at character " + std::to_string(found->column) +
          "; write the absence with printable characters only");
  const size_t colon = text.find(':');
  if (colon == std::string::npos) bad("missing ':' between the staff id and the date");
  const std::string id = text.substr(0, colon);
  std::string range = text.substr(colon + 1), reason = "reported at replan";
  if (const size_t second = range.find(':'); second != std::string::npos) {
    reason = trimCell(range.substr(second + 1));
    range = range.substr(0, second);
    if (reason.empty()) bad("empty reason after the second ':'");
  }
  const StaffIdx s = p.findStaff(id);
  if (s < 0) {
    std::vector<std::string> ids;
    for (const auto& person : p.staff) ids.push_back(person.id);
    wrong("unknown staff id '" + id + "'" + didYouMean(id, ids) + "; use an id from the scenario's staff list");
  }
  const size_t dots = range.find("..");
  const auto from = model::parseIsoDate(range.substr(0, dots));
  const auto to = dots == std::string::npos ? from : model::parseIsoDate(range.substr(dots + 2));
  if (!from || !to) bad("invalid date in '" + range + "'");
  if (*to < *from) bad("the absence ends before it starts");
  if (*from < p.start || *to >= p.start + p.days) wrong("the absence is outside the period " + periodText(p));
  if (*to < p.start + first)
    wrong("the absence ends before --from " + p.dateText(first) +
          "; days before --from are kept as published, so there is nothing to re-plan");
  if (*from < p.start + first)
    std::cerr << "note: --absence " << text << ": days before --from " << p.dateText(first)
              << " are kept as published; the absence is applied from " << p.dateText(first) << "\n";
  for (model::DateSerial d = std::max(*from, p.start + first); d <= *to; ++d) {
    p.absent[p.cell(s, d - p.start)] = 1;
    p.absenceReason[p.cell(s, d - p.start)] = reason;
  }
}

}  // namespace

model::RuleSpec defaultChangesRule(const model::Problem& problem) {
  model::RuleSpec changes;
  changes.kind = model::RuleKind::Changes;
  changes.id = "changes";
  changes.hard = false;
  changes.weight = ChangesDefaults::weight;
  changes.earlyDays = ChangesDefaults::earlyDays;
  changes.earlyWeight = ChangesDefaults::earlyWeight;
  changes.nearDays = ChangesDefaults::nearDays;
  changes.farWeight = ChangesDefaults::farWeight;
  changes.inScope.assign(problem.staff.size(), 1);
  changes.origin = "replan default";
  return changes;
}

model::Problem loadReplanScenario(const std::string& scenario, const ReplanAdditions& additions) {
  model::Problem problem = loadScenario(scenario);
  const auto from = model::parseIsoDate(additions.from);
  if (!from) throw InputError("--from " + additions.from, 0, 0, "invalid date; write YYYY-MM-DD");
  if (*from < problem.start || *from >= problem.start + problem.days)
    throw InputError(
        "--from " + additions.from, 0, 0,
        "the date is outside the period " + periodText(problem) + "; give the first day to re-plan, inside the period");
  const DayIdx first = *from - problem.start;
  checkPublishedFits(additions.publishedRoster, problem);
  const model::Roster published = readRosterCsv(additions.publishedRoster, problem);
  for (const auto& a : additions.absences) applyAbsence(problem, a, first);
  model::computeAbsenceCredit(problem);  // absences given here credit hours as those in the scenario

  // Days before --from are frozen exactly as published, even where they break a rule:
  // they are reported as they are and the search cannot touch them.
  for (StaffIdx s = 0; s < problem.staffCount(); ++s)
    for (DayIdx d = 0; d < first; ++d) {
      TaskIdx& fixed = problem.fixed[problem.cell(s, d)];
      if (fixed >= 0 && fixed != published.at(s, d))
        std::cerr << "note: " << problem.staff[static_cast<size_t>(s)].id << " on " << problem.dateText(d)
                  << ": the scenario fixes " << problem.cellText(fixed, s) << " but the published roster has "
                  << problem.cellText(published.at(s, d), s) << "; days before --from are kept as published\n";
      fixed = published.at(s, d);
    }
  // After the absences: the gap distances the `changes` rule weighs read them.
  problem.published = model::makePublished(problem, published.cells, first);
  const bool listed = std::any_of(problem.rules.begin(), problem.rules.end(),
                                  [](const model::RuleSpec& r) { return r.kind == model::RuleKind::Changes; });
  if (!listed) problem.rules.push_back(defaultChangesRule(problem));
  return problem;
}

}  // namespace rotaweave::io
