#pragma once

#include <string>
#include <string_view>

#include <fmt/format.h>

#include <dovetailor/base/units.hpp>

namespace dovetailor {

// A length (mm inside) to be shown in `units`: what every writer formats.
//   fmt::format("{}", shown(9.525, Units::Inch))    "0.3750 in"
//   fmt::format("{:n}", ...)                        "0.3750"      (number only)
//   fmt::format("{:+}", ...)                        "+0.3750 in"  (signed)
//   fmt::format("{:.6n}", ...)                      "0.375000"    (other decimals)
// Spec: [align][width][+][.decimals][n], align '<' '>' '^' (default right).
// Decimals default to length_decimals(units), the micrometer resolution.
// Rounding is fmt's (round half to even on the binary value, IEEE 754).
// The one rule: never "-0.0000"; a value that rounds to zero is "0.0000",
// or "+0.0000" when signed.
struct Shown {
  double mm = 0;
  Units units = Units::Millimetre;
};

constexpr Shown shown(double mm, Units units) { return {mm, units}; }

// A plain figure that is no length (a rate, a ratio), with the same rule:
// fmt::format("{:+}", figure(-0.0000001, 6)) is "+0.000000".
// Spec: [align][width][+][.decimals].
struct Figure {
  double value = 0;
  int decimals = 0;
};

constexpr Figure figure(double value, int decimals) { return {value, decimals}; }

// `value` at `decimals`, never "-0.000"; with `sign`, "+" before a value
// that is not negative. The one rule the formatters above apply.
std::string fixed_text(double value, int decimals, bool sign = false);

// A length for JSON output: in `units`, rounded two decimals finer than shown.
double length_value(double mm, Units units);

namespace detail {

// The parsed spec of a Shown or Figure.
struct FigureSpec {
  char align = '>';
  std::size_t width = 0;
  bool sign = false;
  int decimals = -1;  // -1: the default
  bool number_only = false;

  // Reads [align][width][+][.decimals][n] (n only when `lengths`), up to '}'.
  constexpr const char* parse(const char* it, const char* end, bool lengths) {
    if (it != end && (*it == '<' || *it == '>' || *it == '^')) align = *it++;
    while (it != end && *it >= '0' && *it <= '9') width = width * 10 + std::size_t(*it++ - '0');
    if (it != end && *it == '+') {
      sign = true;
      ++it;
    }
    if (it != end && *it == '.') {
      ++it;
      if (it == end || *it < '0' || *it > '9') throw fmt::format_error("decimals expected");
      decimals = 0;
      while (it != end && *it >= '0' && *it <= '9') decimals = decimals * 10 + (*it++ - '0');
    }
    if (lengths && it != end && *it == 'n') {
      number_only = true;
      ++it;
    }
    if (it != end && *it != '}') throw fmt::format_error("invalid length format");
    return it;
  }
  // `text` padded with spaces to `width` as `align` says.
  std::string pad(std::string text) const;
};

}  // namespace detail
}  // namespace dovetailor

template <>
struct fmt::formatter<dovetailor::Shown> {
  dovetailor::detail::FigureSpec spec;

  constexpr auto parse(format_parse_context& ctx) {
    return spec.parse(ctx.begin(), ctx.end(), true);
  }

  template <class Context>
  auto format(const dovetailor::Shown& s, Context& ctx) const {
    const int decimals = spec.decimals >= 0 ? spec.decimals : dovetailor::length_decimals(s.units);
    std::string text =
        dovetailor::fixed_text(dovetailor::from_mm(s.mm, s.units), decimals, spec.sign);
    if (!spec.number_only) {
      text += ' ';
      text += dovetailor::unit_symbol(s.units);
    }
    const std::string out = spec.pad(std::move(text));
    return std::copy(out.begin(), out.end(), ctx.out());
  }
};

template <>
struct fmt::formatter<dovetailor::Figure> {
  dovetailor::detail::FigureSpec spec;

  constexpr auto parse(format_parse_context& ctx) {
    return spec.parse(ctx.begin(), ctx.end(), false);
  }

  template <class Context>
  auto format(const dovetailor::Figure& f, Context& ctx) const {
    const std::string out = spec.pad(dovetailor::fixed_text(
        f.value, spec.decimals >= 0 ? spec.decimals : f.decimals, spec.sign));
    return std::copy(out.begin(), out.end(), ctx.out());
  }
};
