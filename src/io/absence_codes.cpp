/// @brief Absence codes: a reason's kind from its words, kept apart from the shift ids.
#include "io/absence_codes.hpp"

#include <algorithm>
#include <array>
#include <cctype>

namespace rotaweave::io {
namespace {

struct CodeKind {
  const char* code;
  const char* meaning;
  std::array<const char*, 4> words;  ///< a reason containing one of these has this kind
};

constexpr std::array<CodeKind, 4> kKinds{{
    // Matched in this order, so "sick leave" is SK and "training leave" TR.
    {"SK", "sick", {"sick", "illness", "unwell", nullptr}},
    {"TR", "training", {"train", "course", "study", nullptr}},
    {"LV", "leave", {"leave", "holiday", "vacation", "annual"}},
    {"AB", "absence", {nullptr, nullptr, nullptr, nullptr}},
}};

std::string lower(std::string s) {
  std::transform(s.begin(), s.end(), s.begin(), [](unsigned char c) { return static_cast<char>(std::tolower(c)); });
  return s;
}

bool isShiftId(const model::Problem& p, const std::string& text) {
  const std::string l = lower(text);
  return std::any_of(p.shifts.begin(), p.shifts.end(), [&](const model::ShiftType& s) { return lower(s.id) == l; });
}

std::string distinctCode(const model::Problem& p, std::string code) {
  while (isShiftId(p, code)) code = "(" + code + ")";
  return code;
}

const CodeKind& kindOf(const std::string& reason) {
  const std::string l = lower(reason);
  for (const CodeKind& k : kKinds)
    for (const char* w : k.words)
      if (w && l.find(w) != std::string::npos) return k;
  return kKinds.back();
}

}  // namespace

std::string absenceCode(const model::Problem& p, const std::string& reason) {
  return distinctCode(p, kindOf(reason).code);
}

std::optional<std::string> absenceCodeMeaning(const model::Problem& p, const std::string& text) {
  for (const CodeKind& k : kKinds)
    if (text == distinctCode(p, k.code)) return std::string(k.meaning);
  return std::nullopt;
}

std::vector<std::string> allAbsenceCodes(const model::Problem& p) {
  std::vector<std::string> codes;
  for (const CodeKind& k : kKinds) codes.push_back(distinctCode(p, k.code));
  return codes;
}

}  // namespace rotaweave::io
