/// @brief roster.xlsx: the roster, cover, violations and summary as one workbook.
#pragma once
#include "io/output_writer.hpp"

namespace rotaweave::io {

/// Writes `roster.xlsx` with the sheets Roster, Cover, Violations and Summary (libxlsxwriter).
/// The workbook is built under a temporary name and renamed when complete.
class XlsxWriter final : public OutputWriter {
 public:
  void write(const std::filesystem::path& dir, const OutputBundle& bundle) const override;
};

}  // namespace rotaweave::io
