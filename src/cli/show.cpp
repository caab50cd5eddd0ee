#include "show.hpp"

#include <cmath>

#include <fmt/format.h>

namespace dovetailor::cli {

std::string number(double mm, Units units) {
  std::string s = fmt::format("{:.{}f}", from_mm(mm, units), length_decimals(units));
  if (s.starts_with("-") && s.find_first_not_of("-0.") == std::string::npos) s.erase(0, 1);
  return s;
}

std::string length(double mm, Units units) {
  return number(mm, units) + " " + std::string(unit_symbol(units));
}

std::string signed_length(double mm, Units units) {
  std::string s = number(mm, units);
  return (s.starts_with("-") ? s : "+" + s) + " " + std::string(unit_symbol(units));
}

double json_length(double mm, Units units) {
  const double scale = std::pow(10.0, length_decimals(units) + 2);
  return std::round(from_mm(mm, units) * scale) / scale;
}

std::string type_name(DovetailType type) { return type == DovetailType::Male ? "male" : "female"; }

std::string sides_name(AngledSides sides) {
  switch (sides) {
    case AngledSides::Both:
      return "both";
    case AngledSides::Left:
      return "left";
    case AngledSides::Right:
      return "right";
  }
  return "both";
}

const std::string& cautions_text() {
  static const std::string text =
      "CAUTION: these figures are advice, not a guarantee. Verify every program by a\n"
      "dry run above the work and in single block. Secure the work and the tool; use\n"
      "guards and eye protection; measure only with the spindle stopped. Dovetail\n"
      "cutters are fragile: never plunge them, take light cuts, clear the chips, and\n"
      "never raise one while it is under the overhang. Follow your shop's rules and\n"
      "the machine maker's instructions.\n";
  return text;
}

}  // namespace dovetailor::cli
