/// @brief Cover-driven ejection chains: a compound move that fills a gap in cover by handing a
/// person the missing task and letting them drop another day, whose gap the next person fills.
#pragma once
#include "eval/evaluator.hpp"
#include "search/eligibility.hpp"
#include "search/rng.hpp"

namespace rotaweave::search {

/// Runs one chain of up to `maxLinks` links from a random under-covered (day, task) on the
/// loaded roster. Each link lets a sampled person take the gap and, if that scores better,
/// give up one of their other days; the chain follows the gap that leaves. The roster is left
/// at the best point of the chain (possibly where it started). `undo` receives the changed
/// cells' previous tasks, so the caller can reject the result. Returns false if nothing changed.
bool ejectionChain(const Eligibility& e, eval::Evaluator& ev, Rng& rng, int maxLinks, eval::Move& undo);

}  // namespace rotaweave::search
