/// @brief Selection schemes, crossover and mutation.
#include "search/operators.hpp"

#include "search/moves.hpp"

#include <algorithm>
#include <cmath>

namespace rotaweave::search {
namespace {

/// Cumulative weights for fitness-proportional schemes; allocation-free after the first call.
const std::vector<double>& cumulative(const std::vector<Individual>& pop, Selection method) {
  thread_local std::vector<double> cum;
  cum.resize(pop.size());
  double total = 0;
  const double n = static_cast<double>(pop.size());
  for (size_t i = 0; i < pop.size(); ++i) {
    // Rank: linear ranking with selection pressure 1.8 (best gets 1.8/n, worst 0.2/n).
    const double w = method == Selection::Rank ? (1.8 - 1.6 * static_cast<double>(i) / std::max(1.0, n - 1)) : fitnessValue(pop[i].score);
    cum[i] = (total += w);
  }
  return cum;
}

int pick(const std::vector<double>& cum, double x) {
  return static_cast<int>(std::upper_bound(cum.begin(), cum.end(), x) - cum.begin());
}

}  // namespace

void selectParents(const std::vector<Individual>& pop, int count, Selection method, int tournamentSize, Rng& rng,
                   std::vector<int>& out) {
  out.clear();
  const int n = static_cast<int>(pop.size());
  if (method == Selection::Tournament) {
    // The population is sorted best first, so the lowest index drawn wins.
    for (int k = 0; k < count; ++k) {
      int best = rng.below(n);
      for (int j = 1; j < tournamentSize; ++j) best = std::min(best, rng.below(n));
      out.push_back(best);
    }
    return;
  }
  const auto& cum = cumulative(pop, method);
  const double total = cum.back();
  if (method == Selection::StochasticUniversal) {
    // One spin, `count` equally spaced pointers: no parent is over- or under-sampled by chance.
    const double step = total / count;
    const double start = rng.uniform() * step;
    for (int k = 0; k < count; ++k) out.push_back(std::min(n - 1, pick(cum, start + k * step)));
    // Pointer order follows rank; shuffle so pairs mix good and weaker parents.
    for (int k = count - 1; k > 0; --k) std::swap(out[static_cast<size_t>(k)], out[static_cast<size_t>(rng.below(k + 1))]);
    return;
  }
  for (int k = 0; k < count; ++k) out.push_back(std::min(n - 1, pick(cum, rng.uniform() * total)));
}

void rowUniformCrossover(const model::Roster& a, const model::Roster& b, model::Roster& child, Rng& rng) {
  const size_t days = static_cast<size_t>(a.days);
  for (int s = 0; s < a.staff; ++s) {
    const model::Roster& from = (rng.next() & 1) ? a : b;
    std::copy_n(from.cells.begin() + static_cast<long>(s * days), days, child.cells.begin() + static_cast<long>(s * days));
  }
}

void dayBlockCrossover(const model::Roster& a, const model::Roster& b, model::Roster& child, Rng& rng) {
  int d0 = rng.below(a.days), d1 = rng.below(a.days);
  if (d0 > d1) std::swap(d0, d1);
  for (int s = 0; s < a.staff; ++s)
    for (int d = 0; d < a.days; ++d) child.at(s, d) = (d >= d0 && d <= d1) ? b.at(s, d) : a.at(s, d);
}

void reassignMutation(const Eligibility& e, model::Roster& g, double rate, Rng& rng) {
  const auto& cells = e.freeCells();
  if (cells.empty() || rate <= 0) return;
  // Geometric skips: the same distribution as one coin per cell, at a cost per mutation.
  const double logq = std::log1p(-std::min(rate, 0.999999));
  double pos = std::floor(std::log(1.0 - rng.uniform()) / logq);
  while (pos < static_cast<double>(cells.size())) {
    const int cell = cells[static_cast<size_t>(pos)];
    const StaffIdx s = cell / g.days;
    const DayIdx d = cell % g.days;
    const int n = e.count(s, d);
    const TaskIdx current = g.at(s, d);
    TaskIdx pickTask = e.begin(s, d)[rng.below(n)];
    if (pickTask == current) pickTask = e.begin(s, d)[(std::find(e.begin(s, d), e.end(s, d), current) - e.begin(s, d) + 1) % n];
    g.at(s, d) = pickTask;
    pos += 1 + std::floor(std::log(1.0 - rng.uniform()) / logq);
  }
}

void swapMutation(const Eligibility& e, model::Roster& g, int moves, Rng& rng) {
  eval::Move move;
  for (int i = 0; i < moves; ++i) {
    randomMove(e, g, rng, move);
    applyMove(g, move);
  }
}

}  // namespace rotaweave::search
