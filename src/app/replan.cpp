/// @brief `replan`: keep the published days before --from, re-plan the rest with few changes.
#include <algorithm>
#include <fstream>
#include <iostream>
#include <set>
#include <sstream>

#include "app/commands.hpp"
#include "app/pipeline.hpp"
#include "io/calendar_revision.hpp"
#include "io/csv.hpp"
#include "io/control_chars.hpp"
#include "io/input_error.hpp"
#include "io/input_limits.hpp"
#include "io/roster_csv.hpp"
#include "io/xlsx_read/zip_archive.hpp"
#include "io/scenario_loader.hpp"

namespace rotaweave::app {
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
  if (io::xlsx_read::startsLikeZip(path)) return;  // a workbook: readRosterCsv locates the table and explains
  io::checkRosterCsvShape(path, p.staff.size(), p.days);  // before any row is stored
  const auto rows = io::readCsvFile(path, "published roster given to --roster");
  if (rows.empty()) return;  // readRosterCsv explains
  const auto& header = rows.front().cells;
  if (header.size() >= 2) {
    const auto first = model::parseIsoDate(io::trimCell(header[1]));
    const auto last = model::parseIsoDate(io::trimCell(header.back()));
    if (first && last && (*first != p.start || *last != p.start + p.days - 1))
      throw io::InputError(path, rows.front().line, 0,
                           "the published roster covers " + model::formatIsoDate(*first) + " to " + model::formatIsoDate(*last) +
                               " but the scenario's period is " + periodText(p) +
                               "; re-plan with the scenario the roster was published for");
  }
  std::vector<std::string> unknown, missing;
  std::set<std::string> listed;
  for (size_t r = 1; r < rows.size(); ++r) {
    if (rows[r].cells.size() == 1 && io::trimCell(rows[r].cells[0]).empty()) continue;
    const std::string id = io::trimCell(rows[r].cells[0]);
    listed.insert(id);
    if (p.findStaff(id) < 0) unknown.push_back(id);
  }
  for (const auto& person : p.staff)
    if (!listed.count(person.id)) missing.push_back(person.id);
  // One or two odd ids are likely typos: readRosterCsv names the line and suggests a spelling.
  if (!unknown.empty() && unknown.size() + missing.size() >= 3)
    throw io::InputError(path, 0, 0,
                         "the published roster is for a different staff list: " + std::to_string(unknown.size()) +
                             " of its people are not in the scenario (" + someIds(unknown) + ")" +
                             (missing.empty() ? std::string() : " and " + std::to_string(missing.size()) + " of the scenario's staff have no row (" + someIds(missing) + ")") +
                             "; use the scenario the roster was published for, or add the new staff to both");
}

/// Parses STAFF:DATE[..DATE][:REASON] and marks the days from `first` on absent.
void applyAbsence(model::Problem& p, const std::string& text, DayIdx first) {
  auto wrong = [&](const std::string& why) { throw io::InputError("--absence " + text, 0, 0, why); };
  auto bad = [&](const std::string& why) {
    wrong(why + "; write STAFF:YYYY-MM-DD or STAFF:YYYY-MM-DD..YYYY-MM-DD (optionally :REASON at the end)");
  };
  if (const auto found = io::findControlChar(text, false))
    wrong("control character " + io::codePointName(found->code) + " at character " + std::to_string(found->column) +
          "; write the absence with printable characters only");
  const size_t colon = text.find(':');
  if (colon == std::string::npos) bad("missing ':' between the staff id and the date");
  const std::string id = text.substr(0, colon);
  std::string range = text.substr(colon + 1), reason = "reported at replan";
  if (const size_t second = range.find(':'); second != std::string::npos) {
    reason = io::trimCell(range.substr(second + 1));
    range = range.substr(0, second);
    if (reason.empty()) bad("empty reason after the second ':'");
  }
  const StaffIdx s = p.findStaff(id);
  if (s < 0) {
    std::vector<std::string> ids;
    for (const auto& person : p.staff) ids.push_back(person.id);
    wrong("unknown staff id '" + id + "'" + io::didYouMean(id, ids) + "; use an id from the scenario's staff list");
  }
  const size_t dots = range.find("..");
  const auto from = model::parseIsoDate(range.substr(0, dots));
  const auto to = dots == std::string::npos ? from : model::parseIsoDate(range.substr(dots + 2));
  if (!from || !to) bad("invalid date in '" + range + "'");
  if (*to < *from) bad("the absence ends before it starts");
  if (*from < p.start || *to >= p.start + p.days) wrong("the absence is outside the period " + periodText(p));
  if (*to < p.start + first)
    wrong("the absence ends before --from " + p.dateText(first) + "; days before --from are kept as published, so there is nothing to re-plan");
  if (*from < p.start + first)
    std::cerr << "note: --absence " << text << ": days before --from " << p.dateText(first)
              << " are kept as published; the absence is applied from " << p.dateText(first) << "\n";
  for (model::DateSerial d = std::max(*from, p.start + first); d <= *to; ++d) {
    p.absent[p.cell(s, d - p.start)] = 1;
    p.absenceReason[p.cell(s, d - p.start)] = reason;
  }
}

/// The calendars published with the roster: calendars/ beside it, as solve and replan write
/// them. Read before the search, so a damaged one stops the run before it starts. Without
/// the folder the published roster's shifts stand for them, at SEQUENCE 0.
std::shared_ptr<const io::CalendarHistory> publishedCalendars(const std::string& rosterPath, const model::Problem& p) {
  const std::filesystem::path folder = std::filesystem::path(rosterPath).parent_path() / "calendars";
  std::error_code ec;
  if (!std::filesystem::is_directory(folder, ec)) {
    std::cerr << "note: no calendars/ folder beside " << rosterPath
              << "; the calendars are written as updates of a first publication of that roster (SEQUENCE 0)\n";
    return nullptr;
  }
  return std::make_shared<const io::CalendarHistory>(io::loadCalendarHistory(folder, p));
}

}  // namespace

Outcome replan(const ReplanRequest& request) {
  refuseToOverwrite(request.publishedRoster, request.solve.out);
  io::OutputFolder out(request.solve.out);  // checked and locked before anything is read or searched
  model::Problem problem = io::loadScenario(request.solve.scenario);
  const auto from = model::parseIsoDate(request.from);
  if (!from) throw io::InputError("--from " + request.from, 0, 0, "invalid date; write YYYY-MM-DD");
  if (*from < problem.start || *from >= problem.start + problem.days)
    throw io::InputError("--from " + request.from, 0, 0, "the date is outside the period " + periodText(problem) +
                                                            "; give the first day to re-plan, inside the period");
  const DayIdx first = *from - problem.start;
  checkPublishedFits(request.publishedRoster, problem);
  const model::Roster published = io::readRosterCsv(request.publishedRoster, problem);
  for (const auto& a : request.absences) applyAbsence(problem, a, first);
  model::computeAbsenceCredit(problem);  // absences given here credit hours as those in the scenario
  printNotes(problem);

  problem.published = model::Published{published.cells, first};
  // Days before --from are frozen exactly as published, even where they break a rule:
  // they are reported as they are and the search cannot touch them.
  for (StaffIdx s = 0; s < problem.staffCount(); ++s)
    for (DayIdx d = 0; d < first; ++d) {
      TaskIdx& fixed = problem.fixed[problem.cell(s, d)];
      if (fixed >= 0 && fixed != published.at(s, d))
        std::cerr << "note: " << problem.staff[static_cast<size_t>(s)].id << " on " << problem.dateText(d) << ": the scenario fixes "
                  << problem.cellText(fixed, s) << " but the published roster has " << problem.cellText(published.at(s, d), s)
                  << "; days before --from are kept as published\n";
      fixed = published.at(s, d);
    }
  const bool listed = std::any_of(problem.rules.begin(), problem.rules.end(),
                                  [](const model::RuleSpec& r) { return r.kind == model::RuleKind::Changes; });
  if (!listed) {
    // Default stability cost: a change costs 2, or 10 within the first 3 days (short notice).
    model::RuleSpec changes;
    changes.kind = model::RuleKind::Changes;
    changes.id = "changes";
    changes.hard = false;
    changes.weight = 2 * kWeightScale;
    changes.earlyDays = 3;
    changes.earlyWeight = 10 * kWeightScale;
    changes.inScope.assign(problem.staff.size(), 1);
    changes.origin = "replan default";
    problem.rules.push_back(std::move(changes));
  }
  // The published roster seeds the search, with cells that are no longer possible cleared.
  model::Roster seed = published;
  for (StaffIdx s = 0; s < problem.staffCount(); ++s)
    for (DayIdx d = first; d < problem.days; ++d) {
      if (problem.fixed[problem.cell(s, d)] >= 0) seed.at(s, d) = problem.fixed[problem.cell(s, d)];
      else if (problem.absent[problem.cell(s, d)]) seed.at(s, d) = kOff;
    }

  SolveRequest solve = request.solve;
  solve.previousCalendars = publishedCalendars(request.publishedRoster, problem);
  return searchAndWrite(problem, {seed}, solve, "replan", out);
}

}  // namespace rotaweave::app
