/// @brief changes.csv writing.
#include "io/changes_csv.hpp"

#include "io/atomic_file.hpp"
#include "io/csv.hpp"

namespace rotaweave::io {

std::string changesCsvText(const report::ChangeSummary& changes, const model::Problem& p) {
  std::string out = "person,date,was,now,reason\n";
  for (const report::CellChange& c : changes.cells)
    out += csvCell(p.staff[static_cast<size_t>(c.staff)].id) + "," + p.dateText(c.day) + "," +
           csvCell(p.cellText(c.was, c.staff)) + "," + csvCell(p.cellText(c.now, c.staff)) + "," +
           csvCell(c.reason) + "\n";
  return out;
}

void ChangesCsvWriter::write(const std::filesystem::path& dir, const OutputBundle& b) const {
  if (!b.report.changes) {
    // A changes.csv left by an earlier replan into this folder no longer describes its roster.
    std::error_code ignored;
    std::filesystem::remove(dir / "changes.csv", ignored);
    return;
  }
  writeFileAtomic(dir / "changes.csv", changesCsvText(*b.report.changes, b.problem));
}

}  // namespace rotaweave::io
