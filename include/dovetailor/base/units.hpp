#pragma once

#include <array>
#include <string_view>

#include <dovetailor/base/words.hpp>

namespace dovetailor {

// Every length inside the core library is in millimetres (double). Inches are
// converted where text comes in (job and post readers, command-line flags) and
// where text goes out (reports, G-code, sheets). Angles are degrees at the
// edges and radians inside formulas.
enum class Units { Inch, Millimetre };

inline constexpr double mm_per_inch = 25.4;  // exact by definition (1959 international inch)

// A length given in `units`, as internal millimetres.
constexpr double to_mm(double value, Units units) {
  return units == Units::Inch ? value * mm_per_inch : value;
}

// An internal length (mm) expressed in `units`.
constexpr double from_mm(double mm, Units units) {
  return units == Units::Inch ? mm / mm_per_inch : mm;
}

// Keys "inch" and "mm" (job files, flags, JSON); texts "in" and "mm", the
// symbols printed beside numbers.
constexpr std::array<EnumWord<Units>, 2> word_table(Units) {
  return {{{Units::Inch, "inch", "in"}, {Units::Millimetre, "mm"}}};
}

// "in" or "mm": the symbol printed beside numbers.
constexpr std::string_view unit_symbol(Units units) { return text_of(units); }

// "inch" or "mm": the spelling used in job files.
constexpr std::string_view unit_name(Units units) { return key_of(units); }

// Decimal places that a length in `units` is shown with: 4 for inch (0.0001 in),
// 3 for mm (0.001 mm), the usual resolution of a micrometer (common practice).
constexpr int length_decimals(Units units) { return units == Units::Inch ? 4 : 3; }

inline constexpr double pi = 3.14159265358979323846;

constexpr double radians(double degrees) { return degrees * pi / 180.0; }
constexpr double degrees(double radians) { return radians * 180.0 / pi; }

}  // namespace dovetailor
