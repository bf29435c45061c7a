/// @brief JSON line building.
#include "bench/json_line.hpp"

#include <cmath>
#include <cstdio>

#include "io/report_json.hpp"

namespace rotaweave::bench {

JsonLine& JsonLine::key(const char* key) {
  if (body_.size() > 1) body_ += ", ";
  body_ += io::jsonString(key) + ": ";
  return *this;
}

JsonLine& JsonLine::text(const char* name, const std::string& value) {
  key(name).body_ += io::jsonString(value);
  return *this;
}

JsonLine& JsonLine::number(const char* name, double value, int decimals) {
  if (!std::isfinite(value)) return raw(name, "null");
  char buf[64];
  if (decimals < 0)
    std::snprintf(buf, sizeof buf, "%.12g", value);
  else
    std::snprintf(buf, sizeof buf, "%.*f", decimals, value);
  return raw(name, buf);
}

JsonLine& JsonLine::integer(const char* name, long long value) { return raw(name, std::to_string(value)); }

JsonLine& JsonLine::boolean(const char* name, bool value) { return raw(name, value ? "true" : "false"); }

JsonLine& JsonLine::raw(const char* name, const std::string& json) {
  key(name).body_ += json;
  return *this;
}

void JsonLine::print() const {
  std::printf("%s\n", str().c_str());
  std::fflush(stdout);
}

std::string phasesJson(const std::vector<search::PhaseTime>& phases) {
  JsonLine line;
  for (const auto& phase : phases) line.number(phase.name, phase.seconds, 2);
  return line.str();
}

}  // namespace rotaweave::bench
