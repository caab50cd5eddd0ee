#include <cstdio>

#include <gtest/gtest.h>

#include <dovetailor/base/length.hpp>

namespace dovetailor {
namespace {

// 3/8 in is 9.525 mm exactly (25.4 mm to the inch, NIST SP 811 appendix B).
TEST(length, shows_the_job_units_at_micrometer_resolution) {
  EXPECT_EQ(fmt::format("{}", shown(9.525, Units::Inch)), "0.3750 in");
  EXPECT_EQ(fmt::format("{}", shown(9.525, Units::Millimetre)), "9.525 mm");
  EXPECT_EQ(fmt::format("{:n}", shown(9.525, Units::Inch)), "0.3750");
  EXPECT_EQ(fmt::format("{:n}", shown(-9.525, Units::Millimetre)), "-9.525");
}

TEST(length, signed_form_puts_plus_before_positive_values) {
  EXPECT_EQ(fmt::format("{:+}", shown(0.0254, Units::Inch)), "+0.0010 in");
  EXPECT_EQ(fmt::format("{:+}", shown(-0.0254, Units::Inch)), "-0.0010 in");
  EXPECT_EQ(fmt::format("{:+n}", shown(0.05, Units::Millimetre)), "+0.050");
}

TEST(length, other_decimals_and_width) {
  EXPECT_EQ(fmt::format("{:.6n}", shown(9.525, Units::Inch)), "0.375000");
  EXPECT_EQ(fmt::format("{:.1}", shown(9.525, Units::Millimetre)), "9.5 mm");
  EXPECT_EQ(fmt::format("{:>9n}", shown(12.7, Units::Inch)), "   0.5000");
  EXPECT_EQ(fmt::format("{:<9n}|", shown(12.7, Units::Inch)), "0.5000   |");
  EXPECT_EQ(fmt::format("{:10}|", shown(1, Units::Millimetre)), "  1.000 mm|");
}

// The one rule: no "-0.000". A value that rounds to zero is shown unsigned,
// or with "+" in the signed form (common practice, no source).
TEST(length, never_shows_minus_zero) {
  EXPECT_EQ(fmt::format("{}", shown(-0.0, Units::Millimetre)), "0.000 mm");
  EXPECT_EQ(fmt::format("{}", shown(-0.0004, Units::Millimetre)), "0.000 mm");
  EXPECT_EQ(fmt::format("{:n}", shown(-0.00002, Units::Inch)), "0.0000");
  EXPECT_EQ(fmt::format("{:+}", shown(-0.0004, Units::Millimetre)), "+0.000 mm");
  EXPECT_EQ(fmt::format("{:+n}", shown(-0.0, Units::Inch)), "+0.0000");
  // Just past half a unit in the last place it is a real negative figure.
  EXPECT_EQ(fmt::format("{}", shown(-0.0006, Units::Millimetre)), "-0.001 mm");
  EXPECT_EQ(fmt::format("{:+}", figure(-0.0000004, 6)), "+0.000000");
  EXPECT_EQ(fmt::format("{:+}", figure(-0.0000006, 6)), "-0.000001");
}

// Rounding is fmt's: the exact binary64 value (IEEE 754) rounded to the
// nearest decimal, as printf("%.3f") does (C17 7.21.6.1). 0.1235 is stored
// as 0.12349999999999999866..., so it shows 0.123; 2.0015 as
// 2.00150000000000005684..., so 2.002 (exact values printed by Python's
// decimal.Decimal(0.1235) and Decimal(2.0015)).
TEST(length, rounds_the_binary_value_as_printf_does) {
  EXPECT_EQ(fmt::format("{:n}", shown(0.1235, Units::Millimetre)), "0.123");
  EXPECT_EQ(fmt::format("{:n}", shown(2.0015, Units::Millimetre)), "2.002");
  char c_text[32];
  for (double v : {2.0005, 2.0015, 0.1235, -1.0005, 17.4445}) {
    std::snprintf(c_text, sizeof c_text, "%.3f", v);
    EXPECT_EQ(fmt::format("{:n}", shown(v, Units::Millimetre)), c_text) << v;
  }
}

TEST(length, json_value_is_two_decimals_finer_than_shown) {
  EXPECT_DOUBLE_EQ(length_value(9.525, Units::Inch), 0.375);
  EXPECT_DOUBLE_EQ(length_value(1.2345678, Units::Millimetre), 1.23457);
  EXPECT_DOUBLE_EQ(length_value(0.0001234, Units::Inch), 0.000005);
}

TEST(length, bad_spec_is_refused) {
  EXPECT_THROW((void)fmt::format(fmt::runtime("{:q}"), shown(1, Units::Millimetre)),
               fmt::format_error);
  EXPECT_THROW((void)fmt::format(fmt::runtime("{:n}"), figure(1, 2)), fmt::format_error);
}

}  // namespace
}  // namespace dovetailor
