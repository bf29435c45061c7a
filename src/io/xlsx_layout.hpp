/// @brief Where things sit on the Roster sheet, shared by the sheets whose formulas refer to it
/// (Cover) and by the Roster sheet itself. Internal to the xlsx_*.cpp files.
#pragma once
#include <xlsxwriter.h>

#include "model/problem.hpp"

namespace rotaweave::io::xlsx {

inline constexpr const char* kRosterSheet = "Roster";
inline constexpr lxw_row_t kTitleRow = 0, kWeekdayRow = 1, kDateRow = 2, kFirstPersonRow = 3;
inline constexpr lxw_col_t kNameCol = 0, kIdCol = 1, kFirstDayCol = 2;

inline lxw_row_t personRow(StaffIdx s) { return static_cast<lxw_row_t>(kFirstPersonRow + s); }
inline lxw_col_t dayCol(DayIdx d) { return static_cast<lxw_col_t>(kFirstDayCol + d); }

/// The totals block right of the dates, after one spacer column: Hours, Min h, Max h, one
/// count per shift, Shifts, Wkends, then Main skill (the role a cell without /skill fills).
struct RosterLayout {
  lxw_col_t totalsCol;  ///< Hours
  lxw_col_t shiftsCol;
  lxw_col_t weekendsCol;
  lxw_col_t skillCol;
  lxw_col_t minCol() const { return totalsCol + 1; }
  lxw_col_t maxCol() const { return totalsCol + 2; }
  lxw_col_t shiftCol(ShiftIdx s) const { return static_cast<lxw_col_t>(totalsCol + 3 + s); }
};

inline RosterLayout rosterLayout(const model::Problem& p) {
  RosterLayout l{};
  l.totalsCol = static_cast<lxw_col_t>(kFirstDayCol + p.days + 1);
  l.shiftsCol = static_cast<lxw_col_t>(l.totalsCol + 3 + static_cast<int>(p.shifts.size()));
  l.weekendsCol = l.shiftsCol + 1;
  l.skillCol = l.weekendsCol + 1;
  return l;
}

}  // namespace rotaweave::io::xlsx
