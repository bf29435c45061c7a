/// @brief The master problem of column generation: one row per person from a set of
/// candidate rows, with cover costed exactly, solved as a linear programme (COIN-OR CLP) for
/// prices and as an integer programme (COIN-OR CBC) for a roster.
///
/// A cover cell's cost is a convex piecewise-linear function of its count (CoverRule): a
/// first slope, charged on every person, then a kink at each bound where the slope rises,
/// modelled by a variable v >= count - bound costing the rise. With a column per candidate
/// row, the linear relaxation gives each person's and each kink's dual, and from them the
/// price of each (day, task) cell at which a person's best new row is found (RowRefit).
#pragma once
#include <chrono>
#include <memory>
#include <optional>
#include <vector>

#include <CoinTypes.hpp>

#include "model/roster.hpp"
#include "rules/rule_set.hpp"

class OsiClpSolverInterface;

namespace rotaweave::search {

class MasterProblem {
 public:
  /// Hard penalty is weighed as `hardWeight` soft points, as in local search.
  MasterProblem(const rules::RuleSet& rules, double hardWeight);
  ~MasterProblem();
  MasterProblem(const MasterProblem&) = delete;
  MasterProblem& operator=(const MasterProblem&) = delete;

  /// False where some cover cell's cost is not convex in its count: the model cannot hold it.
  bool usable() const { return usable_; }

  /// Adds person s's row (one task per period day) whose row rules cost `rowCost` (weighed);
  /// returns its column's index. The column joins the programme at the next solve.
  int addColumn(StaffIdx s, const TaskIdx* row, double rowCost);
  int columns() const { return static_cast<int>(columnStaff_.size()); }

  /// Solves the linear relaxation from the last basis; false if it is not proven optimal.
  bool solveLinear();
  /// The relaxation's value, weighed cost units (cover's cost at zero people included).
  double linearValue() const;
  /// What taking task t on day d adds to a row's reduced cost: [day * tasks + task]; 0 for off.
  const std::vector<double>& cellPrices() const { return price_; }
  /// A person's dual: a new row of theirs helps when its cost plus its cells' prices is below it.
  double personDual(StaffIdx s) const;
  /// A new row's reduced cost: its row rules' cost plus its cells' prices, less the person's
  /// dual; negative where it would lower the relaxation.
  double reducedCost(StaffIdx s, const TaskIdx* row, double rowCost) const;

  /// Diving: the relaxation's value of each row column, fixing one at 1, undoing every fix.
  const double* rowValues() const;
  StaffIdx columnStaff(int column) const { return columnStaff_[static_cast<size_t>(column - firstRowColumn_)]; }
  int firstRowColumn() const { return firstRowColumn_; }
  void fix(int column);
  void unfixAll();
  /// The roster of one fixed column per person (their rows).
  model::Roster rosterOf(const std::vector<int>& columns) const;
  /// The cheapest roster made of the columns, by CBC within `seconds` and `nodes` search nodes
  /// (the best it has then), starting from the roster of the columns `incumbent` (one per person).
  std::optional<model::Roster> solveInteger(double seconds, int nodes, const std::vector<int>& incumbent);

 private:
  const model::Problem* p_;
  bool usable_ = true;
  std::unique_ptr<OsiClpSolverInterface> lp_;
  int people_ = 0, tasks_ = 0;
  double offset_ = 0;                       ///< sum of the cover cells' cost at count 0
  std::vector<double> firstSlope_;          ///< per (day, task): cost of its first person
  std::vector<std::vector<int>> kinkRows_;  ///< per (day, task): the LP rows of its kinks
  struct Kink { size_t cell; int at; int column; };
  std::vector<Kink> kinks_;                 ///< per kink row, in order after the person rows
  std::vector<double> price_;               ///< per (day, task), after solveLinear
  std::vector<StaffIdx> columnStaff_;       ///< per LP column of a row (after the kink variables)
  std::vector<std::vector<TaskIdx>> columnRow_;
  int firstRowColumn_ = 0;
  bool solved_ = false;
  // Columns added since the last solve, in CLP's column-major layout.
  std::vector<CoinBigIndex> pendingStart_{0};
  std::vector<int> pendingIndex_;
  std::vector<double> pendingValue_, pendingCost_;
  void flush();
  std::vector<int> fixed_;
};

}  // namespace rotaweave::search
