/// @brief Plain-word pieces shared by the capacity texts.
#include "analysis/wording.hpp"

#include <cstdio>

namespace rotaweave::analysis::wording {

std::string namesText(const std::vector<std::string>& names, size_t limit) {
  if (names.empty()) return "";
  if (names.size() > limit) {
    std::string out;
    for (size_t i = 0; i < limit; ++i) out += (i ? ", " : "") + names[i];
    return out + " and " + std::to_string(names.size() - limit) + " others";
  }
  std::string out = names.front();
  for (size_t i = 1; i < names.size(); ++i) out += (i + 1 == names.size() ? " and " : ", ") + names[i];
  return out;
}

std::string missingText(const model::Problem& p, const std::vector<Missing>& missing) {
  std::vector<std::string> absent, fixedOff;
  std::vector<std::pair<std::string, TaskIdx>> elsewhere;
  for (const auto& m : missing) {
    const std::string& id = p.staff[static_cast<size_t>(m.staff)].id;
    switch (m.why) {
      case Missing::Why::Absent: absent.push_back(id); break;
      case Missing::Why::FixedOff: fixedOff.push_back(id); break;
      case Missing::Why::FixedElsewhere: elsewhere.emplace_back(id, m.fixedTask); break;
    }
  }
  std::string out;
  auto part = [&](const std::string& text) { out += (out.empty() ? "" : "; ") + text; };
  if (!absent.empty()) part(namesText(absent) + " absent");
  if (!fixedOff.empty()) part(namesText(fixedOff) + " fixed off");
  for (const auto& [id, t] : elsewhere) {
    const model::Task& task = p.tasks[static_cast<size_t>(t)];
    part(id + " fixed to " + p.shifts[static_cast<size_t>(task.shift)].id + " " + p.skills[static_cast<size_t>(task.skill)]);
  }
  return out;
}

std::vector<std::string> absentIds(const model::Problem& p, const std::vector<Missing>& missing) {
  std::vector<std::string> ids;
  for (const auto& m : missing)
    if (m.why == Missing::Why::Absent) ids.push_back(p.staff[static_cast<size_t>(m.staff)].id);
  return ids;
}

std::string slotText(const model::Problem& p, DayIdx d, TaskIdx t) {
  const model::Task& task = p.tasks[static_cast<size_t>(t)];
  return p.dateText(d) + " " + p.shifts[static_cast<size_t>(task.shift)].id + " " + p.skills[static_cast<size_t>(task.skill)];
}

std::string hoursText(long long minutes) {
  char buf[48];
  if (minutes % 60 == 0) std::snprintf(buf, sizeof buf, "%lld h", minutes / 60);
  else std::snprintf(buf, sizeof buf, "%.1f h", static_cast<double>(minutes) / 60.0);
  return buf;
}

std::string daysText(const model::Problem& p, const std::vector<DayIdx>& days) {
  std::string out;
  for (size_t i = 0; i < days.size();) {
    size_t j = i;
    while (j + 1 < days.size() && days[j + 1] == days[j] + 1) ++j;
    out += (out.empty() ? "" : ", ") + p.dateText(days[i]) + (j > i ? ".." + p.dateText(days[j]) : "");
    i = j + 1;
  }
  return out;
}

}  // namespace rotaweave::analysis::wording
