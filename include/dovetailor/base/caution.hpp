#pragma once

#include <array>
#include <string>
#include <string_view>

namespace dovetailor {

// The safety cautions every writer carries (plan report, program header,
// pass sheet, check report), written once here. Each has a long form for
// reports and sheets, a short one for the comment lines of a program
// header, and a form for a manual mill's sheet (same as the long form but
// where the long one speaks of a program).
struct Caution {
  std::string_view long_text;
  std::string_view short_text;
  std::string_view manual_text;
};

inline constexpr std::array<Caution, 6> cautions{{
    {"These figures are advice, not a guarantee.", "Advice, not a guarantee.",
     "These figures are advice, not a guarantee."},
    {"Verify every program by a dry run above the work and in single block.",
     "VERIFY BY DRY RUN BEFORE CUTTING: run it above the work, in single block, with the feed "
     "override low, and read every line first.",
     "Check each pass by a dry run before it cuts: make the move once with the cutter clear of "
     "the work."},
    {"Secure the work and the tool; use guards and eye protection.",
     "Secure the work and the tool; guards and eye protection.",
     "Secure the work and the tool; use guards and eye protection."},
    {"Measure only with the spindle stopped.", "Measure only with the spindle stopped.",
     "Measure only with the spindle stopped."},
    {"Dovetail cutters are fragile: never plunge them, take light cuts, clear the chips, and "
     "never raise one while it is under the overhang.",
     "Dovetail cutters are fragile: never plunge one or raise it under the overhang; light cuts; "
     "clear the chips.",
     "Dovetail cutters are fragile: never plunge them, take light cuts, clear the chips, and "
     "never raise one while it is under the overhang."},
    {"Follow your shop's rules and the machine maker's instructions.",
     "Follow your shop's rules and the machine maker's instructions.",
     "Follow your shop's rules and the machine maker's instructions."},
}};

enum class CautionForm { Long, Short, Manual };

constexpr std::string_view caution_line(const Caution& c, CautionForm form) {
  switch (form) {
    case CautionForm::Short:
      return c.short_text;
    case CautionForm::Manual:
      return c.manual_text;
    case CautionForm::Long:
      break;
  }
  return c.long_text;
}

// "CAUTION: " and every caution's line in `form`, one paragraph (unwrapped).
std::string caution_paragraph(CautionForm form = CautionForm::Long);

}  // namespace dovetailor
