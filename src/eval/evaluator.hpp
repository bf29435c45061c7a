/// @brief Full and incremental evaluation of rosters against a RuleSet.
///
/// Full evaluation scores a whole roster. Incremental evaluation keeps a loaded roster with
/// each row's per-day arrays and totals, per-person row tallies, per (day, task) cover counts
/// and fair-share counts. tryMove() re-scores only the cover cells a move touches and, in each
/// touched row, only the terms of each rule that the changed days can reach (RowRule::reach),
/// so a move costs about the same on a 28-day and a 364-day horizon.
/// Thread safety: an Evaluator holds mutable scratch; give each thread (island) its own copy.
/// The Problem and RuleSet it refers to are shared read-only.
#pragma once
#include <array>
#include <vector>

#include "eval/move.hpp"
#include "model/roster.hpp"
#include "rules/row_buffer.hpp"
#include "rules/rule_set.hpp"

namespace rotaweave::eval {

using rules::Tally;

class Evaluator {
 public:
  explicit Evaluator(const rules::RuleSet& rules);

  /// Penalty of a whole roster. Does not touch the loaded state. No allocation after warm-up.
  Tally score(const model::Roster& roster);
  /// Every breach of a roster, rows first (by person), then cover (by day), then fair share.
  std::vector<rules::Breach> explain(const model::Roster& roster);

  // Incremental interface.
  void load(const model::Roster& roster);
  const model::Roster& roster() const { return roster_; }
  Tally total() const { return total_; }
  /// Total after the move, leaving the loaded roster unchanged. Cells must be distinct.
  Tally tryMove(const Move& move);
  /// True if the total after the move, weighed as hard * hardWeight + soft, is at most `limit`;
  /// then commit() may apply it. Gives up (false) as soon as the rules scored so far prove the
  /// move costs more, so rejected moves are cheap; accepts and rejects exactly as tryMove would.
  bool tryMoveWithin(const Move& move, double hardWeight, double limit);
  /// Applies the move last passed to tryMove(), or to a tryMoveWithin() that returned true.
  void commit();
  /// People on task t on day d in the loaded roster.
  int coverCount(DayIdx d, TaskIdx t) const { return coverCount_[static_cast<size_t>(d * tasks_ + t)]; }

  /// Penalty of the cell-local rules (requests, skills, absences, changes) if s takes t on day d.
  const Tally& cellCost(StaffIdx s, DayIdx d, TaskIdx t) const { return rules_->cellCost(s, d, t); }

  /// Penalty of person s's row rules if the row held `tasks` (one per period day): no cover or
  /// fair share, so rows can be priced one at a time. Does not touch the loaded state.
  Tally rowScore(StaffIdx s, const TaskIdx* tasks) { return rowTally(buffer_.fill(s, tasks)); }

  const rules::RuleSet& rules() const { return *rules_; }

  /// Penalty of person s's row rules in the loaded roster (cell-local rules included).
  const Tally& loadedRowTally(StaffIdx s) const { return rowTally_[static_cast<size_t>(s)]; }
  /// The breaches of person s's row rules in the loaded roster.
  std::vector<rules::Breach> explainLoadedRow(StaffIdx s) const;

 private:
  /// Penalty of a row: sequence rules scored on the row, cell-local rules read from the table.
  Tally rowTally(const rules::RowView& row) const { return cellSum(row.staff, row.tasks) + sequenceTally(row); }
  Tally sequenceTally(const rules::RowView& row) const;
  Tally cellSum(StaffIdx s, const TaskIdx* tasks) const;
  Tally fairTally(size_t rule, const int* counts, long sum) const;
  void countCover(const model::Roster& roster, std::vector<int>& counts) const;

  /// A cap on the weighed total after a move, for tryMoveWithin; none in tryMove.
  struct Limit { double hardWeight, value; };
  /// Scores the move into the pending state; false if `limit` is set and proved exceeded.
  bool evaluateMove(const Move& move, const Limit* limit);

  // The loaded rows, in RowBuffer's layout: staff * (maxHistory + days) per array.
  rules::RowView loadedView(StaffIdx s) const;
  void fillLoadedRow(StaffIdx s);
  /// One day of a row as it was before a patch, to restore it.
  struct SavedDay { DayIdx day; TaskIdx task; };
  /// Writes a changed day into the loaded row (arrays, totals, roster cell).
  void setLoadedDay(StaffIdx s, DayIdx d, TaskIdx t);

  const rules::RuleSet* rules_;
  const model::Problem* p_;
  int days_, tasks_, history_, span_;
  rules::ShiftTables tables_;
  rules::RowBuffer buffer_;  ///< for whole rows that are not loaded
  std::vector<int> coverScratch_;
  std::vector<std::uint32_t> keyStamp_;  ///< per (day, task): the tryMove call that last touched it
  std::uint32_t stamp_ = 0;
  std::vector<int> fairScratch_;

  // Loaded state.
  model::Roster roster_;
  std::vector<ShiftIdx> rowShift_;
  std::vector<int> rowStart_, rowEnd_, rowPaid_;
  std::vector<int> rowShiftCount_;         ///< staff * shifts
  std::vector<std::uint16_t> blockWorked_;  ///< staff * weekends: worked days in each weekend
  std::vector<rules::RowTotals> rowTotals_;
  std::vector<Tally> rowTally_;
  std::vector<Tally> rowCells_;  ///< the cell-local part of rowTally_
  std::vector<Tally> ruleTally_;  ///< staff * maxSequenceRules: each sequence rule's total
  std::vector<int> coverCount_;                 ///< [day * tasks + task]
  std::vector<std::vector<int>> fairCount_;     ///< per fair-share rule, per member
  std::vector<long> fairSum_;
  std::vector<Tally> fairTally_;
  Tally coverTotal_, total_;

  // Pending move (from tryMove).
  Move pending_;
  struct PendingRow {
    StaffIdx staff;
    Tally tally, cells;
    int changes;  ///< its cells are rowChanges_[row * kCapacity, + changes), by day
    int asked;    ///< rules asked about them
  };
  std::array<PendingRow, Move::kCapacity> pendingRows_{};
  std::array<CellChange, Move::kCapacity * Move::kCapacity> rowChanges_{};
  std::array<SavedDay, Move::kCapacity> saved_{};
  /// Collects into `asked` the sequence rules of person s that can see the row's changes, in order.
  int rulesToAsk(StaffIdx s, const CellChange* changes, int count, std::uint32_t* asked);
  /// Scores pending row i's changes into `change` (its sequence rules' new total minus the
  /// old), raising `least` as it goes; false once `least` proves the move over `limit`.
  bool scoreRowChange(int i, const Limit* limit, Tally& least, Tally& change);
  static bool overLimit(const Limit* limit, const Tally& least);
  std::vector<std::uint32_t> asked_;      ///< per pending row, the rules asked (rulesPerRow each)
  std::vector<Tally> newRuleTally_;       ///< per pending row, those rules' new totals
  std::vector<std::uint32_t> askedStamp_;
  std::uint32_t askStamp_ = 0;
  std::vector<rules::AnchorSpan> spans_;  ///< per rule asked, the anchors to re-score
  std::vector<int> spanCount_;
  int pendingRowCount_ = 0;
  struct PendingFair { int member; int count; };
  std::vector<std::array<PendingFair, Move::kCapacity>> pendingFair_;
  std::vector<int> pendingFairCount_;
  std::vector<Tally> pendingFairTally_;
  std::vector<long> pendingFairSum_;
  Tally pendingCover_;
  Tally pendingTotal_;
  bool pendingReady_ = false;  ///< the pending move was scored in full and may be committed
};

}  // namespace rotaweave::eval
