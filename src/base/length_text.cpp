#include <cmath>

#include <fmt/format.h>

#include <dovetailor/base/length_text.hpp>

namespace dovetailor {

std::string length_number(double mm, Units units) {
  std::string s = fmt::format("{:.{}f}", from_mm(mm, units), length_decimals(units));
  if (s.starts_with("-") && s.find_first_not_of("-0.") == std::string::npos) s.erase(0, 1);
  return s;
}

std::string length_text(double mm, Units units) {
  return length_number(mm, units) + " " + std::string(unit_symbol(units));
}

std::string signed_figure(double value, int decimals) {
  std::string s = fmt::format("{:.{}f}", value, decimals);
  if (s.starts_with("-") && s.find_first_not_of("-0.") == std::string::npos) s.erase(0, 1);
  return s.starts_with("-") ? s : "+" + s;
}

std::string signed_length_text(double mm, Units units) {
  return signed_figure(from_mm(mm, units), length_decimals(units)) + " " +
         std::string(unit_symbol(units));
}

double length_value(double mm, Units units) {
  const double scale = std::pow(10.0, length_decimals(units) + 2);
  return std::round(from_mm(mm, units) * scale) / scale;
}

}  // namespace dovetailor
