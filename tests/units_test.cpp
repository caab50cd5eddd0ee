#include <gtest/gtest.h>

#include <dovetailor/base/units.hpp>

namespace dovetailor {
namespace {

TEST(units, inch_is_exactly_25_4_mm) {
  // The international inch is 25.4 mm exactly (international yard and pound
  // agreement, 1959; NIST SP 811 appendix B).
  EXPECT_DOUBLE_EQ(to_mm(1.0, Units::Inch), 25.4);
  EXPECT_DOUBLE_EQ(from_mm(25.4, Units::Inch), 1.0);
}

TEST(units, millimetres_pass_through_unchanged) {
  EXPECT_EQ(to_mm(12.345, Units::Millimetre), 12.345);
  EXPECT_EQ(from_mm(12.345, Units::Millimetre), 12.345);
}

TEST(units, round_trip_is_exact_to_1e_12) {
  for (double v : {0.0001, 0.375, 1.5, 17.25, 99.9999})
    EXPECT_NEAR(from_mm(to_mm(v, Units::Inch), Units::Inch), v, 1e-12);
}

TEST(units, degrees_and_radians) {
  EXPECT_NEAR(radians(180.0), 3.141592653589793, 1e-15);
  EXPECT_NEAR(degrees(radians(55.0)), 55.0, 1e-12);
}

TEST(units, decimals_follow_micrometer_resolution) {
  // 0.0001 in and 0.001 mm: common practice, no source.
  EXPECT_EQ(length_decimals(Units::Inch), 4);
  EXPECT_EQ(length_decimals(Units::Millimetre), 3);
}

}  // namespace
}  // namespace dovetailor
