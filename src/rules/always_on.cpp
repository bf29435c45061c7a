/// @brief Rules that always apply: skills, absences, fixed cells, requests, and re-plan changes.
#include <algorithm>
#include <string>

#include "rules/row_rules.hpp"

namespace rotaweave::rules {
namespace {

/// Cell rules charge each period day on its own, anchored on that day.
DayIdx firstDay(AnchorSpan anchors) { return std::max<DayIdx>(anchors.first, 0); }
DayIdx lastDay(const RowView& row, AnchorSpan anchors) { return std::min(anchors.last, row.days - 1); }

}  // namespace

void SkillRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const auto& p = *row.problem;
  const std::uint64_t mask = p.staff[static_cast<size_t>(row.staff)].skillMask;
  const model::Task* tasks = p.tasks.data();
  for (DayIdx d = firstDay(anchors); d <= lastDay(row, anchors); ++d) {
    const SkillIdx skill = tasks[row.tasks[d]].skill;
    if (skill < 0 || ((mask >> skill) & 1U)) continue;  // off, or a held skill
    charge(row, tally, out, kOne, {d, d}, [&] {
      return row.personId() + ": works " + row.shiftId(d) + " as " + p.skills[static_cast<size_t>(skill)] +
             " on " + row.date(d) + " but does not hold that skill";
    });
  }
}

void AbsenceRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const auto& p = *row.problem;
  const std::uint8_t* absent = &p.absent[p.cell(row.staff, 0)];
  for (DayIdx d = firstDay(anchors); d <= lastDay(row, anchors); ++d) {
    if (!absent[d] || !row.worked(d)) continue;
    charge(row, tally, out, kOne, {d, d}, [&] {
      const std::string& reason = p.absenceReason[p.cell(row.staff, d)];
      return row.personId() + ": works " + row.shiftId(d) + " on " + row.date(d) + ", a day of absence" +
             (reason.empty() ? std::string() : " (" + reason + ")");
    });
  }
}

void FixedRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const auto& p = *row.problem;
  const TaskIdx* fixed = &p.fixed[p.cell(row.staff, 0)];
  for (DayIdx d = firstDay(anchors); d <= lastDay(row, anchors); ++d) {
    const TaskIdx want = fixed[d];
    if (want < 0 || want == row.tasks[d]) continue;
    charge(row, tally, out, kOne, {d, d}, [&] {
      return row.personId() + ": fixed to " + row.problem->cellText(want, row.staff) + " on " + row.date(d) + " but the roster has " +
             row.problem->cellText(row.tasks[d], row.staff);
    });
  }
}

void RequestRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const auto& p = *row.problem;
  for (const auto& r : p.staff[static_cast<size_t>(row.staff)].requests) {
    const DayIdx d = r.day;
    if (!anchors.contains(d)) continue;
    const ShiftIdx has = row.shift(d);
    using K = model::Request::Kind;
    const bool broken = r.kind == K::Off ? has != kNoShift : r.kind == K::Shift ? has != r.shift : has == r.shift;
    if (!broken) continue;
    charge(row, tally, out, kOne, {d, d}, [&] {
      const std::string got = has == kNoShift ? std::string("is off") : "works " + row.shiftId(d);
      const std::string wanted = r.kind == K::Off     ? "asked for " + row.date(d) + " off"
                                 : r.kind == K::Shift ? "asked for " + p.shifts[static_cast<size_t>(r.shift)].id + " on " + row.date(d)
                                                      : "asked not to work " + p.shifts[static_cast<size_t>(r.shift)].id + " on " + row.date(d);
      return row.personId() + ": " + wanted + " but " + got;
    }, r.weight);
  }
}

void ChangesRule::score(const RowView& row, AnchorSpan anchors, Tally& tally, std::vector<Breach>* out) const {
  const auto& p = *row.problem;
  if (!p.published) return;
  const auto& published = *p.published;
  const auto& spec = this->spec();
  const Cost farWeight = spec.farWeight < 0 ? spec.weight : spec.farWeight;
  for (DayIdx d = std::max(published.from, firstDay(anchors)); d <= lastDay(row, anchors); ++d) {
    const TaskIdx was = published.cells[p.cell(row.staff, d)];
    if (was == row.tasks[d]) continue;
    // The highest weight that applies: short notice, then distance from every absence.
    const bool early = d < published.from + spec.earlyDays;
    const bool far = !published.gapDistance.empty() && published.gapDistance[static_cast<size_t>(d)] > spec.nearDays;
    const Cost weight = std::max(early ? spec.earlyWeight : Cost{0}, far ? farWeight : spec.weight);
    charge(row, tally, out, kOne, {d, d}, [&] {
      return row.personId() + ": " + row.date(d) + " changed from " + row.problem->cellText(was, row.staff) + " to " +
             row.problem->cellText(row.tasks[d], row.staff) + (early ? " at short notice" : "") +
             (far ? std::string(early ? "," : "") + " far from any absence" : "");
    }, weight);
  }
}

}  // namespace rotaweave::rules
