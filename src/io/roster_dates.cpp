/// @brief Reading header dates written day-first, month-first or ISO, settled by the period.
#include "io/roster_dates.hpp"

#include <cctype>
#include <cstdio>

#include "io/csv.hpp"

namespace rotaweave::io {
namespace {

/// Splits "a<sep>b<sep>c" into three runs of digits; false unless exactly that shape.
bool splitNumbers(std::string_view t, int (&value)[3], int (&digits)[3], char& sep) {
  int part = 0;
  value[0] = value[1] = value[2] = 0;
  digits[0] = digits[1] = digits[2] = 0;
  sep = 0;
  for (char c : t) {
    if (std::isdigit(static_cast<unsigned char>(c))) {
      if (digits[part] >= 4) return false;
      value[part] = value[part] * 10 + (c - '0');
      ++digits[part];
    } else if (c == '/' || c == '.' || c == '-') {
      if (sep && c != sep) return false;
      sep = c;
      if (++part > 2 || digits[part - 1] == 0) return false;
    } else {
      return false;
    }
  }
  return part == 2 && digits[2] > 0;
}

std::optional<model::DateSerial> civil(int y, int m, int d) {
  if (m < 1 || m > 12 || d < 1 || d > 31 || y < 1 || y > 9999) return std::nullopt;
  char buf[16];
  std::snprintf(buf, sizeof buf, "%04d-%02d-%02d", y, m, d);
  return model::parseIsoDate(buf);  // rejects 2027-02-30 and the like
}

}  // namespace

DateReadings readDateText(std::string_view raw) {
  DateReadings r;
  const std::string text = trimCell(std::string(raw));
  if (const auto iso = model::parseIsoDate(text)) {
    r.dayFirst = iso;
    return r;
  }
  int v[3], n[3];
  char sep = 0;
  if (!splitNumbers(text, v, n, sep)) return r;
  if (n[0] == 4) {  // year first: 2027/03/01
    if (n[1] <= 2 && n[2] <= 2) r.dayFirst = civil(v[0], v[1], v[2]);
    return r;
  }
  if (n[0] > 2 || n[1] > 2 || (n[2] != 2 && n[2] != 4)) return r;
  const int year = n[2] == 2 ? 2000 + v[2] : v[2];
  r.numeric = true;
  r.dayFirst = civil(year, v[1], v[0]);
  r.monthFirst = civil(year, v[0], v[1]);
  return r;
}

HeaderDates resolveHeaderDates(const std::vector<std::string>& cells, model::DateSerial first, model::DateSerial last) {
  HeaderDates out;
  out.dates.resize(cells.size());
  std::vector<DateReadings> readings(cells.size());
  auto inside = [&](const std::optional<model::DateSerial>& d) { return d && *d >= first && *d <= last; };
  // Does every D/M/Y cell read as a date of the period in this order?
  bool dayFits = true, monthFits = true;
  for (size_t i = 0; i < cells.size(); ++i) {
    readings[i] = readDateText(cells[i]);
    if (!readings[i].numeric) continue;
    if (!inside(readings[i].dayFirst)) dayFits = false;
    if (!inside(readings[i].monthFirst)) monthFits = false;
  }
  for (size_t i = 0; i < cells.size(); ++i) {
    const DateReadings& r = readings[i];
    if (!r.numeric) {
      out.dates[i] = r.dayFirst;
      continue;
    }
    if (dayFits && monthFits) {
      if (*r.dayFirst != *r.monthFirst && out.ambiguousCell < 0) {
        out.ambiguousCell = static_cast<int>(i);
        out.error = "the date '" + trimCell(cells[i]) + "' reads as " + model::formatIsoDate(*r.dayFirst) + " (day first) or " +
                    model::formatIsoDate(*r.monthFirst) + " (month first), and both readings fit the period " +
                    model::formatIsoDate(first) + " to " + model::formatIsoDate(last) +
                    "; write the header dates as YYYY-MM-DD (e.g. " + model::formatIsoDate(first) + ") so they cannot be misread";
      }
      out.dates[i] = r.dayFirst;
    } else if (dayFits) {
      out.dates[i] = r.dayFirst;
    } else if (monthFits) {
      out.dates[i] = r.monthFirst;
    } else {
      out.dates[i] = inside(r.monthFirst) ? r.monthFirst : r.dayFirst ? r.dayFirst : r.monthFirst;
    }
  }
  return out;
}

}  // namespace rotaweave::io
