/// @brief Reader for the Employee Shift Scheduling Benchmark text format and its conversion to a rotaweave scenario.
#pragma once

#include <iosfwd>
#include <string>
#include <vector>

namespace rotaweave::bench {

/// One shift type of SECTION_SHIFTS.
struct ShiftType {
    std::string id;
    int lengthMinutes = 0;
    std::vector<std::string> cannotFollow;  ///< shift ids that must not be worked the day after this one
};

/// One "ID=limit" entry of a staff member's MaxShifts field.
struct ShiftLimit {
    std::string shift;
    int maxCount = 0;
};

/// One employee of SECTION_STAFF, with the days of SECTION_DAYS_OFF.
struct StaffMember {
    std::string id;
    std::vector<ShiftLimit> maxShifts;  ///< in file order; a shift type not listed has no limit
    int maxTotalMinutes = 0;
    int minTotalMinutes = 0;
    int maxConsecutiveShifts = 0;
    int minConsecutiveShifts = 0;
    int minConsecutiveDaysOff = 0;
    int maxWeekends = 0;
    std::vector<int> daysOff;  ///< day indexes (0 = first day), sorted, without duplicates
};

/// One row of SECTION_SHIFT_ON_REQUESTS or SECTION_SHIFT_OFF_REQUESTS.
struct ShiftRequest {
    std::string staff;
    int day = 0;
    std::string shift;
    int weight = 0;
};

/// One row of SECTION_COVER.
struct CoverRow {
    int day = 0;
    std::string shift;
    int requirement = 0;
    int underWeight = 0;
    int overWeight = 0;
};

/// A whole benchmark instance, in file order. Every id it refers to is defined and every day
/// lies in [0, horizon).
struct Instance {
    int horizon = 0;
    std::vector<ShiftType> shifts;
    std::vector<StaffMember> staff;
    std::vector<ShiftRequest> onRequests;
    std::vector<ShiftRequest> offRequests;
    std::vector<CoverRow> cover;  ///< at most one row per (day, shift)
};

/// Parses the instance text format: SECTION_* headers (each at most once, any order),
/// comma-separated rows, '#' comment lines and blank lines. SECTION_HORIZON, SECTION_SHIFTS and
/// SECTION_STAFF are required; the other sections may be missing or empty.
/// @param sourceName the name used in error messages.
/// @throws std::runtime_error "SOURCE:LINE: what is wrong" on any malformed or inconsistent line.
Instance parseInstance(std::istream& in, const std::string& sourceName);

/// Opens and parses a file; see parseInstance. @throws std::runtime_error also when it cannot be read.
Instance parseInstanceFile(const std::string& path);

/// First date of every converted scenario (a Monday, as the benchmark requires).
inline constexpr const char* kScenarioStartDate = "2027-03-01";

/// Renders the instance as a rotaweave scenario (YAML) with the benchmark's model exactly:
/// period of `horizon` days from kScenarioStartDate, weekend sat+sun, one skill `any`, shifts
/// starting 08:00 with paid minutes equal to the length, days off as absences, shift-on and
/// shift-off requests as soft requests, cover rows as soft demand (min 0, target = max =
/// requirement, under/over weights), and every other benchmark constraint as a hard rule
/// (forbid-sequence, max-count, max-hours, min-hours, max-consecutive-days,
/// min-consecutive-days, min-consecutive-off, max-weekends), narrowed to the staff that share a
/// limit. Limits that cannot bind in the horizon are left out. Output is deterministic.
/// @throws std::runtime_error when the instance cannot be expressed: a shift of 24 hours or
/// more, or a shift or staff id that is not a scenario id (letters, digits, '-', '_', '.';
/// not `off`).
std::string toScenarioYaml(const Instance& instance, const std::string& name);

}  // namespace rotaweave::bench
