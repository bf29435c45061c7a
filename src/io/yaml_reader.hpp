/// @brief Typed, validated access to a YAML document, with errors that name file, line and key path.
#pragma once
#include <string>
#include <vector>

#include <yaml-cpp/yaml.h>

#include "io/input_error.hpp"
#include "model/calendar.hpp"
#include "model/types.hpp"

namespace rotaweave::io {

/// A node and where it came from ("staff[2].requests[0].date" in "ward.yaml").
class Field {
 public:
  Field(YAML::Node node, std::string path, const std::string* file, YAML::Mark fallback = YAML::Mark::null_mark())
      : node_(std::move(node)), path_(std::move(path)), file_(file), fallback_(fallback) {}

  /// Reads and parses a whole file; rejects empty files, bad UTF-8 and YAML syntax errors.
  static YAML::Node parseFile(const std::string& file);

  const std::string& path() const { return path_; }
  const std::string& file() const { return *file_; }
  const YAML::Node& node() const { return node_; }
  bool isMap() const { return node_.IsMap(); }
  bool isSequence() const { return node_.IsSequence(); }
  bool isScalar() const { return node_.IsScalar(); }
  bool has(const char* key) const { return node_.IsMap() && node_[key]; }

  /// Child of a map; fails if missing. get() is optional access: check has() first.
  Field require(const char* key) const;
  Field get(const char* key) const;
  /// Elements of a sequence (fails if not a sequence).
  std::vector<Field> items() const;
  /// Map entries in file order (fails if not a map or on a duplicate key).
  std::vector<std::pair<std::string, Field>> entries() const;
  /// Fails on any key not in `allowed`, suggesting the closest allowed key.
  void allowOnly(const std::vector<std::string>& allowed) const;

  std::string text() const;  ///< A non-empty scalar.
  std::string id() const;    ///< An identifier: letters, digits, '-', '_', '.'.
  int integer(int min, int max) const;
  double number(double min, double max) const;
  bool boolean() const;
  Cost weight() const;  ///< >= 0, at most 2 decimals, in hundredths.
  int minutesFromHours(double min, double max) const;  ///< Hours given as a number, whole minutes.
  model::DateSerial date() const;
  int clockTime() const;

  [[noreturn]] void fail(const std::string& message) const;
  /// Fails if `value` (this node's text) holds a control character (see io/control_chars.hpp).
  void rejectControl(const std::string& value) const;

 private:
  YAML::Node node_;
  std::string path_;
  const std::string* file_;
  YAML::Mark fallback_;  ///< Where to point when the node itself has no position (a missing key).
};

}  // namespace rotaweave::io
