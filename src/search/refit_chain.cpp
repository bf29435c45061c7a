/// @brief Refit chains.
#include "search/refit_chain.hpp"

#include <algorithm>

namespace rotaweave::search {

namespace {

/// Applies a re-fitted row and records what it replaced.
void applyRow(eval::Evaluator& ev, const RowChange& change, RefitUndo& undo) {
  if (change.empty()) return;
  if (undo.size == static_cast<int>(undo.rows.size())) undo.rows.emplace_back();
  RowChange& back = undo.rows[static_cast<size_t>(undo.size++)];
  back.clear();
  for (const auto& cell : change.cells) back.cells.push_back(eval::CellChange{cell.staff, cell.day, ev.roster().at(cell.staff, cell.day)});
  applyRowChange(ev, change);
}

/// The longest stretch of days a chain re-fits: local, so a chain stays a cheap move.
constexpr int kChainWindow = eval::Move::kCapacity;

}  // namespace

bool refitChain(const Eligibility& e, eval::Evaluator& ev, RowRefit& refit, Rng& rng, double hardWeight, int passes,
                RefitUndo& undo) {
  undo.size = 0;
  const auto& free = e.freeCells();
  if (free.empty()) return false;
  const model::Problem& p = ev.rules().problem();
  const int cell = free[static_cast<size_t>(rng.below(static_cast<int>(free.size())))];
  const StaffIdx s = cell / p.days;
  const DayIdx flip = cell % p.days;
  // The window: the whole period if it fits in one move, else a stretch around the forced day.
  const int length = std::min(p.days, kChainWindow);
  const DayIdx first = std::clamp(flip - length / 2, 0, p.days - length);

  auto& needs = undo.needs;
  needs.assign(static_cast<size_t>(p.days), RowRefit::kAnyTask);
  needs[static_cast<size_t>(flip)] = ev.roster().at(s, flip) == kOff ? RowRefit::kAnyShift : kOff;
  RowChange& change = undo.change;
  if (refit.refit(ev, s, first, length, needs.data(), hardWeight, change)) applyRow(ev, change, undo);
  if (undo.size == 0) return false;
  auto& order = undo.order;
  order.clear();
  for (StaffIdx other = 0; other < p.staffCount(); ++other)
    if (other != s) order.push_back(other);
  for (int pass = 0; pass < passes; ++pass) {
    rng.shuffle(order);
    for (const StaffIdx other : order)
      if (refit.refit(ev, other, first, length, nullptr, hardWeight, change)) applyRow(ev, change, undo);
  }
  return true;
}

void undoRefitChain(eval::Evaluator& ev, const RefitUndo& undo) {
  for (int i = undo.size - 1; i >= 0; --i) applyRowChange(ev, undo.rows[static_cast<size_t>(i)]);
}

}  // namespace rotaweave::search
