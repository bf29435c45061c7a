/// @brief The cells of one person's row that a re-fit changes, and how to apply them.
///
/// A re-fitted row may change more cells than one evaluator move holds; it is applied as a
/// few moves in day order (the rows in between are never judged on their own).
#pragma once
#include <vector>

#include "eval/evaluator.hpp"

namespace rotaweave::search {

struct RowChange {
  std::vector<eval::CellChange> cells;  ///< in day order, one person's
  void clear() { cells.clear(); }
  bool empty() const { return cells.empty(); }
};

/// Applies the change to the roster loaded in `ev`, up to Move::kCapacity cells a move.
inline void applyRowChange(eval::Evaluator& ev, const RowChange& change) {
  eval::Move move;
  for (size_t i = 0; i < change.cells.size(); i += eval::Move::kCapacity) {
    move.clear();
    for (size_t j = i; j < change.cells.size() && j < i + eval::Move::kCapacity; ++j) {
      const eval::CellChange& c = change.cells[j];
      move.add(c.staff, c.day, c.task);
    }
    ev.tryMove(move);
    ev.commit();
  }
}

/// Writes the change into a roster.
inline void writeRowChange(model::Roster& roster, const RowChange& change) {
  for (const eval::CellChange& c : change.cells) roster.at(c.staff, c.day) = c.task;
}

}  // namespace rotaweave::search
