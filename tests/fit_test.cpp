#include <cmath>

#include <gtest/gtest.h>

#include <dovetailor/geometry/fit.hpp>

namespace dovetailor {
namespace {

constexpr Units in = Units::Inch;

DovetailSpec spec(DovetailType type, double width, WidthAt at, double depth) {
  DovetailSpec s;
  s.type = type;
  s.angle = 55;
  s.depth = depth;
  s.width = width;
  s.width_at = at;
  return s;
}

// Hand-derived case (60 degrees, inch):
//   female: reading between 0.2500 pins P = 1.0000, depth 0.3750
//     W_bottom(F) = P + D k = 1 + 0.25 * 2.7320508 = 1.6830127
//     W_top(F)    = 1.6830127 - 2 * 0.375 * cot 60 = 1.6830127 - 0.4330127 = 1.2500000
//   male: reading over 0.2500 pins M = 1.9315127
//     W_bottom(M) = M - D k = 1.9315127 - 0.6830127 = 1.2485000
//   lateral clearance c = 1.2500000 - 1.2485000 = +0.0015 (clearance, positive)
//   normal clearance c sin 60 = 0.0015 * 0.8660254 = 0.0012990
TEST(fit, hand_derived_case_from_readings) {
  const MeasuredPart female{DovetailType::Female, to_mm(1.0, in), to_mm(0.25, in),
                            to_mm(0.375, in)};
  const MeasuredPart male{DovetailType::Male, to_mm(1.9315127, in), to_mm(0.25, in),
                          to_mm(0.3125, in)};
  const Fit f = fit_of(female, male, 60, 2);
  EXPECT_NEAR(from_mm(f.lateral_clearance, in), 0.0015, 1e-7);
  EXPECT_NEAR(from_mm(f.normal_clearance, in), 0.0012990, 1e-7);
}

// The depths, worked by hand on the same pair (60 deg, inch; the trapezoid
// of Machinery's Handbook, "Measuring Dovetail Slides", and the domain
// brief's "Fit of a pair"). W_top(F) = 1.2500, W_bottom(M) = 1.2485,
// H_f = 0.3750. Inverted over the male with its top face at height s above
// the shelf, the female's right flank is x = W_top(F)/2 + (z - s) cot a, the
// male's x = W_bottom(M)/2 + z cot a: the gap, both sides, is
// c0 - 2 s cot a at every height, c0 = +0.0015.
MeasuredPart sample_female() {
  return {DovetailType::Female, to_mm(1.0, in), to_mm(0.25, in), to_mm(0.375, in)};
}
MeasuredPart sample_male(double depth_inch) {
  return {DovetailType::Male, to_mm(1.9315127, in), to_mm(0.25, in), to_mm(depth_inch, in)};
}

TEST(fit, shallower_male_clears_the_floor_and_seats_on_the_shelf) {
  // H_m = 0.3125 < H_f: s = 0, c = c0 = +0.0015; the male's top clears the
  // floor by 0.3750 - 0.3125 = 0.0625; the flanks face over 0.3125.
  const Fit f = fit_of(sample_female(), sample_male(0.3125), 60, 2);
  EXPECT_NEAR(from_mm(f.lateral_clearance, in), 0.0015, 1e-7);
  EXPECT_NEAR(from_mm(f.shelf_gap, in), 0, 1e-12);
  EXPECT_NEAR(from_mm(f.floor_gap, in), 0.0625, 1e-12);
  EXPECT_NEAR(from_mm(f.bearing_height, in), 0.3125, 1e-12);
  EXPECT_TRUE(f.can_assemble);
}

TEST(fit, deeper_male_lifts_the_female_and_closes_the_gap) {
  // H_m = 0.3760: the tongue's top meets the floor with the top face
  // s = 0.3760 - 0.3750 = 0.0010 above the shelf; c = 0.0015 - 2 (0.0010)
  // cot 60 = 0.0015 - 0.0011547 = +0.0003453; normal 0.0003453 sin 60 =
  // 0.0002990. Without the depths the fit read +0.0015.
  const Fit f = fit_of(sample_female(), sample_male(0.3760), 60, 2);
  EXPECT_NEAR(from_mm(f.lateral_clearance, in), 0.0003453, 1e-7);
  EXPECT_NEAR(from_mm(f.normal_clearance, in), 0.0002990, 1e-7);
  EXPECT_NEAR(from_mm(f.shelf_clearance, in), 0.0015, 1e-7);
  EXPECT_NEAR(from_mm(f.shelf_gap, in), 0.0010, 1e-9);
  EXPECT_NEAR(from_mm(f.floor_gap, in), 0, 1e-12);
  EXPECT_NEAR(from_mm(f.bearing_height, in), 0.375, 1e-12);
  EXPECT_TRUE(f.can_assemble);
}

TEST(fit, male_too_deep_for_the_groove_cannot_assemble) {
  // H_m = 0.3800: s = 0.0050, c = 0.0015 - 2 (0.0050)(0.5773503) =
  // 0.0015 - 0.0057735 = -0.0042735: the female cannot go lower (the tongue
  // holds its floor) and higher closes the gap further.
  const Fit f = fit_of(sample_female(), sample_male(0.3800), 60, 2);
  EXPECT_NEAR(from_mm(f.lateral_clearance, in), -0.0042735, 1e-7);
  EXPECT_NEAR(from_mm(f.shelf_gap, in), 0.005, 1e-9);
  EXPECT_FALSE(f.can_assemble);
}

TEST(fit, designed_sections_account_for_both_depths) {
  // 55 deg, mm: female mouth 30 (depth 8), male root 29.9 (depth 8.1).
  // c0 = +0.1; s = 0.1; c = 0.1 - 2 (0.1) cot 55 = 0.1 - 0.2 (0.7002075) =
  // -0.0400415: cannot assemble.
  const auto female = section_of(spec(DovetailType::Female, 30, WidthAt::Top, 8));
  const auto male = section_of(spec(DovetailType::Male, 29.9, WidthAt::Bottom, 8.1));
  const Fit f = fit_of(female, male);
  EXPECT_NEAR(f.lateral_clearance, -0.0400415, 1e-7);
  EXPECT_NEAR(f.shelf_gap, 0.1, 1e-12);
  EXPECT_FALSE(f.can_assemble);
  // One angled flank: the square flank does not move as the female rises,
  // c = 0.1 - 0.1 (0.7002075) = +0.0299793.
  auto half_female = spec(DovetailType::Female, 30, WidthAt::Top, 8);
  auto half_male = spec(DovetailType::Male, 29.9, WidthAt::Bottom, 8.1);
  half_female.sides = half_male.sides = AngledSides::Left;
  EXPECT_NEAR(fit_of(section_of(half_female), section_of(half_male)).lateral_clearance, 0.0299793,
              1e-7);
}

TEST(fit, interference_at_the_shelf_cannot_assemble) {
  const Fit f =
      fit_of(sample_female(),
             {DovetailType::Male, to_mm(1.9340127, in), to_mm(0.25, in), to_mm(0.3125, in)}, 60, 2);
  EXPECT_NEAR(from_mm(f.lateral_clearance, in), -0.001, 1e-7);
  EXPECT_FALSE(f.can_assemble);
}

TEST(fit, target_for_a_deeper_male_gives_the_clearance_where_it_comes_to_rest) {
  // Male to make 0.3760 deep against the sample female, 0.0015 wanted at
  // rest: its root must be 1.2500 - 0.0015 - 0.0011547 = 1.2473453, read
  // over 0.25 pins at 1.2473453 + 0.6830127 = 1.9303580.
  const double wanted = to_mm(0.0015, in);
  MeasuredPart male{DovetailType::Male, 0, to_mm(0.25, in), to_mm(0.3760, in)};
  male.reading = reading_for_clearance(sample_female(), male, 60, 2, wanted);
  EXPECT_NEAR(from_mm(male.reading, in), 1.9303580, 1e-7);
  EXPECT_NEAR(fit_of(sample_female(), male, 60, 2).lateral_clearance, wanted, 1e-9);
  // And the female to make against that male.
  MeasuredPart female = sample_female();
  female.reading = 0;
  EXPECT_NEAR(reading_for_clearance(male, female, 60, 2, wanted), sample_female().reading, 1e-9);
}

TEST(fit, interference_is_negative) {
  const MeasuredPart female{DovetailType::Female, to_mm(1.0, in), to_mm(0.25, in),
                            to_mm(0.375, in)};
  const MeasuredPart male{DovetailType::Male, to_mm(1.9340127, in), to_mm(0.25, in),
                          to_mm(0.3125, in)};
  EXPECT_NEAR(from_mm(fit_of(female, male, 60, 2).lateral_clearance, in), -0.001, 1e-7);
}

TEST(fit, target_reading_gives_back_the_wanted_clearance) {
  const MeasuredPart female{DovetailType::Female, to_mm(1.0, in), to_mm(0.25, in),
                            to_mm(0.375, in)};
  const MeasuredPart male_pins{DovetailType::Male, 0, to_mm(0.1875, in), to_mm(0.3125, in)};
  const double wanted = to_mm(0.0015, in);
  const double aim = reading_for_clearance(female, male_pins, 60, 2, wanted);
  EXPECT_NEAR(from_mm(aim, in), 1.2485 + 0.1875 * 2.7320508, 1e-7);
  MeasuredPart male = male_pins;
  male.reading = aim;
  EXPECT_NEAR(fit_of(female, male, 60, 2).lateral_clearance, wanted, 1e-9);
  // And the other way: the female reading to aim for against that male.
  const MeasuredPart female_pins{DovetailType::Female, 0, to_mm(0.25, in), to_mm(0.375, in)};
  EXPECT_NEAR(reading_for_clearance(male, female_pins, 60, 2, wanted), female.reading, 1e-9);
}

TEST(fit, designs_with_equal_mouth_and_root_have_zero_clearance) {
  // A female whose mouth equals the male's root width fits line on line.
  const auto female = section_of(spec(DovetailType::Female, 30, WidthAt::Top, 8));
  const auto male = section_of(spec(DovetailType::Male, 30, WidthAt::Bottom, 7));
  EXPECT_NEAR(fit_of(female, male).lateral_clearance, 0, 1e-12);
}

TEST(fit, gib_allowance_is_filled_by_the_gib) {
  auto with_gib = spec(DovetailType::Female, 30.05, WidthAt::Top, 8);
  with_gib.gib = Gib{Side::Right, 2.0, 0};
  const auto male = section_of(spec(DovetailType::Male, 30, WidthAt::Bottom, 7));
  EXPECT_NEAR(fit_of(section_of(with_gib), male).lateral_clearance, 0.05, 1e-12);
}

TEST(fit, one_angled_flank_uses_one_run) {
  auto f = spec(DovetailType::Female, 20, WidthAt::Bottom, 5);
  f.sides = AngledSides::Left;
  auto m = spec(DovetailType::Male, 20 - 5 / std::tan(55 * 3.14159265358979323846 / 180) - 0.03,
                WidthAt::Bottom, 5);
  m.sides = AngledSides::Left;
  EXPECT_NEAR(fit_of(section_of(f), section_of(m)).lateral_clearance, 0.03, 1e-12);
}

TEST(fit, readings_of_a_gibbed_female_give_the_allowance_back) {
  // The pins read the female as cut, t/sin(a) wider on the gib side; the
  // gib fills that in assembly. 0.0938 in gib at 60 deg: 0.0938/0.8660254.
  const double allowance = to_mm(0.0938 / 0.8660254, in);
  const MeasuredPart plain{DovetailType::Female, to_mm(1.0, in), to_mm(0.25, in), to_mm(0.375, in)};
  MeasuredPart gibbed = plain;
  gibbed.reading += allowance;
  gibbed.gib_allowance = allowance;
  const MeasuredPart male{DovetailType::Male, to_mm(1.9315127, in), to_mm(0.25, in),
                          to_mm(0.3125, in)};
  EXPECT_NEAR(fit_of(gibbed, male, 60, 2).lateral_clearance,
              fit_of(plain, male, 60, 2).lateral_clearance, 1e-12);
  const MeasuredPart male_pins{DovetailType::Male, 0, to_mm(0.25, in), to_mm(0.3125, in)};
  EXPECT_NEAR(reading_for_clearance(gibbed, male_pins, 60, 2, 0.03),
              reading_for_clearance(plain, male_pins, 60, 2, 0.03), 1e-12);
  MeasuredPart female_pins = gibbed;
  female_pins.reading = 0;
  // 1e-6 mm: the male reading above is rounded to 1e-7 in.
  EXPECT_NEAR(reading_for_clearance(male, female_pins, 60, 2, to_mm(0.0015, in)), gibbed.reading,
              1e-6);
}

}  // namespace
}  // namespace dovetailor
