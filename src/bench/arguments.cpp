/// @brief Option and list reading.
#include "bench/arguments.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>

namespace rotaweave::bench {
namespace {

bool listed(const std::vector<std::string>& names, const std::string& name) {
  return std::find(names.begin(), names.end(), name) != names.end();
}

std::vector<std::string> split(const std::string& text, char by) {
  std::vector<std::string> parts;
  size_t from = 0;
  while (true) {
    const size_t at = text.find(by, from);
    parts.push_back(text.substr(from, at == std::string::npos ? std::string::npos : at - from));
    if (at == std::string::npos) return parts;
    from = at + 1;
  }
}

double realNumber(const std::string& text, const std::string& what) {
  size_t used = 0;
  double value = 0;
  try {
    value = std::stod(text, &used);
  } catch (const std::exception&) {
    used = 0;
  }
  if (used == 0 || used != text.size() || !std::isfinite(value) || value < 0)
    throw std::invalid_argument(what + ": expected a number of at least 0, got '" + text + "'");
  return value;
}

}  // namespace

Arguments::Arguments(const std::vector<std::string>& args, const std::vector<std::string>& valued,
                     const std::vector<std::string>& flags) {
  for (size_t i = 0; i < args.size(); ++i) {
    if (args[i].rfind("--", 0) != 0) {
      positional_.push_back(args[i]);
      continue;
    }
    const std::string name = args[i].substr(2);
    if (listed(flags, name)) {
      values_[name] = "";
    } else if (listed(valued, name)) {
      if (i + 1 == args.size()) throw std::invalid_argument("--" + name + " needs a value");
      values_[name] = args[++i];
    } else {
      throw std::invalid_argument("unknown option '" + args[i] + "'");
    }
  }
}

std::optional<std::string> Arguments::value(const std::string& name) const {
  const auto it = values_.find(name);
  if (it == values_.end()) return std::nullopt;
  return it->second;
}

double Arguments::number(const std::string& name, double fallback) const {
  const auto text = value(name);
  return text ? realNumber(*text, "--" + name) : fallback;
}

long Arguments::integer(const std::string& name, long fallback) const {
  const auto text = value(name);
  return text ? wholeNumber(*text, "--" + name) : fallback;
}

long wholeNumber(const std::string& text, const std::string& what) {
  const bool digits = !text.empty() && text.size() < 10 &&
                      std::all_of(text.begin(), text.end(), [](unsigned char c) { return c >= '0' && c <= '9'; });
  if (!digits) throw std::invalid_argument(what + ": expected a whole number, got '" + text + "'");
  return std::stol(text);
}

std::vector<double> numberList(const std::string& text, const std::string& what) {
  std::vector<double> values;
  for (const auto& part : split(text, ',')) values.push_back(realNumber(part, what));
  return values;
}

std::vector<long> rangeList(const std::string& text, const std::string& what) {
  std::vector<long> values;
  for (const auto& part : split(text, ',')) {
    const auto ends = split(part, '-');
    if (ends.size() > 2) throw std::invalid_argument(what + ": expected N or N-M, got '" + part + "'");
    const long from = wholeNumber(ends.front(), what), to = wholeNumber(ends.back(), what);
    if (from < 1 || to < from) throw std::invalid_argument(what + ": expected 1 <= N <= M, got '" + part + "'");
    for (long v = from; v <= to; ++v) values.push_back(v);
  }
  return values;
}

}  // namespace rotaweave::bench
