#include <cmath>
#include <string>

#include <gtest/gtest.h>

#include <dovetailor/rs274/rs274_interpreter.hpp>

#include "rs274_test_support.hpp"
#include "test_support.hpp"

namespace dovetailor {
namespace {

using testing::expect_input_error;
using testing::motions;
using testing::run_program;

constexpr double eps = 1e-9;

Motion one_arc(const std::string& program) {
  const auto moves = motions(run_program(program));
  EXPECT_FALSE(moves.empty());
  return moves.back();
}

// Counterclockwise sweep in degrees from start to end about the centre (XY).
double ccw_sweep(const PathSegment& s) {
  const auto& c = s.arc->centre;
  double a =
      std::atan2(s.end.y - c.y, s.end.x - c.x) - std::atan2(s.start.y - c.y, s.start.x - c.x);
  a = a * 180 / 3.141592653589793;
  while (a <= 0) a += 360;
  return a;
}

TEST(rs274_arc, centre_format_offsets_are_from_the_start) {
  // NISTIR 6556 section 3.5.3.2 (from memory): I J are incremental from the
  // start point even in G90.
  const auto arc = one_arc("G0 X10 Y0\nG3 X0 Y10 I-10 J0 F100\nM2\n");
  ASSERT_TRUE(arc.programmed.arc);
  EXPECT_EQ(arc.kind, MotionKind::Arc);
  EXPECT_EQ(arc.programmed.arc->direction, ArcDirection::Counterclockwise);
  EXPECT_NEAR(arc.programmed.arc->centre.x, 0, eps);
  EXPECT_NEAR(arc.programmed.arc->centre.y, 0, eps);
  EXPECT_NEAR(ccw_sweep(arc.programmed), 90, 1e-9);
}

TEST(rs274_arc, radius_sign_picks_the_short_or_long_arc) {
  // NISTIR 6556 section 3.5.3.1 (from memory): R > 0 gives the arc of 180
  // degrees or less, R < 0 the arc over 180 degrees. Chord 10, radius 10:
  // the centre is 10*sin(60 deg) = 8.660254 from the chord's middle (hand
  // worked) and the arcs sweep 60 and 300 degrees.
  const auto short_arc = one_arc("G3 X10 Y0 R10 F100\nM2\n");
  EXPECT_NEAR(short_arc.programmed.arc->centre.x, 5, eps);
  EXPECT_NEAR(short_arc.programmed.arc->centre.y, 8.660254037844386, eps);
  EXPECT_NEAR(ccw_sweep(short_arc.programmed), 60, 1e-9);
  const auto long_arc = one_arc("G3 X10 Y0 R-10 F100\nM2\n");
  EXPECT_NEAR(long_arc.programmed.arc->centre.y, -8.660254037844386, eps);
  EXPECT_NEAR(ccw_sweep(long_arc.programmed), 300, 1e-9);
  // Clockwise: the short arc's centre is on the other side of the chord.
  const auto cw = one_arc("G2 X10 Y0 R10 F100\nM2\n");
  EXPECT_NEAR(cw.programmed.arc->centre.y, -8.660254037844386, eps);
  EXPECT_NEAR(360 - ccw_sweep(cw.programmed), 60, 1e-9);
}

TEST(rs274_arc, full_circle_and_helix) {
  const auto circle = one_arc("G0 X5 Y0\nG2 X5 Y0 Z-2 I-5 F100\nM2\n");
  EXPECT_EQ(circle.programmed.start.x, circle.programmed.end.x);
  EXPECT_EQ(circle.programmed.end.z, -2);
  EXPECT_EQ(circle.programmed.arc->turns, 1);
  EXPECT_NEAR(circle.programmed.arc->centre.x, 0, eps);
  // A full circle cannot be given with R (start and end the same point).
  expect_input_error([] { run_program("G2 X0 Y0 R5 F100\n"); },
                     {"test.ngc:1:10", "R", "full circle"});
}

TEST(rs274_arc, other_planes_use_their_own_offsets) {
  // G18: ZX plane, offsets K (Z) and I (X); G19: YZ, offsets J and K.
  const auto zx = one_arc("G18 G2 X10 Z0 I5 F100\nM2\n");
  EXPECT_EQ(zx.programmed.arc->plane, Plane::ZX);
  EXPECT_NEAR(zx.programmed.arc->centre.x, 5, eps);
  EXPECT_NEAR(zx.programmed.arc->centre.z, 0, eps);
  const auto yz = one_arc("G19 G3 Y0 Z10 K5 F100\nM2\n");
  EXPECT_EQ(yz.programmed.arc->plane, Plane::YZ);
  EXPECT_NEAR(yz.programmed.arc->centre.z, 5, eps);
  expect_input_error([] { run_program("G2 X10 Y0 K5 F100\n"); },
                     {"test.ngc:1:11", "K", "not a centre offset"});
  expect_input_error([] { run_program("G18 G2 X10 J5 F100\n"); }, {"J", "not a centre offset"});
}

TEST(rs274_arc, inconsistent_arcs_are_errors) {
  expect_input_error([] { run_program("G2 X10 Y0 R4 F100\n"); }, {"R", "smaller than half"});
  expect_input_error([] { run_program("G2 X10 Y0 I4 F100\n"); }, {"G2", "not on the circle"});
  expect_input_error([] { run_program("G2 X10 Y0 I5 R5 F100\n"); }, {"R", "not both"});
  // Within the tolerance (0.005 mm, NIST interpreter, from memory): fine.
  EXPECT_NO_THROW(run_program("G2 X10.004 Y0 I5 F100\n"));
}

TEST(rs274_arc, inch_arcs_convert_radius_and_centre) {
  const auto arc = one_arc("G20 G3 X1 Y0 R0.5 F10\nM2\n");
  EXPECT_NEAR(arc.programmed.end.x, 25.4, eps);
  EXPECT_NEAR(arc.programmed.arc->centre.x, 12.7, eps);
  EXPECT_NEAR(arc.programmed.arc->centre.y, 0, 1e-6);
}

}  // namespace
}  // namespace dovetailor
