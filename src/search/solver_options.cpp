/// @brief The parameter table and its bounds checks.
#include "search/solver_options.hpp"

#include <cmath>
#include <sstream>
#include <stdexcept>

namespace rotaweave::search {

const std::vector<ParameterInfo>& parameterTable() {
  static const SolverOptions d;
  static const std::vector<ParameterInfo> kTable{
      {"time-limit", "stop after this many seconds", 0.1, 86400, d.timeLimit, false},
      {"generations", "stop after this many generations (0: no limit)", 0, 1e9, static_cast<double>(d.generations), true},
      {"stall", "stop after this many generations without improvement (0: never)", 0, 1e9, static_cast<double>(d.stallGenerations), true},
      {"target", "stop once a roster has no hard penalty and at most this soft penalty (points)", 0, 1e12, d.targetSoft, false},
      {"seed", "random seed; the same seed, islands and generations give the same roster (0: from the clock)", 0, 1.8e19, 0, true},
      {"threads", "worker threads (0: all cores); with --islands given, does not change the result", 0, 256, 0, true},
      {"islands", "independent populations, one per thread at a time (0: one per thread, at least 4)", 0, 256, static_cast<double>(d.islands), true},
      {"population", "individuals per island", 4, 1000, static_cast<double>(d.population), true},
      {"elite", "best individuals kept unchanged each generation", 0, 100, static_cast<double>(d.elite), true},
      {"tournament-size", "individuals drawn per tournament", 2, 32, static_cast<double>(d.tournamentSize), true},
      {"crossover-rate", "probability that a child mixes two parents", 0, 1, d.crossoverRate, false},
      {"block-crossover", "share of crossovers that exchange a block of days rather than whole rows", 0, 1, d.blockCrossoverShare, false},
      {"mutation-rate", "probability that each cell of a child is reassigned", 0, 1, d.mutationRate, false},
      {"local-search", "late-acceptance local-search moves tried on each child", 0, 1e7, static_cast<double>(d.localSearchMoves), true},
      {"chain-interval", "local-search moves between ejection chains, which fill a gap in cover by passing shifts along a chain of people (0: none)", 0, 1e7, static_cast<double>(d.chainInterval), true},
      {"refit-interval", "local-search moves between refit chains, which force one person's row to change on one day, re-fit it whole and let others re-fit theirs in answer (0: none)", 0, 1e7, static_cast<double>(d.refitInterval), true},
      {"refit-passes", "rounds in which everyone else re-fits their row in answer, in each refit chain", 0, 10, static_cast<double>(d.refitPasses), true},
      {"lagrangian-rounds", "subgradient rounds that price cover so each person's row can be chosen alone; the rows they propose are combined into the cheapest roster found, and the best rosters start every island (0: none; capped at a tenth of the time limit)", 0, 1e6, static_cast<double>(d.lagrangianRounds), true},
      {"lagrangian-starts", "rosters from those rounds that join every island's first population", 0, 1000, static_cast<double>(d.lagrangianStarts), true},
      {"column-share", "share of the time limit for column generation after those rounds: a linear programme (CLP) prices cover, each person's best row at those prices joins it, and an integer programme (CBC) picks a roster that starts every island (0: none)", 0, 0.9, d.columnShare, false},
      {"hard-weight", "while searching, a hard penalty point counts as at least this many soft points; more while the search stays infeasible", 1, 1e6, d.hardWeightFloor, false},
      {"migration-interval", "generations between migrations on the island ring", 1, 1e6, static_cast<double>(d.migrationInterval), true},
      {"migrants", "best individuals sent to the next island at each migration", 0, 100, static_cast<double>(d.migrants), true},
  };
  return kTable;
}

void setParameter(SolverOptions& o, const std::string& name, double v) {
  const ParameterInfo* info = nullptr;
  for (const auto& p : parameterTable())
    if (name == p.name) info = &p;
  if (!info) throw std::invalid_argument("unknown parameter '" + name + "'");
  if (!(v >= info->min && v <= info->max) || (info->integer && std::floor(v) != v)) {  // NaN fails too
    std::ostringstream msg;
    msg << "--" << name << " must be " << (info->integer ? "a whole number " : "") << "in [" << info->min << ", "
        << info->max << "], got " << v;
    throw std::invalid_argument(msg.str());
  }
  if (name == "time-limit") o.timeLimit = v;
  else if (name == "generations") o.generations = static_cast<long>(v);
  else if (name == "stall") o.stallGenerations = static_cast<long>(v);
  else if (name == "target") o.targetSoft = v;
  else if (name == "seed") o.seed = static_cast<std::uint64_t>(v);
  else if (name == "threads") o.threads = static_cast<int>(v);
  else if (name == "islands") o.islands = static_cast<int>(v);
  else if (name == "population") o.population = static_cast<int>(v);
  else if (name == "elite") o.elite = static_cast<int>(v);
  else if (name == "tournament-size") o.tournamentSize = static_cast<int>(v);
  else if (name == "crossover-rate") o.crossoverRate = v;
  else if (name == "block-crossover") o.blockCrossoverShare = v;
  else if (name == "mutation-rate") o.mutationRate = v;
  else if (name == "local-search") o.localSearchMoves = static_cast<int>(v);
  else if (name == "chain-interval") o.chainInterval = static_cast<int>(v);
  else if (name == "refit-interval") o.refitInterval = static_cast<int>(v);
  else if (name == "refit-passes") o.refitPasses = static_cast<int>(v);
  else if (name == "lagrangian-rounds") o.lagrangianRounds = static_cast<int>(v);
  else if (name == "lagrangian-starts") o.lagrangianStarts = static_cast<int>(v);
  else if (name == "column-share") o.columnShare = v;
  else if (name == "hard-weight") o.hardWeightFloor = v;
  else if (name == "migration-interval") o.migrationInterval = static_cast<int>(v);
  else if (name == "migrants") o.migrants = static_cast<int>(v);
}

Selection parseSelection(const std::string& t) {
  if (t == "tournament") return Selection::Tournament;
  if (t == "rank") return Selection::Rank;
  if (t == "sus") return Selection::StochasticUniversal;
  if (t == "roulette") return Selection::Roulette;
  throw std::invalid_argument("--selection must be tournament, rank, sus or roulette, got '" + t + "'");
}

const char* selectionName(Selection s) {
  switch (s) {
    case Selection::Tournament: return "tournament";
    case Selection::Rank: return "rank";
    case Selection::StochasticUniversal: return "sus";
    case Selection::Roulette: return "roulette";
  }
  return "tournament";
}

}  // namespace rotaweave::search
