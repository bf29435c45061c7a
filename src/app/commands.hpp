/// @brief The three use cases behind the CLI: check, solve and replan.
///
/// Each loads and validates all input first, so bad input writes nothing, then computes,
/// then writes the outputs as one set (io/output_folder.hpp), into an --out checked and locked
/// before anything was read. Errors are thrown (io::InputError, io::OutputError).
#pragma once
#include <chrono>
#include <filesystem>
#include <memory>
#include <string>
#include <vector>

#include "report/report.hpp"
#include "search/solver_options.hpp"

namespace rotaweave::io {
struct CalendarHistory;
}

namespace rotaweave::app {

struct Outcome {
  report::Report report;
  int exitCode = 0;  ///< 0: no hard breach; 1: hard breaches remain.
};

/// `baseline` (may be empty): the roster `roster` was edited from, read the same way; the
/// report then says which cells changed and which breaches are new or gone.
Outcome check(const std::string& scenario, const std::string& roster, const std::filesystem::path& out,
              const std::string& baseline = "");

struct SolveRequest {
  std::string scenario;
  std::filesystem::path out = "out";
  search::SolverOptions options;
  /// When the run began: the time limit counts from here, loading and writing included.
  std::chrono::steady_clock::time_point startedAt = std::chrono::steady_clock::now();
  /// replan: the calendars published with the roster it starts from, read before the search.
  std::shared_ptr<const io::CalendarHistory> previousCalendars = nullptr;
};
Outcome solve(const SolveRequest& request);

struct ReplanRequest {
  SolveRequest solve;
  std::string publishedRoster;
  std::string from;                   ///< YYYY-MM-DD
  std::vector<std::string> absences;  ///< STAFF:DATE or STAFF:DATE..DATE
};
Outcome replan(const ReplanRequest& request);

}  // namespace rotaweave::app
