/// @brief A move: a short list of cells to set, which the evaluator scores incrementally.
#pragma once
#include <array>

#include "model/types.hpp"

namespace rotaweave::eval {

struct CellChange {
  StaffIdx staff;
  DayIdx day;
  TaskIdx task;
};

/// Fixed capacity, so building a move never allocates.
struct Move {
  static constexpr int kCapacity = 32;
  std::array<CellChange, kCapacity> cells;
  int size = 0;

  bool add(StaffIdx s, DayIdx d, TaskIdx t) {
    if (size == kCapacity) return false;
    cells[static_cast<size_t>(size++)] = CellChange{s, d, t};
    return true;
  }
  void clear() { size = 0; }
  const CellChange* begin() const { return cells.data(); }
  const CellChange* end() const { return cells.data() + size; }
};

}  // namespace rotaweave::eval
