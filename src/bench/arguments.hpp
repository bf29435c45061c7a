/// @brief Command-line reading for the bench modes: `--name value` options among positional
/// arguments, and the lists they take ("5,10,60", "1-24", "1,3,5-8").
/// Every function throws std::invalid_argument with a message naming the bad text.
#pragma once
#include <map>
#include <optional>
#include <string>
#include <vector>

namespace rotaweave::bench {

class Arguments {
 public:
  /// `valued`: the options this mode knows, each followed by one value (without the "--").
  /// `flags`: the options it knows that take no value.
  Arguments(const std::vector<std::string>& args, const std::vector<std::string>& valued,
            const std::vector<std::string>& flags = {});

  const std::vector<std::string>& positional() const { return positional_; }
  bool has(const std::string& name) const { return values_.count(name) > 0; }
  std::optional<std::string> value(const std::string& name) const;
  double number(const std::string& name, double fallback) const;
  long integer(const std::string& name, long fallback) const;

 private:
  std::map<std::string, std::string> values_;
  std::vector<std::string> positional_;
};

/// A whole number, all of `text`; `what` names it in the message.
long wholeNumber(const std::string& text, const std::string& what);
/// "5,10,60" -> {5, 10, 60}; every entry a number of at least zero.
std::vector<double> numberList(const std::string& text, const std::string& what);
/// "1-24" or "1,3,5-8" -> whole numbers in that order; every entry at least one.
std::vector<long> rangeList(const std::string& text, const std::string& what);

}  // namespace rotaweave::bench
