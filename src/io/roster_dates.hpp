/// @brief Header dates of a roster as people and spreadsheet programs write them: ISO
/// (2027-03-01), day-first or month-first with '/', '.' or '-' (01/03/2027, 3.1.27), and
/// year-first with '/' (2027/03/01). The scenario's period decides between day-first and
/// month-first; a header that reads both ways inside the period is refused with the fix.
#pragma once
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "model/calendar.hpp"

namespace rotaweave::io {

/// The readings of one cell. ISO and year-first text: `dayFirst` is the date. D/M/Y text
/// (`numeric`): `dayFirst` and `monthFirst` are the two readings, each empty where it is no
/// real date (13/01/2027 has no month-first reading); they are equal where day and month are.
/// Two-digit years mean 20YY. Not a date: both empty.
struct DateReadings {
  std::optional<model::DateSerial> dayFirst;
  std::optional<model::DateSerial> monthFirst;
  bool numeric = false;
  bool any() const { return dayFirst || monthFirst; }
};
DateReadings readDateText(std::string_view text);

/// The dates of a header row, one per cell: `dates[i]` is the date cell i names, or empty where
/// the cell is not a date. One order (day-first or month-first) is chosen for the whole row: the
/// one under which every D/M/Y cell is a date inside [first, last]. When neither order fits, each
/// cell takes the reading that falls inside the period if one does (else its day-first reading),
/// so the caller's "expected date X in this column" names the right cell. When both fit and give
/// different dates, `ambiguousCell` is the first such cell and `error` says how to fix it.
struct HeaderDates {
  std::vector<std::optional<model::DateSerial>> dates;
  int ambiguousCell = -1;
  std::string error;
};
HeaderDates resolveHeaderDates(const std::vector<std::string>& cells, model::DateSerial first, model::DateSerial last);

}  // namespace rotaweave::io
