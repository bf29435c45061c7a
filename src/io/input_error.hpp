/// @brief Errors in user input: file, line, column and a message that says how to fix it.
#pragma once
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

namespace rotaweave::io {

class InputError : public std::runtime_error {
 public:
  InputError(std::string file, int line, int column, const std::string& message)
      : std::runtime_error(format(file, line, column, message)), file_(std::move(file)), line_(line), column_(column) {}
  const std::string& file() const { return file_; }
  int line() const { return line_; }      ///< 1-based; 0 if unknown.
  int column() const { return column_; }  ///< 1-based; 0 if unknown.

 private:
  static std::string format(const std::string& file, int line, int column, const std::string& message);
  std::string file_;
  int line_, column_;
};

/// An output that cannot be written (exit status 2, like bad input).
class OutputError : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

/// 1-based line of the first byte of `text` that is not valid UTF-8, or 0 if all is valid.
int badUtf8Line(std::string_view text);

/// The closest candidate within a small edit distance, or "" if none is close.
std::string closestMatch(const std::string& word, const std::vector<std::string>& candidates);
/// " (did you mean 'x'?)" or "".
std::string didYouMean(const std::string& word, const std::vector<std::string>& candidates);

}  // namespace rotaweave::io
