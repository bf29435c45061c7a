/// @brief Progress on stderr during a search: one updating line on a terminal, a plain line
/// every few seconds otherwise, nothing with --quiet; then a short final summary.
#pragma once
#include "search/solver.hpp"

namespace rotaweave::app {

class ProgressPrinter {
 public:
  explicit ProgressPrinter(bool quiet);
  void operator()(const search::Progress& p);
  void finish(const search::SolveResult& result) const;

 private:
  bool quiet_, terminal_;
  double lastPrinted_ = -1e9;
};

}  // namespace rotaweave::app
