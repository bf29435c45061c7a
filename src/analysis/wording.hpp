/// @brief Plain-word pieces shared by the capacity texts (internal to src/analysis/).
#pragma once
#include <string>
#include <vector>

#include "analysis/capacity.hpp"

namespace rotaweave::analysis::wording {

/// "ana", "ana and ben", "ana, ben and cat"; beyond `limit` names: "ana, ben, cat and 4 others".
std::string namesText(const std::vector<std::string>& names, size_t limit = 6);
/// "ana and ben absent; cat fixed off; dee fixed to E"
std::string missingText(const model::Problem& p, const std::vector<Missing>& missing);
/// Ids of the people absent in the list (for "move the leave of ...").
std::vector<std::string> absentIds(const model::Problem& p, const std::vector<Missing>& missing);
/// "2027-03-14 N rn"
std::string slotText(const model::Problem& p, DayIdx d, TaskIdx t);
/// "7.5 h", "150 h"
std::string hoursText(long long minutes);
/// "2027-03-10..2027-03-14, 2027-03-20"
std::string daysText(const model::Problem& p, const std::vector<DayIdx>& days);

}  // namespace rotaweave::analysis::wording
