#include <cmath>

#include <dovetailor/base/length.hpp>

namespace dovetailor {

std::string fixed_text(double value, int decimals, bool sign) {
  std::string s = fmt::format("{:.{}f}", value, decimals);
  // A negative value that rounds to zero (or -0.0 itself) loses its sign.
  if (s.starts_with("-") && s.find_first_not_of("-0.") == std::string::npos) s.erase(0, 1);
  if (sign && !s.starts_with("-")) s.insert(0, 1, '+');
  return s;
}

double length_value(double mm, Units units) {
  const double scale = std::pow(10.0, length_decimals(units) + 2);
  return std::round(from_mm(mm, units) * scale) / scale;
}

namespace detail {

std::string FigureSpec::pad(std::string text) const {
  if (text.size() >= width) return text;
  const std::size_t fill = width - text.size();
  switch (align) {
    case '<':
      return text + std::string(fill, ' ');
    case '^':
      return std::string(fill / 2, ' ') + text + std::string(fill - fill / 2, ' ');
    default:
      return std::string(fill, ' ') + text;
  }
}

}  // namespace detail
}  // namespace dovetailor
