/// @brief The short codes the workbook shows in absence cells (LV leave, SK sick, TR training,
/// AB any other reason), shared by the workbook writer and any reader of the workbook, which
/// must read such a cell as a day off.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "model/problem.hpp"

namespace rotaweave::io {

/// The code shown for an absence with `reason` (free text from the scenario or --absence):
/// LV, SK, TR or AB; wrapped in parentheses, "(LV)", where a shift of `problem` already has
/// that id (compared case-insensitively, as spreadsheet formulas compare text).
std::string absenceCode(const model::Problem& problem, const std::string& reason);

/// The meaning of an absence code ("leave", "sick", "training", "absence"), or nullopt when
/// `text` is no absence code of `problem`. A reader of the workbook reads such a cell as off.
std::optional<std::string> absenceCodeMeaning(const model::Problem& problem, const std::string& text);

/// Every absence code of `problem`, in a fixed order (SK, TR, LV, AB), each once.
std::vector<std::string> allAbsenceCodes(const model::Problem& problem);

}  // namespace rotaweave::io
