/// @brief Row re-fit: the cheapest row for one person while everyone else's cells stay put.
///
/// A shortest path over the person's days (dynamic programming with one label per distinct
/// state): each day's cost is the change in cover that person's task makes there plus the
/// cell-local rules (requests, skills, changes). The hard row rules it can model are kept as
/// constraints in the state: forbidden shift pairs (and minimum rest between consecutive days),
/// runs of worked days and days off, shift counts, period hours and weekends worked.
/// Everything else (soft row rules, rolling windows, fair share) it leaves to the evaluator,
/// which scores the re-fitted row with every rule; so a re-fit is a proposal, never trusted.
/// One instance per island: it keeps scratch buffers, so a re-fit allocates nothing after warm-up.
#pragma once
#include <cstdint>
#include <vector>

#include "eval/evaluator.hpp"
#include "search/eligibility.hpp"

namespace rotaweave::search {

class RowRefit {
 public:
  /// Longest stretch of days one re-fit rewrites (one move's worth of cells).
  static constexpr int kMaxWindow = eval::Move::kCapacity;

  RowRefit(const rules::RuleSet& rules, const Eligibility& e);

  /// What a re-fit must put on a day, besides one task (kOff for a day off): anything, or
  /// some worked task.
  static constexpr TaskIdx kAnyTask = -1, kAnyShift = -2;

  /// Finds the cheapest row for person s on days [first, first + length) of the roster loaded in
  /// `ev`, weighing hard cost by `hardWeight`, and writes it into `move` (only the cells that
  /// change). `needs` (per period day; nullptr for none) says what days must hold.
  /// Returns false if no row satisfies them and the modelled rules.
  bool refit(const eval::Evaluator& ev, StaffIdx s, DayIdx first, int length, const TaskIdx* needs, double hardWeight,
             eval::Move& move);
  /// Like refit, but a worked cell costs its price, `prices[day * tasks + task]`, instead of the
  /// change in cover it makes: the others' cells do not matter. Sets `cost` to the cheapest
  /// row's cost (cell-local rules plus prices).
  bool refitAtPrices(const eval::Evaluator& ev, StaffIdx s, DayIdx first, int length, const double* prices,
                     double hardWeight, eval::Move& move, double& cost);

 private:
  /// The hard row rules of one person that the search models; unset bounds are "none".
  struct Limits {
    int maxRun = 0, minRun = 0, minOff = 0, maxWeekends = -1, minMinutes = 0, maxMinutes = -1;
    std::vector<int> countShift, countLimit;  ///< max-count rules: shift (kNoShift: any) and bound
    std::vector<std::uint8_t> forbid;         ///< [(prev + 1) * (shifts + 1) + next + 1] on consecutive days
  };
  /// What the rest of the row needs to know about the days so far.
  struct State {
    ShiftIdx last = kNoShift;
    int workRun = 0, offRun = 0;
    bool runAtEdge = false;     ///< the current run starts at the first known day (rules exempt it)
    bool blockWorked = false;   ///< the current weekend is already counted
    int weekends = 0, minutes = 0;
    std::uint8_t counts[4] = {0, 0, 0, 0};
  };
  struct Label {
    std::uint64_t key[2];
    double cost;
    int parent;
    TaskIdx task;
    State state;
  };
  static constexpr int kMaxCounts = 4;  ///< max-count rules modelled per person; more are left to the evaluator

  Limits limitsFor(const rules::RuleSet& rules, StaffIdx s) const;
  /// Advances `st` by one day with shift `sh`; false if a modelled rule is broken on the way.
  bool step(const Limits& lim, State& st, DayIdx d, ShiftIdx sh) const;
  /// Whether the window's last state joins the unchanged days after it without a modelled breach.
  bool joinsSuffix(const Limits& lim, const State& st, const model::Roster& roster, StaffIdx s, DayIdx end) const;
  static void packKey(Label& label);
  /// The shortest path behind refit and refitAtPrices: cover priced by `prices`, or by the
  /// roster in `ev` when it is null.
  bool cheapestRow(const eval::Evaluator& ev, StaffIdx s, DayIdx first, int length, const TaskIdx* needs,
                   const double* prices, double hardWeight, eval::Move& move, double& cost);

  const model::Problem* p_;
  const Eligibility* e_;
  std::vector<Limits> limits_;
  std::vector<ShiftIdx> taskShift_;
  std::vector<int> shiftPaid_;  ///< paid minutes per shift type
  std::vector<Label> labels_, next_;  ///< every day's labels, for the walk back; the day being built
};

}  // namespace rotaweave::search
