/// @brief Who could have filled a slot: people off that day who hold its skill, are not
/// absent, and break no hard rule by taking it, as the evaluator judges their row.
#pragma once
#include <string>
#include <vector>

#include "eval/evaluator.hpp"
#include "model/roster.hpp"

namespace rotaweave::analysis {

/// People off on day d in `roster` who could take task t: they hold its skill, are not absent,
/// and their row rules' hard penalty (rest, runs, hours, fixed cells, ...) does not rise when
/// they take it. `except` is left out (the person who holds the slot now). In staff order.
/// Costs two row scorings per person off that day; does not touch the evaluator's loaded state.
std::vector<StaffIdx> fillCandidates(eval::Evaluator& evaluator, const model::Roster& roster, DayIdx d, TaskIdx t,
                                     StaffIdx except = -1);

/// The ids of fillCandidates, for a message.
std::vector<std::string> fillCandidateIds(eval::Evaluator& evaluator, const model::Roster& roster, DayIdx d, TaskIdx t,
                                          StaffIdx except = -1);

}  // namespace rotaweave::analysis
