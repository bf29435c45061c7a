/// @brief One JSON object on one line, built field by field: every bench mode prints its
/// results this way so that scripts can read them line by line.
#pragma once
#include <string>
#include <vector>

#include "search/solver.hpp"

namespace rotaweave::bench {

class JsonLine {
 public:
  JsonLine& text(const char* key, const std::string& value);
  /// A number with `decimals` places, or as short as it goes exactly (up to 12 digits) when
  /// `decimals` is negative; NaN and infinities print as null.
  JsonLine& number(const char* key, double value, int decimals);
  JsonLine& integer(const char* key, long long value);
  JsonLine& boolean(const char* key, bool value);
  /// Already valid JSON: a nested object, penalty points as report::pointsText prints them, null.
  JsonLine& raw(const char* key, const std::string& json);
  std::string str() const { return body_ + "}"; }
  /// Prints the line on stdout and flushes it, so a long run shows each result as it comes.
  void print() const;

 private:
  JsonLine& key(const char* key);
  std::string body_ = "{";
};

/// {"starts": 1.23, "populations": 0.45, "generations": 6.78}, in the order the phases ran.
std::string phasesJson(const std::vector<search::PhaseTime>& phases);

}  // namespace rotaweave::bench
