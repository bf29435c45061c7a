/// @brief The cover side of a relaxation that prices cover: per cell, the cheapest count at a
/// price, and the range where an optimal price lies. Shared by the Lagrangian rounds and the
/// pool's dual.
#pragma once
#include <cmath>
#include <cstdlib>

namespace rotaweave::search {

struct CountChoice {
  double value;  ///< cover cost of the count minus price times the count
  int count;
};

/// The count y in [0, people] minimising cost(y) - price * y. Among equal choices it takes the
/// one nearest `near` (the rows' count), so a settled cell stops moving.
template <class CoverCost>
CountChoice cheapestCount(int people, double price, int near, CoverCost&& cost) {
  CountChoice best{INFINITY, near};
  for (int y = 0; y <= people; ++y) {
    const double v = cost(y) - price * y;
    if (v < best.value - 1e-9 || (v <= best.value + 1e-9 && std::abs(y - near) < std::abs(best.count - near))) best = {v, y};
  }
  return best;
}

struct PriceRange {
  double low, high;
};

/// An optimal price lies between what a cell's first person and its last change its cost by:
/// beyond them the cover side would take no one or everyone.
template <class CoverCost>
PriceRange optimalPriceRange(int people, CoverCost&& cost) {
  return {cost(1) - cost(0), cost(people) - cost(people - 1)};
}

}  // namespace rotaweave::search
