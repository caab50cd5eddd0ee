#include <cmath>
#include <random>

#include <gtest/gtest.h>

#include <dovetailor/base/units.hpp>
#include <dovetailor/job/handwheel.hpp>

namespace dovetailor {
namespace {

constexpr double in = 25.4;  // mm per inch, exact

TEST(handwheel, common_dials) {
  // 0.200 in per turn, 200 divisions: 0.001 in a division; 5 mm / 250 and
  // 2 mm / 100: 0.02 mm (common practice, from memory).
  EXPECT_NEAR(common_dial(CommonDial::Inch200).division(), 0.001 * in, 1e-15);
  EXPECT_NEAR(common_dial(CommonDial::Inch100).division(), 0.001 * in, 1e-15);
  EXPECT_NEAR(common_dial(CommonDial::Metric5mm).division(), 0.02, 1e-15);
  EXPECT_NEAR(common_dial(CommonDial::Metric2mm).division(), 0.02, 1e-15);
  EXPECT_EQ(common_dial(CommonDial::Metric5mm).divisions, 250);
}

TEST(handwheel, reading_is_turns_and_divisions_hand_worked) {
  const auto wheel = common_dial(CommonDial::Inch200);
  // 0.2343 in = 234.3 divisions: 1 turn (200) and 34, 0.0003 in left over.
  auto s = dial_setting(wheel, 0.2343 * in);
  EXPECT_EQ(s.reading, (DialReading{1, 34}));
  EXPECT_NEAR(s.left_over / in, 0.0003, 1e-12);
  // 0.0996 in = 99.6 divisions: rounds to 100, 0.0004 in short.
  s = dial_setting(wheel, 0.0996 * in);
  EXPECT_EQ(s.reading, (DialReading{0, 100}));
  EXPECT_NEAR(s.left_over / in, -0.0004, 1e-12);
  // One division on the minus side of the datum: one turn back, reading 199.
  s = dial_setting(wheel, -0.001 * in);
  EXPECT_EQ(s.reading, (DialReading{-1, 199}));
  EXPECT_EQ(s.reading.count(wheel), -1);
  // Metric 5 mm / 250: 12.345 mm = 617.25 divisions: 2 turns and 117, 0.005 mm over.
  const auto metric = common_dial(CommonDial::Metric5mm);
  s = dial_setting(metric, 12.345);
  EXPECT_EQ(s.reading, (DialReading{2, 117}));
  EXPECT_NEAR(s.left_over, 0.005, 1e-12);
  EXPECT_NEAR(reading_position(metric, s.reading), 12.34, 1e-12);
}

TEST(handwheel, reading_that_grows_against_the_axis) {
  auto wheel = common_dial(CommonDial::Inch200);
  wheel.reading_grows = AxisDirection::Minus;
  // +0.0503 in: the reading falls 50 divisions from zero: turn -1, reading 150.
  const auto s = dial_setting(wheel, 0.0503 * in);
  EXPECT_EQ(s.reading, (DialReading{-1, 150}));
  EXPECT_NEAR(s.left_over / in, 0.0003, 1e-12);
  EXPECT_NEAR(reading_position(wheel, s.reading) / in, 0.050, 1e-12);
  EXPECT_TRUE(reading_rises(wheel, AxisDirection::Minus));
  EXPECT_FALSE(reading_rises(wheel, AxisDirection::Plus));
}

TEST(handwheel, move_with_the_approach_is_one_leg) {
  auto wheel = common_dial(CommonDial::Inch200);
  wheel.backlash = 0.005 * in;
  // From 0.100 in to 0.4567 in, approaching in +: 100 -> 457 divisions, turn
  // 357 = 1 turn and 157 divisions, reading rising; 0.0003 in short.
  const auto move = dial_move(wheel, 0.100 * in, 0.4567 * in);
  EXPECT_FALSE(move.back_off);
  EXPECT_EQ(move.approach.direction, AxisDirection::Plus);
  EXPECT_TRUE(move.approach.reading_rises);
  EXPECT_EQ(move.approach.turns, 1);
  EXPECT_EQ(move.approach.divisions, 157);
  EXPECT_EQ(move.approach.stop, (DialReading{2, 57}));
  EXPECT_NEAR(move.left_over / in, -0.0003, 1e-12);
}

TEST(handwheel, move_against_the_approach_goes_past_and_back) {
  auto wheel = common_dial(CommonDial::Inch200);
  wheel.backlash = 0.005 * in;
  // From 0.300 in to 0.250 in, approach +: the target is 50 divisions the
  // wrong way. Margin = backlash 5 divisions + a quarter turn 50 = 55:
  // back off 105 divisions (reading falls to 195), then forward 55 to 250
  // (1 turn, 50).
  const auto move = dial_move(wheel, 0.300 * in, 0.250 * in);
  ASSERT_TRUE(move.back_off);
  EXPECT_EQ(move.back_off->direction, AxisDirection::Minus);
  EXPECT_FALSE(move.back_off->reading_rises);
  EXPECT_EQ(move.back_off->turns, 0);
  EXPECT_EQ(move.back_off->divisions, 105);
  EXPECT_EQ(move.back_off->stop, (DialReading{0, 195}));
  EXPECT_EQ(move.approach.direction, AxisDirection::Plus);
  EXPECT_EQ(move.approach.turns, 0);
  EXPECT_EQ(move.approach.divisions, 55);
  EXPECT_EQ(move.approach.stop, (DialReading{1, 50}));
}

TEST(handwheel, metric_move_approaching_in_minus) {
  auto wheel = common_dial(CommonDial::Metric5mm);
  wheel.backlash = 0.1;
  wheel.approach = AxisDirection::Minus;
  // From 10 mm (500 div) to 10.5 mm (525): against the approach. Margin =
  // 0.1 / 0.02 = 5 + quarter turn 63 (250/4 rounded up) = 68: back off in +
  // by 93 divisions to 593 (2 turns, 93), then in - by 68 to 525 (2 turns, 25).
  const auto move = dial_move(wheel, 10.0, 10.5);
  ASSERT_TRUE(move.back_off);
  EXPECT_EQ(move.back_off->direction, AxisDirection::Plus);
  EXPECT_TRUE(move.back_off->reading_rises);
  EXPECT_EQ(move.back_off->divisions, 93);
  EXPECT_EQ(move.back_off->stop, (DialReading{2, 93}));
  EXPECT_EQ(move.approach.direction, AxisDirection::Minus);
  EXPECT_FALSE(move.approach.reading_rises);
  EXPECT_EQ(move.approach.divisions, 68);
  EXPECT_EQ(move.approach.stop, (DialReading{2, 25}));
  // Going the approach way: 10.5 mm to 7.5 mm, 150 divisions down, no back-off.
  const auto down = dial_move(wheel, 10.5, 7.5);
  EXPECT_FALSE(down.back_off);
  EXPECT_EQ(down.approach.turns, 0);
  EXPECT_EQ(down.approach.divisions, 150);
  EXPECT_EQ(down.approach.stop, (DialReading{1, 125}));
}

TEST(handwheel, no_move_when_already_there) {
  const auto wheel = common_dial(CommonDial::Inch100);
  const auto move = dial_move(wheel, 0.0301 * in, 0.0299 * in);  // both read 30
  EXPECT_FALSE(move.back_off);
  EXPECT_EQ(move.approach.turns, 0);
  EXPECT_EQ(move.approach.divisions, 0);
}

TEST(handwheel, moves_always_end_in_the_approach_direction) {
  std::mt19937_64 rng(6);
  std::uniform_real_distribution<double> position(-200, 200);
  const CommonDial dials[] = {CommonDial::Inch200, CommonDial::Inch100, CommonDial::Metric5mm,
                              CommonDial::Metric2mm};
  for (int n = 0; n < 2000; ++n) {
    auto wheel = common_dial(dials[rng() % 4]);
    wheel.backlash = std::uniform_real_distribution<double>(0, 0.5)(rng);
    wheel.reading_grows = rng() % 2 ? AxisDirection::Plus : AxisDirection::Minus;
    wheel.approach = rng() % 2 ? AxisDirection::Plus : AxisDirection::Minus;
    const double from = position(rng), to = position(rng);
    const auto target = dial_setting(wheel, to);
    EXPECT_LE(std::abs(target.left_over), wheel.division() / 2 + 1e-9);
    EXPECT_NEAR(reading_position(wheel, target.reading) + target.left_over, to, 1e-9);
    const auto move = dial_move(wheel, from, to);
    EXPECT_EQ(move.approach.stop, target.reading);
    EXPECT_EQ(move.approach.direction, wheel.approach);
    EXPECT_EQ(move.approach.reading_rises, reading_rises(wheel, wheel.approach));
    const auto graduations = [&](const DialLeg& leg) {
      return leg.turns * wheel.divisions + leg.divisions;
    };
    const long start = dial_setting(wheel, from).reading.count(wheel);
    if (move.back_off) {
      EXPECT_NE(move.back_off->direction, wheel.approach);
      // The turn point lies beyond the target by more than the backlash.
      const double past = std::abs(reading_position(wheel, move.back_off->stop) -
                                   reading_position(wheel, target.reading));
      EXPECT_GT(past, wheel.backlash);
      EXPECT_EQ(graduations(*move.back_off), std::abs(move.back_off->stop.count(wheel) - start));
      EXPECT_EQ(graduations(move.approach),
                std::abs(target.reading.count(wheel) - move.back_off->stop.count(wheel)));
    } else {
      EXPECT_EQ(graduations(move.approach), std::abs(target.reading.count(wheel) - start));
    }
  }
}

}  // namespace
}  // namespace dovetailor
