/// @brief Parses benchmark instance files and renders them as rotaweave scenarios.
#include "bench/instance_format.hpp"

#include "model/calendar.hpp"

#include <algorithm>
#include <cctype>
#include <charconv>
#include <cstdio>
#include <fstream>
#include <map>
#include <optional>
#include <set>
#include <sstream>
#include <stdexcept>
#include <string_view>
#include <tuple>
#include <utility>

namespace rotaweave::bench {
namespace {

// ---------------------------------------------------------------- reading

struct Line {
    int number = 0;
    std::string text;
};

struct Section {
    int headerLine = 0;
    std::vector<Line> rows;
};

std::string trim(std::string_view s) {
    const auto isSpace = [](char c) { return std::isspace(static_cast<unsigned char>(c)) != 0; };
    while (!s.empty() && isSpace(s.front())) s.remove_prefix(1);
    while (!s.empty() && isSpace(s.back())) s.remove_suffix(1);
    return std::string(s);
}

std::vector<std::string> split(const std::string& s, char sep) {
    std::vector<std::string> parts;
    std::size_t from = 0;
    for (std::size_t at = s.find(sep); at != std::string::npos; at = s.find(sep, from)) {
        parts.push_back(trim(std::string_view(s).substr(from, at - from)));
        from = at + 1;
    }
    parts.push_back(trim(std::string_view(s).substr(from)));
    return parts;
}

const std::set<std::string>& knownSections() {
    static const std::set<std::string> names = {
        "SECTION_HORIZON", "SECTION_SHIFTS", "SECTION_STAFF", "SECTION_DAYS_OFF",
        "SECTION_SHIFT_ON_REQUESTS", "SECTION_SHIFT_OFF_REQUESTS", "SECTION_COVER"};
    return names;
}

/// Reports problems as "SOURCE:LINE: message".
class Diagnostics {
public:
    explicit Diagnostics(std::string source) : source_(std::move(source)) {}

    [[noreturn]] void fail(int line, const std::string& message) const {
        throw std::runtime_error(source_ + ":" + std::to_string(line) + ": " + message);
    }

    int nonNegative(const Line& line, const std::string& field, const std::string& what) const {
        int value = 0;
        const char* end = field.data() + field.size();
        const auto [ptr, ec] = std::from_chars(field.data(), end, value);
        if (field.empty() || ec != std::errc() || ptr != end || value < 0)
            fail(line.number, what + " must be a whole number >= 0, got '" + field + "'");
        return value;
    }

    std::vector<std::string> fields(const Line& line, std::size_t count, const std::string& layout) const {
        auto parts = split(line.text, ',');
        if (parts.size() != count)
            fail(line.number, "expected " + std::to_string(count) + " comma-separated fields (" + layout +
                                  "), got " + std::to_string(parts.size()));
        return parts;
    }

private:
    std::string source_;
};

std::map<std::string, Section> readSections(std::istream& in, const Diagnostics& diag) {
    std::map<std::string, Section> sections;
    Section* current = nullptr;
    std::string raw;
    for (int number = 1; std::getline(in, raw); ++number) {
        if (number == 1 && raw.rfind("\xEF\xBB\xBF", 0) == 0) raw.erase(0, 3);  // UTF-8 byte order mark
        const std::string text = trim(raw);
        if (text.empty() || text.front() == '#') continue;
        if (text.rfind("SECTION_", 0) == 0) {
            if (knownSections().count(text) == 0) diag.fail(number, "unknown section '" + text + "'");
            if (sections.count(text) != 0) diag.fail(number, "section '" + text + "' appears twice");
            current = &sections[text];
            current->headerLine = number;
            continue;
        }
        if (current == nullptr) diag.fail(number, "data before the first SECTION_ header");
        current->rows.push_back({number, text});
    }
    if (in.bad()) diag.fail(0, "read error");
    return sections;
}

// ---------------------------------------------------------------- interpreting

class InstanceBuilder {
public:
    InstanceBuilder(std::map<std::string, Section> sections, Diagnostics diag, int lastLine)
        : sections_(std::move(sections)), diag_(std::move(diag)), lastLine_(lastLine) {}

    Instance build() {
        readHorizon();
        readShifts();
        readStaff();
        readDaysOff();
        readRequests("SECTION_SHIFT_ON_REQUESTS", instance_.onRequests);
        readRequests("SECTION_SHIFT_OFF_REQUESTS", instance_.offRequests);
        readCover();
        return std::move(instance_);
    }

private:
    const std::vector<Line>& rows(const std::string& name, bool required) const {
        static const std::vector<Line> none;
        const auto it = sections_.find(name);
        if (it == sections_.end()) {
            if (required) diag_.fail(lastLine_, "missing " + name);
            return none;
        }
        return it->second.rows;
    }

    void readHorizon() {
        const auto& lines = rows("SECTION_HORIZON", true);
        if (lines.size() != 1)
            diag_.fail(lines.empty() ? sections_.at("SECTION_HORIZON").headerLine : lines[1].number,
                       "SECTION_HORIZON must hold exactly one number");
        instance_.horizon = diag_.nonNegative(lines[0], lines[0].text, "horizon");
        if (instance_.horizon == 0) diag_.fail(lines[0].number, "horizon must be at least 1 day");
    }

    void readShifts() {
        const auto& lines = rows("SECTION_SHIFTS", true);
        if (lines.empty()) diag_.fail(sections_.at("SECTION_SHIFTS").headerLine, "no shift types");
        for (const Line& line : lines) {
            const auto f = diag_.fields(line, 3, "ShiftID, Length, CannotFollow");
            if (f[0].empty()) diag_.fail(line.number, "empty shift id");
            if (!shiftIndex_.emplace(f[0], instance_.shifts.size()).second)
                diag_.fail(line.number, "shift '" + f[0] + "' defined twice");
            ShiftType shift{f[0], diag_.nonNegative(line, f[1], "shift length"), {}};
            if (shift.lengthMinutes == 0) diag_.fail(line.number, "shift length must be at least 1 minute");
            instance_.shifts.push_back(std::move(shift));
        }
        for (std::size_t i = 0; i < lines.size(); ++i) {
            const std::string list = split(lines[i].text, ',')[2];
            if (list.empty()) continue;
            for (const std::string& next : split(list, '|')) {
                requireShift(lines[i], next);
                instance_.shifts[i].cannotFollow.push_back(next);
            }
        }
    }

    void readStaff() {
        const auto& lines = rows("SECTION_STAFF", true);
        if (lines.empty()) diag_.fail(sections_.at("SECTION_STAFF").headerLine, "no staff");
        for (const Line& line : lines) {
            const auto f = diag_.fields(line, 8,
                                        "ID, MaxShifts, MaxTotalMinutes, MinTotalMinutes, MaxConsecutiveShifts, "
                                        "MinConsecutiveShifts, MinConsecutiveDaysOff, MaxWeekends");
            if (f[0].empty()) diag_.fail(line.number, "empty staff id");
            if (!staffIndex_.emplace(f[0], instance_.staff.size()).second)
                diag_.fail(line.number, "staff '" + f[0] + "' defined twice");
            StaffMember member;
            member.id = f[0];
            member.maxShifts = shiftLimits(line, f[1]);
            member.maxTotalMinutes = diag_.nonNegative(line, f[2], "MaxTotalMinutes");
            member.minTotalMinutes = diag_.nonNegative(line, f[3], "MinTotalMinutes");
            member.maxConsecutiveShifts = diag_.nonNegative(line, f[4], "MaxConsecutiveShifts");
            member.minConsecutiveShifts = diag_.nonNegative(line, f[5], "MinConsecutiveShifts");
            member.minConsecutiveDaysOff = diag_.nonNegative(line, f[6], "MinConsecutiveDaysOff");
            member.maxWeekends = diag_.nonNegative(line, f[7], "MaxWeekends");
            if (member.minTotalMinutes > member.maxTotalMinutes)
                diag_.fail(line.number, "MinTotalMinutes is greater than MaxTotalMinutes");
            instance_.staff.push_back(std::move(member));
        }
    }

    std::vector<ShiftLimit> shiftLimits(const Line& line, const std::string& field) const {
        std::vector<ShiftLimit> limits;
        if (field.empty()) return limits;
        std::set<std::string> seen;
        for (const std::string& entry : split(field, '|')) {
            const auto eq = entry.find('=');
            if (eq == std::string::npos) diag_.fail(line.number, "MaxShifts entry '" + entry + "' is not ID=limit");
            const std::string shift = trim(std::string_view(entry).substr(0, eq));
            requireShift(line, shift);
            if (!seen.insert(shift).second) diag_.fail(line.number, "MaxShifts names '" + shift + "' twice");
            limits.push_back({shift, diag_.nonNegative(line, trim(std::string_view(entry).substr(eq + 1)),
                                                       "MaxShifts limit for '" + shift + "'")});
        }
        return limits;
    }

    void readDaysOff() {
        for (const Line& line : rows("SECTION_DAYS_OFF", false)) {
            const auto f = split(line.text, ',');
            StaffMember& member = instance_.staff[requireStaff(line, f[0])];
            for (std::size_t i = 1; i < f.size(); ++i) member.daysOff.push_back(day(line, f[i]));
        }
        for (StaffMember& member : instance_.staff) {
            std::sort(member.daysOff.begin(), member.daysOff.end());
            member.daysOff.erase(std::unique(member.daysOff.begin(), member.daysOff.end()), member.daysOff.end());
        }
    }

    void readRequests(const std::string& name, std::vector<ShiftRequest>& out) {
        for (const Line& line : rows(name, false)) {
            const auto f = diag_.fields(line, 4, "EmployeeID, Day, ShiftID, Weight");
            requireStaff(line, f[0]);
            requireShift(line, f[2]);
            out.push_back({f[0], day(line, f[1]), f[2], diag_.nonNegative(line, f[3], "weight")});
        }
    }

    void readCover() {
        std::set<std::pair<int, std::string>> seen;
        for (const Line& line : rows("SECTION_COVER", false)) {
            const auto f = diag_.fields(line, 5, "Day, ShiftID, Requirement, Weight for under, Weight for over");
            requireShift(line, f[1]);
            CoverRow row{day(line, f[0]), f[1], diag_.nonNegative(line, f[2], "requirement"),
                         diag_.nonNegative(line, f[3], "weight for under"),
                         diag_.nonNegative(line, f[4], "weight for over")};
            if (!seen.emplace(row.day, row.shift).second)
                diag_.fail(line.number, "second cover row for day " + f[0] + " shift '" + f[1] + "'");
            instance_.cover.push_back(std::move(row));
        }
    }

    int day(const Line& line, const std::string& field) const {
        const int d = diag_.nonNegative(line, field, "day index");
        if (d >= instance_.horizon)
            diag_.fail(line.number, "day " + field + " is outside the horizon of " +
                                        std::to_string(instance_.horizon) + " days");
        return d;
    }

    void requireShift(const Line& line, const std::string& id) const {
        if (shiftIndex_.count(id) == 0) diag_.fail(line.number, "unknown shift '" + id + "'");
    }

    std::size_t requireStaff(const Line& line, const std::string& id) const {
        const auto it = staffIndex_.find(id);
        if (it == staffIndex_.end()) diag_.fail(line.number, "unknown staff '" + id + "'");
        return it->second;
    }

    std::map<std::string, Section> sections_;
    Diagnostics diag_;
    int lastLine_;
    Instance instance_;
    std::map<std::string, std::size_t> shiftIndex_;
    std::map<std::string, std::size_t> staffIndex_;
};

// ---------------------------------------------------------------- writing

/// ISO date of day index `day` of the scenario period (day 0 = kScenarioStartDate).
std::string dateOf(int day) {
    static const model::DateSerial start = *model::parseIsoDate(kScenarioStartDate);
    return model::formatIsoDate(start + day);
}

bool isReservedWord(std::string s) {
    std::transform(s.begin(), s.end(), s.begin(), [](unsigned char c) { return std::tolower(c); });
    static const std::set<std::string> words = {"y", "n", "yes", "no", "on", "off", "true", "false", "null", "~"};
    return words.count(s) != 0;
}

/// A scalar as YAML: plain when no reader could take it for anything but a string, else double-quoted.
std::string scalar(const std::string& s) {
    const bool plain = !s.empty() && std::isalpha(static_cast<unsigned char>(s.front())) && !isReservedWord(s) &&
                       std::all_of(s.begin(), s.end(), [](unsigned char c) {
                           return std::isalnum(c) || c == '_' || c == '-' || c == '.';
                       });
    if (plain) return s;
    std::string quoted = "\"";
    for (char c : s) {
        if (c == '"' || c == '\\') quoted += '\\';
        quoted += c;
    }
    return quoted + "\"";
}

/// A flow sequence; items are written through scalar() unless `verbatim` (ISO dates).
std::string list(const std::vector<std::string>& items, bool verbatim = false) {
    std::string out = "[";
    for (std::size_t i = 0; i < items.size(); ++i) out += (i ? ", " : "") + (verbatim ? items[i] : scalar(items[i]));
    return out + "]";
}

std::string clock(int minuteOfDay) {
    char text[32];
    std::snprintf(text, sizeof text, "%02d:%02d", minuteOfDay / 60, minuteOfDay % 60);
    return text;
}

/// Minutes as hours: exact when 60 divides them into at most two decimals (minutes % 3 == 0),
/// else to 1e-10 h, so that hours * 60 comes back to the same whole minutes.
std::string hours(int minutes) {
    char text[32];
    if (minutes % 3 != 0) {
        std::snprintf(text, sizeof text, "%.10f", minutes / 60.0);
        return text;
    }
    const int hundredths = minutes / 3 * 5;
    if (hundredths % 100 == 0)
        std::snprintf(text, sizeof text, "%d", hundredths / 100);
    else if (hundredths % 10 == 0)
        std::snprintf(text, sizeof text, "%d.%d", hundredths / 100, hundredths % 100 / 10);
    else
        std::snprintf(text, sizeof text, "%d.%02d", hundredths / 100, hundredths % 100);
    return text;
}

bool isScenarioId(const std::string& id) {
    return !id.empty() && id != "off" && std::all_of(id.begin(), id.end(), [](unsigned char c) {
        return std::isalnum(c) || c == '-' || c == '_' || c == '.';
    });
}

/// Scenario ids hold only letters, digits, '-', '_' and '.', and `off` means a day off.
void requireScenarioIds(const Instance& instance) {
    const auto check = [](const std::string& what, const std::string& id) {
        if (!isScenarioId(id))
            throw std::runtime_error("cannot convert " + what + " '" + id +
                                     "': a scenario id holds only letters, digits, '-', '_' and '.', and is not 'off'");
    };
    for (const ShiftType& shift : instance.shifts) check("shift", shift.id);
    for (const StaffMember& member : instance.staff) check("staff", member.id);
}

constexpr int kShiftStartMinute = 8 * 60;

void writeShifts(std::ostream& out, const Instance& instance) {
    out << "shifts:\n";
    for (const ShiftType& shift : instance.shifts) {
        if (shift.lengthMinutes >= 1440)
            throw std::runtime_error("cannot convert shift '" + shift.id + "': it lasts " +
                                     std::to_string(shift.lengthMinutes) +
                                     " minutes, a scenario shift less than 24 hours");
        out << "  - {id: " << scalar(shift.id) << ", start: \"" << clock(kShiftStartMinute) << "\", end: \""
            << clock((kShiftStartMinute + shift.lengthMinutes) % 1440) << "\", break_minutes: 0}\n";
    }
}

/// Days off as absences, consecutive days merged into one range.
std::string absences(const std::vector<int>& days) {
    std::string out = "[";
    for (std::size_t i = 0; i < days.size();) {
        std::size_t j = i;
        while (j + 1 < days.size() && days[j + 1] == days[j] + 1) ++j;
        out += (i ? ", " : "") + std::string("{from: ") + dateOf(days[i]) + ", to: " + dateOf(days[j]) +
               ", reason: day off}";
        i = j + 1;
    }
    return out + "]";
}

void writeRequests(std::ostream& out, const std::vector<ShiftRequest>& requests, const std::string& staff,
                   const char* key) {
    for (const ShiftRequest& r : requests)
        if (r.staff == staff)
            out << "      - {date: " << dateOf(r.day) << ", " << key << ": " << scalar(r.shift)
                << ", weight: " << r.weight << "}\n";
}

void writeStaff(std::ostream& out, const Instance& instance) {
    out << "staff:\n";
    for (const StaffMember& member : instance.staff) {
        out << "  - id: " << scalar(member.id) << "\n    skills: [any]\n";
        if (!member.daysOff.empty()) out << "    absences: " << absences(member.daysOff) << "\n";
        const auto mine = [&](const ShiftRequest& r) { return r.staff == member.id; };
        if (std::none_of(instance.onRequests.begin(), instance.onRequests.end(), mine) &&
            std::none_of(instance.offRequests.begin(), instance.offRequests.end(), mine))
            continue;
        out << "    requests:\n";
        writeRequests(out, instance.onRequests, member.id, "shift");
        writeRequests(out, instance.offRequests, member.id, "not");
    }
}

/// Cover rows with equal shift, requirement and weights share one demand entry listing their dates.
void writeDemand(std::ostream& out, const Instance& instance) {
    using Key = std::tuple<std::string, int, int, int>;
    std::vector<std::pair<Key, std::vector<std::string>>> groups;
    for (const ShiftType& shift : instance.shifts)
        for (const CoverRow& row : instance.cover) {
            if (row.shift != shift.id) continue;
            const Key key{row.shift, row.requirement, row.underWeight, row.overWeight};
            auto it = std::find_if(groups.begin(), groups.end(), [&](const auto& g) { return g.first == key; });
            if (it == groups.end()) it = groups.insert(groups.end(), {key, {}});
            it->second.push_back(dateOf(row.day));
        }
    out << (groups.empty() ? "demand: []\n" : "demand:\n");
    for (const auto& [key, dates] : groups) {
        const auto& [shift, requirement, under, over] = key;
        out << "  - {shift: " << scalar(shift) << ", skill: any, min: 0, target: " << requirement
            << ", max: " << requirement << ", target_weight: " << under << ", max_weight: " << over
            << ", dates: " << list(dates, true) << "}\n";
    }
}

/// Staff ids grouped by a per-person limit (nullopt = no rule for that person), groups in order of first appearance.
template <typename LimitOf>
std::vector<std::pair<int, std::vector<std::string>>> groupByLimit(const Instance& instance, LimitOf limitOf) {
    std::vector<std::pair<int, std::vector<std::string>>> groups;
    for (const StaffMember& member : instance.staff) {
        const std::optional<int> limit = limitOf(member);
        if (!limit) continue;
        auto it = std::find_if(groups.begin(), groups.end(), [&](const auto& g) { return g.first == *limit; });
        if (it == groups.end()) it = groups.insert(groups.end(), {*limit, {}});
        it->second.push_back(member.id);
    }
    return groups;
}

class RuleWriter {
public:
    RuleWriter(std::ostream& out, const Instance& instance) : out_(out), instance_(instance) {}

    void writeAll() {
        out_ << "rules:\n  list:\n";
        writeCannotFollow();
        writeMaxShifts();
        const int horizon = instance_.horizon;
        perStaff("max-total-minutes", "max-hours", "hours",
                 [](const StaffMember& m) { return std::optional<int>(m.maxTotalMinutes); }, hours);
        perStaff("min-total-minutes", "min-hours", "hours",
                 [](const StaffMember& m) { return bindsIf(m.minTotalMinutes, m.minTotalMinutes > 0); }, hours);
        perStaff("max-consecutive-shifts", "max-consecutive-days", "days", [horizon](const StaffMember& m) {
            return bindsIf(m.maxConsecutiveShifts, m.maxConsecutiveShifts < horizon);
        });
        perStaff("min-consecutive-shifts", "min-consecutive-days", "days", [](const StaffMember& m) {
            return bindsIf(m.minConsecutiveShifts, m.minConsecutiveShifts > 1);
        });
        perStaff("min-consecutive-days-off", "min-consecutive-off", "days", [](const StaffMember& m) {
            return bindsIf(m.minConsecutiveDaysOff, m.minConsecutiveDaysOff > 1);
        });
        const int weekends = weekendBlocks(horizon);
        perStaff("max-weekends", "max-weekends", "count", [weekends](const StaffMember& m) {
            return bindsIf(m.maxWeekends, m.maxWeekends < weekends);
        });
    }

private:
    static std::optional<int> bindsIf(int value, bool binds) { return binds ? std::optional<int>(value) : std::nullopt; }

    /// Weekend blocks (Saturday and/or Sunday) in a period that starts on a Monday.
    static int weekendBlocks(int horizon) { return (horizon + 1) / 7; }

    static std::string number(int value) { return std::to_string(value); }

    void writeCannotFollow() {
        for (const ShiftType& shift : instance_.shifts)
            for (const std::string& next : shift.cannotFollow)
                out_ << "    - {id: " << scalar("cannot-follow-" + shift.id + "-" + next)
                     << ", kind: forbid-sequence, sequence: " << list({shift.id, next}) << ", severity: hard}\n";
    }

    void writeMaxShifts() {
        const int horizon = instance_.horizon;
        for (const ShiftType& shift : instance_.shifts) {
            const auto groups = groupByLimit(instance_, [&](const StaffMember& m) -> std::optional<int> {
                for (const ShiftLimit& limit : m.maxShifts)
                    if (limit.shift == shift.id && limit.maxCount < horizon) return limit.maxCount;
                return std::nullopt;
            });
            for (const auto& [limit, staff] : groups)
                out_ << "    - {id: " << scalar("max-shifts-" + shift.id + "-" + number(limit))
                     << ", kind: max-count, shift: " << scalar(shift.id) << ", count: " << limit
                     << ", severity: hard, staff: " << list(staff) << "}\n";
        }
    }

    template <typename LimitOf, typename Format = std::string (*)(int)>
    void perStaff(const std::string& idPrefix, const char* kind, const char* key, LimitOf limitOf,
                  Format format = number) {
        for (const auto& [limit, staff] : groupByLimit(instance_, limitOf))
            out_ << "    - {id: " << scalar(idPrefix + "-" + number(limit)) << ", kind: " << kind << ", " << key
                 << ": " << format(limit) << ", severity: hard, staff: " << list(staff) << "}\n";
    }

    std::ostream& out_;
    const Instance& instance_;
};

}  // namespace

Instance parseInstance(std::istream& in, const std::string& sourceName) {
    Diagnostics diag(sourceName);
    auto sections = readSections(in, diag);
    int lastLine = 0;
    for (const auto& [name, section] : sections)
        lastLine = std::max({lastLine, section.headerLine, section.rows.empty() ? 0 : section.rows.back().number});
    return InstanceBuilder(std::move(sections), std::move(diag), lastLine).build();
}

Instance parseInstanceFile(const std::string& path) {
    std::ifstream in(path);
    if (!in) throw std::runtime_error(path + ":0: cannot open the file");
    return parseInstance(in, path);
}

std::string toScenarioYaml(const Instance& instance, const std::string& name) {
    requireScenarioIds(instance);
    std::ostringstream out;
    out << "# Employee Shift Scheduling Benchmark instance in rotaweave's scenario format.\n"
        << "# Every benchmark constraint is a hard rule; requests and cover carry the benchmark's soft weights.\n"
        << "name: " << scalar(name) << "\n"
        << "period: {start: " << dateOf(0) << ", end: " << dateOf(instance.horizon - 1) << "}\n"
        << "weekend: [sat, sun]\n"
        << "skills: [any]\n"
        // The benchmark's days off are days a person cannot work, not paid leave: its hours
        // bounds count hours worked only.
        << "absence_credit: {day off: 0}\n";
    writeShifts(out, instance);
    writeStaff(out, instance);
    writeDemand(out, instance);
    RuleWriter(out, instance).writeAll();
    return out.str();
}

}  // namespace rotaweave::bench
