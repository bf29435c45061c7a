/// @brief Input size limits: the file-size cap, a streaming count of roster CSV rows and cells,
/// and a count of YAML nodes and people from the parser's events, before any tree is built.
#include "io/input_limits.hpp"

#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

#include <cerrno>
#include <algorithm>
#include <cstring>
#include <fstream>
#include <vector>

#include <yaml-cpp/eventhandler.h>
#include <yaml-cpp/exceptions.h>
#include <yaml-cpp/mark.h>
#include <yaml-cpp/parser.h>

#include "io/input_error.hpp"

namespace rotaweave::io {
namespace {

std::string megabytes(std::uintmax_t bytes) { return std::to_string((bytes + (1 << 20) - 1) >> 20) + " MB"; }

[[noreturn]] void tooLarge(const std::string& path, const std::string& what, const std::string& size) {
  throw InputError(path, 0, 0,
                   "the " + what + " is " + size + "; at most " + megabytes(kMaxInputBytes) +
                       " is read (a scenario or roster for 5,000 people is far smaller): check that this is the right file");
}

/// Closes a file descriptor on every path out.
struct Fd {
  int fd;
  ~Fd() {
    if (fd >= 0) ::close(fd);
  }
};

}  // namespace

void checkInputSize(const std::string& path, const std::string& what) {
  struct stat st{};
  if (::stat(path.c_str(), &st) != 0) return;  // the reader says it cannot open it
  if (S_ISREG(st.st_mode) && static_cast<std::uintmax_t>(st.st_size) > kMaxInputBytes)
    tooLarge(path, what, megabytes(static_cast<std::uintmax_t>(st.st_size)));
}

std::string readInputFile(const std::string& path, const std::string& what) {
  const Fd file{::open(path.c_str(), O_RDONLY | O_CLOEXEC)};
  if (file.fd < 0)
    throw InputError(path, 0, 0, "cannot open the " + what + " (" + std::strerror(errno) + "); check the path and that it is readable");
  struct stat st{};
  if (::fstat(file.fd, &st) != 0) throw InputError(path, 0, 0, "cannot read the " + what + ": " + std::strerror(errno));
  if (S_ISDIR(st.st_mode)) throw InputError(path, 0, 0, "cannot open the " + what + ": this is a folder; give the file inside it");
  if (S_ISREG(st.st_mode) && static_cast<std::uintmax_t>(st.st_size) > kMaxInputBytes)
    tooLarge(path, what, megabytes(static_cast<std::uintmax_t>(st.st_size)));
  std::string text;
  if (S_ISREG(st.st_mode)) text.reserve(static_cast<size_t>(st.st_size));
  std::vector<char> buffer(1 << 16);
  for (;;) {
    const ssize_t n = ::read(file.fd, buffer.data(), buffer.size());
    if (n < 0 && errno == EINTR) continue;
    if (n < 0) throw InputError(path, 0, 0, "cannot read the " + what + ": " + std::strerror(errno));
    if (n == 0) break;
    text.append(buffer.data(), static_cast<size_t>(n));
    if (text.size() > kMaxInputBytes) tooLarge(path, what, "larger than " + megabytes(kMaxInputBytes));
  }
  return text;
}

CsvShape measureCsv(std::istream& in, size_t maxRows, size_t maxCells) {
  CsvShape shape;
  size_t cells = 1;
  int line = 1;
  bool quoted = false, quoteInQuoted = false, value = false, afterCr = false;
  shape.line = 1;
  auto endRow = [&] {
    // parseCsv drops a row of one empty cell (a blank line).
    if (cells > 1 || value) {
      ++shape.rows;
      shape.widest = std::max(shape.widest, cells);
      if (shape.rows > maxRows) shape.stopped = true;
    }
    cells = 1;
    value = false;
    if (!shape.stopped) shape.line = line;
  };
  std::vector<char> buffer(1 << 16);
  while (in && !shape.stopped) {
    in.read(buffer.data(), static_cast<std::streamsize>(buffer.size()));
    const auto n = static_cast<size_t>(in.gcount());
    for (size_t i = 0; i < n && !shape.stopped; ++i) {
      const char c = buffer[i];
      if (quoted) {
        if (quoteInQuoted) {
          quoteInQuoted = false;
          if (c == '"') {  // "" inside quotes: one quote in the value
            value = true;
            continue;
          }
          quoted = false;  // the quote closed the cell: read c as unquoted
        } else {
          if (c == '"') {
            quoteInQuoted = true;
          } else {
            value = true;
            if (c == '\n') ++line;
          }
          continue;
        }
      }
      const bool lfAfterCr = c == '\n' && afterCr;
      afterCr = c == '\r';
      if (lfAfterCr) continue;  // the \n of \r\n
      if (c == '\n' || c == '\r') {
        ++line;
        endRow();
      } else if (c == '"' && !value) {
        quoted = true;
      } else if (c == ',') {
        value = false;
        if (++cells > maxCells) {
          shape.widest = cells;
          shape.stopped = true;
        }
      } else {
        value = true;
      }
    }
  }
  if (!shape.stopped) endRow();
  return shape;
}

void checkRosterCsvShape(const std::string& path, size_t staff, int days) {
  checkInputSize(path, "roster file");
  std::ifstream in(path, std::ios::binary);
  if (!in) return;  // the reader says it cannot open it
  const size_t maxRows = staff + kSpareCsvRows;
  const size_t maxCells = static_cast<size_t>(days) + 1 + kSpareCsvCells;
  const CsvShape shape = measureCsv(in, maxRows, maxCells);
  if (shape.rows > maxRows)
    throw InputError(path, shape.line, 0,
                     "the roster has more than " + std::to_string(maxRows) + " rows but the scenario has " + std::to_string(staff) +
                         " people; a roster has a header and one row per person: check that it is the roster for this scenario");
  if (shape.widest > maxCells)
    throw InputError(path, shape.line, 0,
                     "this row has more than " + std::to_string(maxCells) + " cells but the period has " + std::to_string(days) +
                         " days; a roster row has the staff id and one cell per date");
}

namespace {

/// Counts nodes, and the items of the top-level `staff` list, as the parser reports them.
class ShapeCounter final : public YAML::EventHandler {
 public:
  explicit ShapeCounter(const std::string& file) : file_(file) {}

  void OnDocumentStart(const YAML::Mark&) override {}
  void OnDocumentEnd() override {}
  void OnNull(const YAML::Mark& m, YAML::anchor_t) override { node(m, false); }
  void OnAlias(const YAML::Mark& m, YAML::anchor_t) override { node(m, false); }
  void OnScalar(const YAML::Mark& m, const std::string&, YAML::anchor_t, const std::string& value) override {
    // A key of the top-level map, at an even position: is it `staff`?
    const bool rootKey = open_.size() == 1 && open_[0].map && open_[0].children % 2 == 0;
    node(m, false);
    staffNext_ = rootKey && value == "staff";
  }
  void OnSequenceStart(const YAML::Mark& m, const std::string&, YAML::anchor_t, YAML::EmitterStyle::value) override {
    const bool staff = staffNext_ && open_.size() == 1;
    node(m, false);
    open_.push_back({false, staff, 0});
  }
  void OnSequenceEnd() override { open_.pop_back(); }
  void OnMapStart(const YAML::Mark& m, const std::string&, YAML::anchor_t, YAML::EmitterStyle::value) override {
    node(m, true);
    open_.push_back({true, false, 0});
  }
  void OnMapEnd() override { open_.pop_back(); }

 private:
  struct Open {
    bool map, staff;
    size_t children;
  };

  void node(const YAML::Mark& m, bool) {
    staffNext_ = false;
    if (++nodes_ > kMaxYamlNodes)
      throw InputError(file_, m.line + 1, m.column + 1,
                       "more than " + std::to_string(kMaxYamlNodes) +
                           " YAML values, lists and maps; a scenario for 5,000 people needs far fewer: check that this is the right file");
    if (open_.empty()) return;
    Open& parent = open_.back();
    ++parent.children;
    if (parent.staff && parent.children > kMaxStaff)
      throw InputError(file_, m.line + 1, m.column + 1,
                       "staff: more than " + std::to_string(kMaxStaff) + " people; at most " + std::to_string(kMaxStaff) +
                           " are supported: split the roster by unit");
  }

  const std::string& file_;
  std::vector<Open> open_;
  size_t nodes_ = 0;
  bool staffNext_ = false;
};

}  // namespace

void checkYamlShape(const std::string& path) {
  checkInputSize(path, "file");
  std::ifstream in(path, std::ios::binary);
  if (!in) return;  // the reader says it cannot open it
  ShapeCounter counter(path);
  try {
    YAML::Parser parser(in);
    parser.HandleNextDocument(counter);
  } catch (const YAML::Exception&) {
    // Syntax errors (and nesting too deep) are reported by the full parse, with its message.
  }
}

}  // namespace rotaweave::io
