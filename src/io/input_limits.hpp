/// @brief Size limits on input, checked while reading and before any large structure is built.
///
/// A wrong file (a database export, a log, a generated list of a million people) is refused
/// within a second and a few megabytes of memory, with exit status 2, instead of being parsed
/// into gigabytes first. The limits are far above any real ward or site.
#pragma once
#include <cstddef>
#include <cstdint>
#include <istream>
#include <string>

namespace rotaweave::io {

/// Largest input file read: scenario, included rule file or roster CSV.
inline constexpr std::uintmax_t kMaxInputBytes = std::uintmax_t{64} << 20;
/// People in one scenario.
inline constexpr size_t kMaxStaff = 5000;
/// YAML nodes (scalars, lists and maps) in one file; a 5,000-person scenario with a dozen
/// requests and absences each has about 150,000, and yaml-cpp takes about 500 bytes a node.
inline constexpr size_t kMaxYamlNodes = 500'000;
/// Non-blank rows a roster CSV may have beyond one per person (the header, stray lines).
inline constexpr size_t kSpareCsvRows = 100;
/// Cells a roster CSV row may have beyond one per date and the staff column.
inline constexpr size_t kSpareCsvCells = 100;

/// Throws InputError if `path` is larger than kMaxInputBytes (`what` names it: "roster file").
/// Only the file's size is read; missing files are left to the reader.
void checkInputSize(const std::string& path, const std::string& what);

/// The whole file, read after checking its size; throws InputError if it cannot be opened, is
/// a folder or is too large (a pipe or device is read up to the limit, then refused).
std::string readInputFile(const std::string& path, const std::string& what);

/// Rows and cells of CSV text as parseCsv splits it (blank lines are not rows), counted while
/// streaming, without storing cells.
struct CsvShape {
  size_t rows = 0;      ///< Rows read (up to the one that passed a limit).
  size_t widest = 0;    ///< Cells in the widest row read.
  int line = 1;         ///< Where the row over a limit starts (when stopped).
  bool stopped = false; ///< Reading stopped at a row over `maxRows` or a cell over `maxCells`.
};
CsvShape measureCsv(std::istream& in, size_t maxRows, size_t maxCells);

/// Streams a roster CSV a few kilobytes at a time and throws InputError as soon as it has more
/// than `staff` + kSpareCsvRows non-blank rows, or a row of more than `days` + 1 +
/// kSpareCsvCells cells. The size cap is checked first. Quoting follows parseCsv.
void checkRosterCsvShape(const std::string& path, size_t staff, int days);

/// Streams a YAML file's events (no document tree is built) and throws InputError as soon as
/// its top-level `staff` list has more than kMaxStaff items or the file more than
/// kMaxYamlNodes nodes. Syntax errors are left to the full parse, which reports them.
void checkYamlShape(const std::string& path);

}  // namespace rotaweave::io
