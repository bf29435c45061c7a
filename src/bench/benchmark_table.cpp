/// @brief Markdown rendering of benchmark results.
#include "bench/benchmark_table.hpp"

#include <algorithm>
#include <cstdio>

#include "bench/published_results.hpp"

namespace rotaweave::bench {
namespace {

double median(std::vector<double> values) {
  std::sort(values.begin(), values.end());
  const size_t n = values.size();
  return n % 2 ? values[n / 2] : (values[n / 2 - 1] + values[n / 2]) / 2;
}

std::string number(double value, int decimals = 4) {
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.*f", decimals, value);
  std::string s = buf;
  if (s.find('.') != std::string::npos) {
    while (s.back() == '0') s.pop_back();
    if (s.back() == '.') s.pop_back();
  }
  return s == "-0" ? "0" : s;
}

/// "607" when every seed agrees, else "median (least–most)".
std::string spread(const std::vector<double>& values) {
  if (values.empty()) return "–";
  const auto [least, most] = std::minmax_element(values.begin(), values.end());
  if (*least == *most) return number(*least);
  return number(median(values)) + " (" + number(*least) + "–" + number(*most) + ")";
}

}  // namespace

std::string markdownTable(const std::vector<TableRow>& rows) {
  std::string out =
      "| instance | size (staff x days x shift types) | hard | soft median (range) | wall median s | best known | "
      "best published 10 min | gap of median to best known % |\n"
      "|---|---|---|---|---|---|---|---|\n";
  for (const TableRow& row : rows) {
    std::vector<double> hard, soft, wall;
    for (const TableRun& run : row.runs) {
      wall.push_back(run.wallSeconds);
      if (!run.scored) continue;
      hard.push_back(run.hard);
      soft.push_back(run.soft);
    }
    const PublishedResult* published = publishedResult(row.instance);
    const bool comparable = published && !soft.empty() && soft.size() == row.runs.size() &&
                            std::all_of(hard.begin(), hard.end(), [](double h) { return h == 0; });
    const std::string gap =
        comparable ? number(100.0 * (median(soft) - published->bestUpper) / published->bestUpper, 1) : "–";
    out += "| " + std::to_string(row.instance) + " | " + row.size + " | " + spread(hard) + " | " + spread(soft) +
           " | " + (wall.empty() ? "–" : number(median(wall), 1)) + " | " +
           (published ? std::to_string(published->bestUpper) : "–") + " | " +
           (published ? std::to_string(published->tenMinutes) : "–") + " | " + gap + " |\n";
  }
  return out;
}

}  // namespace rotaweave::bench
