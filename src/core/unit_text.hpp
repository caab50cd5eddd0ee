#pragma once

// Numbers in a job's units and the short words the text writers (plan,
// sheet, program header) share. Internal to the core library.

#include <string>

#include <fmt/format.h>

#include <dovetailor/length_text.hpp>
#include <dovetailor/plan.hpp>

namespace dovetailor::detail {

struct UnitText {
  Units u;
  std::string num(double mm) const { return length_number(mm, u); }
  std::string len(double mm) const { return length_text(mm, u); }
  // Feeds: 0.1 in/min, or whole mm/min.
  std::string feed(double mm_per_min) const {
    return u == Units::Inch ? fmt::format("{:.1f}", from_mm(mm_per_min, u))
                            : fmt::format("{:.0f}", mm_per_min);
  }
  std::string feed_unit() const { return u == Units::Inch ? "in/min" : "mm/min"; }
};

// A pass's role for a table column: "rough", "semi", "finish", "spring".
inline std::string role_name(PassRole r) {
  return r == PassRole::SemiFinish ? "semi" : std::string(pass_role_word(r));
}

// The flank a pass works toward: "left", "right", or "centre".
inline std::string side_name(std::optional<Side> s) {
  if (!s) return "centre";
  return *s == Side::Left ? "left" : "right";
}

// How the reading is taken: "over 2 pins", "between 2 pins", ...
inline std::string method_words(const PinReading& r) {
  switch (r.method) {
    case ReadingMethod::OverPins:
      return "over 2 pins";
    case ReadingMethod::BetweenPins:
      return "between 2 pins";
    case ReadingMethod::SquareSideToPin:
      return "from the square side to 1 pin";
  }
  return "";
}

}  // namespace dovetailor::detail
