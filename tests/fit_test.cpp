#include <cmath>

#include <gtest/gtest.h>

#include <dovetailor/fit.hpp>

namespace dovetailor {
namespace {

constexpr Units in = Units::Inch;

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
  const MeasuredPart male{DovetailType::Male, to_mm(1.9315127, in), to_mm(0.25, in), 0};
  const Fit f = fit_of(female, male, 60, 2);
  EXPECT_NEAR(from_mm(f.lateral_clearance, in), 0.0015, 1e-7);
  EXPECT_NEAR(from_mm(f.normal_clearance, in), 0.0012990, 1e-7);
}

TEST(fit, interference_is_negative) {
  const MeasuredPart female{DovetailType::Female, to_mm(1.0, in), to_mm(0.25, in),
                            to_mm(0.375, in)};
  const MeasuredPart male{DovetailType::Male, to_mm(1.9340127, in), to_mm(0.25, in), 0};
  EXPECT_NEAR(from_mm(fit_of(female, male, 60, 2).lateral_clearance, in), -0.001, 1e-7);
}

TEST(fit, target_reading_gives_back_the_wanted_clearance) {
  const MeasuredPart female{DovetailType::Female, to_mm(1.0, in), to_mm(0.25, in),
                            to_mm(0.375, in)};
  const MeasuredPart male_pins{DovetailType::Male, 0, to_mm(0.1875, in), 0};
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

DovetailSpec spec(DovetailType type, double width, WidthAt at, double depth) {
  DovetailSpec s;
  s.type = type;
  s.angle = 55;
  s.depth = depth;
  s.width = width;
  s.width_at = at;
  return s;
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
  const MeasuredPart male{DovetailType::Male, to_mm(1.9315127, in), to_mm(0.25, in), 0};
  EXPECT_NEAR(fit_of(gibbed, male, 60, 2).lateral_clearance,
              fit_of(plain, male, 60, 2).lateral_clearance, 1e-12);
  const MeasuredPart male_pins{DovetailType::Male, 0, to_mm(0.25, in), 0};
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
