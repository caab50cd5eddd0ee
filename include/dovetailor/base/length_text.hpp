#pragma once

#include <string>

#include <dovetailor/base/units.hpp>

namespace dovetailor {

// Lengths as people read them: in `units`, at the micrometer resolution of
// those units (4 decimals inch, 3 mm), never "-0.0000".
std::string length_number(double mm, Units units);       // "0.5170"
std::string length_text(double mm, Units units);         // "0.5170 in"
std::string signed_length_text(double mm, Units units);  // "+0.0010 in"
// Any figure with its sign at `decimals`, never "-0.000" ("+0.000").
std::string signed_figure(double value, int decimals);  // "+0.000012"

// A length for JSON output: in `units`, rounded two decimals finer than shown.
double length_value(double mm, Units units);

}  // namespace dovetailor
