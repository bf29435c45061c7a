/// @brief changes.csv: the cells a re-plan changed against the published roster, with reasons.
#pragma once
#include <string>

#include "io/output_writer.hpp"
#include "report/changes.hpp"

namespace rotaweave::io {

/// Header `person,date,was,now,reason`, one row per changed cell in staff then date order;
/// `was` and `now` are a shift id (or SHIFT/skill) or `off`.
std::string changesCsvText(const report::ChangeSummary& changes, const model::Problem& problem);

/// Writes changes.csv when the report carries changes (replan); writes nothing otherwise.
class ChangesCsvWriter final : public OutputWriter {
 public:
  void write(const std::filesystem::path& dir, const OutputBundle& bundle) const override;
};

}  // namespace rotaweave::io
