/// @brief Pool dual by subgradient rounds, then a restarted depth-first search bounded by it.
#include "search/pool_combination.hpp"

#include <algorithm>
#include <cmath>
#include <numeric>

#include "search/priced_cover.hpp"
#include "search/stop_signal.hpp"

namespace rotaweave::search {

namespace {

/// Dual rounds without a better value before the step halves. The pool's dual is cheap to
/// evaluate, so it can afford a patient schedule (20 left it 5 points short on Instance 2).
constexpr int kPatience = 100;
/// Restarts at each target before the next, wider one.
constexpr int kRestartsPerTarget = 20;

/// The pool as a set-partitioning model: one column per pooled row, filling the cover cells
/// its worked days count towards.
struct PoolModel {
  int people = 0, cells = 0;
  std::vector<double> coverCost;   ///< [cell * (people + 1) + count]
  std::vector<size_t> firstColumn; ///< per person, then the end
  std::vector<double> rowCost;     ///< per column: the row rules' weighed penalty
  std::vector<size_t> coverBegin;  ///< per column, into `covered`; then the end
  std::vector<int> covered;        ///< the modelled cells each column fills
  double granularity = 0;          ///< every cost is a multiple of it (0: not known)

  double cover(int cell, int count) const { return coverCost[static_cast<size_t>(cell) * static_cast<size_t>(people + 1) + static_cast<size_t>(count)]; }
  auto coverOf(int cell) const { return [this, cell](int count) { return cover(cell, count); }; }
  const int* coveredBegin(size_t col) const { return covered.data() + coverBegin[col]; }
  const int* coveredEnd(size_t col) const { return covered.data() + coverBegin[col + 1]; }
  /// A column's row cost plus the prices of the cells it fills.
  double pricedCost(size_t col, const std::vector<double>& price) const {
    double v = rowCost[col];
    for (const int* c = coveredBegin(col); c != coveredEnd(col); ++c) v += price[static_cast<size_t>(*c)];
    return v;
  }
};

/// The modelled cell person's task `t` fills on day `d`, or -1 (off, or no demand there).
int cellAt(const std::vector<int>& cellOf, int tasks, DayIdx d, TaskIdx t) {
  return t == kOff ? -1 : cellOf[static_cast<size_t>(d) * static_cast<size_t>(tasks) + static_cast<size_t>(t)];
}

/// The greatest common divisor of the costs when all are whole numbers, else 0.
double granularityOf(const std::vector<double>& a, const std::vector<double>& b) {
  Cost g = 0;
  for (const auto* v : {&a, &b})
    for (const double x : *v) {
      if (std::abs(x - std::round(x)) > 1e-6) return 0;
      g = std::gcd(g, static_cast<Cost>(std::llround(std::abs(x))));
    }
  return static_cast<double>(g);
}

PoolModel buildModel(const RowPool& pool, eval::Evaluator& ev, double hardWeight, std::vector<int>& cellOf) {
  const model::Problem& p = ev.rules().problem();
  const rules::CoverRule& cover = ev.rules().cover();
  PoolModel m;
  m.people = pool.people();
  const int tasks = p.taskCount();
  cellOf.assign(static_cast<size_t>(p.days) * static_cast<size_t>(tasks), -1);
  for (DayIdx d = 0; d < p.days; ++d)
    for (TaskIdx t = 1; t < tasks; ++t) {
      if (!p.demandAt(d, t).defined) continue;
      cellOf[static_cast<size_t>(d) * static_cast<size_t>(tasks) + static_cast<size_t>(t)] = m.cells++;
      for (int y = 0; y <= m.people; ++y) m.coverCost.push_back(cover.cellTally(d, t, y).weighed(hardWeight));
    }
  for (StaffIdx s = 0; s < m.people; ++s) {
    m.firstColumn.push_back(m.rowCost.size());
    for (const auto& row : pool.rows(s)) {
      m.rowCost.push_back(ev.rowScore(s, row.data()).weighed(hardWeight));
      m.coverBegin.push_back(m.covered.size());
      for (DayIdx d = 0; d < pool.days(); ++d)
        if (const int cell = cellAt(cellOf, tasks, d, row[static_cast<size_t>(d)]); cell >= 0) m.covered.push_back(cell);
    }
  }
  m.firstColumn.push_back(m.rowCost.size());
  m.coverBegin.push_back(m.covered.size());
  m.granularity = granularityOf(m.rowCost, m.coverCost);
  return m;
}

/// The model's cost of a whole roster (rows outside the pool included).
double modelCost(const PoolModel& m, eval::Evaluator& ev, const model::Roster& roster, double hardWeight,
                 const std::vector<int>& cellOf) {
  const int tasks = ev.rules().problem().taskCount();
  std::vector<int> count(static_cast<size_t>(m.cells), 0);
  double cost = 0;
  for (StaffIdx s = 0; s < roster.staff; ++s) {
    cost += ev.rowScore(s, roster.row(s)).weighed(hardWeight);
    for (DayIdx d = 0; d < roster.days; ++d)
      if (const int cell = cellAt(cellOf, tasks, d, roster.at(s, d)); cell >= 0) ++count[static_cast<size_t>(cell)];
  }
  for (int c = 0; c < m.cells; ++c) cost += m.cover(c, count[static_cast<size_t>(c)]);
  return cost;
}

/// Cover prices from subgradient rounds: each person takes their cheapest column at the
/// prices, each cell the count cheapest against them. Prices stay between the cost of the
/// first person on a cell and of the last, where an optimal dual lies.
struct PoolDual {
  std::vector<double> price;
  double value = -INFINITY;
};

/// Stops early once the value passes `enough`: every combination then costs more than that.
PoolDual solveDual(const PoolModel& m, double upper, double enough, int rounds,
                   std::chrono::steady_clock::time_point deadline) {
  const size_t cells = static_cast<size_t>(m.cells);
  std::vector<double> price(cells, 0.0), gradient(cells);
  std::vector<PriceRange> range;
  for (int c = 0; c < m.cells; ++c) range.push_back(optimalPriceRange(m.people, m.coverOf(c)));
  std::vector<int> count(cells);
  PoolDual best;
  best.price = price;
  double scale = 2.0;
  int sinceBetter = 0;
  for (int round = 0; round < rounds; ++round) {
    if (round % 64 == 0 && (std::chrono::steady_clock::now() >= deadline || stopRequested())) break;
    double value = 0;
    std::fill(count.begin(), count.end(), 0);
    for (int s = 0; s < m.people; ++s) {
      double cheapest = INFINITY;
      size_t pick = m.firstColumn[static_cast<size_t>(s)];
      for (size_t col = m.firstColumn[static_cast<size_t>(s)]; col < m.firstColumn[static_cast<size_t>(s) + 1]; ++col)
        if (const double v = m.pricedCost(col, price); v < cheapest) {
          cheapest = v;
          pick = col;
        }
      value += cheapest;
      for (const int* c = m.coveredBegin(pick); c != m.coveredEnd(pick); ++c) ++count[static_cast<size_t>(*c)];
    }
    double norm = 0;
    for (int c = 0; c < m.cells; ++c) {
      const size_t k = static_cast<size_t>(c);
      const CountChoice cheapest = cheapestCount(m.people, price[k], count[k], m.coverOf(c));
      value += cheapest.value;
      gradient[k] = cheapest.count - count[k];
      norm += gradient[k] * gradient[k];
    }
    if (value > best.value + 1e-9) {
      best.value = value;
      best.price = price;
      sinceBetter = 0;
      if (value > enough) break;
    } else if (++sinceBetter >= kPatience) {
      scale /= 2;
      sinceBetter = 0;
    }
    const double step = scale * std::max(upper - value, 0.0) / norm;
    if (norm == 0 || !(step > 1e-12)) break;  // settled, at the upper bound, or the step vanished
    for (size_t k = 0; k < cells; ++k) price[k] = std::clamp(price[k] - step * gradient[k], range[k].low, range[k].high);
  }
  return best;
}

/// Depth-first search over columns of small reduced cost. The bound at a node: the dual value,
/// plus the reduced costs of the columns taken, plus for each person still open their
/// cheapest column that fits, plus for each cell the cheapest reduced cost of a count it can
/// still reach. Open people are taken fewest fitting columns first.
class CombinationSearch {
 public:
  CombinationSearch(const PoolModel& m, const PoolDual& dual, double upper)
      : m_(m), bound_(dual.value), best_(upper), people_(static_cast<size_t>(m.people)), cells_(static_cast<size_t>(m.cells)) {
    tolerance_ = 1e-6 * std::max(1.0, m.granularity);
    unit_ = std::max(m.granularity, 2 * tolerance_);
    ceiling_ = best_ - unit_;
    // Reduced costs of columns and of cover counts at the dual's prices.
    slack_.resize(m.rowCost.size());
    for (size_t s = 0; s < people_; ++s) {
      double least = INFINITY;
      for (size_t col = m.firstColumn[s]; col < m.firstColumn[s + 1]; ++col) {
        slack_[col] = m.pricedCost(col, dual.price);
        least = std::min(least, slack_[col]);
      }
      for (size_t col = m.firstColumn[s]; col < m.firstColumn[s + 1]; ++col) slack_[col] -= least;
    }
    const size_t counts = people_ + 1;
    countSlack_.resize(cells_ * counts);
    countSlackFrom_.resize(cells_ * (counts + 1), INFINITY);
    for (size_t k = 0; k < cells_; ++k) {
      const double least = cheapestCount(m.people, dual.price[k], 0, m.coverOf(static_cast<int>(k))).value;
      for (size_t y = 0; y < counts; ++y)
        countSlack_[k * counts + y] = m.cover(static_cast<int>(k), static_cast<int>(y)) - dual.price[k] * static_cast<double>(y) - least;
      for (size_t y = counts; y-- > 0;)
        countSlackFrom_[k * (counts + 1) + y] = std::min(countSlack(k, static_cast<int>(y)), countSlackFrom(k, static_cast<int>(y) + 1));
    }
    // Candidates: the columns that fit the first gap, cheapest reduced cost first.
    candidates_.resize(people_);
    const double gap = budget(0);
    for (size_t s = 0; s < people_; ++s) {
      for (size_t col = m.firstColumn[s]; col < m.firstColumn[s + 1]; ++col)
        if (slack_[col] <= gap) candidates_[s].push_back(col);
      std::sort(candidates_[s].begin(), candidates_[s].end(), [&](size_t a, size_t b) { return slack_[a] < slack_[b]; });
    }
    count_.assign(cells_, 0);
    reach_.assign(cells_, 0);
    forced_.assign(cells_, 0);
    fitCount_.assign(cells_, 0);
    open_.assign(people_, 1);
    choice_.assign(people_, 0);
  }

  /// True once no combination can beat the best found: the bound says so (penalties are never
  /// negative, so 0 bounds too), or a restart searched its whole tree.
  bool proven() const { return exhausted_ || best_ - unit_ + tolerance_ < std::max(bound_, 0.0); }
  /// The least a combination can cost: the bound, rounded up to a whole unit when costs come
  /// in units.
  double least() const { return m_.granularity > 0 ? std::ceil(bound_ / m_.granularity - 1e-9) * m_.granularity : bound_; }
  double unit() const { return m_.granularity > 0 ? m_.granularity : kCostScale; }
  double bound() const { return bound_; }
  const std::optional<std::vector<size_t>>& best() const { return bestChoice_; }
  long nodes() const { return nodes_; }

  /// One depth-first search of at most `nodeLimit` nodes for a combination cheaper than the
  /// best and costing at most `target`; ties among equal reduced costs in a new random order.
  void restart(Rng& rng, long nodeLimit, std::chrono::steady_clock::time_point deadline, double target) {
    for (auto& list : candidates_)
      for (size_t a = 0; a < list.size();) {
        size_t b = a;
        while (b < list.size() && slack_[list[b]] - slack_[list[a]] < tolerance_) ++b;
        rng.shuffle(list.data() + a, list.data() + b);
        a = b;
      }
    nodeLimit_ = nodes_ + nodeLimit;
    deadline_ = deadline;
    target_ = target;
    ceiling_ = std::min(best_ - unit_, target_);
    const bool capped = target_ < best_ - unit_;
    descend(0, 0.0);
    exhausted_ = exhausted_ || (!capped && nodes_ < nodeLimit_);
  }

 private:
  /// How much more reduced cost a combination may carry and still beat the best by a unit.
  double budget(double used) const { return ceiling_ + tolerance_ - bound_ - used; }
  double countSlack(size_t k, int y) const { return countSlack_[k * (people_ + 1) + static_cast<size_t>(y)]; }
  /// The cheapest reduced cost of cell k at a count of y or more (infinite past everyone).
  double countSlackFrom(size_t k, int y) const { return countSlackFrom_[k * (people_ + 2) + static_cast<size_t>(y)]; }
  /// Whether column `col` still fits: no cell it fills is pushed past every count within `room`.
  bool fits(size_t col, double room) const {
    for (const int* c = m_.coveredBegin(col); c != m_.coveredEnd(col); ++c) {
      const size_t k = static_cast<size_t>(*c);
      if (countSlackFrom(k, count_[k] + 1) > room) return false;
    }
    return true;
  }
  void take(size_t col, int delta) {
    for (const int* c = m_.coveredBegin(col); c != m_.coveredEnd(col); ++c) count_[static_cast<size_t>(*c)] += delta;
  }

  void descend(size_t depth, double used) {
    if (++nodes_ >= nodeLimit_) return;
    if ((nodes_ & 1023) == 0 && (std::chrono::steady_clock::now() >= deadline_ || stopRequested())) nodeLimit_ = nodes_;
    const double room = budget(used);
    if (depth == people_) {
      double cost = 0;
      for (size_t s = 0; s < people_; ++s) cost += m_.rowCost[choice_[s]];
      for (size_t k = 0; k < cells_; ++k) cost += m_.cover(static_cast<int>(k), count_[k]);
      if (cost <= ceiling_ + tolerance_) {
        best_ = cost;
        ceiling_ = std::min(best_ - unit_, target_);
        bestChoice_ = choice_;
      }
      return;
    }
    // Bound the node and pick the open person with the fewest fitting columns.
    std::fill(reach_.begin(), reach_.end(), 0);
    std::fill(forced_.begin(), forced_.end(), 0);
    double rows = 0;
    size_t branch = people_, fewest = SIZE_MAX;
    for (size_t s = 0; s < people_; ++s) {
      if (!open_[s]) continue;
      size_t fitting = 0;
      double least = INFINITY;
      touched_.clear();
      for (const size_t col : candidates_[s]) {
        if (slack_[col] > room) break;
        if (!fits(col, room)) continue;
        ++fitting;
        least = std::min(least, slack_[col]);
        for (const int* c = m_.coveredBegin(col); c != m_.coveredEnd(col); ++c)
          if (fitCount_[static_cast<size_t>(*c)]++ == 0) touched_.push_back(*c);
      }
      if (fitting == 0) return;
      rows += least;
      for (const int c : touched_) {
        const size_t k = static_cast<size_t>(c);
        ++reach_[k];
        if (fitCount_[k] == static_cast<int>(fitting)) ++forced_[k];
        fitCount_[k] = 0;
      }
      if (fitting < fewest) { fewest = fitting; branch = s; }
    }
    double counts = 0;
    for (size_t k = 0; k < cells_ && rows + counts <= room; ++k) {
      double least = INFINITY;
      for (int y = count_[k] + forced_[k]; y <= count_[k] + reach_[k]; ++y) least = std::min(least, countSlack(k, y));
      counts += least;
    }
    if (rows + counts > room) return;

    open_[branch] = 0;
    for (const size_t col : candidates_[branch]) {
      if (nodes_ >= nodeLimit_) break;
      const double left = budget(used);  // shrinks as better combinations turn up
      if (slack_[col] > left) break;
      if (!fits(col, left)) continue;
      choice_[branch] = col;
      take(col, +1);
      descend(depth + 1, used + slack_[col]);
      take(col, -1);
    }
    open_[branch] = 1;
  }

  const PoolModel& m_;
  double bound_, best_;
  double tolerance_ = 0, unit_ = 0;  ///< float slack; the least a better combination saves
  double target_ = INFINITY, ceiling_ = 0;  ///< the restart's cap; the most a new best may cost
  size_t people_, cells_;
  std::vector<double> slack_, countSlack_, countSlackFrom_;
  std::vector<std::vector<size_t>> candidates_;
  std::vector<int> count_, reach_, forced_, fitCount_, touched_;
  std::vector<char> open_;
  std::vector<size_t> choice_;
  std::optional<std::vector<size_t>> bestChoice_;
  long nodes_ = 0, nodeLimit_ = 0;  ///< a node limit cut short to nodes_ at the deadline
  bool exhausted_ = false;
  std::chrono::steady_clock::time_point deadline_;
};

}  // namespace

PoolCombination combinePool(const RowPool& pool, eval::Evaluator& ev, const model::Roster& incumbent, double hardWeight,
                            Rng& rng, const PoolSearchLimits& limits) {
  PoolCombination result;
  if (pool.people() == 0 || pool.size() == 0) return result;
  for (StaffIdx s = 0; s < pool.people(); ++s)
    if (pool.rows(s).empty()) return result;  // someone has no row to pick
  std::vector<int> cellOf;
  const PoolModel m = buildModel(pool, ev, hardWeight, cellOf);
  const double upper = modelCost(m, ev, incumbent, hardWeight, cellOf);
  const PoolDual dual = solveDual(m, upper, limits.worthwhileCost, limits.dualRounds, limits.deadline);
  if (!std::isfinite(dual.value)) return result;  // no round ran: nothing to bound a search by
  if (dual.value > limits.worthwhileCost) {
    result.bound = dual.value;
    return result;
  }
  CombinationSearch search(m, dual, upper);
  // Look near the bound first, where few rows fit and the search is quick, then further out:
  // targets one, two, four... units above it, a share of the restarts each, then uncapped.
  double target = search.least();
  for (int r = 0; r < limits.restarts && !search.proven(); ++r) {
    if (std::chrono::steady_clock::now() >= limits.deadline || stopRequested()) break;
    if (r > 0 && r % kRestartsPerTarget == 0) target = search.least() + (target - search.least()) * 2 + search.unit();
    search.restart(rng, limits.nodesPerRestart, limits.deadline, target);
  }
  result.bound = search.bound();
  result.proven = search.proven();
  result.nodes = search.nodes();
  if (const auto& choice = search.best()) {
    model::Roster roster(pool.people(), pool.days());
    for (StaffIdx s = 0; s < pool.people(); ++s) {
      const size_t col = (*choice)[static_cast<size_t>(s)] - m.firstColumn[static_cast<size_t>(s)];
      const auto& row = pool.rows(s)[col];
      std::copy(row.begin(), row.end(), roster.cells.begin() + static_cast<std::ptrdiff_t>(s) * pool.days());
    }
    result.roster = std::move(roster);
  }
  return result;
}

}  // namespace rotaweave::search
