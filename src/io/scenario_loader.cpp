/// @brief Scenario sections: period, weekend, shifts, skills, contracts, staff and demand.
#include "io/scenario_loader.hpp"

#include <algorithm>
#include <map>
#include <regex>
#include <set>

#include "io/input_limits.hpp"
#include "io/loader_context.hpp"
#include "io/tzif.hpp"

namespace rotaweave::io {
namespace detail {
namespace {

template <class T, class GetId>
int findIndex(const std::vector<T>& items, const std::string& id, GetId&& getId) {
  for (size_t i = 0; i < items.size(); ++i)
    if (getId(items[i]) == id) return static_cast<int>(i);
  return -1;
}

template <class T, class GetId>
std::vector<std::string> idsOf(const std::vector<T>& items, GetId&& getId) {
  std::vector<std::string> out;
  for (const auto& item : items) out.push_back(getId(item));
  return out;
}

/// "E, L, N", or the first 12 and how many more.
std::string knownList(const std::vector<std::string>& known) {
  constexpr size_t kShown = 12;
  std::string out;
  for (size_t i = 0; i < known.size() && i < kShown; ++i) out += (i ? ", " : "") + known[i];
  if (known.size() > kShown) out += " and " + std::to_string(known.size() - kShown) + " more";
  return out;
}

[[noreturn]] void unknown(const Field& f, const std::string& what, const std::string& id,
                          const std::vector<std::string>& known) {
  std::string message = "unknown " + what + " '" + id + "'" + didYouMean(id, known);
  // YAML 1.1 tools (Python's PyYAML) read an unquoted `off` as a boolean and write it back as false.
  if (what == "shift" && (id == "false" || id == "False"))
    message += " (a YAML 1.1 tool such as Python's PyYAML turns an unquoted `off` into false; write 'off' in quotes)";
  f.fail(message + "; known " + what + "s: " + knownList(known) +
         "; declare it first or fix the spelling");
}

}  // namespace

ShiftIdx LoadContext::shift(const Field& f) const {
  const std::string id = f.text();
  const int i = findIndex(problem.shifts, id, [](const auto& s) { return s.id; });
  if (i < 0) unknown(f, "shift", id, shiftIds());
  return static_cast<ShiftIdx>(i);
}

SkillIdx LoadContext::skill(const Field& f) const {
  const std::string id = f.text();
  const int i = findIndex(problem.skills, id, [](const auto& s) { return s; });
  if (i < 0) unknown(f, "skill", id, problem.skills);
  return static_cast<SkillIdx>(i);
}

StaffIdx LoadContext::staff(const Field& f) const {
  const std::string id = f.text();
  const int i = findIndex(problem.staff, id, [](const auto& s) { return s.id; });
  if (i < 0) unknown(f, "staff id", id, idsOf(problem.staff, [](const auto& s) { return s.id; }));
  return i;
}

int LoadContext::contract(const Field& f) const {
  const std::string id = f.text();
  const int i = findIndex(problem.contracts, id, [](const auto& c) { return c.id; });
  if (i < 0) unknown(f, "contract", id, idsOf(problem.contracts, [](const auto& c) { return c.id; }));
  return i;
}

DayIdx LoadContext::periodDay(const Field& f) const {
  const model::DateSerial d = f.date();
  if (d < problem.start || d >= problem.start + problem.days)
    f.fail("date " + f.text() + " is outside the period " + problem.dateText(0) + " to " + problem.dateText(problem.days - 1));
  return d - problem.start;
}

std::vector<std::string> LoadContext::shiftIds() const {
  return idsOf(problem.shifts, [](const auto& s) { return s.id; });
}

}  // namespace detail

namespace {

using detail::LoadContext;
constexpr int kMaxDays = 400;
constexpr int kMaxHistory = 60;
constexpr size_t kMaxTasks = 2000;

void loadPeriod(LoadContext& ctx, const Field& f) {
  f.allowOnly({"start", "end"});
  const auto start = f.require("start").date();
  const Field endField = f.require("end");
  const auto end = endField.date();
  if (end < start) endField.fail("the period ends before it starts; end must be on or after start");
  if (end - start + 1 > kMaxDays) endField.fail("the period is longer than " + std::to_string(kMaxDays) + " days; split it");
  ctx.problem.start = start;
  ctx.problem.days = end - start + 1;
}

std::vector<int> loadWeekend(const Field& f) {
  std::vector<int> days;
  for (const Field& item : f.items()) {
    auto wd = model::parseWeekday(item.text());
    if (!wd) item.fail("unknown weekday '" + item.text() + "'; use mon, tue, wed, thu, fri, sat or sun");
    if (std::find(days.begin(), days.end(), *wd) != days.end()) item.fail("weekday listed twice");
    days.push_back(*wd);
  }
  return days;
}

void loadShifts(LoadContext& ctx, const Field& f) {
  static const std::regex kColour("#[0-9A-Fa-f]{6}");
  auto items = f.items();
  if (items.empty()) f.fail("the shift list is empty; declare at least one shift");
  for (const Field& item : items) {
    item.allowOnly({"id", "label", "start", "end", "break_minutes", "colour"});
    model::ShiftType s;
    const Field idField = item.require("id");
    s.id = idField.id();
    if (s.id.find('/') != std::string::npos) idField.fail("a shift id cannot contain '/'");
    if (ctx.problem.findShift(s.id) != kNoShift) idField.fail("duplicate shift id '" + s.id + "'; shift ids must be unique");
    s.label = item.has("label") ? item.get("label").text() : s.id;
    s.start = item.require("start").clockTime();
    const Field endField = item.require("end");
    s.end = endField.clockTime();
    if (s.start == 24 * 60) item.require("start").fail("a shift cannot start at 24:00; use 00:00 of the next day");
    if (s.end == s.start) endField.fail("a shift cannot end when it starts; 24-hour shifts are not supported");
    if (s.end < s.start) s.end += kMinutesPerDay;  // ends the next day
    if (item.has("break_minutes")) {
      const Field b = item.get("break_minutes");
      s.breakMinutes = b.integer(0, 600);
      if (s.breakMinutes >= s.end - s.start) b.fail("the break is as long as the shift itself");
    }
    if (item.has("colour")) {
      const Field c = item.get("colour");
      s.colour = c.text();
      if (!std::regex_match(s.colour, kColour)) c.fail("colour must be #RRGGBB, e.g. \"#FFE699\" (quoted)");
    }
    ctx.problem.shifts.push_back(std::move(s));
  }
}

void loadSkills(LoadContext& ctx, const Field& f) {
  auto items = f.items();
  if (items.empty()) f.fail("the skill list is empty; declare at least one skill");
  for (const Field& item : items) {
    const std::string id = item.id();
    if (ctx.problem.findSkill(id) >= 0) item.fail("duplicate skill '" + id + "'");
    ctx.problem.skills.push_back(id);
  }
}

void loadContracts(LoadContext& ctx, const Field& f) {
  for (const auto& [id, c] : f.entries()) {
    c.allowOnly({"hours", "daily_hours", "severity", "weight"});
    model::Contract contract;
    contract.id = id;
    contract.origin = c.file() + ":" + std::to_string(c.node().Mark().line + 1);
    if (c.has("hours")) {
      const Field h = c.get("hours");
      h.allowOnly({"min", "max"});
      if (h.has("min")) contract.minMinutes = h.get("min").minutesFromHours(0, 1e5);
      if (h.has("max")) contract.maxMinutes = h.get("max").minutesFromHours(0, 1e5);
      if (contract.minMinutes && contract.maxMinutes && *contract.minMinutes > *contract.maxMinutes)
        h.fail("hours.min is above hours.max");
    }
    if (c.has("daily_hours")) contract.dailyMinutes = c.get("daily_hours").minutesFromHours(0, 24);
    if (c.has("severity")) {
      const std::string sev = c.get("severity").text();
      if (sev != "hard" && sev != "soft") c.get("severity").fail("severity must be hard or soft");
      contract.hard = sev == "hard";
    }
    if (c.has("weight")) contract.weight = c.get("weight").weight();
    ctx.problem.contracts.push_back(std::move(contract));
  }
}

void loadAbsences(LoadContext& ctx, StaffIdx s, const Field& f) {
  auto& p = ctx.problem;
  for (const Field& a : f.items()) {
    a.allowOnly({"from", "to", "date", "reason"});
    model::DateSerial from, to;
    if (a.has("date")) {
      from = to = a.get("date").date();
    } else {
      from = a.require("from").date();
      to = a.require("to").date();
      if (to < from) a.get("to").fail("the absence ends before it starts");
    }
    const std::string reason = a.has("reason") ? a.get("reason").text() : "";
    const model::DateSerial last = p.start + p.days - 1;
    const std::string range = model::formatIsoDate(from) + (to == from ? "" : " to " + model::formatIsoDate(to));
    // Wholly outside is most likely a wrong month or year: the person would be rostered on
    // the real leave days, so it is an error, as for requests and fixed cells.
    if (to < p.start || from > last)
      (a.has("date") ? a.get("date") : a.get(to < p.start ? "to" : "from"))
          .fail("the absence " + range + " is outside the period " + p.dateText(0) + " to " + p.dateText(p.days - 1) +
                "; fix the dates (a wrong month or year?) or leave the absence out");
    // Partly outside is a long leave: only the days inside matter.
    if (from < p.start || to > last)
      ctx.problem.notes.push_back(a.file() + ":" + std::to_string(a.node().Mark().line + 1) + ": the absence of " +
                                  p.staff[static_cast<size_t>(s)].id + " (" + range + ") runs outside the period; only " +
                                  model::formatIsoDate(std::max(from, p.start)) + " to " + model::formatIsoDate(std::min(to, last)) +
                                  " count");
    for (model::DateSerial d = std::max(from, p.start); d <= std::min(to, last); ++d) {
      p.absent[p.cell(s, d - p.start)] = 1;
      p.absenceReason[p.cell(s, d - p.start)] = reason;
    }
  }
}

/// YAML 1.1 tools (Python's PyYAML) read the key `off` as the boolean false and write it back
/// as `false:`; say so instead of calling it an unknown key.
void refuseBooleanKey(const Field& entry) {
  if (!entry.isMap()) return;
  for (const char* key : {"false", "False", "FALSE"})
    if (entry.has(key))
      entry.get(key).fail(std::string("key '") + key +
                          "' is how YAML 1.1 tools such as Python's PyYAML write the key `off` (they read an unquoted off "
                          "as a boolean); write day_off: true, which every YAML tool keeps as it is");
}

void loadRequests(LoadContext& ctx, model::Person& person, const Field& f) {
  for (const Field& r : f.items()) {
    refuseBooleanKey(r);
    r.allowOnly({"date", "off", "day_off", "shift", "not", "weight"});
    model::Request req;
    req.day = ctx.periodDay(r.require("date"));
    const int kinds = r.has("off") + r.has("day_off") + r.has("shift") + r.has("not");
    if (kinds != 1) r.fail("a request needs exactly one of day_off: true (or off: true), shift: ID or not: ID");
    using K = model::Request::Kind;
    if (r.has("off") || r.has("day_off")) {
      const char* key = r.has("off") ? "off" : "day_off";
      if (!r.get(key).boolean()) r.get(key).fail(std::string("write ") + key + ": true, or leave the request out");
      req.kind = K::Off;
    } else if (r.has("shift")) {
      req.kind = K::Shift;
      req.shift = ctx.shift(r.get("shift"));
    } else {
      req.kind = K::NotShift;
      req.shift = ctx.shift(r.get("not"));
    }
    if (r.has("weight")) req.weight = r.get("weight").weight();
    person.requests.push_back(req);
  }
}

void loadFixed(LoadContext& ctx, StaffIdx s, const Field& f) {
  auto& p = ctx.problem;
  const auto& person = p.staff[static_cast<size_t>(s)];
  for (const Field& x : f.items()) {
    refuseBooleanKey(x);
    x.allowOnly({"date", "shift", "skill", "off", "day_off"});
    const DayIdx d = ctx.periodDay(x.require("date"));
    TaskIdx task = kOff;
    const bool off = x.has("off") || x.has("day_off");
    if (x.has("off") && x.has("day_off")) x.fail("give day_off: true or off: true, not both");
    if (off == x.has("shift")) x.fail("a fixed cell needs either shift: ID or day_off: true (or off: true)");
    if (off) {
      const char* key = x.has("off") ? "off" : "day_off";
      if (!x.get(key).boolean()) x.get(key).fail(std::string("write ") + key + ": true for a fixed day off, or leave the entry out");
    }
    if (x.has("shift")) {
      const ShiftIdx sh = ctx.shift(x.get("shift"));
      SkillIdx sk = person.skills.front();
      if (x.has("skill")) {
        sk = ctx.skill(x.get("skill"));
        if (!person.holds(sk)) x.get("skill").fail(person.id + " does not hold skill '" + p.skills[static_cast<size_t>(sk)] + "'");
      }
      task = p.task(sh, sk);
    }
    if (p.fixed[p.cell(s, d)] >= 0) x.fail("this date is already fixed for " + person.id);
    p.fixed[p.cell(s, d)] = task;
  }
}

void loadHistory(LoadContext& ctx, model::Person& person, const Field& f) {
  auto items = f.items();
  if (items.size() > kMaxHistory) f.fail("history is longer than " + std::to_string(kMaxHistory) + " days; keep the last weeks");
  for (const Field& h : items) person.history.push_back(h.text() == "off" ? kNoShift : ctx.shift(h));
}

void loadStaff(LoadContext& ctx, const Field& f) {
  auto& p = ctx.problem;
  auto items = f.items();
  if (items.empty()) f.fail("the staff list is empty; add at least one person");
  if (items.size() > kMaxStaff)
    f.fail(std::to_string(items.size()) + " people; at most " + std::to_string(kMaxStaff) + " are supported: split the roster by unit");
  // First pass: ids and skills, so later entries can refer to any person.
  for (const Field& item : items) {
    item.allowOnly({"id", "name", "contract", "skills", "absences", "requests", "fixed", "history"});
    model::Person person;
    const Field idField = item.require("id");
    person.id = idField.id();
    if (person.id.find(',') != std::string::npos) idField.fail("a staff id cannot contain ','");
    if (p.findStaff(person.id) >= 0) idField.fail("duplicate staff id '" + person.id + "'; staff ids must be unique");
    person.name = item.has("name") ? item.get("name").text() : person.id;
    if (item.has("contract")) person.contract = ctx.contract(item.get("contract"));
    const Field skills = item.require("skills");
    for (const Field& sk : skills.items()) {
      const SkillIdx i = ctx.skill(sk);
      if (person.holds(i)) sk.fail("skill listed twice");
      person.skills.push_back(i);
      person.skillMask |= std::uint64_t{1} << i;
    }
    if (person.skills.empty()) skills.fail("a person needs at least one skill");
    p.staff.push_back(std::move(person));
  }
  const size_t cells = p.staff.size() * static_cast<size_t>(p.days);
  p.absent.assign(cells, 0);
  p.absenceReason.assign(cells, "");
  p.fixed.assign(cells, -1);
  for (size_t i = 0; i < items.size(); ++i) {
    const Field& item = items[i];
    auto s = static_cast<StaffIdx>(i);
    if (item.has("absences")) loadAbsences(ctx, s, item.get("absences"));
    if (item.has("requests")) loadRequests(ctx, p.staff[i], item.get("requests"));
    if (item.has("fixed")) loadFixed(ctx, s, item.get("fixed"));
    if (item.has("history")) loadHistory(ctx, p.staff[i], item.get("history"));
    p.maxHistory = std::max(p.maxHistory, static_cast<int>(p.staff[i].history.size()));
  }
}

void loadDemand(LoadContext& ctx, const Field& f) {
  auto& p = ctx.problem;
  const size_t nTasks = p.tasks.size();
  p.demand.assign(static_cast<size_t>(p.days) * nTasks, model::DemandCell{});
  std::vector<int> level(p.demand.size(), -1);       // 0 every day, 1 weekday filter, 2 dates
  std::vector<std::string> setBy(p.demand.size());  // where the winning entry is
  for (const Field& e : f.items()) {
    e.allowOnly({"shift", "skill", "min", "target", "max", "days", "dates", "severity", "min_weight", "target_weight", "max_weight"});
    const ShiftIdx sh = ctx.shift(e.require("shift"));
    const SkillIdx sk = ctx.skill(e.require("skill"));
    model::DemandCell c;
    c.defined = true;
    c.min = e.has("min") ? e.get("min").integer(0, 10000) : 0;
    c.target = e.has("target") ? e.get("target").integer(0, 10000) : c.min;
    if (c.target < c.min) e.get("target").fail("target is below min; target must be at least min");
    if (e.has("max")) {
      c.max = e.get("max").integer(0, 10000);
      if (c.max < c.target) e.get("max").fail("max is below target (or min); max must be at least target");
    }
    if (!e.has("min") && !e.has("target") && !e.has("max")) e.fail("give at least one of min, target or max");
    if (e.has("severity")) {
      const std::string sev = e.get("severity").text();
      if (sev != "hard" && sev != "soft") e.get("severity").fail("severity must be hard or soft");
      c.minHard = sev == "hard";
    }
    if (e.has("min_weight")) c.minWeight = e.get("min_weight").weight();
    if (e.has("target_weight")) c.targetWeight = e.get("target_weight").weight();
    if (e.has("max_weight")) c.maxWeight = e.get("max_weight").weight();
    if (e.has("days") && e.has("dates")) e.fail("use either days or dates in one demand entry, not both");

    std::vector<uint8_t> applies(static_cast<size_t>(p.days), 0);
    int lvl = 0;
    if (e.has("dates")) {
      lvl = 2;
      for (const Field& d : e.get("dates").items()) applies[static_cast<size_t>(ctx.periodDay(d))] = 1;
    } else if (e.has("days")) {
      lvl = 1;
      // Each item is a weekday name, `weekend` or `weekdays`; a date matches if any item does.
      const auto items = e.get("days").items();
      auto isWeekdays = [](const std::string& w) { return w == "weekdays" || w == "weekday"; };
      for (const Field& d : items)
        if (!model::parseWeekday(d.text()) && d.text() != "weekend" && !isWeekdays(d.text()))
          d.fail("unknown day '" + d.text() + "'; use mon..sun, weekend or weekdays");
      for (DayIdx d = 0; d < p.days; ++d) {
        const bool isWeekend = p.weekend[static_cast<size_t>(d)];
        for (const Field& x : items) {
          const auto named = model::parseWeekday(x.text());
          if ((named && *named == p.weekday[static_cast<size_t>(d)]) || (x.text() == "weekend" && isWeekend) ||
              (isWeekdays(x.text()) && !isWeekend))
            applies[static_cast<size_t>(d)] = 1;
        }
      }
    } else {
      std::fill(applies.begin(), applies.end(), 1);
    }
    const TaskIdx task = p.task(sh, sk);
    const std::string here = "line " + std::to_string(e.node().Mark().line + 1);
    for (DayIdx d = 0; d < p.days; ++d) {
      if (!applies[static_cast<size_t>(d)]) continue;
      const size_t k = static_cast<size_t>(d) * nTasks + static_cast<size_t>(task);
      if (level[k] == lvl)
        e.fail("demand for " + p.shifts[static_cast<size_t>(sh)].id + " " + p.skills[static_cast<size_t>(sk)] + " on " +
               p.dateText(d) + " is also given at " + setBy[k] + " with the same kind of filter; merge the two entries");
      if (level[k] > lvl) continue;  // a more specific entry already decides this date
      level[k] = lvl;
      setBy[k] = here;
      p.demand[k] = c;
    }
  }
}

/// `absence_credit:` maps a reason to `daily` (the person's usual day), hours per absent
/// working day, or 0; entries replace the built-in defaults of the same reason.
void loadAbsenceCredit(LoadContext& ctx, const Field& f) {
  if (!f.isMap()) f.fail("absence_credit is a map of reason to daily, hours or 0, e.g. {leave: daily, training: 6, unpaid: 0}");
  auto& credits = ctx.problem.absenceCredit;
  for (const auto& [key, value] : f.entries()) {
    const std::string& reason = key;  // a plain name: clang 14 lambdas cannot capture structured bindings
    model::AbsenceCredit c;
    c.reason = reason;
    c.origin = value.file() + ":" + std::to_string(value.node().Mark().line + 1);
    if (value.isScalar() && value.node().Scalar() == "daily") {
      c.daily = true;
    } else {
      if (!value.isScalar()) value.fail("write daily, a number of hours per absent working day, or 0");
      c.daily = false;
      c.minutes = value.minutesFromHours(0, 24);
    }
    auto it = std::find_if(credits.begin(), credits.end(), [&](const model::AbsenceCredit& x) { return x.reason == reason; });
    if (it != credits.end()) *it = c;
    else credits.push_back(c);
  }
}

void loadHolidays(LoadContext& ctx, const Field& f) {
  auto& p = ctx.problem;
  p.holiday.assign(static_cast<size_t>(p.days), 0);
  for (const Field& d : f.items()) {
    const model::DateSerial date = d.date();
    if (date >= p.start && date < p.start + p.days) p.holiday[static_cast<size_t>(date - p.start)] = 1;
  }
}

/// `timezone`: an IANA name the system's zone files know (RFC 8536 TZif, tzdata package).
void loadTimeZoneKey(LoadContext& ctx, const Field& f) {
  const std::string name = f.text();
  std::string why;
  if (loadTimeZone(name, &why)) {
    ctx.problem.timezone = name;
    return;
  }
  const std::vector<std::string> known = knownZoneNames();
  if (known.empty())
    f.fail("unknown time zone '" + name + "': no zone data in " + zoneInfoDir() +
           "; install the tzdata package (or set TZDIR to a zoneinfo folder), or leave timezone out for floating times");
  f.fail("unknown time zone '" + name + "'" + didYouMean(name, known) +
         "; give an IANA name such as Europe/Berlin, America/New_York or UTC (the names in " + zoneInfoDir() + ")");
}

}  // namespace

model::Problem loadScenario(const std::string& path) {
  model::Problem problem;
  problem.sourceFile = path;
  LoadContext ctx{problem, path, {}};
  const Field root(Field::parseFile(path), "", &ctx.scenarioFile);
  if (!root.isMap()) root.fail("a scenario must be a map with keys such as period, shifts, skills, staff");
  root.allowOnly({"name", "description", "timezone", "period", "weekend", "holidays", "shifts", "skills", "contracts", "absence_credit",
                  "staff", "demand", "rules"});

  problem.name = root.has("name") ? root.get("name").text() : path;
  if (root.has("timezone")) loadTimeZoneKey(ctx, root.get("timezone"));
  loadPeriod(ctx, root.require("period"));
  const std::vector<int> weekend = root.has("weekend") ? loadWeekend(root.get("weekend")) : std::vector<int>{5, 6};
  loadShifts(ctx, root.require("shifts"));
  loadSkills(ctx, root.require("skills"));
  // Each (shift, role) pair is a task with a 16-bit index, and cover is kept per day and task.
  if (problem.shifts.size() * problem.skills.size() > kMaxTasks)
    root.require("skills").fail(std::to_string(problem.shifts.size()) + " shifts x " + std::to_string(problem.skills.size()) +
                                " skills make too many (shift, role) pairs; at most " + std::to_string(kMaxTasks) +
                                " are supported: merge shifts or skills");
  if (problem.skills.size() > 64) root.require("skills").fail("at most 64 skills are supported");
  if (root.has("holidays")) loadHolidays(ctx, root.get("holidays"));
  model::buildDerivedTables(problem, weekend);
  if (root.has("contracts")) loadContracts(ctx, root.get("contracts"));
  loadStaff(ctx, root.require("staff"));
  if (root.has("demand"))
    loadDemand(ctx, root.get("demand"));
  else
    problem.demand.assign(static_cast<size_t>(problem.days) * problem.tasks.size(), model::DemandCell{});
  if (root.has("absence_credit")) loadAbsenceCredit(ctx, root.get("absence_credit"));
  model::computeAbsenceCredit(problem);
  detail::addImpliedRules(problem);
  if (root.has("rules")) detail::loadRules(ctx, root.get("rules"));
  return problem;
}

}  // namespace rotaweave::io
