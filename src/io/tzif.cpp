/// @brief The TZif reader: header, data block, footer TZ string (RFC 8536 sections 3.1-3.3).
#include "io/tzif.hpp"

#include <algorithm>
#include <cctype>
#include <limits>
#include <cstdlib>
#include <fstream>
#include <iterator>
#include <sstream>
#include <stdexcept>

namespace rotaweave::io {
namespace {

constexpr std::int64_t kDay = 86400;

std::int64_t daysFromCivil(int y, int m, int d) {
  y -= m <= 2 ? 1 : 0;
  const int era = (y >= 0 ? y : y - 399) / 400;
  const int yoe = y - era * 400;
  const int doy = (153 * (m > 2 ? m - 3 : m + 9) + 2) / 5 + d - 1;
  const int doe = yoe * 365 + yoe / 4 - yoe / 100 + doy;
  return static_cast<std::int64_t>(era) * 146097 + doe - 719468;
}

int yearOf(std::int64_t utc) {
  // Civil year of a UTC second (Howard Hinnant's algorithm, inverted for the year only).
  std::int64_t z = (utc >= 0 ? utc : utc - kDay + 1) / kDay + 719468;
  const std::int64_t era = (z >= 0 ? z : z - 146096) / 146097;
  const std::int64_t doe = z - era * 146097;
  const std::int64_t yoe = (doe - doe / 1460 + doe / 36524 - doe / 146096) / 365;
  const std::int64_t doy = doe - (365 * yoe + yoe / 4 - yoe / 100);
  const std::int64_t mp = (5 * doy + 2) / 153;
  const std::int64_t m = mp < 10 ? mp + 3 : mp - 9;
  return static_cast<int>(yoe + era * 400 + (m <= 2 ? 1 : 0));
}

bool leapYear(int y) { return (y % 4 == 0 && y % 100 != 0) || y % 400 == 0; }

/// Big-endian reads from a byte view, failing past its end.
class Bytes {
 public:
  explicit Bytes(std::string_view b) : b_(b) {}
  std::int64_t get(int width) {
    need(static_cast<size_t>(width));
    std::uint64_t v = 0;
    for (int i = 0; i < width; ++i) v = (v << 8) | static_cast<unsigned char>(b_[pos_++]);
    if (width == 4) return static_cast<std::int32_t>(static_cast<std::uint32_t>(v));
    return static_cast<std::int64_t>(v);
  }
  std::string_view take(size_t n) {
    need(n);
    const std::string_view out = b_.substr(pos_, n);
    pos_ += n;
    return out;
  }
  void skip(size_t n) { take(n); }
  std::string_view rest() const { return b_.substr(pos_); }

 private:
  void need(size_t n) const {
    if (b_.size() - pos_ < n) throw std::invalid_argument("TZif data ends early");
  }
  std::string_view b_;
  size_t pos_ = 0;
};

struct Header {
  char version = 0;
  std::int64_t isutcnt = 0, isstdcnt = 0, leapcnt = 0, timecnt = 0, typecnt = 0, charcnt = 0;
};

Header readHeader(Bytes& in) {
  if (in.take(4) != "TZif") throw std::invalid_argument("not a TZif file (no 'TZif' magic)");
  Header h;
  h.version = in.take(1)[0];
  in.skip(15);
  h.isutcnt = in.get(4), h.isstdcnt = in.get(4), h.leapcnt = in.get(4);
  h.timecnt = in.get(4), h.typecnt = in.get(4), h.charcnt = in.get(4);
  if (h.typecnt < 1 || h.typecnt > 256 || h.timecnt < 0 || h.charcnt < 0 || h.leapcnt < 0 || h.isutcnt < 0 || h.isstdcnt < 0)
    throw std::invalid_argument("TZif header counts out of range");
  return h;
}

/// Parses the footer's POSIX TZ string pieces (POSIX base definitions 8.3, with RFC 8536's
/// extensions: hours up to 167 and negative transition times).
class TzString {
 public:
  explicit TzString(std::string_view s) : s_(s) {}
  bool done() const { return i_ >= s_.size(); }
  bool peek(char c) const { return i_ < s_.size() && s_[i_] == c; }
  void expect(char c) {
    if (!peek(c)) fail();
    ++i_;
  }
  std::string name() {
    std::string out;
    if (peek('<')) {
      ++i_;
      while (i_ < s_.size() && s_[i_] != '>') out += s_[i_++];
      expect('>');
    } else {
      while (i_ < s_.size() && std::isalpha(static_cast<unsigned char>(s_[i_]))) out += s_[i_++];
    }
    if (out.size() < 3) fail();
    return out;
  }
  /// [+-]hh[:mm[:ss]] in seconds.
  std::int32_t time() {
    int sign = 1;
    if (peek('+') || peek('-')) sign = s_[i_++] == '-' ? -1 : 1;
    const int h = number();
    int m = 0, sec = 0;
    if (peek(':')) ++i_, m = number();
    if (peek(':')) ++i_, sec = number();
    if (h > 167 || m > 59 || sec > 59) fail();  // RFC 8536 section 3.3.1: hours up to 167
    return sign * (h * 3600 + m * 60 + sec);
  }
  int number() {
    if (i_ >= s_.size() || !std::isdigit(static_cast<unsigned char>(s_[i_]))) fail();
    int v = 0;
    while (i_ < s_.size() && std::isdigit(static_cast<unsigned char>(s_[i_]))) {
      v = v * 10 + (s_[i_++] - '0');
      if (v > 9999) fail();
    }
    return v;
  }
  bool startsOffset() const { return i_ < s_.size() && (std::isdigit(static_cast<unsigned char>(s_[i_])) || s_[i_] == '+' || s_[i_] == '-'); }
  [[noreturn]] void fail() const { throw std::invalid_argument("unreadable TZ string in the TZif footer: '" + std::string(s_) + "'"); }

 private:
  std::string_view s_;
  size_t i_ = 0;
};

}  // namespace

std::int64_t civilSeconds(int year, int month, int day, int seconds) { return daysFromCivil(year, month, day) * kDay + seconds; }

TimeZone TimeZone::parse(std::string name, std::string_view bytes) {
  TimeZone z;
  z.name_ = std::move(name);
  Bytes in(bytes);
  Header h = readHeader(in);
  int timeWidth = 4;
  if (h.version >= '2') {
    // Skip the version 1 block: the 64-bit block after the second header supersedes it.
    in.skip(static_cast<size_t>(h.timecnt * 5 + h.typecnt * 6 + h.charcnt + h.leapcnt * 8 + h.isstdcnt + h.isutcnt));
    h = readHeader(in);
    timeWidth = 8;
  }
  // Counts beyond the bytes left are a damaged file: refuse before allocating for them.
  if (static_cast<std::uint64_t>(h.timecnt) * static_cast<std::uint64_t>(timeWidth + 1) > in.rest().size())
    throw std::invalid_argument("TZif data ends early");
  z.times_.resize(static_cast<size_t>(h.timecnt));
  for (auto& t : z.times_) t = in.get(timeWidth);
  z.typeIndex_.resize(static_cast<size_t>(h.timecnt));
  for (auto& i : z.typeIndex_) {
    i = static_cast<std::uint8_t>(in.get(1));
    if (i >= h.typecnt) throw std::invalid_argument("TZif transition names a missing time type");
  }
  struct RawType {
    std::int32_t utoff;
    bool isdst;
    int idx;
  };
  std::vector<RawType> raw(static_cast<size_t>(h.typecnt));
  for (auto& r : raw) {
    r.utoff = static_cast<std::int32_t>(in.get(4));
    r.isdst = in.get(1) != 0;
    r.idx = static_cast<int>(in.get(1));
  }
  const std::string_view chars = in.take(static_cast<size_t>(h.charcnt));
  for (const auto& r : raw) {
    if (r.idx >= static_cast<int>(chars.size())) throw std::invalid_argument("TZif abbreviation index out of range");
    const std::string_view from = chars.substr(static_cast<size_t>(r.idx));
    z.types_.push_back(ZoneType{r.utoff, r.isdst, std::string(from.substr(0, from.find('\0')))});
  }
  in.skip(static_cast<size_t>(h.leapcnt * (timeWidth + 4) + h.isstdcnt + h.isutcnt));
  if (!std::is_sorted(z.times_.begin(), z.times_.end())) throw std::invalid_argument("TZif transitions out of order");

  if (h.version >= '2') {
    const std::string_view rest = in.rest();
    if (rest.size() < 2 || rest[0] != '\n') throw std::invalid_argument("TZif footer missing");
    const size_t end = rest.find('\n', 1);
    if (end == std::string_view::npos) throw std::invalid_argument("TZif footer not terminated");
    const std::string_view tz = rest.substr(1, end - 1);
    if (!tz.empty()) {
      TzString p(tz);
      z.hasFooter_ = true;
      z.std_.abbr = p.name();
      z.std_.utoff = -p.time();  // POSIX offsets are west of UTC
      if (!p.done()) {
        z.hasDst_ = true;
        z.dst_.isdst = true;
        z.dst_.abbr = p.name();
        z.dst_.utoff = p.startsOffset() ? -p.time() : z.std_.utoff + 3600;
        auto date = [&p](Date& d) {
          p.expect(',');
          if (p.peek('M')) {
            p.expect('M');
            d.kind = 'M';
            d.month = p.number();
            p.expect('.');
            d.week = p.number();
            p.expect('.');
            d.weekday = p.number();
            if (d.month < 1 || d.month > 12 || d.week < 1 || d.week > 5 || d.weekday > 6) p.fail();
          } else if (p.peek('J')) {
            p.expect('J');
            d.kind = 'J';
            d.day = p.number();
            if (d.day < 1 || d.day > 365) p.fail();
          } else {
            d.kind = 'n';
            d.day = p.number();
            if (d.day > 365) p.fail();
          }
          d.time = 7200;
          if (p.peek('/')) p.expect('/'), d.time = p.time();
        };
        if (p.done()) {
          // No rule: POSIX leaves it to the implementation; the usual default is the US rule.
          z.start_ = Date{'M', 3, 2, 0, 0, 7200};
          z.end_ = Date{'M', 11, 1, 0, 0, 7200};
        } else {
          date(z.start_);
          date(z.end_);
        }
      }
      if (!p.done()) p.fail();
    }
  }
  return z;
}

std::vector<ZoneTransition> TimeZone::footerTransitions(int year) const {
  std::vector<ZoneTransition> out;
  if (!hasFooter_ || !hasDst_) return out;
  auto dayOf = [year](const Date& d) -> std::int64_t {  // days since 1970 of the rule's date in `year`
    if (d.kind == 'J') {
      int n = d.day - 1;  // 0-based, 29 February never counted
      if (leapYear(year) && d.day >= 60) ++n;
      return daysFromCivil(year, 1, 1) + n;
    }
    if (d.kind == 'n') return daysFromCivil(year, 1, 1) + d.day;
    const std::int64_t first = daysFromCivil(year, d.month, 1);
    const int firstWeekday = static_cast<int>(((first % 7) + 7 + 4) % 7);  // 1970-01-01 was a Thursday (4); 0 = Sunday
    std::int64_t day = first + (d.weekday - firstWeekday + 7) % 7 + 7 * (d.week - 1);
    const int monthDays[] = {31, leapYear(year) ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
    while (day >= first + monthDays[d.month - 1]) day -= 7;  // week 5: the last such weekday
    return day;
  };
  // The start is read on the standard clock, the end on the daylight clock.
  const std::int64_t start = dayOf(start_) * kDay + start_.time - std_.utoff;
  const std::int64_t end = dayOf(end_) * kDay + end_.time - dst_.utoff;
  out.push_back({start, std_, dst_});
  out.push_back({end, dst_, std_});
  std::sort(out.begin(), out.end(), [](const ZoneTransition& a, const ZoneTransition& b) { return a.at < b.at; });
  return out;
}

ZoneType TimeZone::typeAt(std::int64_t utc) const {
  // RFC 8536 section 3.2: after the last transition the footer's rule applies (where there is
  // one); before the first, time type 0.
  if (hasFooter_ && (times_.empty() || utc >= times_.back())) {
    if (!hasDst_) return std_;
    // The last rule transition up to `utc`, over this year and the one before (a southern
    // zone's daylight time runs across the new year).
    const int y = yearOf(utc);
    ZoneType current = std_;
    for (int year = y - 1; year <= y; ++year)
      for (const ZoneTransition& t : footerTransitions(year))
        if (t.at <= utc) current = t.after;
    return current;
  }
  if (times_.empty() || utc < times_.front()) return types_.front();
  const auto it = std::upper_bound(times_.begin(), times_.end(), utc);
  return types_[typeIndex_[static_cast<size_t>(it - times_.begin() - 1)]];
}

std::vector<ZoneTransition> TimeZone::transitions(std::int64_t from, std::int64_t to) const {
  std::vector<ZoneTransition> out;
  for (size_t i = 0; i < times_.size(); ++i) {
    if (times_[i] < from || times_[i] >= to) continue;
    const ZoneType before = i == 0 ? types_.front() : types_[typeIndex_[i - 1]];
    const ZoneType after = types_[typeIndex_[i]];
    out.push_back({times_[i], before, after});
  }
  if (hasFooter_ && hasDst_) {
    const std::int64_t last = times_.empty() ? std::numeric_limits<std::int64_t>::min() : times_.back();
    for (int year = yearOf(std::max(from, std::min(last, to))) - 1; year <= yearOf(to) + 1; ++year)
      for (const ZoneTransition& t : footerTransitions(year))
        if (t.at > last && t.at >= from && t.at < to) out.push_back(t);
  }
  // Drop entries that change nothing a calendar shows (a new abbreviation at the same offset
  // is still kept: a zone may rename its time).
  out.erase(std::remove_if(out.begin(), out.end(), [](const ZoneTransition& t) { return t.before == t.after; }), out.end());
  return out;
}

std::int64_t TimeZone::toUtc(std::int64_t local) const {
  // The offsets a day either side: a zone never changes twice within two days.
  const std::int32_t early = typeAt(local - kDay - 14 * 3600).utoff;
  const std::int32_t late = typeAt(local + kDay + 14 * 3600).utoff;
  const bool earlyFits = typeAt(local - early).utoff == early;
  const bool lateFits = typeAt(local - late).utoff == late;
  if (earlyFits && lateFits) return std::min(local - early, local - late);  // twice: the first
  if (earlyFits) return local - early;
  if (lateFits) return local - late;
  return local - early;  // skipped: the offset before the gap
}

std::string zoneInfoDir() {
  const char* dir = std::getenv("TZDIR");
  return dir && *dir ? dir : "/usr/share/zoneinfo";
}

bool plausibleZoneName(std::string_view name) {
  if (name.empty() || name.size() > 255 || name.front() == '/' || name.find("..") != std::string_view::npos) return false;
  return std::all_of(name.begin(), name.end(), [](char c) {
    return std::isalnum(static_cast<unsigned char>(c)) || c == '/' || c == '_' || c == '+' || c == '-';
  });
}

std::optional<TimeZone> loadTimeZone(const std::string& name, std::string* why) {
  auto failWith = [&](const std::string& reason) -> std::optional<TimeZone> {
    if (why) *why = reason;
    return std::nullopt;
  };
  if (!plausibleZoneName(name)) return failWith("not a time zone name");
  const std::string path = zoneInfoDir() + "/" + name;
  std::ifstream f(path, std::ios::binary);
  if (!f) return failWith("no file " + path);
  const std::string bytes((std::istreambuf_iterator<char>(f)), std::istreambuf_iterator<char>());
  try {
    return TimeZone::parse(name, bytes);
  } catch (const std::invalid_argument& e) {
    return failWith(path + ": " + e.what());
  }
}

std::vector<std::string> knownZoneNames() {
  std::vector<std::string> names;
  std::ifstream f(zoneInfoDir() + "/tzdata.zi");
  std::string line;
  while (std::getline(f, line)) {
    // "Z Europe/Berlin ..." names a zone, "L Europe/Berlin Arctic/Longyearbyen" a link.
    std::istringstream words(line);
    std::string kind, a, b;
    words >> kind >> a >> b;
    if (kind == "Z" && !a.empty()) names.push_back(a);
    else if (kind == "L" && !b.empty()) names.push_back(b);
  }
  return names;
}

}  // namespace rotaweave::io
