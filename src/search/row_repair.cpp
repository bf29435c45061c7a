/// @brief Row repair around hard breaches.
#include "search/row_repair.hpp"

#include <algorithm>

namespace rotaweave::search {

int repairRows(eval::Evaluator& ev, RowRefit& refit, Rng& rng, double hardWeight, int window, int maxRows,
               RowRepairScratch& scratch) {
  const model::Problem& p = ev.rules().problem();
  auto& rows = scratch.rows;
  rows.clear();
  for (StaffIdx s = 0; s < p.staffCount(); ++s)
    if (ev.loadedRowTally(s).hard > 0) rows.push_back(s);
  rng.shuffle(rows);
  if (static_cast<int>(rows.size()) > maxRows) rows.resize(static_cast<size_t>(maxRows));
  int changed = 0;
  for (const StaffIdx s : rows) {
    // Centred on a day of one of the row's hard breaches, drawn at random.
    DayIdx at = -1;
    int seen = 0;
    for (const rules::Breach& b : ev.explainLoadedRow(s))
      if (b.hard && !b.days.empty() && rng.below(++seen) == 0) at = b.days[static_cast<size_t>(rng.below(static_cast<int>(b.days.size())))];
    if (at < 0) continue;
    const int length = std::min(window, p.days);
    const DayIdx first = std::clamp(at - length / 2, 0, p.days - length);
    const double before = ev.total().weighed(hardWeight);
    if (!refit.refit(ev, s, first, length, nullptr, hardWeight, scratch.change) || scratch.change.empty()) continue;
    scratch.undo.clear();
    for (const auto& c : scratch.change.cells) scratch.undo.cells.push_back(eval::CellChange{c.staff, c.day, ev.roster().at(c.staff, c.day)});
    applyRowChange(ev, scratch.change);
    if (ev.total().weighed(hardWeight) > before) applyRowChange(ev, scratch.undo);
    else ++changed;
  }
  return changed;
}

}  // namespace rotaweave::search
