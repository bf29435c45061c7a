/// @brief One interface for every output format; each writer formats the same report value.
#pragma once
#include <filesystem>
#include <memory>
#include <vector>

#include "model/problem.hpp"
#include "model/roster.hpp"
#include "report/report.hpp"

namespace rotaweave::io {

struct CalendarHistory;

/// Everything an output needs; all formats read this one bundle, so they agree.
struct OutputBundle {
  const model::Problem& problem;
  const model::Roster& roster;
  const report::Report& report;
  /// The calendars published with the roster a replan started from, where found; else null.
  const CalendarHistory* previousCalendars = nullptr;
};

class OutputWriter {
 public:
  virtual ~OutputWriter() = default;
  /// Writes this format's file(s) into `dir` atomically; throws OutputError on failure.
  virtual void write(const std::filesystem::path& dir, const OutputBundle& bundle) const = 0;
};

/// The writers of the standard output set: roster.csv, report.json, report.txt, roster.xlsx, calendars/.
std::vector<std::unique_ptr<OutputWriter>> standardWriters();

/// Creates `dir` and runs every standard writer.
void writeStandardOutputs(const std::filesystem::path& dir, const OutputBundle& bundle);

}  // namespace rotaweave::io
