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

void expect_xy(const Point3& p, double x, double y) {
  EXPECT_NEAR(p.x, x, eps);
  EXPECT_NEAR(p.y, y, eps);
}

const InterpreterOptions tools{.tools = {{.number = 1, .radius_mm = 1, .length_mm = 0},
                                         {.number = 2, .radius_mm = 6, .length_mm = 0}}};

// Rules: NIST RS274NGC Interpreter V3 (NISTIR 6556), cutter radius
// compensation (section 2.1.2.4 and 3.5.11, from memory). Tool radius 1.
const char* contour =
    "G0 X0 Y-10\n"
    "G41 D1 G1 X0 Y0 F100\n"  // entry
    "X10\n"                   // along +X, tool on the left (+Y)
    "Y-10\n"                  // outside corner: arc round (10, 0)
    "G40 X20\n"               // exit
    "M2\n";

TEST(cutter_compensation, entry_move_ends_on_the_tangent_point) {
  const auto moves = motions(run_program(contour, tools));
  ASSERT_EQ(moves.size(), 5u);
  const auto& entry = moves[1];
  expect_xy(entry.programmed.end, 0, 0);
  ASSERT_EQ(entry.tool_centre.size(), 1u);
  // Hand-worked: from P = (0, -10) the tangent to the unit circle round the
  // origin touches at T with T.P = 1, so T.y = -0.1, T.x = -sqrt(0.99) (left
  // of the travel direction +Y).
  expect_xy(entry.tool_centre[0].start, 0, -10);
  expect_xy(entry.tool_centre[0].end, -std::sqrt(0.99), -0.1);
}

TEST(cutter_compensation, outside_corner_gets_an_arc_round_the_programmed_point) {
  const auto moves = motions(run_program(contour, tools));
  const auto& along_x = moves[2];
  ASSERT_EQ(along_x.tool_centre.size(), 2u);
  // Round the corner (0, 0) from the tangent point to (0, 1), clockwise.
  const auto& corner = along_x.tool_centre[0];
  ASSERT_TRUE(corner.arc);
  expect_xy(corner.arc->centre, 0, 0);
  EXPECT_EQ(corner.arc->direction, ArcDirection::Clockwise);
  expect_xy(corner.end, 0, 1);
  // Then the line offset by the radius to the left of the travel.
  expect_xy(along_x.tool_centre[1].start, 0, 1);
  expect_xy(along_x.tool_centre[1].end, 10, 1);
  expect_xy(along_x.programmed.start, 0, 0);
  expect_xy(along_x.programmed.end, 10, 0);
  // Turning right onto -Y: arc round (10, 0) to (11, 0), then down to (11, -10).
  const auto& down = moves[3];
  ASSERT_EQ(down.tool_centre.size(), 2u);
  expect_xy(down.tool_centre[0].arc->centre, 10, 0);
  expect_xy(down.tool_centre[0].end, 11, 0);
  expect_xy(down.tool_centre[1].end, 11, -10);
}

TEST(cutter_compensation, exit_move_runs_from_the_offset_point) {
  const auto events = run_program(contour, tools);
  const auto moves = motions(events);
  const auto& exit = moves[4];
  ASSERT_EQ(exit.tool_centre.size(), 1u);
  expect_xy(exit.tool_centre[0].start, 11, -10);
  expect_xy(exit.tool_centre[0].end, 20, -10);
  EXPECT_EQ(events[4].state.compensation, CompensationSide::Off);
  EXPECT_EQ(events[2].state.compensation, CompensationSide::Left);
  EXPECT_EQ(events[2].state.compensation_radius_mm, 1);
}

TEST(cutter_compensation, right_side_mirrors_left) {
  // The mirror image of the left-hand case in X: entry tangent point on +X,
  // then a left turn onto -X (an outside corner for G42), arc
  // counterclockwise round (0, 0) to (0, 1), line at y = 1.
  const auto moves = motions(run_program("G0 X0 Y-10\nG42 D1 G1 X0 Y0 F100\nX-10\nM2\n", tools));
  expect_xy(moves[1].tool_centre[0].end, std::sqrt(0.99), -0.1);
  ASSERT_EQ(moves[2].tool_centre.size(), 2u);
  EXPECT_EQ(moves[2].tool_centre[0].arc->direction, ArcDirection::Counterclockwise);
  expect_xy(moves[2].tool_centre[0].end, 0, 1);
  expect_xy(moves[2].tool_centre[1].end, -10, 1);
  // A right turn with the tool on the right is an inside corner: refused.
  expect_input_error([] { run_program("G0 X0 Y-10\nG42 D1 G1 X0 Y0 F100\nX10\n", tools); },
                     {"inside corner"});
}

TEST(cutter_compensation, inside_corner_is_refused) {
  expect_input_error([] { run_program("G0 X0 Y-10\nG41 D1 G1 X0 Y0 F100\nX10\nY10\n", tools); },
                     {"test.ngc:4:1", "inside corner", "gouge"});
}

TEST(cutter_compensation, arcs_are_offset_inside_and_outside) {
  // G3 from (10, 0) round (15, 0): the tool (left) is inside, radius 5 - 1.
  const auto moves =
      motions(run_program("G0 X0 Y-10\nG41 D1 G1 X0 Y0 F100\nX10\nG3 X20 Y0 I5\nM2\n", tools));
  const auto& arc = moves[3];
  ASSERT_EQ(arc.tool_centre.size(), 2u);  // corner arc round (10, 0) first
  expect_xy(arc.tool_centre[0].end, 11, 0);
  ASSERT_TRUE(arc.tool_centre[1].arc);
  expect_xy(arc.tool_centre[1].arc->centre, 15, 0);
  expect_xy(arc.tool_centre[1].start, 11, 0);
  expect_xy(arc.tool_centre[1].end, 19, 0);
}

TEST(cutter_compensation, forbidden_cases_are_errors) {
  // An arc cannot be the first compensated move.
  expect_input_error([] { run_program("G0 X0 Y-10\nG41 D1 G2 X0 Y0 R10 F100\n", tools); },
                     {"test.ngc:2", "first move after G41/G42"});
  // Entry start within the radius of its end.
  expect_input_error([] { run_program("G0 X0 Y-0.5\nG41 D1 G1 X0 Y0 F100\n", tools); },
                     {"test.ngc:2", "within the cutter radius"});
  // Inside arc smaller than the cutter (radius 6 > arc radius 5).
  expect_input_error(
      [] { run_program("G0 X0 Y-20\nG41 D2 G1 X0 Y0 F100\nX10\nG3 X20 Y0 I5\n", tools); },
      {"test.ngc:4", "not smaller than the radius of this inside arc"});
  expect_input_error([] { run_program("G41 D7\n", tools); }, {"D", "tool 7"});
  expect_input_error([] { run_program("G41 D1\nG42 D1\n", tools); }, {"already on"});
  expect_input_error([] { run_program("G41 D1\nG18\n", tools); }, {"G18", "plane cannot change"});
  expect_input_error([] { run_program("G41 D1\nG81 X1 Z-1 R1 F10\n", tools); },
                     {"cutter compensation on"});
}

TEST(cutter_compensation, z_only_move_before_the_entry_is_allowed) {
  const auto moves = motions(run_program("G0 X0 Y-10 Z5\nG41 D1\nG1 Z-1 F100\nX0 Y0\nM2\n", tools));
  ASSERT_EQ(moves.size(), 3u);
  expect_xy(moves[1].tool_centre[0].end, 0, -10);
  expect_xy(moves[2].tool_centre[0].end, -std::sqrt(0.99), -0.1);
}

}  // namespace
}  // namespace dovetailor
