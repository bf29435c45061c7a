/// @brief Construction heuristics.
#include "search/construction.hpp"

#include "search/stop_signal.hpp"

#include <algorithm>
#include <vector>

namespace rotaweave::search {

void randomRoster(const Eligibility& e, model::Roster& g, double offShare, Rng& rng) {
  for (StaffIdx s = 0; s < g.staff; ++s)
    for (DayIdx d = 0; d < g.days; ++d) {
      const int n = e.count(s, d);
      const TaskIdx* opts = e.begin(s, d);
      if (n == 1) g.at(s, d) = opts[0];
      else if (opts[0] == kOff && rng.chance(offShare)) g.at(s, d) = kOff;
      else g.at(s, d) = opts[rng.below(n)];
    }
}

void greedyRoster(const Eligibility& e, eval::Evaluator& ev, Rng& rng, double noise,
                  std::chrono::steady_clock::time_point deadline) {
  const model::Problem& p = ev.rules().problem();
  model::Roster g(p.staffCount(), p.days);
  for (StaffIdx s = 0; s < g.staff; ++s)
    for (DayIdx d = 0; d < g.days; ++d) g.at(s, d) = e.begin(s, d)[0];  // off, or the forced task
  ev.load(g);

  std::vector<std::pair<int, TaskIdx>> cells;  // (candidates, task) for the day
  eval::Move move;
  for (DayIdx d = 0; d < p.days && std::chrono::steady_clock::now() < deadline && !stopRequested(); ++d) {
    cells.clear();
    for (TaskIdx t = 1; t < p.taskCount(); ++t) {
      if (!p.demandAt(d, t).defined) continue;
      int candidates = 0;
      for (StaffIdx s : e.freeOnDay(d)) candidates += e.allows(s, d, t);
      cells.emplace_back(candidates, t);
    }
    std::sort(cells.begin(), cells.end());
    for (const auto& [candidates, t] : cells) {
      const int target = p.demandAt(d, t).wanted();
      int have = 0;
      for (StaffIdx s = 0; s < g.staff; ++s) have += ev.roster().at(s, d) == t;
      for (; have < target; ++have) {
        StaffIdx best = -1;
        rules::Tally bestScore;
        double bestKey = 0;
        for (StaffIdx s : e.freeOnDay(d)) {
          if (ev.roster().at(s, d) != kOff || !e.allows(s, d, t)) continue;
          move.clear();
          move.add(s, d, t);
          const rules::Tally score = ev.tryMove(move);
          const double key = noise > 0 ? rng.uniform() * noise : 0.0;
          const double points = static_cast<double>(score.hard) * 1000.0 + static_cast<double>(score.soft);
          const double bestPoints = static_cast<double>(bestScore.hard) * 1000.0 + static_cast<double>(bestScore.soft);
          if (best < 0 || points * (1 + key) < bestPoints * (1 + bestKey)) best = s, bestScore = score, bestKey = key;
        }
        if (best < 0 || ev.total() < bestScore) break;  // nobody left, or filling now costs more than it saves
        move.clear();
        move.add(best, d, t);
        ev.tryMove(move);
        ev.commit();
      }
    }
  }
}

}  // namespace rotaweave::search
