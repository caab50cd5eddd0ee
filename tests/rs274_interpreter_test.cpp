#include <cmath>
#include <fstream>
#include <sstream>
#include <string>
#include <utility>

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

void expect_point(const Point3& p, double x, double y, double z, double tolerance = eps) {
  EXPECT_NEAR(p.x, x, tolerance);
  EXPECT_NEAR(p.y, y, tolerance);
  EXPECT_NEAR(p.z, z, tolerance);
}

TEST(rs274_interpreter, straight_moves_carry_line_feed_and_state) {
  const auto events = run_program("G21 G90 G17\nS1000 M3\nG0 X10 Y5\nG1 Z-1 F120\nM30\n");
  ASSERT_EQ(events.size(), 4u);
  EXPECT_EQ(events[0].line, 2);
  EXPECT_EQ(std::get<SpindleChange>(events[0].body),
            (SpindleChange{SpindleDirection::Clockwise, 1000}));
  const auto& rapid = std::get<Motion>(events[1].body);
  EXPECT_EQ(events[1].line, 3);
  EXPECT_EQ(rapid.kind, MotionKind::Rapid);
  expect_point(rapid.programmed.start, 0, 0, 0);
  expect_point(rapid.programmed.end, 10, 5, 0);
  EXPECT_EQ(rapid.tool_centre, std::vector<PathSegment>{rapid.programmed});
  EXPECT_EQ(events[1].state.spindle, SpindleDirection::Clockwise);
  const auto& feed = std::get<Motion>(events[2].body);
  EXPECT_EQ(feed.kind, MotionKind::Feed);
  EXPECT_EQ(feed.feed_mm_per_min, 120);
  expect_point(feed.programmed.end, 10, 5, -1);
  EXPECT_EQ(std::get<ProgramEnd>(events[3].body).how, EndKind::M30);
}

TEST(rs274_interpreter, inch_programs_become_millimetres) {
  // 1 in = 25.4 mm exactly (international inch, 1959).
  const auto moves = motions(run_program("G20 G1 X1 Y-0.5 F10\nG21 G1 X30\nM2\n"));
  ASSERT_EQ(moves.size(), 2u);
  expect_point(moves[0].programmed.end, 25.4, -12.7, 0);
  EXPECT_NEAR(moves[0].feed_mm_per_min, 254, eps);
  expect_point(moves[1].programmed.end, 30, -12.7, 0);
}

TEST(rs274_interpreter, incremental_mode_adds_to_the_current_point) {
  const auto moves = motions(run_program("G91 G0 X5 Y5\nX5\nG90 X1\nM2\n"));
  ASSERT_EQ(moves.size(), 3u);
  expect_point(moves[1].programmed.end, 10, 5, 0);
  expect_point(moves[2].programmed.end, 1, 5, 0);
}

TEST(rs274_interpreter, parameter_settings_apply_after_the_line) {
  // NISTIR 6556 section 3.5.3 (from memory).
  const auto moves = motions(run_program("#1=3\n#1=7 G0 X#1\nY#1\nM2\n"));
  ASSERT_EQ(moves.size(), 2u);
  EXPECT_EQ(moves[0].programmed.end.x, 3);
  EXPECT_EQ(moves[1].programmed.end.y, 7);
}

TEST(rs274_interpreter, work_offsets_come_from_parameters) {
  // G55 origin at #5241..#5243 (NISTIR 6556 parameter table, from memory).
  InterpreterOptions options{.parameters = {{5241, 100}, {5242, 50}, {5243, -10}}};
  const auto events = run_program("G0 X0 Y0 Z0\nG55\nG0 X1\nM2\n", options);
  const auto moves = motions(events);
  ASSERT_EQ(moves.size(), 2u);
  // After G55 the same machine point reads 100, 50, 10 less.
  expect_point(moves[1].programmed.start, -100, -50, 10);
  expect_point(moves[1].programmed.end, 1, -50, 10);
  expect_point(events[1].state.work_offset_mm, 100, 50, -10);
  EXPECT_EQ(events[1].state.coordinate_system, 2);
}

TEST(rs274_interpreter, length_offset_shifts_the_programmed_tip) {
  InterpreterOptions options{.tools = {{.number = 3, .radius_mm = 5, .length_mm = 40}}};
  const auto events = run_program("G0 Z100\nT3 M6\nG43 H3\nG0 X1\nG49\nG0 X2\nM2\n", options);
  const auto moves = motions(events);
  ASSERT_EQ(moves.size(), 3u);
  // The gauge point stays put; the tip it now describes is 40 mm lower.
  expect_point(moves[1].programmed.start, 0, 0, 60);
  EXPECT_TRUE(events[2].state.length_offset_active);
  EXPECT_EQ(events[2].state.tool, 3);
  expect_point(moves[2].programmed.start, 1, 0, 100);
}

TEST(rs274_interpreter, g53_moves_in_machine_coordinates) {
  InterpreterOptions options{.parameters = {{5221, 10}, {5222, 20}, {5223, 30}}};
  const auto moves = motions(run_program("G53 G0 X0 Y0 Z0\nM2\n", options));
  ASSERT_EQ(moves.size(), 1u);
  expect_point(moves[0].programmed.end, -10, -20, -30);
}

TEST(rs274_interpreter, g28_goes_home_through_the_intermediate_point) {
  // Home at machine (0, 0, 100) in #5161..#5163, G54 origin at machine
  // (200, 100, 0): the home reads (-200, -100, 100) in work coordinates.
  InterpreterOptions options{.parameters = {{5163, 100}, {5221, 200}, {5222, 100}}};
  const auto moves = motions(run_program("G0 X5 Y5 Z1\nG91 G28 Z10\nM2\n", options));
  ASSERT_EQ(moves.size(), 3u);
  expect_point(moves[1].programmed.end, 5, 5, 11);
  expect_point(moves[2].programmed.end, -200, -100, 100);
  EXPECT_EQ(moves[2].kind, MotionKind::Rapid);
  expect_input_error([] { run_program("G28 G1 X1 F10\n"); }, {"G1", "both use the axis words"});
}

TEST(rs274_interpreter, events_come_in_the_spec_order_within_a_block) {
  // NISTIR 6556 section 3.8 order of execution (from memory): tool change,
  // spindle, coolant, dwell, motion, stop.
  const auto events = run_program("T2\nM0 G1 X1 F100 G4 P0.5 M8 M3 S500 M6\nM2\n");
  ASSERT_EQ(events.size(), 7u);
  EXPECT_TRUE(std::holds_alternative<ToolChange>(events[0].body));
  EXPECT_TRUE(std::holds_alternative<SpindleChange>(events[1].body));
  EXPECT_EQ(std::get<CoolantChange>(events[2].body).coolant, (Coolant{false, true}));
  EXPECT_EQ(std::get<Dwell>(events[3].body).seconds, 0.5);
  EXPECT_TRUE(std::holds_alternative<Motion>(events[4].body));
  EXPECT_EQ(std::get<Stop>(events[5].body).kind, StopKind::Program);
  EXPECT_EQ(std::get<ProgramEnd>(events[6].body).how, EndKind::M2);
}

TEST(rs274_interpreter, stops_coolant_and_path_modes) {
  const auto events = run_program("G64 M7\nM1\nM9 S300\nG20\nM5\nM2\n");
  ASSERT_EQ(events.size(), 5u);
  EXPECT_EQ(std::get<CoolantChange>(events[0].body).coolant, (Coolant{true, false}));
  EXPECT_EQ(std::get<Stop>(events[1].body).kind, StopKind::Optional);
  EXPECT_EQ(std::get<CoolantChange>(events[2].body).coolant, (Coolant{}));
  // S alone with the spindle stopped only changes the state; M5 reports it.
  EXPECT_EQ(std::get<SpindleChange>(events[3].body),
            (SpindleChange{SpindleDirection::Stopped, 300}));
  EXPECT_EQ(events[3].state.program_units, Units::Inch);
}

TEST(rs274_interpreter, program_end_ignores_the_rest) {
  const auto events = run_program("G0 X1\nM2\nG0 X2\nthis is not read\n");
  ASSERT_EQ(events.size(), 2u);
  EXPECT_EQ(std::get<ProgramEnd>(events[1].body).how, EndKind::M2);
}

TEST(rs274_interpreter, percent_lines_and_missing_end) {
  auto events = run_program("%\nG0 X1\n%\nG0 X2\n");
  ASSERT_EQ(events.size(), 2u);
  EXPECT_EQ(std::get<ProgramEnd>(events[1].body).how, EndKind::Percent);
  events = run_program("G0 X1\n");
  EXPECT_EQ(std::get<ProgramEnd>(events.back().body).how, EndKind::EndOfInput);
  EXPECT_EQ(events.back().line, 1);
}

TEST(rs274_interpreter, block_delete_switch_skips_slash_lines) {
  EXPECT_EQ(motions(run_program("/G0 X1\nG0 X2\n", {.block_delete = true})).size(), 1u);
  EXPECT_EQ(motions(run_program("/G0 X1\nG0 X2\n", {.block_delete = false})).size(), 2u);
  // With the switch on a deleted line is not even read.
  EXPECT_EQ(motions(run_program("/G0 X1 E?\nG0 X2\n", {.block_delete = true})).size(), 1u);
}

TEST(rs274_interpreter, inverse_time_feed_needs_f_on_every_move) {
  // G93: F is 1/minutes for the move (NISTIR 6556 section 3.5.19, from memory).
  const auto moves = motions(run_program("G93 G1 X30 F2\nM2\n"));
  EXPECT_NEAR(moves[0].feed_mm_per_min, 60, eps);  // 30 mm in half a minute
  expect_input_error([] { run_program("G93 G1 X30 F2\nX40\n"); },
                     {"test.ngc:2", "inverse time", "F"});
}

// NISTIR 6556 section 3.4, table 4 "Modal groups" (from memory): one code of
// each group may share a line with one of every other group, never two of
// one group (M7 with M8 excepted, section 3.6.4).
TEST(rs274_interpreter, each_modal_group_takes_one_code_per_line) {
  // Groups 1, 2, 3, 5, 6, 7, 8, 10, 12, 13 and M groups 4, 6, 7, 8, 9.
  EXPECT_NO_THROW(
      run_program("G0 G17 G90 G94 G21 G40 G49 G98 G54 G64 M48 T1 M6 S500 M3 M7 M8\n"
                  "G0 X1\nM2\n"));
  const std::pair<const char*, const char*> same[] = {
      {"G90 G91", "G91"},       {"G93 G94", "G94"}, {"G20 G21", "G21"},     {"G40 G42", "G42"},
      {"G43 H0 G49", "G49"},    {"G98 G99", "G99"}, {"G54 G59.3", "G59.3"}, {"G4 P1 G53", "G53"},
      {"G92.1 G92.2", "G92.2"}, {"M48 M49", "M49"}, {"M7 M9", "M9"},
  };
  for (const auto& c : same) {
    SCOPED_TRACE(c.first);
    expect_input_error([&] { run_program(c.first); }, {c.second, "same modal group"});
  }
}

// Rejected programs with the spec rule beside each (NISTIR 6556 chapter 3,
// section numbers from memory).
struct Rejected {
  const char* program;
  const char* where;
  const char* field;
  const char* message;
  const char* rule;
};

TEST(rs274_interpreter, rejects_what_the_spec_forbids) {
  const Rejected cases[] = {
      {"G0 G1 X1", "test.ngc:1:4", "G1", "same modal group", "3.4 one code per modal group"},
      {"G17 G18", "test.ngc:1:5", "G18", "same modal group", "3.4 modal group 2"},
      {"G64 G61.1", "test.ngc:1:5", "G61.1", "same modal group", "3.4 modal group 13"},
      {"M3 M4", "test.ngc:1:4", "M4", "same modal group", "3.4 M group 7"},
      {"G0 M2 M30", "test.ngc:1:7", "M30", "same modal group", "3.4 M group 4"},
      {"G1.5 X1", "test.ngc:1:1", "G1.5", "not an RS-274/NGC G code", "3.4 table of G codes"},
      {"M99", "test.ngc:1:1", "M99", "not an RS-274/NGC M code", "3.4 table of M codes"},
      {"G92", "test.ngc:1:1", "G92", "needs X, Y or Z", "G92 needs an axis word"},
      {"G10 P1 X0", "test.ngc:1:1", "G10", "needs L2", "G10 needs L"},
      {"G10 L1 P1 X0", "test.ngc:1:5", "L", "G10 L1 (tool table data) is not supported",
       "checker scope: tools from the job"},
      {"G10 L2 X0", "test.ngc:1:1", "G10", "needs P", "G10 L2 needs P"},
      {"G10 L2 P10 X0", "test.ngc:1:8", "P", "1 (G54) to 9 (G59.3)", "G10 P is a system 1-9"},
      {"G10 L2 P1 G1 X1 F10", "test.ngc:1:11", "G1", "both use the axis words",
       "axis words belong to G10"},
      {"G84 X1 Z-1 R1 F10", "test.ngc:1:1", "G84", "not supported by the checker", "checker scope"},
      {"G0 A10", "test.ngc:1:4", "A", "rotary axis", "checker scope: three linear axes"},
      {"G1 X1", "test.ngc:1:1", "G1", "feed rate", "3.5.4 feed move needs F (G94)"},
      {"G2 X1 Y1", "test.ngc:1:1", "G2", "R (radius) or the centre offsets", "3.5.3 arc format"},
      {"G2 I5", "test.ngc:1:1", "G2", "needs an end point", "3.5.3 arc needs X or Y"},
      {"G4", "test.ngc:1:1", "G4", "needs P", "3.5.5 G4 needs P"},
      {"G4 P-1", "test.ngc:1:4", "P", "must not be negative", "3.5.5 dwell time"},
      {"X1", "test.ngc:1:1", "G80", "G80", "3.5.15 axis words need a motion mode"},
      {"G0 I1 X1", "test.ngc:1:4", "I", "without G2 or G3", "3.4 words a code does not use"},
      {"G0 X1 R2", "test.ngc:1:7", "R", "without G2, G3", "3.4 words a code does not use"},
      {"G0 X1 Q2", "test.ngc:1:7", "Q", "without G83", "3.4 words a code does not use"},
      {"D1", "test.ngc:1:1", "D", "without G41 or G42", "3.4 words a code does not use"},
      {"G43", "test.ngc:1:1", "G43", "needs H", "3.5.13 G43 needs H"},
      {"G43 H9", "test.ngc:1:5", "H", "tool 9 is not in the tool table", "tool table"},
      {"G0 X1e9", "test.ngc:1:6", "E", "not an RS-274/NGC word letter", "3.5 no exponents"},
      {"G0 X99999999", "test.ngc:1:4", "X", "out of range", "checker: coordinates finite"},
      {"#5241=[10**300]\nG55", "test.ngc:2:1", "G55", "#5241 is out of range", "checker range"},
      {"G1 X1 F-5", "test.ngc:1:7", "F", "must not be negative", "3.5.4 feed rate"},
      {"S-1", "test.ngc:1:1", "S", "must not be negative", "3.6 spindle speed"},
      {"T1.5", "test.ngc:1:1", "T", "tool number", "3.7 T is an integer"},
      {"G53 G91 G0 X1", "test.ngc:1:1", "G53", "incremental", "3.5.12 G53 absolute only"},
      {"G53 G2 X1 R1 F1", "test.ngc:1:1", "G53", "G0 or G1", "3.5.12 G53 with G0/G1"},
      {"G18 G41 D0", "test.ngc:1:5", "G41", "only in the XY plane", "3.5.11 comp in XY"},
      {"G81 X1 Z-1 F10", "test.ngc:1:1", "G81", "needs R", "3.5.16 cycle needs R"},
      {"G81 X1 Z1 R0 F10", "test.ngc:1:1", "G81", "above the retract plane",
       "3.5.16 R must not be below Z"},
      {"G83 X1 Z-1 R1 F10", "test.ngc:1:1", "G83", "needs Q", "3.5.16.3 G83 needs Q"},
  };
  for (const auto& c : cases) {
    SCOPED_TRACE(std::string(c.program) + " -- " + c.rule);
    expect_input_error([&] { run_program(c.program); }, {c.where, c.field, c.message});
  }
}

TEST(rs274_interpreter, error_names_the_program_line_column_and_word) {
  StringProgramSource source("G0 X1\nG1 X2 X3\n", "bracket.ngc");
  Rs274Interpreter interpreter(source);
  ASSERT_TRUE(interpreter.next());
  try {
    interpreter.next();
    FAIL() << "no error";
  } catch (const InputError& e) {
    EXPECT_EQ(e.where(), (SourcePlace{"bracket.ngc", 2, 7}));
    EXPECT_EQ(e.field(), "X");
  }
}

// --- canned cycles (NISTIR 6556 section 3.5.16, from memory) ---

TEST(rs274_interpreter, g81_with_g98_returns_to_the_old_z) {
  const auto moves = motions(run_program("G0 Z10\nG98 G81 X5 Y5 Z-3 R2 F100\nG80\nM2\n"));
  // Rapid over the hole, rapid to R, feed to the bottom, rapid back to the
  // old Z (10, above R).
  ASSERT_EQ(moves.size(), 5u);
  expect_point(moves[1].programmed.end, 5, 5, 10);
  expect_point(moves[2].programmed.end, 5, 5, 2);
  EXPECT_EQ(moves[3].kind, MotionKind::Feed);
  expect_point(moves[3].programmed.end, 5, 5, -3);
  expect_point(moves[4].programmed.end, 5, 5, 10);
  EXPECT_TRUE(moves[4].canned_cycle);
}

TEST(rs274_interpreter, g81_with_g99_returns_to_r_and_keeps_r_and_z) {
  const auto moves = motions(run_program("G0 Z10\nG99 G81 X5 Z-3 R2 F100\nX8\nM2\n"));
  ASSERT_EQ(moves.size(), 8u);
  expect_point(moves[4].programmed.end, 5, 0, 2);  // back to R only
  expect_point(moves[5].programmed.end, 8, 0, 2);  // next hole: R and Z retained
  expect_point(moves[6].programmed.end, 8, 0, -3);
  expect_point(moves[7].programmed.end, 8, 0, 2);
}

TEST(rs274_interpreter, g83_pecks_back_to_r) {
  const auto moves = motions(run_program("G0 Z2\nG99 G83 X0 Z-5 R2 Q3 F100\nM2\n"));
  // Already over the hole at R: no positioning moves. R=2, pecks to -1, retract to 2, rapid to
  // -1+0.254, feed to -4, retract, rapid to -3.746, feed to the bottom -5, back to R.
  ASSERT_EQ(moves.size(), 9u);
  expect_point(moves[1].programmed.end, 0, 0, -1);
  expect_point(moves[2].programmed.end, 0, 0, 2);
  expect_point(moves[3].programmed.end, 0, 0, -0.746);
  expect_point(moves[4].programmed.end, 0, 0, -4);
  expect_point(moves[7].programmed.end, 0, 0, -5);
  expect_point(moves[8].programmed.end, 0, 0, 2);
}

TEST(rs274_interpreter, repeats_in_incremental_mode_step_along) {
  const auto events = run_program("G0 Z5\nG91 G99 G82 X10 Z-4 R-3 P0.2 L3 F50\nM0\nM2\n");
  const auto moves = motions(events);
  // R is 3 below the start (z=2), the bottom 4 below R (z=-2).
  // First hole: over it at z=5, down to R, feed, back to R (4 moves); the
  // next two start at R already (3 moves each).
  ASSERT_EQ(moves.size(), 1u + 4 + 3 + 3);
  expect_point(moves[3].programmed.end, 10, 0, -2);
  expect_point(moves[9].programmed.end, 30, 0, -2);
  int dwells = 0;
  for (const auto& e : events) dwells += std::holds_alternative<Dwell>(e.body) ? 1 : 0;
  EXPECT_EQ(dwells, 3);
  EXPECT_TRUE(std::holds_alternative<Stop>(events[events.size() - 2].body));
}

// --- coordinate systems, G92, G10, G28/G30 and G53 (NISTIR 6556, the
// sections on coordinate systems, G10, G92, G28/G30 and G53; parameter
// numbers from memory: #5161-#5166 G28 home, #5181-#5186 G30 home,
// #5211-#5216 G92 offsets, #5220 the selected system, #5221 + 20 (n - 1) the
// origin of system n) ---

TEST(rs274_interpreter, g92_gives_the_current_point_new_coordinates) {
  // G92 X0 Y0 at (10, 5, 3): the offsets become 10 and 5 (Z keeps its
  // offset, none); G92.2 zeroes the offsets and keeps #5211..; G92.3 takes
  // them back from the parameters; G92.1 zeroes both.
  StringProgramSource source(
      "G0 X10 Y5 Z3\nG92 X0 Y0\nG0 X1\nG92.2\nG0 X1\nG92.3\nG0 X1\nG92.1\nG0 X1\nM2\n", "test.ngc");
  Rs274Interpreter interpreter(source);
  std::vector<Event> events;
  while (auto event = interpreter.next()) {
    events.push_back(*event);
    if (events.size() == 2) {
      EXPECT_EQ(interpreter.parameters().get(5211), 10);
      EXPECT_EQ(interpreter.parameters().get(5212), 5);
    }
  }
  const auto moves = motions(events);
  ASSERT_EQ(moves.size(), 5u);
  expect_point(moves[1].programmed.start, 0, 0, 3);  // the same machine point
  expect_point(moves[1].programmed.end, 1, 0, 3);
  expect_point(events[1].state.axis_offset_mm, 10, 5, 0);
  expect_point(moves[2].programmed.start, 11, 5, 3);  // G92.2: offsets gone
  expect_point(moves[3].programmed.start, -9, 0, 3);  // G92.3: back from #5211..
  expect_point(moves[4].programmed.start, 11, 5, 3);  // G92.1
  EXPECT_EQ(interpreter.parameters().get(5211), 0);
}

TEST(rs274_interpreter, g92_offsets_apply_to_every_system_and_not_to_g53) {
  InterpreterOptions options{.parameters = {{5241, 100}}};
  const auto moves = motions(run_program("G0 X10\nG92 X0\nG55\nG0 Y1\nG53 G0 X0\nM2\n", options));
  ASSERT_EQ(moves.size(), 3u);
  // Machine x 10 in G55 (origin 100) with the G92 offset 10: 10 - 100 - 10.
  expect_point(moves[1].programmed.start, -100, 0, 0);
  // G53 X0 is machine x 0: 0 - 100 - 10 in the work coordinates of the move.
  expect_point(moves[2].programmed.end, -110, 1, 0);
}

TEST(rs274_interpreter, g10_l2_sets_a_systems_origin) {
  // Setting the selected system's origin moves the current point's
  // coordinates at once; another system's takes effect when selected.
  StringProgramSource source(
      "G0 X5\nG10 L2 P1 X2\nG0 Y1\nG10 L2 P2 X100 Y50 Z-10\nG55\nG0 X1\nM2\n", "test.ngc");
  Rs274Interpreter interpreter(source);
  std::vector<Event> events;
  while (auto event = interpreter.next()) events.push_back(*event);
  const auto moves = motions(events);
  ASSERT_EQ(moves.size(), 3u);
  expect_point(moves[1].programmed.start, 3, 0, 0);
  expect_point(moves[2].programmed.start, 5 - 100, 1 - 50, 10);
  EXPECT_EQ(interpreter.parameters().get(5221), 2);
  EXPECT_EQ(interpreter.parameters().get(5242), 50);
  EXPECT_EQ(interpreter.parameters().get(5220), 2);  // G55 selected
}

TEST(rs274_interpreter, g10_l20_sets_the_origin_so_the_current_point_reads_as_given) {
  // A later extension to RS274NGC (from memory): G10 L20 P3 X0 Y0 at
  // machine (5, 5, 0) puts G56's origin at (5, 5) and leaves Z's alone.
  StringProgramSource source("G0 X5 Y5\nG10 L20 P3 X0 Y0\nG56\nG0 Z1\nM2\n", "test.ngc");
  Rs274Interpreter interpreter(source);
  std::vector<Event> events;
  while (auto event = interpreter.next()) events.push_back(*event);
  const auto moves = motions(events);
  ASSERT_EQ(moves.size(), 2u);
  expect_point(moves[1].programmed.start, 0, 0, 0);
  EXPECT_EQ(interpreter.parameters().get(5261), 5);
  EXPECT_EQ(interpreter.parameters().get(5262), 5);
  EXPECT_EQ(interpreter.parameters().get(5263), 0);
}

TEST(rs274_interpreter, the_program_starts_in_the_system_5220_names) {
  InterpreterOptions options{.parameters = {{5220, 2}, {5241, 10}, {5211, 1}}};
  const auto events = run_program("G0 X0\nG54\nG0 X0\nM2\n", options);
  const auto moves = motions(events);
  ASSERT_EQ(moves.size(), 2u);
  EXPECT_EQ(events[0].state.coordinate_system, 2);
  expect_point(events[0].state.work_offset_mm, 10, 0, 0);
  expect_point(events[0].state.axis_offset_mm, 1, 0, 0);  // G92 offset from #5211
  // Machine x 11 reads 11 - 0 - 1 in G54.
  expect_point(moves[1].programmed.start, 10, 0, 0);
}

TEST(rs274_interpreter, g28_without_a_home_can_rise_straight_up) {
  // The checker's stand-in for a home nobody gave: straight up from the
  // intermediate point (G91 G28 Z0: the current point) to machine z 100.
  InterpreterOptions options{.g28_rise_to_mm = 100.0};
  const auto moves = motions(run_program("G0 X5 Y5 Z-1\nG91 G28 Z0\nG90\nM2\n", options));
  ASSERT_EQ(moves.size(), 3u);
  expect_point(moves[1].programmed.end, 5, 5, -1);
  expect_point(moves[2].programmed.end, 5, 5, 100);
  EXPECT_EQ(moves[2].home_return, 28);
  EXPECT_EQ(moves[1].home_return, 0);
}

TEST(rs274_interpreter, a_missing_tool_can_be_reported_and_read_on) {
  InterpreterOptions options{.tools = {{.number = 3, .radius_mm = 6, .length_mm = 0}},
                             .missing_tools_are_zero = true};
  const auto events = run_program("G43 H7\nG41 D8\nG0 X10\nM2\n", options);
  ASSERT_GE(events.size(), 3u);
  EXPECT_EQ(std::get<MissingTool>(events[0].body), (MissingTool{7, 'H'}));
  EXPECT_EQ(std::get<MissingTool>(events[1].body), (MissingTool{8, 'D'}));
  EXPECT_EQ(events[2].state.compensation_radius_mm, 0);
}

TEST(rs274_interpreter, fuzz_seed_programs_run_to_their_end) {
  // The seeds under tests/fuzz/corpus/rs274 start with one mode byte for the
  // fuzz target ('1' mm, '2' inch); the rest is a valid program.
  for (const char* name : {"contour.ngc", "peck.ngc", "params.ngc", "planes.ngc", "offsets.ngc"}) {
    SCOPED_TRACE(name);
    std::ifstream in(testing::source_path(std::string("tests/fuzz/corpus/rs274/") + name),
                     std::ios::binary);
    ASSERT_TRUE(in) << name;
    std::stringstream text;
    text << in.rdbuf();
    const std::string program = text.str();
    const auto units = program[0] == '2' ? Units::Inch : Units::Millimetre;
    InterpreterOptions options{.tools = {{.number = 1, .radius_mm = 3, .length_mm = 50}},
                               .initial_units = units};
    const auto events = run_program(program.substr(1), options);
    ASSERT_FALSE(events.empty());
    EXPECT_TRUE(std::holds_alternative<ProgramEnd>(events.back().body));
    EXPECT_GT(motions(events).size(), 0u);
  }
}

}  // namespace
}  // namespace dovetailor
