/// @brief Subgradient rounds over cover prices, with re-fit repair of each round's roster.
#include "search/lagrangian.hpp"

#include <algorithm>
#include <atomic>
#include <cmath>

#ifdef _OPENMP
#include <omp.h>
#endif

#include "search/pool_combination.hpp"
#include "search/priced_cover.hpp"
#include "search/row_pool.hpp"
#include "search/stop_signal.hpp"

namespace rotaweave::search {

namespace {

/// Rounds without a better relaxation before the step shrinks (a common subgradient schedule).
constexpr int kPatience = 20;
/// The step has shrunk this much (12 halvings: at least 240 rounds without a better
/// relaxation): the prices no longer move enough to propose new rows.
constexpr double kLeastScale = 1.0 / 4096;
/// Rounds times people: a bound on the rounds' work that grows with the scenario, so a run
/// bounded by generations rather than time does not spend minutes here. Scenarios of up to
/// 20 people keep every round asked for (the benchmark's Instances 2 and 3 need most of
/// their 1,000); a 500-person month stops after 40 rounds (10 s on this machine, where
/// 1,000 rounds took 54 s).
constexpr long kPersonRounds = 20000;
constexpr int kRepairPasses = 3;
/// Cells the row pool may hold (2 bytes each): room for 1,000 rounds on 50 people over 31 days.
constexpr size_t kMaxPoolCells = size_t{4} << 20;
/// Time the pool's combination may take after the rounds, as a share of the time they took
/// (Instance 3's hardest seed needs about two thirds).
constexpr double kCombineTimeShare = 1.0;
/// How far above the relaxation's value the pool's dual may lie for combining to be worth it.
/// Further above, the pool lacks rows that good rosters need: on Instances 2 and 3 the two lie
/// within 1.1 % and 0.02 %, where combining finds the optima; on Instances 5, 7 and 9 the
/// pool's dual is 75 % to eleven times higher, on the samples the relaxation's value is 0, and
/// combining found no roster there that one generation of the islands did not beat.
constexpr double kWorthwhileGap = 0.1;

/// People re-fitted at once in a repair pass, each against the cover as it was before their
/// group: one at a time (exactly sequential) up to 31 people, so small scenarios keep the
/// rosters they were measured with, then a sixteenth of the people. Fixed by the scenario
/// alone, so the result does not depend on the thread count.
int repairGroup(int people) { return std::max(1, people / 16); }

/// Runs `body(i, refit)` for every i in [0, count), on up to refits.size() threads, each
/// thread with its own re-fitter. Returns false if the deadline passed or a stop was
/// requested before every person was done.
template <class Body>
bool forEach(std::vector<RowRefit>& refits, int count, std::chrono::steady_clock::time_point deadline, Body&& body) {
  std::atomic<bool> late{false};
  const int threads = std::min(static_cast<int>(refits.size()), count);
#pragma omp parallel for num_threads(std::max(threads, 1)) schedule(dynamic, 1)
  for (int i = 0; i < count; ++i) {
    if (late.load(std::memory_order_relaxed)) continue;
    if (std::chrono::steady_clock::now() >= deadline || stopRequested()) {
      late = true;
      continue;
    }
#ifdef _OPENMP
    RowRefit& refit = refits[static_cast<size_t>(omp_get_thread_num())];
#else
    RowRefit& refit = refits.front();
#endif
    body(i, refit);
  }
  return !late;
}

/// Keeps the best `keep` distinct rosters seen, best first.
void remember(std::vector<std::pair<double, model::Roster>>& kept, int keep, double value, const model::Roster& roster) {
  if (keep <= 0) return;
  for (const auto& [v, r] : kept)
    if (v == value && r.cells == roster.cells) return;
  if (static_cast<int>(kept.size()) == keep && value >= kept.back().first) return;
  if (static_cast<int>(kept.size()) == keep) kept.pop_back();
  const auto at = std::find_if(kept.begin(), kept.end(), [&](const auto& entry) { return value < entry.first; });
  kept.insert(at, {value, roster});
}

}  // namespace

LagrangianResult lagrangianStarts(const Eligibility& e, eval::Evaluator& ev, std::vector<RowRefit>& refits, Rng& rng, int rounds,
                                  int keep, double hardWeight, std::chrono::steady_clock::time_point deadline) {
  LagrangianResult result;
  const model::Problem& p = ev.rules().problem();
  const rules::CoverRule& cover = ev.rules().cover();
  const int people = p.staffCount(), tasks = p.taskCount();
  const size_t cells = static_cast<size_t>(p.days) * static_cast<size_t>(tasks);
  // What a person's row pays for taking each (day, task); negative: a reward for cover.
  std::vector<double> price(cells, 0.0), gradient(cells, 0.0);
  auto coverCost = [&](DayIdx d, TaskIdx t) { return [&, d, t](int y) { return cover.cellTally(d, t, y).weighed(hardWeight); }; };
  std::vector<PriceRange> range(cells, PriceRange{0.0, 0.0});
  for (DayIdx d = 0; d < p.days; ++d)
    for (TaskIdx t = 1; t < tasks; ++t)
      range[static_cast<size_t>(d) * static_cast<size_t>(tasks) + static_cast<size_t>(t)] = optimalPriceRange(people, coverCost(d, t));
  std::vector<StaffIdx> order(static_cast<size_t>(people));
  for (StaffIdx s = 0; s < people; ++s) order[static_cast<size_t>(s)] = s;
  std::vector<std::pair<double, model::Roster>> kept;  // (weighed cost, roster), best first
  RowPool rows(people, p.days, kMaxPoolCells);
  const auto began = std::chrono::steady_clock::now();
  for (RowRefit& refit : refits) refit.setDeadline(deadline);
  const int group = repairGroup(people);
  std::vector<double> rowCost(static_cast<size_t>(people), 0.0);
  std::vector<std::uint8_t> rowExact(static_cast<size_t>(people), 1);
  std::vector<RowChange> groupChanges(static_cast<size_t>(group)), pricedChanges(static_cast<size_t>(people));

  model::Roster start(people, p.days);  // each cell's first option: off unless the cell is fixed
  for (StaffIdx s = 0; s < people; ++s)
    for (DayIdx d = 0; d < p.days; ++d) start.at(s, d) = *e.begin(s, d);
  ev.load(start);
  model::Roster working = start;  // rows being priced; each thread writes only its own
  double bestPrimal = INFINITY, bestDual = -INFINITY, scale = 1.0;
  int sinceBetter = 0;
  rounds = static_cast<int>(std::min<long>(rounds, std::max<long>(1, kPersonRounds / std::max(people, 1))));
  for (int round = 0; round < rounds; ++round) {
    // 1 - Every row at the current prices; with cover priced, rows do not depend on each
    // other, so they are re-fitted at once and the roster reloaded.
    const auto roundBegan = std::chrono::steady_clock::now();
    working = ev.roster();
    const bool priced = forEach(refits, people, deadline, [&](int i, RowRefit& refit) {
      const StaffIdx s = order[static_cast<size_t>(i)];
      RowChange& change = pricedChanges[static_cast<size_t>(s)];
      double& cost = rowCost[static_cast<size_t>(s)];
      cost = 0;
      const bool found = refit.refitAtPrices(working, s, 0, p.days, price.data(), hardWeight, change, cost);
      rowExact[static_cast<size_t>(s)] = refit.lastWasExact();
      if (found) writeRowChange(working, change);
    });
    if (!priced) break;  // out of time: this round's rows are unfinished
    double rowsCost = 0;
    for (const StaffIdx s : order) rowsCost += rowCost[static_cast<size_t>(s)];  // in a fixed order: the same sum on any thread count
    ev.load(working);
    // A round's repair takes about kRepairPasses times its pricing: give up rather than start
    // a repair that cannot end in time (the first round on a very large scenario).
    const auto pricedAt = std::chrono::steady_clock::now();
    if (result.rounds == 0 && pricedAt + (pricedAt - roundBegan) * kRepairPasses > deadline) break;
    rows.addRows(ev.roster());

    // 2 - The cover side: for each cell the count cheapest at its price.
    double coverSide = 0, norm = 0;
    for (DayIdx d = 0; d < p.days; ++d)
      for (TaskIdx t = 1; t < tasks; ++t) {
        const size_t c = static_cast<size_t>(d) * static_cast<size_t>(tasks) + static_cast<size_t>(t);
        if (!p.demandAt(d, t).defined) continue;
        const int x = ev.coverCount(d, t);
        const CountChoice best = cheapestCount(people, price[c], x, coverCost(d, t));
        coverSide += best.value;
        gradient[c] = best.count - x;
        norm += gradient[c] * gradient[c];
      }
    const double dual = rowsCost + coverSide;
    if (std::all_of(rowExact.begin(), rowExact.end(), [](std::uint8_t exact) { return exact != 0; }))
      result.bound = std::max(result.bound.value_or(-INFINITY), dual);

    // 3 - Repair: re-fit rows against the real cover, in a random order each pass, a group of
    // people at a time (each against the cover before the group). A repair cut short by the
    // deadline still gives a whole roster.
    for (int pass = 0; pass < kRepairPasses; ++pass) {
      rng.shuffle(order);
      for (int from = 0; from < people; from += group) {
        const int count = std::min(group, people - from);
        if (!forEach(refits, count, deadline, [&](int slot, RowRefit& refit) {
              RowChange& change = groupChanges[static_cast<size_t>(slot)];
              if (!refit.refit(ev, order[static_cast<size_t>(from + slot)], 0, p.days, nullptr, hardWeight, change)) change.clear();
            }))
          break;
        for (int slot = 0; slot < count; ++slot) applyRowChange(ev, groupChanges[static_cast<size_t>(slot)]);
      }
    }
    rows.addRows(ev.roster());
    result.rounds = round + 1;
    const double primal = ev.total().weighed(hardWeight);
    bestPrimal = std::min(bestPrimal, primal);
    remember(kept, keep, primal, ev.roster());

    // 4 - A subgradient step towards the target (the best roster so far), shrinking when the
    // relaxation stops improving.
    if (dual > bestDual + 1e-9) {
      bestDual = dual;
      sinceBetter = 0;
    } else if (++sinceBetter >= kPatience) {
      scale /= 2;
      sinceBetter = 0;
    }
    // Stop before a round that cannot end in time.
    const auto now = std::chrono::steady_clock::now();
    if (now + (now - roundBegan) > deadline) break;
    if (norm == 0) break;  // every cell settled: the prices cannot move
    const double step = scale * std::max(bestPrimal - dual, 0.0) / norm;
    if (step == 0 || scale < kLeastScale) break;
    for (size_t c = 0; c < cells; ++c) price[c] = std::clamp(price[c] - step * gradient[c], range[c].low, range[c].high);
  }
  result.dual = result.rounds > 0 ? bestDual : 0;

  // 5 - The rows each round proposed, combined: the rows a good roster needs tend to turn up
  // in different rounds.
  if (!kept.empty()) {
    PoolSearchLimits limits;
    const auto now = std::chrono::steady_clock::now();
    limits.deadline = now + std::chrono::duration_cast<std::chrono::steady_clock::duration>((now - began) * kCombineTimeShare);
    limits.worthwhileCost = (1 + kWorthwhileGap) * std::max(result.dual, 0.0);
    const PoolCombination combined = combinePool(rows, ev, kept.front().second, hardWeight, rng, limits);
    if (combined.roster) remember(kept, keep, ev.score(*combined.roster).weighed(hardWeight), *combined.roster);
  }
  for (auto& entry : kept) result.rosters.push_back(std::move(entry.second));
  result.pool.emplace(std::move(rows));
  return result;
}

}  // namespace rotaweave::search
