/// @brief The tasks each (person, day) cell may take, so every genome respects absences,
/// fixed cells, skills and hard limits of no shifts of a type by construction. Immutable;
/// shared by all islands.
#pragma once
#include <vector>

#include "model/problem.hpp"

namespace rotaweave::search {

class Eligibility {
 public:
  explicit Eligibility(const model::Problem& problem);

  /// Options of a cell, off included where allowed; size() >= 1.
  const TaskIdx* begin(StaffIdx s, DayIdx d) const { return options_.data() + start_[index(s, d)]; }
  const TaskIdx* end(StaffIdx s, DayIdx d) const { return options_.data() + start_[index(s, d) + 1]; }
  int count(StaffIdx s, DayIdx d) const { return start_[index(s, d) + 1] - start_[index(s, d)]; }
  bool allows(StaffIdx s, DayIdx d, TaskIdx t) const { return allowed_[index(s, d) * tasks_ + static_cast<size_t>(t)] != 0; }
  /// Cells with more than one option (the ones search may change), as s * days + d.
  const std::vector<int>& freeCells() const { return free_; }
  /// The free cells of day d, as staff indices.
  const std::vector<StaffIdx>& freeOnDay(DayIdx d) const { return freeByDay_[static_cast<size_t>(d)]; }
  /// The only option of a cell that is not free (fixed, or off for an absence).
  TaskIdx forced(StaffIdx s, DayIdx d) const { return *begin(s, d); }
  /// Whether every cell offers every role its person holds that no hard rule rules out. Cells
  /// skip roles nobody needs that day (no demand, no request), and then rosters that use
  /// them, worth having only for a person's hours, are never built.
  bool complete() const { return complete_; }

 private:
  size_t index(StaffIdx s, DayIdx d) const { return static_cast<size_t>(s) * static_cast<size_t>(days_) + static_cast<size_t>(d); }
  int days_;
  size_t tasks_;
  std::vector<int> start_;
  std::vector<TaskIdx> options_;
  std::vector<std::uint8_t> allowed_;
  std::vector<int> free_;
  std::vector<std::vector<StaffIdx>> freeByDay_;
  bool complete_ = true;
};

}  // namespace rotaweave::search
