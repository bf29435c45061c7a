/// @brief An individual of the genetic algorithm: a genome (the roster's cells) and its score.
#pragma once
#include "model/roster.hpp"
#include "rules/breach.hpp"

namespace rotaweave::search {

/// The genome is the person x day matrix of task indices (0 = off), kept as a Roster.
struct Individual {
  model::Roster genome;
  rules::Tally score;
};

/// One number for fitness-proportional selection: larger is better, always positive.
inline double fitnessValue(const rules::Tally& t) {
  const double points = static_cast<double>(t.hard) * 1000.0 + static_cast<double>(t.soft);
  return 1.0 / (1.0 + points / static_cast<double>(kCostScale));
}

}  // namespace rotaweave::search
