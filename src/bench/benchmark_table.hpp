/// @brief The markdown table of benchmark results over seeds: per instance, its size, hard and
/// soft (median and range over seeds), the median wall time, the published figures and the gap
/// of the median soft to the best known value.
#pragma once
#include <string>
#include <vector>

namespace rotaweave::bench {

struct TableRun {
  bool scored = false;  ///< a roster was there to score; hard and soft are meaningless otherwise
  double hard = 0, soft = 0, wallSeconds = 0;
};

struct TableRow {
  int instance = 0;
  std::string size;  ///< "staff x days x shift types"
  std::vector<TableRun> runs;
};

/// The table, header included, one line per row. The gap is left out ("–") unless every run of
/// the instance left a roster without hard breaches: a roster that breaks a hard rule does not
/// compare with a published value.
std::string markdownTable(const std::vector<TableRow>& rows);

}  // namespace rotaweave::bench
