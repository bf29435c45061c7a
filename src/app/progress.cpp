/// @brief Progress line formatting.
#include "app/progress.hpp"

#include <unistd.h>

#include <cstdio>
#include <string>

#include "report/report.hpp"

namespace rotaweave::app {

ProgressPrinter::ProgressPrinter(bool quiet) : quiet_(quiet), terminal_(::isatty(2) != 0) {}

void ProgressPrinter::operator()(const search::Progress& p) {
  if (quiet_) return;
  const double every = terminal_ ? 0.2 : 5.0;
  if (p.seconds - lastPrinted_ < every) return;
  lastPrinted_ = p.seconds;
  std::string islands;
  for (const auto& t : p.islandBest) islands += " " + report::pointsText(t.hard) + "/" + report::pointsText(t.soft);
  std::fprintf(stderr, "%s%7.1f s  gen %-6ld best hard %s soft %s  islands (hard/soft):%s%s", terminal_ ? "\r\033[K" : "",
               p.seconds, p.generation, report::pointsText(p.best.hard).c_str(), report::pointsText(p.best.soft).c_str(),
               islands.c_str(), terminal_ ? "" : "\n");
  std::fflush(stderr);
}

void ProgressPrinter::finish(const search::SolveResult& r) const {
  if (quiet_) return;
  std::string phases;
  for (const search::PhaseTime& phase : r.phases) {
    char text[64];
    std::snprintf(text, sizeof text, "%s%s %.1f s", phases.empty() ? "" : ", ", phase.name, phase.seconds);
    phases += text;
  }
  std::fprintf(stderr, "%sdone in %.1f s (%s), %ld generations (stopped: %s); seed %llu, %d islands on %d threads\n"
               "best roster: hard %s, soft %s\n",
               terminal_ ? "\r\033[K" : "", r.seconds, phases.c_str(), r.generations, r.stopReason.c_str(),
               static_cast<unsigned long long>(r.seed), r.islands, r.threads, report::pointsText(r.score.hard).c_str(),
               report::pointsText(r.score.soft).c_str());
}

}  // namespace rotaweave::app
