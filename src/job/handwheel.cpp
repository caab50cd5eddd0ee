#include <cassert>
#include <cmath>

#include <dovetailor/base/units.hpp>
#include <dovetailor/job/handwheel.hpp>

namespace dovetailor {
namespace {

// +1 when the reading grows with the axis moving Plus, else -1.
int sense(const Handwheel& wheel) { return wheel.reading_grows == AxisDirection::Plus ? 1 : -1; }

AxisDirection reverse(AxisDirection d) {
  return d == AxisDirection::Plus ? AxisDirection::Minus : AxisDirection::Plus;
}

void check(const Handwheel& wheel) {
  assert(wheel.travel_per_turn > 0 && wheel.divisions > 0 && wheel.backlash >= 0);
  (void)wheel;
}

DialLeg leg(const Handwheel& wheel, AxisDirection direction, long graduations, long stop) {
  return {direction, reading_rises(wheel, direction), graduations / wheel.divisions,
          static_cast<int>(graduations % wheel.divisions), reading_from_count(wheel, stop)};
}

}  // namespace

Handwheel common_dial(CommonDial dial) {
  switch (dial) {
    case CommonDial::Inch200:
      return {.travel_per_turn = 0.200 * mm_per_inch, .divisions = 200};
    case CommonDial::Inch100:
      return {.travel_per_turn = 0.100 * mm_per_inch, .divisions = 100};
    case CommonDial::Metric5mm:
      return {.travel_per_turn = 5.0, .divisions = 250};
    case CommonDial::Metric2mm:
      return {.travel_per_turn = 2.0, .divisions = 100};
  }
  return {};
}

bool reading_rises(const Handwheel& wheel, AxisDirection motion) {
  return motion == wheel.reading_grows;
}

DialReading reading_from_count(const Handwheel& wheel, long count) {
  check(wheel);
  long turns = count / wheel.divisions;
  long division = count % wheel.divisions;
  if (division < 0) {
    division += wheel.divisions;
    --turns;
  }
  return {turns, static_cast<int>(division)};
}

double reading_position(const Handwheel& wheel, const DialReading& reading) {
  return sense(wheel) * static_cast<double>(reading.count(wheel)) * wheel.division();
}

DialSetting dial_setting(const Handwheel& wheel, double position) {
  check(wheel);
  const long count = std::lround(sense(wheel) * position / wheel.division());
  const auto reading = reading_from_count(wheel, count);
  return {reading, position - reading_position(wheel, reading)};
}

DialMove dial_move(const Handwheel& wheel, double from, double to) {
  const long start = dial_setting(wheel, from).reading.count(wheel);
  const auto target = dial_setting(wheel, to);
  const long end = target.reading.count(wheel);
  // Graduations to go, counted positive along the approach direction.
  const int approach_sense = reading_rises(wheel, wheel.approach) ? 1 : -1;
  const long ahead = (end - start) * approach_sense;
  DialMove move;
  move.left_over = target.left_over;
  if (ahead >= 0) {
    move.approach = leg(wheel, wheel.approach, ahead, end);
    return move;
  }
  const long margin = static_cast<long>(std::ceil(wheel.backlash / wheel.division() - 1e-9)) +
                      (wheel.divisions + 3) / 4;
  const long turn_point = end - approach_sense * margin;
  move.back_off = leg(wheel, reverse(wheel.approach), -ahead + margin, turn_point);
  move.approach = leg(wheel, wheel.approach, margin, end);
  return move;
}

}  // namespace dovetailor
