#pragma once

// Numbers in a job's units for the text writers (plan, sheet). Internal to
// the core library.

#include <string>

#include <fmt/format.h>

#include <dovetailor/length_text.hpp>

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

}  // namespace dovetailor::detail
