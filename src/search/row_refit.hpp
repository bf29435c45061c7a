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
///
/// Work and memory per call are bounded: a day keeps at most a budgeted number of labels
/// (the cheapest, spread over the hours worked so far so that rows able to reach a minimum of
/// hours survive). A call that had to drop labels is not exact (`lastWasExact()`); its row is
/// still one that keeps every modelled rule. Labels that can no longer reach a modelled minimum
/// of hours are dropped first, which loses nothing.
#pragma once
#include <chrono>
#include <cstdint>
#include <vector>

#include "eval/evaluator.hpp"
#include "search/eligibility.hpp"
#include "search/row_change.hpp"

namespace rotaweave::search {

class RowRefit {
 public:
  RowRefit(const rules::RuleSet& rules, const Eligibility& e);

  /// What a re-fit must put on a day, besides one task (kOff for a day off): anything, or
  /// some worked task.
  static constexpr TaskIdx kAnyTask = -1, kAnyShift = -2;

  /// Finds the cheapest row for person s on days [first, first + length) of the roster loaded in
  /// `ev`, weighing hard cost by `hardWeight`, and writes it into `change` (only the cells that
  /// change). `needs` (per period day; nullptr for none) says what days must hold.
  /// Returns false if no row satisfies them and the modelled rules.
  bool refit(const eval::Evaluator& ev, StaffIdx s, DayIdx first, int length, const TaskIdx* needs, double hardWeight,
             RowChange& change) {
    return refit(ev.roster(), ev, s, first, length, needs, hardWeight, change);
  }
  /// The same with person s's row read from `roster`, which may differ from ev's on days
  /// outside the window (earlier windows of the row re-fitted but not applied yet) and in
  /// other people's rows; cover is ev's.
  bool refit(const model::Roster& roster, const eval::Evaluator& ev, StaffIdx s, DayIdx first, int length,
             const TaskIdx* needs, double hardWeight, RowChange& change);
  /// Like refit, but a worked cell costs its price, `prices[day * tasks + task]`, instead of the
  /// change in cover it makes: the others' cells do not matter. Sets `cost` to the cheapest
  /// row's cost (cell-local rules plus prices).
  bool refitAtPrices(const eval::Evaluator& ev, StaffIdx s, DayIdx first, int length, const double* prices,
                     double hardWeight, RowChange& change, double& cost) {
    return refitAtPrices(ev.roster(), s, first, length, prices, hardWeight, change, cost);
  }
  /// The same on any roster: only person s's row is read, so re-fits of different people may
  /// run at once on one roster (each on its own RowRefit) while each writes only its own row.
  bool refitAtPrices(const model::Roster& roster, StaffIdx s, DayIdx first, int length, const double* prices,
                     double hardWeight, RowChange& change, double& cost);

  /// Whether the last call kept every label to the end (its row, if any, is then the cheapest
  /// there is; if none, there is none).
  bool lastWasExact() const { return exact_; }
  /// Calls return false (no row) once `deadline` passes or a stop is requested.
  void setDeadline(std::chrono::steady_clock::time_point deadline) { deadline_ = deadline; }
  /// Most labels one day may keep, at least 1 (default kMaxBeam). A day keeps fewer where a
  /// call would extend more than kExtensionsPerCall labels or keep more than kLabelsPerCall.
  void setBeamWidth(int labels) { beam_ = labels > 0 ? labels : 1; }

  static constexpr int kMaxBeam = 4096;    ///< keeps Instances 1-4 of the benchmark exact, and most rows of 5-12
  static constexpr int kMinBeam = 64;
  static constexpr long kExtensionsPerCall = 1L << 20;  ///< about 10-20 ms of work
  static constexpr long kLabelsPerCall = 1L << 18;      ///< 16 MB of labels for the walk back

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
  /// Hours-worked strata the beam keeps labels from, so that rows reaching a minimum survive.
  static constexpr int kMinuteStrata = 16;

  /// Keeps at most `beam` of next_'s labels (sorted by state, one per state): the cheapest of
  /// each stratum of minutes worked first, then the cheapest of the rest.
  void trimToBeam(int beam);

  Limits limitsFor(const rules::RuleSet& rules, StaffIdx s) const;
  /// Advances `st` by one day with shift `sh`; false if a modelled rule is broken on the way.
  bool step(const Limits& lim, State& st, DayIdx d, ShiftIdx sh) const;
  /// Whether the window's last state joins the unchanged days after it without a modelled breach.
  bool joinsSuffix(const Limits& lim, const State& st, const model::Roster& roster, StaffIdx s, DayIdx end) const;
  static void packKey(Label& label);
  /// The shortest path behind refit and refitAtPrices: cover priced by `prices`, or, when they
  /// are null, by the cover counts of `ev`.
  bool cheapestRow(const model::Roster& roster, const eval::Evaluator* ev, StaffIdx s, DayIdx first, int length,
                   const TaskIdx* needs, const double* prices, double hardWeight, RowChange& change, double& cost);

  const rules::RuleSet* rules_;
  const model::Problem* p_;
  const Eligibility* e_;
  std::vector<Limits> limits_;
  std::vector<ShiftIdx> taskShift_;
  std::vector<int> shiftPaid_;  ///< paid minutes per shift type
  std::vector<Label> labels_, next_;  ///< every day's labels, for the walk back; the day being built
  std::vector<int> mostPaid_;         ///< scratch: the most minutes one day of the window can add
  std::vector<std::uint8_t> keep_;    ///< scratch for trimToBeam
  int beam_ = kMaxBeam;
  bool exact_ = true;
  std::chrono::steady_clock::time_point deadline_ = std::chrono::steady_clock::time_point::max();
};

}  // namespace rotaweave::search
