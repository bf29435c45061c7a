/// @brief Column generation rounds: solve the relaxation, price every person's row, add the
/// rows that help; then a dive through the relaxation, pricing again after each fix.
#include "search/column_generation.hpp"

#include <algorithm>
#include <atomic>
#include <cmath>

#ifdef _OPENMP
#include <omp.h>
#endif

#include "search/master_problem.hpp"
#include "search/stop_signal.hpp"

namespace rotaweave::search {

namespace {

using Clock = std::chrono::steady_clock;

/// A row helps when its reduced cost is below minus this (weighed cost units; a point is
/// kCostScale): well above rounding, well below any penalty step.
constexpr double kImprovement = 1e-3 * kCostScale;
/// A row the relaxation takes this much of is whole: the dive fixes it at once.
constexpr double kWhole = 0.9;
/// Pricing rounds after each fix of the dive: enough to mend the prices the fix moved.
constexpr int kRoundsPerFix = 6;
/// A dive fixes at least one open person in this many at each step.
constexpr int kDiveSteps = 16;
/// Search nodes CBC may visit after the dive: a bound on its work besides its time.
constexpr int kIntegerNodes = 2000;
/// Pricing rounds times people before the dive (at least kMinRounds rounds).
constexpr int kPersonRounds = 5000;
constexpr int kMinRounds = 4;
constexpr int kMaxRounds = 500;
/// CBC runs only on masters of at most this many columns: on larger ones its root alone
/// (cuts, heuristics) takes minutes and, measured, found nothing better than the dive.
constexpr int kIntegerColumns = 20000;

/// Prices rows against the master's relaxation and adds those that help.
class Pricer {
 public:
  Pricer(eval::Evaluator& ev, std::vector<RowRefit>& refits, MasterProblem& master, RowPool& seen, const model::Roster& base,
         double hardWeight)
      : ev_(ev), refits_(refits), master_(master), seen_(seen), base_(base), hardWeight_(hardWeight),
        p_(ev.rules().problem()), cost_(static_cast<size_t>(p_.staffCount())), found_(cost_.size()), exact_(cost_.size()),
        changes_(cost_.size()), row_(static_cast<size_t>(p_.days)) {}

  struct Round {
    bool complete = false;  ///< every open person was priced before the deadline
    bool exact = false;     ///< and exactly, so `bound` holds
    double bound = 0;       ///< the relaxation's value plus each person's most negative reduced cost
    int added = 0;
  };

  /// One round over the people not in `done` (per person; may be empty: everyone).
  Round run(const std::vector<std::uint8_t>& done, Clock::time_point deadline) {
    Round round;
    const int people = p_.staffCount();
    std::atomic<bool> late{false};
    for (RowRefit& refit : refits_) refit.setDeadline(deadline);
#pragma omp parallel for num_threads(static_cast<int>(refits_.size())) schedule(dynamic, 1)
    for (StaffIdx s = 0; s < people; ++s) {
      const auto i = static_cast<size_t>(s);
      if (!done.empty() && done[i]) continue;
#ifdef _OPENMP
      RowRefit& refit = refits_[static_cast<size_t>(omp_get_thread_num())];
#else
      RowRefit& refit = refits_.front();
#endif
      cost_[i] = 0;
      found_[i] = refit.refitAtPrices(base_, s, 0, p_.days, master_.cellPrices().data(), hardWeight_, changes_[i], cost_[i]);
      exact_[i] = refit.lastWasExact();
      if (!refit.lastWasExact() && Clock::now() >= deadline) late = true;
    }
    // A round cut short proves nothing, but every row it found is a whole row: those that
    // help still join (a large scenario on a busy machine may never finish a round).
    round.complete = round.exact = !late;
    round.bound = master_.linearValue();
    for (StaffIdx s = 0; s < people; ++s) {
      const auto i = static_cast<size_t>(s);
      if (!done.empty() && done[i]) continue;
      round.exact = round.exact && exact_[i];
      if (!found_[i]) continue;  // no row keeps the modelled hard rules, or not priced in time
      round.bound += std::min(0.0, cost_[i] - master_.personDual(s));
      std::copy(base_.row(s), base_.row(s) + p_.days, row_.begin());
      for (const auto& c : changes_[i].cells) row_[static_cast<size_t>(c.day)] = c.task;
      // The true reduced cost: the row rules the re-fit does not model count too.
      const double cost = ev_.rowScore(s, row_.data()).weighed(hardWeight_);
      if (master_.reducedCost(s, row_.data(), cost) < -kImprovement && seen_.addRow(s, row_.data())) {
        master_.addColumn(s, row_.data(), cost);
        ++round.added;
      }
    }
    return round;
  }

 private:
  eval::Evaluator& ev_;
  std::vector<RowRefit>& refits_;
  MasterProblem& master_;
  RowPool& seen_;
  const model::Roster& base_;  ///< priced rows are whole, so only its history matters
  double hardWeight_;
  const model::Problem& p_;
  std::vector<double> cost_;
  std::vector<std::uint8_t> found_, exact_;
  std::vector<RowChange> changes_;
  std::vector<TaskIdx> row_;
};

}  // namespace

ColumnGenerationResult generateColumns(eval::Evaluator& ev, std::vector<RowRefit>& refits, const RowPool& pool,
                                       const model::Roster& incumbent, double hardWeight, const ColumnGenerationLimits& limits) {
  ColumnGenerationResult result;
  const model::Problem& p = ev.rules().problem();
  const int people = p.staffCount();
  MasterProblem master(ev.rules(), hardWeight);
  if (!master.usable() || people == 0) return result;

  // The first columns: the incumbent's rows and every pooled row.
  RowPool seen(people, p.days, static_cast<size_t>(-1));
  std::vector<int> incumbentColumns;
  for (StaffIdx s = 0; s < people; ++s) {
    seen.addRow(s, incumbent.row(s));
    incumbentColumns.push_back(master.addColumn(s, incumbent.row(s), ev.rowScore(s, incumbent.row(s)).weighed(hardWeight)));
  }
  for (StaffIdx s = 0; s < people; ++s)
    for (const auto& row : pool.rows(s))
      if (seen.addRow(s, row.data())) master.addColumn(s, row.data(), ev.rowScore(s, row.data()).weighed(hardWeight));
  Pricer pricer(ev, refits, master, seen, incumbent, hardWeight);

  // 1 - Rounds until no row helps or the pricing share is spent.
  const std::vector<std::uint8_t> everyone;
  // Rounds are bounded by work too (person-rounds), for runs bounded by generations.
  const int maxRounds = std::min(kMaxRounds, std::max(kMinRounds, kPersonRounds / std::max(people, 1)));
  while (result.rounds < maxRounds && Clock::now() < limits.pricingDeadline && !stopRequested()) {
    if (!master.solveLinear()) return result;
    ++result.rounds;
    const Pricer::Round round = pricer.run(everyone, limits.pricingDeadline);
    if (!round.complete) break;
    if (round.exact) result.bound = std::max(result.bound.value_or(-INFINITY), round.bound);
    if (round.added == 0) break;  // converged: no row lowers the relaxation
  }
  if (result.rounds == 0 || stopRequested()) return result;

  // 2 - A dive: fix the rows the relaxation takes most of (each whole one, else the largest),
  // price the people still open against the new relaxation, repeat.
  const auto diveEnd = Clock::now() + std::chrono::duration_cast<Clock::duration>(std::chrono::duration<double>(limits.integerSeconds));
  std::vector<std::uint8_t> done(static_cast<size_t>(people), 0);
  std::vector<int> chosen, candidates;
  while (static_cast<int>(chosen.size()) < people && Clock::now() < diveEnd && !stopRequested()) {
    if (!master.solveLinear()) break;
    bool solved = true;  // the values read below are of every column, new ones included
    for (int round = 0; round < kRoundsPerFix && solved; ++round) {
      if (pricer.run(done, diveEnd).added == 0) break;
      solved = master.solveLinear();
    }
    if (!solved) break;
    // Each whole row, then the largest others: a sixteenth of the people still open at a
    // time, so a dive takes a bounded number of steps however many people there are.
    const double* x = master.rowValues();
    candidates.clear();
    for (int c = master.firstRowColumn(); c < master.firstRowColumn() + master.columns(); ++c) {
      const auto s = static_cast<size_t>(master.columnStaff(c));
      if (done[s]) continue;
      if (x[c] > kWhole) done[s] = 1, chosen.push_back(c), master.fix(c);
      else if (x[c] > 0) candidates.push_back(c);
    }
    std::stable_sort(candidates.begin(), candidates.end(), [&](int a, int b) { return x[a] > x[b]; });
    const int open = people - static_cast<int>(chosen.size());
    int take = std::max(1, std::min(open, people / kDiveSteps));
    for (const int c : candidates) {
      const auto s = static_cast<size_t>(master.columnStaff(c));
      if (take == 0) break;
      if (done[s]) continue;
      done[s] = 1, chosen.push_back(c), master.fix(c), --take;
    }
  }
  // Out of time before everyone was fixed: each open person takes the row the last
  // relaxation took most of (their incumbent row where it took none), so the dive's work
  // still yields a whole roster for the islands to improve.
  if (static_cast<int>(chosen.size()) < people && !stopRequested()) {
    std::vector<int> best(incumbentColumns);
    std::vector<double> most(static_cast<size_t>(people), 0.0);
    if (master.solveLinear()) {
      const double* x = master.rowValues();
      for (int c = master.firstRowColumn(); c < master.firstRowColumn() + master.columns(); ++c) {
        const auto s = static_cast<size_t>(master.columnStaff(c));
        if (!done[s] && x[c] > most[s]) most[s] = x[c], best[s] = c;
      }
    }
    for (StaffIdx s = 0; s < people; ++s)
      if (!done[static_cast<size_t>(s)]) done[static_cast<size_t>(s)] = 1, chosen.push_back(best[static_cast<size_t>(s)]);
  }
  master.unfixAll();
  if (static_cast<int>(chosen.size()) < people) return result;
  result.roster = master.rosterOf(chosen);
  // 3 - What time is left goes to CBC, from the dive's roster: on small scenarios it may
  // find a better one among the rows gathered.
  const double left = std::chrono::duration<double>(diveEnd - Clock::now()).count();
  if (left > 0.1 && master.columns() <= kIntegerColumns && !stopRequested())
    if (auto better = master.solveInteger(left, kIntegerNodes, chosen)) result.roster = std::move(better);
  return result;
}

}  // namespace rotaweave::search
