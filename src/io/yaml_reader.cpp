/// @brief Field: typed YAML access and validation messages.
#include "io/yaml_reader.hpp"

#include <cmath>
#include <fstream>
#include <iomanip>
#include <set>
#include <sstream>

#include <yaml-cpp/depthguard.h>

#include "io/control_chars.hpp"
#include "io/input_limits.hpp"

namespace rotaweave::io {
namespace {


std::string quoted(const std::string& s) { return "'" + s + "'"; }

}  // namespace

YAML::Node Field::parseFile(const std::string& file) {
  // Size first (from the file system), then the number of nodes and people (from the parser's
  // events, without a tree), and only then the whole file and its tree.
  checkInputSize(file, "file");
  checkYamlShape(file);
  const std::string text = readInputFile(file, "file");
  if (text.find_first_not_of(" \t\r\n") == std::string::npos)
    throw InputError(file, 0, 0, "the file is empty; a scenario needs at least period, shifts, skills and staff, "
                                 "a rule file a list: of rules");
  if (const int line = badUtf8Line(text))
    throw InputError(file, line, 0, "the file is not valid UTF-8; save it as UTF-8 text");
  rejectControlChars(text, file);
  try {
    return YAML::Load(text);
  } catch (const YAML::DeepRecursion& e) {
    throw InputError(file, e.mark.line + 1, e.mark.column + 1,
                     "YAML nested too deeply (brackets or indentation more than " + std::to_string(e.depth()) +
                         " levels); a scenario needs only a few levels");
  } catch (const YAML::Exception& e) {
    throw InputError(file, e.mark.line + 1, e.mark.column + 1,
                     "YAML syntax error: " + e.msg + "; check brackets, quotes and indentation (spaces, not tabs) here or just above");
  }
}

void Field::fail(const std::string& message) const {
  YAML::Mark m = node_.Mark();
  if (m.is_null()) m = fallback_;
  const bool known = !m.is_null();
  throw InputError(*file_, known ? m.line + 1 : 0, known ? m.column + 1 : 0,
                   (path_.empty() ? std::string() : path_ + ": ") + message);
}

Field Field::get(const char* key) const {
  const YAML::Node& n = node_;
  const std::string path = path_.empty() ? key : path_ + "." + key;
  if (!n.IsMap() || !n[key]) return Field(YAML::Node(), path, file_, node_.Mark());
  return Field(n[key], path, file_);
}

Field Field::require(const char* key) const {
  if (!node_.IsMap()) fail("expected a map with key '" + std::string(key) + "'");
  const YAML::Node& n = node_;
  if (!n[key]) fail("missing required key '" + std::string(key) + "'");
  return get(key);
}

std::vector<Field> Field::items() const {
  if (!node_.IsSequence()) fail("expected a list ([...] or '- ' items)");
  std::vector<Field> out;
  size_t i = 0;
  for (const auto& item : node_) out.emplace_back(item, path_ + "[" + std::to_string(i++) + "]", file_);
  return out;
}

std::vector<std::pair<std::string, Field>> Field::entries() const {
  if (!node_.IsMap()) fail("expected a map (key: value entries)");
  std::vector<std::pair<std::string, Field>> out;
  std::set<std::string> seen;
  for (const auto& kv : node_) {
    const std::string key = kv.first.Scalar();
    Field keyField(kv.first, path_, file_);
    keyField.rejectControl(key);
    if (!seen.insert(key).second) keyField.fail("duplicate key " + quoted(key) + "; each key may appear once");
    out.emplace_back(key, Field(kv.second, path_.empty() ? key : path_ + "." + key, file_));
  }
  return out;
}

void Field::allowOnly(const std::vector<std::string>& allowed) const {
  for (const auto& [key, value] : entries()) {
    bool ok = false;
    for (const auto& a : allowed) ok = ok || a == key;
    if (ok) continue;
    std::string list;
    for (const auto& a : allowed) list += (list.empty() ? "" : ", ") + a;
    const std::string message = "unknown key " + quoted(key) + didYouMean(key, allowed) + "; allowed keys: " + list;
    // Point at the key itself. (Never assign one YAML::Node to another here: that rewrites
    // the node's content, which would free the map being iterated.)
    for (const auto& kv : node_)
      if (kv.first.Scalar() == key) Field(kv.first, path_, file_).fail(message);
    fail(message);
  }
}

std::string Field::text() const {
  if (!node_.IsScalar() || node_.Scalar().empty()) fail("expected a non-empty text value");
  rejectControl(node_.Scalar());
  return node_.Scalar();
}

void Field::rejectControl(const std::string& value) const {
  // Raw control bytes are refused before parsing; these come from escapes ("\0", "\x07").
  if (const auto found = findControlChar(value))
    fail("control character " + codePointName(found->code) + " in this value (from an escape such as \\0); names, ids "
         "and other text may hold printable characters only: remove it");
}

std::string Field::id() const {
  const std::string s = text();
  for (char c : s)
    if (!(std::isalnum(static_cast<unsigned char>(c)) || c == '-' || c == '_' || c == '.'))
      fail("id " + quoted(s) + " may contain only letters, digits, '-', '_' and '.'");
  if (s == "off") fail("'off' is reserved for a day off and cannot be an id");
  return s;
}

double Field::number(double min, double max) const {
  const std::string s = text();
  double v = 0;
  size_t used = 0;
  try {
    v = std::stod(s, &used);
  } catch (const std::exception&) {
    used = 0;
  }
  if (used != s.size() || !std::isfinite(v)) fail("expected a number, found " + quoted(s));
  if (v < min || v > max) {
    std::ostringstream msg;
    msg << std::setprecision(15) << "value " << s << " is out of range; expected " << min << " to " << max;
    fail(msg.str());
  }
  return v;
}

int Field::integer(int min, int max) const {
  const double v = number(min, max);
  if (v != std::floor(v)) fail("expected a whole number, found " + text());
  return static_cast<int>(v);
}

bool Field::boolean() const {
  const std::string s = text();
  if (s == "true" || s == "yes") return true;
  if (s == "false" || s == "no") return false;
  fail("expected true or false, found " + quoted(s));
}

Cost Field::weight() const {
  const double v = number(0, 1e6);
  const double hundredths = v * 100.0;
  if (std::fabs(hundredths - std::round(hundredths)) > 1e-6) fail("a weight may have at most 2 decimals");
  return static_cast<Cost>(std::llround(hundredths));
}

int Field::minutesFromHours(double min, double max) const {
  const double v = number(min, max);
  const double minutes = v * 60.0;
  if (std::fabs(minutes - std::round(minutes)) > 1e-6) fail("hours must come to a whole number of minutes");
  return static_cast<int>(std::lround(minutes));
}

model::DateSerial Field::date() const {
  const std::string s = text();
  auto d = model::parseIsoDate(s);
  if (!d) fail("invalid date " + quoted(s) + "; write an existing date as YYYY-MM-DD, e.g. 2027-03-01");
  return *d;
}

int Field::clockTime() const {
  const std::string s = text();
  auto t = model::parseClockTime(s);
  if (!t) fail("invalid time " + quoted(s) + "; write HH:MM from 00:00 to 24:00, in quotes, e.g. \"07:00\"");
  return *t;
}

}  // namespace rotaweave::io
