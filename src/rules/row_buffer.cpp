/// @brief Row buffers: per-day arrays and totals of one row.
#include "rules/row_buffer.hpp"

#include <algorithm>

namespace rotaweave::rules {

ShiftTables::ShiftTables(const model::Problem& p) {
  for (const auto& sh : p.shifts) {
    shiftStart.push_back(sh.start);
    shiftEnd.push_back(sh.end);
    shiftPaid.push_back(sh.paidMinutes());
  }
  const size_t tasks = p.tasks.size();
  taskShift.assign(tasks, kNoShift);
  taskStart.assign(tasks, 0);
  taskEnd.assign(tasks, 0);
  taskPaid.assign(tasks, 0);
  for (size_t t = 1; t < tasks; ++t) {
    const auto sh = p.tasks[t].shift;
    taskShift[t] = sh;
    taskStart[t] = shiftStart[static_cast<size_t>(sh)];
    taskEnd[t] = shiftEnd[static_cast<size_t>(sh)];
    taskPaid[t] = shiftPaid[static_cast<size_t>(sh)];
  }
}

RowBuffer::RowBuffer(const model::Problem& p) : p_(&p), tables_(p) {
  const auto span = static_cast<size_t>(p.maxHistory + p.days);
  shifts_.assign(span, kNoShift);
  starts_.assign(span, 0);
  ends_.assign(span, 0);
  paid_.assign(span, 0);
  shiftCount_.assign(p.shifts.size(), 0);
  totals_.shiftCount = shiftCount_.data();
}

RowView RowBuffer::fill(StaffIdx s, const TaskIdx* tasks) {
  const auto& hist = p_->staff[static_cast<size_t>(s)].history;
  const int h = static_cast<int>(hist.size());
  const auto base = static_cast<size_t>(p_->maxHistory);
  ShiftIdx* shifts = shifts_.data() + base;
  int* starts = starts_.data() + base;
  int* ends = ends_.data() + base;
  int* paid = paid_.data() + base;
  for (int i = 0; i < h; ++i) setDay(tables_, shifts, starts, ends, paid, i - h, hist[static_cast<size_t>(i)]);
  std::fill(shiftCount_.begin(), shiftCount_.end(), 0);
  totals_.paidMinutes = totals_.workedDays = totals_.weekendsWorked = 0;
  int lastBlock = -1;
  for (DayIdx d = 0; d < p_->days; ++d) {
    const ShiftIdx sh = tables_.taskShift[static_cast<size_t>(tasks[d])];
    setDay(tables_, shifts, starts, ends, paid, d, sh);
    if (sh == kNoShift) continue;
    totals_.paidMinutes += paid[d];
    ++totals_.workedDays;
    ++shiftCount_[static_cast<size_t>(sh)];
    const int block = p_->weekendBlock[static_cast<size_t>(d)];
    if (block >= 0 && block != lastBlock) ++totals_.weekendsWorked, lastBlock = block;
  }
  return RowView{p_, s, tasks, shifts, starts, ends, paid, &totals_, h, p_->days};
}

}  // namespace rotaweave::rules
