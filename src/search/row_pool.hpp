/// @brief The distinct rows seen for each person, to be combined into rosters later.
///
/// The Lagrangian rounds propose a row per person at every set of prices, and the rows that a
/// good roster needs usually appear among them, just not all in the same round. The pool keeps
/// them; search/pool_combination.hpp picks one per person.
#pragma once
#include <cstddef>
#include <string_view>
#include <unordered_set>
#include <vector>

#include "model/roster.hpp"

namespace rotaweave::search {

class RowPool {
 public:
  /// A pool for `people` rows of `days` cells; it stops taking rows once it holds `maxCells`.
  RowPool(int people, int days, size_t maxCells) : days_(days), maxCells_(maxCells), rows_(static_cast<size_t>(people)),
                                                   seen_(static_cast<size_t>(people)) {}
  // The seen-sets view the stored rows' buffers: a copy would point into the original.
  RowPool(const RowPool&) = delete;
  RowPool& operator=(const RowPool&) = delete;
  RowPool(RowPool&&) = default;

  /// Adds every person's row of `roster` that the pool does not hold yet.
  void addRows(const model::Roster& roster) {
    for (StaffIdx s = 0; s < roster.staff; ++s) addRow(s, roster.row(s));
  }
  /// Adds person s's row (one task per day) unless the pool holds it or is full; true if added.
  bool addRow(StaffIdx s, const TaskIdx* row) {
    if (held_ + static_cast<size_t>(days_) > maxCells_) return false;
    auto& rows = rows_[static_cast<size_t>(s)];
    const std::string_view key(reinterpret_cast<const char*>(row), static_cast<size_t>(days_) * sizeof(TaskIdx));
    if (seen_[static_cast<size_t>(s)].count(key)) return false;
    rows.emplace_back(row, row + days_);
    // The key views the stored row, which never moves again: each row is its own vector.
    seen_[static_cast<size_t>(s)].insert(std::string_view(reinterpret_cast<const char*>(rows.back().data()), key.size()));
    held_ += static_cast<size_t>(days_);
    return true;
  }

  int people() const { return static_cast<int>(rows_.size()); }
  int days() const { return days_; }
  /// Person s's distinct rows, in the order first seen.
  const std::vector<std::vector<TaskIdx>>& rows(StaffIdx s) const { return rows_[static_cast<size_t>(s)]; }
  size_t size() const { return held_ / static_cast<size_t>(days_ > 0 ? days_ : 1); }

 private:
  int days_;
  size_t maxCells_, held_ = 0;
  std::vector<std::vector<std::vector<TaskIdx>>> rows_;
  std::vector<std::unordered_set<std::string_view>> seen_;
};

}  // namespace rotaweave::search
