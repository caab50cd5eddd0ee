#include <cmath>

#include <gtest/gtest.h>

#include <dovetailor/geometry/pin_gauge.hpp>

namespace dovetailor {
namespace {

// Machinery's Handbook, "Measuring Dovetail Slides" (rolls method): male
// x = D(1 + cot a/2) + c, female y = b - D(1 + cot a/2), where c and b are the
// widths at the base plane the rolls rest on. The constants below are the
// domain brief's reference values (derived from the formula).
TEST(pin_gauge, pin_constant_matches_reference_values) {
  EXPECT_NEAR(pin_constant(45), 3.4142136, 5e-8);
  EXPECT_NEAR(pin_constant(55), 2.9209821, 5e-8);
  // 1 + cot 30 = 2.7321 for 60 degree dovetails: common practice, no source.
  EXPECT_NEAR(pin_constant(60), 2.7321, 5e-5);
}

TEST(pin_gauge, cot_60_matches_trig_table) {
  EXPECT_NEAR(cot_deg(60), 0.5774, 5e-5);  // trigonometric table value
}

struct HandbookCase {
  DovetailType type;
  double angle;
  Units units;
  double width_bottom;  // in the case's units
  double pin;
};

class pin_gauge_handbook : public ::testing::TestWithParam<HandbookCase> {};

TEST_P(pin_gauge_handbook, reading_follows_handbook_formula_and_round_trips) {
  const auto c = GetParam();
  const double w = to_mm(c.width_bottom, c.units);
  const double d = to_mm(c.pin, c.units);
  // The handbook formula written out independently: k = 1 + cot(a/2).
  const double k = 1.0 + 1.0 / std::tan(c.angle * 3.14159265358979323846 / 360.0);
  const double expected = c.type == DovetailType::Male ? w + d * k : w - d * k;
  const double reading = reading_for_width(c.type, 2, w, d, c.angle);
  EXPECT_NEAR(reading, expected, 1e-9);
  EXPECT_NEAR(width_for_reading(c.type, 2, reading, d, c.angle), w, 1e-9);
}

INSTANTIATE_TEST_SUITE_P(
    rolls, pin_gauge_handbook,
    ::testing::Values(HandbookCase{DovetailType::Male, 45, Units::Inch, 1.0, 0.25},
                      HandbookCase{DovetailType::Male, 55, Units::Inch, 2.125, 0.1875},
                      HandbookCase{DovetailType::Male, 60, Units::Inch, 1.5, 0.25},
                      HandbookCase{DovetailType::Female, 45, Units::Inch, 1.75, 0.25},
                      HandbookCase{DovetailType::Female, 55, Units::Inch, 2.0, 0.3125},
                      HandbookCase{DovetailType::Female, 60, Units::Inch, 1.933, 0.25},
                      HandbookCase{DovetailType::Male, 45, Units::Millimetre, 28, 4},
                      HandbookCase{DovetailType::Male, 60, Units::Millimetre, 40, 6},
                      HandbookCase{DovetailType::Female, 55, Units::Millimetre, 50, 8},
                      HandbookCase{DovetailType::Female, 60, Units::Millimetre, 32, 5}));

TEST(pin_gauge, sixty_degree_male_with_quarter_inch_pins) {
  // Hand-worked: W = 1.5000 in, D = 0.2500 in, k = 2.7320508:
  // M = 1.5 + 0.25 * 2.7320508 = 2.1830127 in.
  EXPECT_NEAR(from_mm(reading_for_width(DovetailType::Male, 2, to_mm(1.5, Units::Inch),
                                        to_mm(0.25, Units::Inch), 60),
                      Units::Inch),
              2.1830127, 1e-7);
}

TEST(pin_gauge, one_angled_flank_adds_half_the_two_pin_offset) {
  // Domain brief: with one angled side the distance grows by (D/2)k.
  const double w = 30, d = 5;
  EXPECT_NEAR(reading_for_width(DovetailType::Male, 1, w, d, 60), w + d / 2 * pin_constant(60),
              1e-12);
  EXPECT_NEAR(reading_for_width(DovetailType::Female, 1, w, d, 60), w - d / 2 * pin_constant(60),
              1e-12);
}

TEST(pin_gauge, contact_height_matches_reference_fractions) {
  // Domain brief reference values (derived): h = r(1 + cos a).
  EXPECT_NEAR(contact_height(1.0, 45), 0.8536, 5e-5);
  EXPECT_NEAR(contact_height(1.0, 55), 0.7868, 5e-5);
  EXPECT_NEAR(contact_height(1.0, 60), 0.750, 5e-5);
}

DovetailSection female_60(double width_bottom, double depth) {
  DovetailSpec spec;
  spec.type = DovetailType::Female;
  spec.angle = 60;
  spec.depth = depth;
  spec.width = width_bottom;
  spec.width_at = WidthAt::Bottom;
  return section_of(spec);
}

TEST(pin_gauge, placed_pins_agree_with_the_formula) {
  const auto s = female_60(40, 10);
  const double d = 6;
  const auto left = place_pin(s, Side::Left, d);
  const auto right = place_pin(s, Side::Right, d);
  EXPECT_NEAR(right.measuring_edge_x - left.measuring_edge_x, reading_of(s, d).value, 1e-12);
  EXPECT_NEAR(left.center.z, -10 + 3, 1e-12);
  // The centre is one radius from the flank line (distance from a point to a line).
  const auto& f = s.left;
  const double dx = f.top.x - f.base.x, dz = f.top.z - f.base.z;
  const double dist = std::abs(dx * (left.center.z - f.base.z) - dz * (left.center.x - f.base.x)) /
                      std::hypot(dx, dz);
  EXPECT_NEAR(dist, 3, 1e-12);
}

TEST(pin_gauge, refuses_pin_that_touches_above_the_flank) {
  const auto s = female_60(40, 4);
  // Largest pin: 2(H - chamfer)/(1 + cos a) = 8/1.5 = 5.333 mm (domain brief).
  EXPECT_NEAR(largest_pin(4, 0, 60), 16.0 / 3.0, 1e-12);
  EXPECT_TRUE(pin_problems(s, 5.0, 0, Units::Millimetre).empty());
  const auto problems = pin_problems(s, 5.5, 0, Units::Millimetre);
  ASSERT_EQ(problems.size(), 1u);
  EXPECT_NE(problems[0].find("flank ends"), std::string::npos);
}

TEST(pin_gauge, refuses_pin_that_rests_on_the_corner_fillet) {
  const auto s = female_60(40, 10);
  const auto problems = pin_problems(s, 1.0, 0.5, Units::Millimetre);
  ASSERT_EQ(problems.size(), 1u);
  EXPECT_NE(problems[0].find("fillet"), std::string::npos);
  EXPECT_TRUE(pin_problems(s, 1.2, 0.5, Units::Millimetre).empty());
}

TEST(pin_gauge, advice_marks_middle_third_contacts) {
  const auto s = female_60(to_mm(2.0, Units::Inch), to_mm(0.375, Units::Inch));
  const auto advice = advise_pins(s, 0, Units::Inch);
  ASSERT_FALSE(advice.empty());
  int marked = 0;
  for (const auto& a : advice) {
    const double fraction = a.contact_height / s.depth;
    EXPECT_LT(fraction, 1.0);
    EXPECT_EQ(a.middle_third, fraction >= 1.0 / 3 && fraction <= 2.0 / 3);
    marked += a.middle_third ? 1 : 0;
  }
  // 0.1875, 0.25 and 0.3125 in touch at 0.375, 0.5 and 0.625 of the flank.
  EXPECT_EQ(marked, 3);
}

// Two pins in a female sit r cot(a/2) in from each base corner, so their
// centres lie W - D cot(a/2) apart; they overlap or touch when that is D or
// less: W - D (1 + cot(a/2)) = P <= 0 (the handbook's reading, pin_gauge.hpp).
// At 60 deg, W = 10 mm: D < 10 / 2.7320508 = 3.6602540 mm (hand-computed).
TEST(pin_gauge, refuses_female_pins_that_overlap) {
  const auto s = female_60(10, 4);
  EXPECT_NEAR(largest_usable_pin(s), 3.6602540, 1e-7);
  // D = 3.6: centres 10 - 3.6 (1.7320508) = 3.7646171 apart, P = +0.1646171.
  EXPECT_TRUE(pin_problems(s, 3.6, 0, Units::Millimetre).empty());
  // D = 3.7: centres 3.5914120 apart, less than 3.7; P = -0.1085880.
  const auto problems = pin_problems(s, 3.7, 0, Units::Millimetre);
  ASSERT_EQ(problems.size(), 1u);
  EXPECT_NE(problems[0].find("overlap"), std::string::npos) << problems[0];
  EXPECT_NE(problems[0].find("-0.109 mm"), std::string::npos) << problems[0];
  EXPECT_NE(problems[0].find("smaller than 3.660 mm"), std::string::npos) << problems[0];
  // Never suggested: the contact height (0.75 D on the 4 mm flank) allows up
  // to 5.33 mm here, the floor only 3.66 mm, so 4 and 5 mm are out too.
  std::vector<double> advised;
  for (const auto& a : advise_pins(s, 0, Units::Millimetre)) advised.push_back(a.diameter);
  EXPECT_EQ(advised, (std::vector<double>{1, 1.5, 2, 2.5, 3}));
}

TEST(pin_gauge, refuses_a_half_female_pin_that_reaches_the_square_flank) {
  // One angled flank: the pin reaches (D/2) k from the corner, so
  // D < 2 W / k = 20 / 2.7320508 = 7.3205081 mm.
  DovetailSpec spec;
  spec.type = DovetailType::Female;
  spec.angle = 60;
  spec.depth = 12;
  spec.width = 10;
  spec.width_at = WidthAt::Bottom;
  spec.sides = AngledSides::Left;
  const auto s = section_of(spec);
  EXPECT_NEAR(largest_usable_pin(s), 7.3205081, 1e-7);
  EXPECT_TRUE(pin_problems(s, 7.3, 0, Units::Millimetre).empty());
  ASSERT_EQ(pin_problems(s, 7.35, 0, Units::Millimetre).size(), 1u);
  EXPECT_NE(pin_problems(s, 7.35, 0, Units::Millimetre)[0].find("square flank"), std::string::npos);
}

// A male's pin rests on the shelf with its centre r cot(a/2) out from the
// root corner; the shelf ends at the stock face. 60 deg, root 20 mm, depth
// 4 mm, stock faces at +-14 mm: shelves 4 mm wide, so
// D < 2 (4) / cot 30 = 8 / 1.7320508 = 4.6188022 mm (hand-computed).
TEST(pin_gauge, refuses_male_pins_off_the_shelf) {
  DovetailSpec spec;
  spec.type = DovetailType::Male;
  spec.angle = 60;
  spec.depth = 4;
  spec.width = 20;
  spec.width_at = WidthAt::Bottom;
  const auto s = section_of(spec);
  const StockFaces stock{-14, 14};
  EXPECT_NEAR(largest_usable_pin(s, stock), 4.6188022, 1e-7);
  EXPECT_TRUE(pin_problems(s, 4.6, 0, Units::Millimetre, stock).empty());
  // D = 4.7: the centre lies 2.35 (1.7320508) = 4.0703194 out, 0.070 mm past the face.
  const auto problems = pin_problems(s, 4.7, 0, Units::Millimetre, stock);
  ASSERT_EQ(problems.size(), 2u);  // both corners
  EXPECT_NE(problems[0].find("left corner cannot rest on the shelf"), std::string::npos);
  EXPECT_NE(problems[0].find("by 0.070 mm"), std::string::npos) << problems[0];
  EXPECT_NE(problems[1].find("right corner"), std::string::npos);
  // Without the stock the shelf is not known and only the flank limits:
  // 2 (4) / 1.5 = 5.333 mm.
  EXPECT_TRUE(pin_problems(s, 4.7, 0, Units::Millimetre).empty());
  std::vector<double> advised;
  for (const auto& a : advise_pins(s, 0, Units::Millimetre, stock)) advised.push_back(a.diameter);
  EXPECT_EQ(advised, (std::vector<double>{1, 1.5, 2, 2.5, 3, 4}));
}

}  // namespace
}  // namespace dovetailor
