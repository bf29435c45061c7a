/// @brief Search parameters, declared once with bounds and help text (CLI help, validation, docs).
#pragma once
#include <cstdint>
#include <string>
#include <vector>

namespace rotaweave::search {

/// Islands when none are asked for and fewer threads run.
inline constexpr int kMinIslands = 4;

enum class Selection { Tournament, Rank, StochasticUniversal, Roulette };

struct SolverOptions {
  double timeLimit = 30;          ///< seconds
  long generations = 0;           ///< 0: no limit
  long stallGenerations = 400;    ///< stop after this many generations without improvement; 0: never
  double targetSoft = 0;          ///< stop once a roster has no hard penalty and at most this soft penalty (points)
  std::uint64_t seed = 0;         ///< 0: pick one from the clock (the one used is reported)
  int threads = 0;                ///< 0: all cores
  int islands = 0;                ///< 0: one per thread, at least kMinIslands
  int population = 8;             ///< per island
  int elite = 2;
  Selection selection = Selection::Tournament;
  int tournamentSize = 3;
  double crossoverRate = 0.9;
  double blockCrossoverShare = 0.5;  ///< share of crossovers that exchange a block of days
  double mutationRate = 0.01;        ///< per cell
  int localSearchMoves = 100000;     ///< moves tried on each offspring (late acceptance)
  int chainInterval = 300;           ///< local-search moves between ejection chains; 0: none
  int refitInterval = 0;             ///< local-search moves between refit chains; 0: none
  int refitPasses = 1;               ///< rounds of answering re-fits by everyone else in a refit chain
  int lagrangianRounds = 1000;       ///< subgradient rounds for starting rosters from priced cover; 0: none
  int lagrangianStarts = 4;          ///< of its rosters, how many join every island's first population
  double columnShare = 0.35;         ///< of the time limit, for column generation after the rounds; 0: none
  double hardWeightFloor = 100;      ///< least soft points a hard point counts for while searching
  int migrationInterval = 8;         ///< generations between migrations
  int migrants = 2;
  bool quiet = false;
};

/// One tunable parameter: name as on the command line, help text, bounds and default.
struct ParameterInfo {
  const char* name;
  const char* help;
  double min, max;
  double defaultValue;
  bool integer;
};

/// Numeric parameters of SolverOptions, in display order.
const std::vector<ParameterInfo>& parameterTable();
/// Sets a numeric parameter by name after checking its bounds; throws std::invalid_argument
/// with a message naming the value and the allowed range.
void setParameter(SolverOptions& options, const std::string& name, double value);
/// Parses tournament, rank, sus or roulette; throws std::invalid_argument otherwise.
Selection parseSelection(const std::string& text);
const char* selectionName(Selection s);

}  // namespace rotaweave::search
