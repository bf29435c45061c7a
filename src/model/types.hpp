/// @brief Index and cost types shared by every module.
#pragma once
#include <cstddef>
#include <cstdint>

namespace rotaweave {

using std::size_t;
using StaffIdx = std::int32_t;
using DayIdx = std::int32_t;
using ShiftIdx = std::int16_t;  ///< -1 means "off" where a shift slot may be empty.
using SkillIdx = std::int16_t;
using TaskIdx = std::int16_t;   ///< A (shift, skill) pair; 0 means off.

inline constexpr TaskIdx kOff = 0;
inline constexpr ShiftIdx kNoShift = -1;

/// Penalties are exact integers: amounts in 1/60 units (minutes for hours, x60 for counts)
/// times weights in hundredths. One penalty point is kCostScale.
using Cost = std::int64_t;
inline constexpr Cost kAmountScale = 60;
inline constexpr Cost kWeightScale = 100;
inline constexpr Cost kCostScale = kAmountScale * kWeightScale;

inline constexpr int kMinutesPerDay = 1440;

}  // namespace rotaweave
