/// @brief The master problem on COIN-OR CLP (linear) and CBC (integer).
#include "search/master_problem.hpp"

#include <CbcModel.hpp>
#include <CoinPackedVector.hpp>
#include <OsiClpSolverInterface.hpp>

#include <algorithm>
#include <cmath>

namespace rotaweave::search {

namespace {

/// Slopes closer than this (cost units) are the same slope.
constexpr double kSlopeTolerance = 1e-6;

}  // namespace

MasterProblem::MasterProblem(const rules::RuleSet& rules, double hardWeight)
    : p_(&rules.problem()), lp_(std::make_unique<OsiClpSolverInterface>()), people_(p_->staffCount()), tasks_(p_->taskCount()) {
  lp_->messageHandler()->setLogLevel(0);
  lp_->setHintParam(OsiDoReducePrint, true, OsiHintTry);
  const CoinPackedVector empty;
  for (StaffIdx s = 0; s < people_; ++s) lp_->addRow(empty, 1.0, 1.0);  // one row per person
  const size_t cells = static_cast<size_t>(p_->days) * static_cast<size_t>(tasks_);
  firstSlope_.assign(cells, 0.0);
  kinkRows_.resize(cells);
  price_.assign(cells, 0.0);
  const rules::CoverRule& cover = rules.cover();
  for (DayIdx d = 0; d < p_->days; ++d)
    for (TaskIdx t = 1; t < tasks_; ++t) {
      if (!p_->demandAt(d, t).defined || people_ == 0) continue;
      const size_t cell = static_cast<size_t>(d) * static_cast<size_t>(tasks_) + static_cast<size_t>(t);
      auto cost = [&](int y) { return cover.cellTally(d, t, y).weighed(hardWeight); };
      offset_ += cost(0);
      double slope = cost(1) - cost(0);
      firstSlope_[cell] = slope;
      for (int y = 1; y < people_; ++y) {
        const double next = cost(y + 1) - cost(y);
        if (next < slope - kSlopeTolerance) usable_ = false;  // not convex
        if (next > slope + kSlopeTolerance) {
          // A kink at count y: v >= count - y, costing the rise, as the row v - count >= -y.
          lp_->addRow(empty, -static_cast<double>(y), lp_->getInfinity());
          const int row = lp_->getNumRows() - 1;
          kinkRows_[cell].push_back(row);
          CoinPackedVector v;
          v.insert(row, 1.0);
          lp_->addCol(v, 0.0, lp_->getInfinity(), next - slope);
          kinks_.push_back(Kink{cell, y, lp_->getNumCols() - 1});
        }
        slope = next;
      }
    }
  firstRowColumn_ = lp_->getNumCols();
}

MasterProblem::~MasterProblem() = default;

int MasterProblem::addColumn(StaffIdx s, const TaskIdx* row, double rowCost) {
  // Held until the next solve and added in one call: CLP copies its matrix on every addCol.
  pendingIndex_.push_back(s);
  pendingValue_.push_back(1.0);
  double cost = rowCost;
  for (DayIdx d = 0; d < p_->days; ++d) {
    if (row[d] == kOff) continue;
    const size_t cell = static_cast<size_t>(d) * static_cast<size_t>(tasks_) + static_cast<size_t>(row[d]);
    cost += firstSlope_[cell];
    for (const int kink : kinkRows_[cell]) pendingIndex_.push_back(kink), pendingValue_.push_back(-1.0);
  }
  pendingStart_.push_back(static_cast<CoinBigIndex>(pendingIndex_.size()));
  pendingCost_.push_back(cost);
  columnStaff_.push_back(s);
  columnRow_.emplace_back(row, row + p_->days);
  return firstRowColumn_ + columns() - 1;
}

void MasterProblem::flush() {
  const int n = static_cast<int>(pendingCost_.size());
  if (n == 0) return;
  const std::vector<double> lower(static_cast<size_t>(n), 0.0), upper(static_cast<size_t>(n), lp_->getInfinity());
  lp_->addCols(n, pendingStart_.data(), pendingIndex_.data(), pendingValue_.data(), lower.data(), upper.data(), pendingCost_.data());
  pendingStart_.assign(1, 0);
  pendingIndex_.clear();
  pendingValue_.clear();
  pendingCost_.clear();
}

bool MasterProblem::solveLinear() {
  flush();
  if (solved_) lp_->resolve();  // from the last basis: the new columns start at zero
  else lp_->initialSolve();
  solved_ = true;
  if (!lp_->isProvenOptimal()) return false;
  const double* dual = lp_->getRowPrice();
  for (size_t cell = 0; cell < price_.size(); ++cell) {
    double price = firstSlope_[cell];
    for (const int kink : kinkRows_[cell]) price += dual[kink];
    price_[cell] = price;
  }
  return true;
}

double MasterProblem::linearValue() const { return lp_->getObjValue() + offset_; }

double MasterProblem::personDual(StaffIdx s) const { return lp_->getRowPrice()[s]; }

double MasterProblem::reducedCost(StaffIdx s, const TaskIdx* row, double rowCost) const {
  double reduced = rowCost - personDual(s);
  for (DayIdx d = 0; d < p_->days; ++d)
    if (row[d] != kOff) reduced += price_[static_cast<size_t>(d) * static_cast<size_t>(tasks_) + static_cast<size_t>(row[d])];
  return reduced;
}

const double* MasterProblem::rowValues() const { return lp_->getColSolution(); }

void MasterProblem::fix(int column) {
  lp_->setColLower(column, 1.0);  // the person's row of the master holds their other rows at 0
  fixed_.push_back(column);
}

void MasterProblem::unfixAll() {
  for (const int column : fixed_) lp_->setColLower(column, 0.0);
  fixed_.clear();
}

model::Roster MasterProblem::rosterOf(const std::vector<int>& columns) const {
  model::Roster roster(people_, p_->days);
  for (const int column : columns) {
    const StaffIdx s = columnStaff(column);
    const auto& row = columnRow_[static_cast<size_t>(column - firstRowColumn_)];
    for (DayIdx d = 0; d < p_->days; ++d) roster.at(s, d) = row[static_cast<size_t>(d)];
  }
  return roster;
}

std::optional<model::Roster> MasterProblem::solveInteger(double seconds, int nodes, const std::vector<int>& incumbent) {
  flush();
  OsiClpSolverInterface solver(*lp_);
  for (int c = firstRowColumn_; c < solver.getNumCols(); ++c) solver.setInteger(c);
  CbcModel model(solver);
  model.setLogLevel(0);
  model.messageHandler()->setLogLevel(0);
  model.solver()->messageHandler()->setLogLevel(0);
  model.setMaximumSeconds(std::max(seconds, 0.01));
  model.setMaximumNodes(nodes);
  // The incumbent as the first solution: its rows, and each kink at what its count needs.
  std::vector<double> start(static_cast<size_t>(solver.getNumCols()), 0.0);
  std::vector<int> count(firstSlope_.size(), 0);
  for (const int column : incumbent) {
    start[static_cast<size_t>(column)] = 1.0;
    const auto& row = columnRow_[static_cast<size_t>(column - firstRowColumn_)];
    for (DayIdx d = 0; d < p_->days; ++d)
      if (row[static_cast<size_t>(d)] != kOff) ++count[static_cast<size_t>(d) * static_cast<size_t>(tasks_) + static_cast<size_t>(row[static_cast<size_t>(d)])];
  }
  for (const Kink& k : kinks_) start[static_cast<size_t>(k.column)] = std::max(0, count[k.cell] - k.at);
  double value = 0;
  const double* cost = solver.getObjCoefficients();
  for (size_t c = 0; c < start.size(); ++c) value += cost[c] * start[c];
  model.initialSolve();
  model.setBestSolution(start.data(), static_cast<int>(start.size()), value, true);
  model.branchAndBound();
  const double* x = model.bestSolution();
  if (!x) return std::nullopt;
  model::Roster roster(people_, p_->days);
  std::vector<bool> placed(static_cast<size_t>(people_), false);
  for (size_t j = 0; j < columnStaff_.size(); ++j) {
    if (x[static_cast<size_t>(firstRowColumn_) + j] < 0.5) continue;
    const StaffIdx s = columnStaff_[j];
    for (DayIdx d = 0; d < p_->days; ++d) roster.at(s, d) = columnRow_[j][static_cast<size_t>(d)];
    placed[static_cast<size_t>(s)] = true;
  }
  for (const bool done : placed)
    if (!done) return std::nullopt;
  return roster;
}

}  // namespace rotaweave::search
