/// @brief A roster: one task (shift and role) per person and day.
#pragma once
#include <vector>

#include "model/types.hpp"

namespace rotaweave::model {

struct Roster {
  int staff = 0;
  int days = 0;
  std::vector<TaskIdx> cells;  ///< [staff * days + day]; kOff = off.

  Roster() = default;
  Roster(int staffCount, int dayCount)
      : staff(staffCount), days(dayCount), cells(static_cast<size_t>(staffCount) * static_cast<size_t>(dayCount), kOff) {}
  TaskIdx& at(StaffIdx s, DayIdx d) { return cells[static_cast<size_t>(s) * static_cast<size_t>(days) + static_cast<size_t>(d)]; }
  TaskIdx at(StaffIdx s, DayIdx d) const { return cells[static_cast<size_t>(s) * static_cast<size_t>(days) + static_cast<size_t>(d)]; }
  const TaskIdx* row(StaffIdx s) const { return cells.data() + static_cast<size_t>(s) * static_cast<size_t>(days); }
  friend bool operator==(const Roster&, const Roster&) = default;
};

}  // namespace rotaweave::model
