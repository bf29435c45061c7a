/// @brief Row re-fit by dynamic programming over one person's days.
#include "search/row_refit.hpp"

#include <algorithm>

#include "search/stop_signal.hpp"

namespace rotaweave::search {

namespace {

bool applies(const model::RuleSpec& r, StaffIdx s) { return r.hard && r.inScope[static_cast<size_t>(s)] != 0; }

}  // namespace

RowRefit::RowRefit(const rules::RuleSet& rules, const Eligibility& e) : rules_(&rules), p_(&rules.problem()), e_(&e) {
  for (const model::Task& t : p_->tasks) taskShift_.push_back(t.shift);
  for (const model::ShiftType& shift : p_->shifts) shiftPaid_.push_back(shift.paidMinutes());
  for (StaffIdx s = 0; s < p_->staffCount(); ++s) limits_.push_back(limitsFor(rules, s));
}

// The kinds handled here are those the catalogue declares Exact or Partly
// (model::KindInfo::rowOptimiser); tests/unit/test_rule_catalogue.cpp holds the two together.
RowRefit::Limits RowRefit::limitsFor(const rules::RuleSet& rules, StaffIdx s) const {
  using model::RuleKind;
  const int shifts = static_cast<int>(p_->shifts.size());
  Limits lim;
  lim.forbid.assign(static_cast<size_t>((shifts + 1) * (shifts + 1)), 0);
  auto forbid = [&](ShiftIdx a, ShiftIdx b) { lim.forbid[static_cast<size_t>((a + 1) * (shifts + 1) + b + 1)] = 1; };
  auto tighter = [](int& bound, int value, bool lower) {  // lower: keep the smaller (a maximum)
    if (bound < 0 || (lower ? value < bound : value > bound)) bound = value;
  };
  for (const model::RuleSpec& r : rules.problem().rules) {
    if (!applies(r, s)) continue;
    switch (r.kind) {
      case RuleKind::ForbidSequence:
        if (r.sequence.size() == 2 && r.sequence[0] != kNoShift && r.sequence[1] != kNoShift) forbid(r.sequence[0], r.sequence[1]);
        break;
      case RuleKind::MinRest:  // on consecutive days only; longer gaps are left to the evaluator
        for (ShiftIdx a = 0; a < shifts; ++a)
          for (ShiftIdx b = 0; b < shifts; ++b)
            if (kMinutesPerDay + p_->shifts[static_cast<size_t>(b)].start - p_->shifts[static_cast<size_t>(a)].end < r.minutes) forbid(a, b);
        break;
      case RuleKind::MaxConsecutiveDays:
        lim.maxRun = lim.maxRun == 0 ? r.count : std::min(lim.maxRun, r.count);
        break;
      case RuleKind::MinConsecutiveDays: lim.minRun = std::max(lim.minRun, r.count); break;
      case RuleKind::MinConsecutiveOff: lim.minOff = std::max(lim.minOff, r.count); break;
      case RuleKind::MaxWeekends: tighter(lim.maxWeekends, r.count, true); break;
      // Period hours count what absences credit (a constant per person, as in the rules), so
      // the bounds on minutes worked move by it. A maximum the credit alone reaches leaves no
      // worked minute; a minimum the credit alone reaches asks for none.
      case RuleKind::MaxHours:
        if (r.windowDays == 0) tighter(lim.maxMinutes, std::max(0, r.minutes - (r.creditAbsences ? p_->credit(s) : 0)), true);
        break;
      case RuleKind::MinHours:
        if (r.windowDays == 0) lim.minMinutes = std::max(lim.minMinutes, r.minutes - (r.creditAbsences ? p_->credit(s) : 0));
        break;
      case RuleKind::MaxCount:
        if (static_cast<int>(lim.countShift.size()) < kMaxCounts && r.count < 255) {
          lim.countShift.push_back(r.shift);
          lim.countLimit.push_back(r.count);
        }
        break;
      default: break;  // not modelled: the evaluator judges it
    }
  }
  return lim;
}

bool RowRefit::step(const Limits& lim, State& st, DayIdx d, ShiftIdx sh) const {
  // The state is always advanced in full, so a prefix that already breaks a rule still gives
  // the right state; `ok` says whether this day broke a modelled rule.
  const bool inPeriod = d >= 0;
  const bool endsInPeriod = d >= 1;  // a run ending on day d - 1 is judged only if that day is in the period
  bool ok = true;
  if (sh != kNoShift) {
    if (st.last != kNoShift) {
      const int n = static_cast<int>(p_->shifts.size()) + 1;
      ok &= !(inPeriod && lim.forbid[static_cast<size_t>((st.last + 1) * n + sh + 1)]);
      ++st.workRun;
    } else {
      // An off run ends; one cut by the first known day is exempt, as in the rule.
      ok &= !(endsInPeriod && st.offRun > 0 && st.offRun < lim.minOff && !st.runAtEdge);
      st.workRun = 1;
      st.runAtEdge = false;  // the caller marks a run that starts on the first known day
    }
    st.offRun = 0;
    ok &= !(inPeriod && lim.maxRun > 0 && st.workRun > lim.maxRun);
    st.workRun = std::min(st.workRun, lim.maxRun > 0 ? lim.maxRun + 1 : std::max(lim.minRun, 1));
  } else {
    if (st.last != kNoShift) {
      ok &= !(endsInPeriod && st.workRun < lim.minRun && !st.runAtEdge);
      st.offRun = 1;
      st.runAtEdge = false;
    } else {
      ++st.offRun;
    }
    st.workRun = 0;
    st.offRun = std::min(st.offRun, std::max(lim.minOff, 1));
  }
  st.last = sh;
  if (!inPeriod) return ok;  // totals count period days only

  const int block = p_->weekendBlock[static_cast<size_t>(d)];
  if (block < 0 || d == 0 || p_->weekendBlock[static_cast<size_t>(d - 1)] != block) st.blockWorked = false;
  if (lim.maxWeekends >= 0 && block >= 0 && sh != kNoShift && !st.blockWorked) {
    st.blockWorked = true;
    ++st.weekends;
    ok &= st.weekends <= lim.maxWeekends;
  }
  if (sh != kNoShift) {
    if (lim.maxMinutes >= 0 || lim.minMinutes > 0) {
      st.minutes += shiftPaid_[static_cast<size_t>(sh)];
      ok &= lim.maxMinutes < 0 || st.minutes <= lim.maxMinutes;
    }
    for (size_t i = 0; i < lim.countShift.size() && i < kMaxCounts; ++i)
      if (lim.countShift[i] == kNoShift || lim.countShift[i] == sh) {
        st.counts[i] = static_cast<std::uint8_t>(std::min(st.counts[i] + 1, 255));
        ok &= st.counts[i] <= lim.countLimit[i];
      }
  }
  return ok;
}

bool RowRefit::joinsSuffix(const Limits& lim, const State& st, const model::Roster& roster, StaffIdx s, DayIdx end) const {
  // Run the unchanged days after the window through the same steps. If those days break a
  // modelled rule among themselves, no window fits; such rows are left to the other moves.
  State after = st;
  for (DayIdx d = end; d < p_->days; ++d)
    if (!step(lim, after, d, taskShift_[static_cast<size_t>(roster.at(s, d))])) return false;
  return after.minutes >= lim.minMinutes;
}

void RowRefit::packKey(Label& label) {
  const State& st = label.state;
  label.key[0] = (static_cast<std::uint64_t>(st.last + 1) << 48) | (static_cast<std::uint64_t>(st.workRun) << 32) |
                 (static_cast<std::uint64_t>(st.offRun) << 16) | (static_cast<std::uint64_t>(st.runAtEdge) << 9) |
                 (static_cast<std::uint64_t>(st.blockWorked) << 8) | static_cast<std::uint64_t>(st.weekends);
  label.key[1] = (static_cast<std::uint64_t>(st.minutes) << 32) | (static_cast<std::uint64_t>(st.counts[0]) << 24) |
                 (static_cast<std::uint64_t>(st.counts[1]) << 16) | (static_cast<std::uint64_t>(st.counts[2]) << 8) |
                 static_cast<std::uint64_t>(st.counts[3]);
}

bool RowRefit::refit(const model::Roster& roster, const eval::Evaluator& ev, StaffIdx s, DayIdx first, int length,
                     const TaskIdx* needs, double hardWeight, RowChange& change) {
  double cost = 0;
  return cheapestRow(roster, &ev, s, first, length, needs, nullptr, hardWeight, change, cost);
}

bool RowRefit::refitAtPrices(const model::Roster& roster, StaffIdx s, DayIdx first, int length, const double* prices,
                             double hardWeight, RowChange& change, double& cost) {
  return cheapestRow(roster, nullptr, s, first, length, nullptr, prices, hardWeight, change, cost);
}

bool RowRefit::cheapestRow(const model::Roster& roster, const eval::Evaluator* ev, StaffIdx s, DayIdx first, int length,
                           const TaskIdx* needs, const double* prices, double hardWeight, RowChange& change, double& cost) {
  change.clear();
  const Limits& lim = limits_[static_cast<size_t>(s)];
  const rules::CoverRule& cover = rules_->cover();
  const DayIdx end = std::min(first + length, p_->days);
  if (end <= first) return false;

  // The state before the window: history, then the unchanged days in front of it.
  Label start{};
  const auto& hist = p_->staff[static_cast<size_t>(s)].history;
  const int h = static_cast<int>(hist.size());
  // The run on the first known day is cut by the edge of what we know: the run rules exempt it.
  const DayIdx firstKnown = -h;
  auto advance = [&](State& st, DayIdx d, ShiftIdx sh) {
    const bool ok = step(lim, st, d, sh);
    if (d == firstKnown) st.runAtEdge = true;
    return ok;
  };
  for (int i = 0; i < h; ++i) advance(start.state, static_cast<DayIdx>(i - h), hist[static_cast<size_t>(i)]);
  for (DayIdx d = 0; d < first; ++d) advance(start.state, d, taskShift_[static_cast<size_t>(roster.at(s, d))]);
  start.parent = -1;
  start.task = kOff;
  start.cost = 0;
  packKey(start);

  labels_.clear();
  labels_.push_back(start);
  exact_ = true;
  // The most minutes the days from d on can still add: the window's best cells, then the
  // unchanged days after it. A label below the minimum by more than that is dropped.
  const bool needsMinutes = lim.minMinutes > 0;
  if (needsMinutes) {
    mostPaid_.assign(static_cast<size_t>(end - first + 1), 0);
    for (DayIdx d = end; d < p_->days; ++d) {
      const ShiftIdx sh = taskShift_[static_cast<size_t>(roster.at(s, d))];
      mostPaid_.back() += sh == kNoShift ? 0 : shiftPaid_[static_cast<size_t>(sh)];
    }
    for (DayIdx d = end - 1; d >= first; --d) {
      int most = 0;
      for (const TaskIdx* t = e_->begin(s, d); t != e_->end(s, d); ++t) {
        const ShiftIdx sh = taskShift_[static_cast<size_t>(*t)];
        if (sh != kNoShift) most = std::max(most, shiftPaid_[static_cast<size_t>(sh)]);
      }
      mostPaid_[static_cast<size_t>(d - first)] = mostPaid_[static_cast<size_t>(d - first + 1)] + most;
    }
  }
  // Labels a day keeps: within the call's budgets of extensions (per day, over the most
  // options a day has) and of labels kept for the walk back.
  int options = 1;
  for (DayIdx d = first; d < end; ++d) options = std::max(options, e_->count(s, d));
  const long days = end - first;
  const long budget = std::min(kExtensionsPerCall / (days * options), kLabelsPerCall / days);
  const int beam = static_cast<int>(std::clamp<long>(budget, std::min(kMinBeam, beam_), beam_));
  size_t layerBegin = 0;  // the previous day's labels are labels_[layerBegin, end)
  for (DayIdx d = first; d < end; ++d) {
    if (std::chrono::steady_clock::now() >= deadline_ || stopRequested()) return exact_ = false;
    const int reachable = needsMinutes ? mostPaid_[static_cast<size_t>(d - first + 1)] : 0;
    const int from = static_cast<int>(layerBegin);
    const int to = static_cast<int>(labels_.size());
    const TaskIdx current = ev ? ev->roster().at(s, d) : kOff;  // counted in ev's cover
    next_.clear();
    for (const TaskIdx* t = e_->begin(s, d); t != e_->end(s, d); ++t) {
      if (needs && (needs[d] == kAnyShift ? *t == kOff : needs[d] != kAnyTask && *t != needs[d])) continue;
      // The cover this person's task earns: its price, or the change it makes with everyone
      // else as they are.
      double cellCost = rules_->cellCost(s, d, *t).weighed(hardWeight);
      if (*t != kOff && prices) {
        cellCost += prices[static_cast<size_t>(d) * static_cast<size_t>(p_->taskCount()) + static_cast<size_t>(*t)];
      } else if (*t != kOff) {
        const int others = ev->coverCount(d, *t) - (current == *t);
        cellCost += (cover.cellTally(d, *t, others + 1) - cover.cellTally(d, *t, others)).weighed(hardWeight);
      }
      const ShiftIdx sh = taskShift_[static_cast<size_t>(*t)];
      for (int i = from; i < to; ++i) {
        Label l = labels_[static_cast<size_t>(i)];
        if (!advance(l.state, d, sh)) continue;
        if (needsMinutes && l.state.minutes + reachable < lim.minMinutes) continue;
        l.cost += cellCost;
        l.parent = i;
        l.task = *t;
        packKey(l);
        next_.push_back(l);
      }
    }
    if (next_.empty()) return false;
    // One label per state: the cheapest.
    std::sort(next_.begin(), next_.end(), [](const Label& a, const Label& b) {
      if (a.key[0] != b.key[0]) return a.key[0] < b.key[0];
      if (a.key[1] != b.key[1]) return a.key[1] < b.key[1];
      return a.cost < b.cost;
    });
    next_.erase(std::unique(next_.begin(), next_.end(), [](const Label& a, const Label& b) {
      return a.key[0] == b.key[0] && a.key[1] == b.key[1];
    }), next_.end());
    if (static_cast<int>(next_.size()) > beam) trimToBeam(beam);
    layerBegin = labels_.size();
    labels_.insert(labels_.end(), next_.begin(), next_.end());
  }

  int best = -1;
  for (int i = static_cast<int>(layerBegin); i < static_cast<int>(labels_.size()); ++i) {
    const Label& l = labels_[static_cast<size_t>(i)];
    if ((best < 0 || l.cost < labels_[static_cast<size_t>(best)].cost) && joinsSuffix(lim, l.state, roster, s, end)) best = i;
  }
  if (best < 0) return false;
  cost = labels_[static_cast<size_t>(best)].cost;
  // Walk back one day per label.
  DayIdx d = end - 1;
  for (int i = best; labels_[static_cast<size_t>(i)].parent >= 0; i = labels_[static_cast<size_t>(i)].parent, --d) {
    const TaskIdx t = labels_[static_cast<size_t>(i)].task;
    if (roster.at(s, d) != t) change.cells.push_back(eval::CellChange{s, d, t});
  }
  std::reverse(change.cells.begin(), change.cells.end());
  return true;
}

void RowRefit::trimToBeam(int beam) {
  exact_ = false;
  const size_t n = next_.size();
  int lo = next_[0].state.minutes, hi = lo;
  for (const Label& l : next_) lo = std::min(lo, l.state.minutes), hi = std::max(hi, l.state.minutes);
  // Order by cost (ties by state, so the outcome does not depend on the sort), then take the
  // cheapest few of each stratum of minutes, then the cheapest of the rest.
  std::sort(next_.begin(), next_.end(), [](const Label& a, const Label& b) {
    if (a.cost != b.cost) return a.cost < b.cost;
    if (a.key[0] != b.key[0]) return a.key[0] < b.key[0];
    return a.key[1] < b.key[1];
  });
  keep_.assign(n, 0);
  const int width = (hi - lo) / kMinuteStrata + 1;
  const int perStratum = std::max(1, beam / (2 * kMinuteStrata));
  int taken[kMinuteStrata] = {};
  int kept = 0;
  for (size_t i = 0; i < n && kept < beam; ++i) {
    int& k = taken[(next_[i].state.minutes - lo) / width];
    if (k < perStratum) ++k, keep_[i] = 1, ++kept;
  }
  for (size_t i = 0; i < n && kept < beam; ++i)
    if (!keep_[i]) keep_[i] = 1, ++kept;
  size_t out = 0;
  for (size_t i = 0; i < n; ++i)
    if (keep_[i]) next_[out++] = next_[i];
  next_.resize(out);
}

}  // namespace rotaweave::search
