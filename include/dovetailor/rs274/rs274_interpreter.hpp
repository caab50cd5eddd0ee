#pragma once

#include <cstddef>
#include <deque>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include <dovetailor/base/units.hpp>
#include <dovetailor/rs274/program_source.hpp>
#include <dovetailor/rs274/rs274_block.hpp>
#include <dovetailor/rs274/rs274_codes.hpp>
#include <dovetailor/rs274/rs274_events.hpp>
#include <dovetailor/rs274/rs274_parameters.hpp>

namespace dovetailor {

// An RS-274/NGC interpreter after the NIST RS274NGC Interpreter Version 3
// (Kramer, Proctor, Messina, NISTIR 6556, 2000). It pulls lines from a
// ProgramSource one at a time and turns them into canonical events
// (rs274_events.hpp), streaming: memory does not grow with the program.
//
//   StringProgramSource source("G21 G90 G17\nG0 X10 Y5\nM30\n", "demo.ngc");
//   Rs274Interpreter interpreter(source, {.tools = {{1, 3.0, 50.0}}});
//   while (auto event = interpreter.next()) { ... event->line, event->body ... }
//
// Supported (NISTIR 6556 chapter 3, section numbers from memory):
//   G0 G1 G2 G3 (centre I J K and radius R, full circles, helices), G4 P
//   dwell, G17 G18 G19, G20 G21 (everything becomes mm), G40 G41 G42 with D
//   (XY plane only), G43 H, G49, G53 (with G0/G1: machine coordinates for
//   that block only), G54..G59 G59.1..G59.3 (origins of systems 1..9 from
//   parameters #5221 + 20 (n - 1) X, +1 Y, +2 Z, in the program's units at
//   the time the system is selected; the number of the selected system is
//   kept in #5220 and the program starts in the system #5220 names, 1 when
//   it holds 0), G10 L2 Pn (sets system n's origin to the axis words, in
//   machine coordinates; the others keep theirs) and G10 L20 Pn (a later
//   extension to RS274NGC, from memory: sets system n's origin so that the
//   current point has the given coordinates in it), G92 (an offset of every
//   system such that the current point has the given coordinates; kept in
//   #5211..#5213 and read from them at the start), G92.1 (offset zero and
//   #5211.. cleared), G92.2 (offset zero, parameters kept), G92.3 (offset
//   back from the parameters), G61 G61.1 G64 (accepted; no effect on the
//   path), G28 G30 (via the axis words' point to the home position in
//   #5161.. or #5181.., machine coordinates, all three axes, as NIST V3
//   does), G80, canned cycles G81 G82 G83 G85 G89 in the XY plane
//   (generated as the moves they make, with G98/G99 return levels, L
//   repeats, R and Z kept while the same cycle continues as NIST does, P and
//   Q kept too), G90 G91, G93 G94, G98 G99, M0 M1 M2 M3 M4 M5 M6 M7 M8 M9 M30
//   M48 M49 M60, F S T, parameters and expressions.
// Not supported (InputError naming the line and the word): G10 L1 (tool
//   table), G38.2, G84, G86, G87, G88, A B C axis words, canned cycles
//   outside the XY plane, canned cycles in G93.
//
// Order of execution within a block follows the spec's table (section 3.8,
// from memory): parameter settings, feed mode, F, S, T, M6, M3-M5, M7-M9,
// G4, plane, units, cutter compensation, length offset, coordinate system,
// path mode, distance mode, return mode, G28/G30, motion, then M0 M1 M2 M30
// M60. One deviation: G20/G21 takes effect before F, so F is read in the
// units the line sets.
//
// Errors are InputError with the program name as file, the line, the column
// and the word as field. After an error the interpreter must not be used
// further (the checker stops at the first error).
//
// Deviations from NIST V3, chosen for checking real programs: a move that
// changes only Z right after G41/G42 is allowed and leaves the entry move
// for later; the line number may have up to nine digits.

// One tool the program may name with T, D or H. `radius_mm` is used by
// G41/G42 D, `length_mm` by G43 H. Number 0 means "no tool" and always has
// zero radius and length.
struct ToolTableEntry {
  int number = 0;
  double radius_mm = 0;
  double length_mm = 0;

  bool operator==(const ToolTableEntry&) const = default;
};

struct InterpreterOptions {
  std::vector<ToolTableEntry> tools{};
  Units initial_units = Units::Millimetre;  // until the program says G20 or G21
  Point3 start_mm{};  // tool tip at the start, in the starting system's work coordinates
  // The operator's block delete switch: when on, lines that start with '/'
  // are skipped without being read.
  bool block_delete = false;
  Rs274Limits limits{};
  int highest_parameter = Rs274Parameters::highest_number;
  // Parameter values before the program starts, e.g. {{5221, 10.0}}.
  std::vector<std::pair<int, double>> parameters{};
  // A D or H word naming a tool not in `tools`: false refuses the line
  // (InputError); true goes on with zero radius or length and hands out a
  // MissingTool event first (a checker reports it and reads on).
  bool missing_tools_are_zero = false;
  // When set, G28 (G30) goes through the intermediate point to a point
  // straight above it at this machine Z (mm) instead of to the stored home
  // position: a stand-in for a home position nobody gave.
  std::optional<double> g28_rise_to_mm{};
  std::optional<double> g30_rise_to_mm{};
};

class Rs274Interpreter {
 public:
  Rs274Interpreter(ProgramSource& source, InterpreterOptions options = {});

  // The next event, or nothing once the program has ended (the last event
  // is always a ProgramEnd). Throws InputError for a bad line.
  std::optional<Event> next();

  const MachineState& state() const { return state_; }
  const Rs274Parameters& parameters() const { return parameters_; }
  // Tool-centre position now, work coordinates, mm.
  const Point3& position() const { return position_; }
  // Events waiting to be handed out. Bounded by what one block can make
  // (a canned cycle hands out one hole at a time), never by program length.
  std::size_t queued_events() const { return queue_.size(); }

 private:
  struct Cycle {
    GCode code = GCode::Drill;  // G81 .. G89
    int holes_left = 0;
    double x = 0, y = 0;    // this hole
    double dx = 0, dy = 0;  // increment per repeat (G91), 0 in G90
    double r = 0, bottom = 0, clear = 0, dwell = 0, peck = 0;
    int line = 0;
  };

  bool read_block();
  void execute(const Rs274Block& block);
  void push(int line, EventBody body);
  void push_motion(int line, MotionKind kind, PathSegment programmed,
                   std::vector<PathSegment> tool_centre, double feed, bool canned = false);
  void next_hole();
  [[noreturn]] void fail(const Rs274Block& block, int column, const std::string& field,
                         const std::string& message) const;

  friend class Rs274BlockExecutor;

  ProgramSource& source_;
  InterpreterOptions options_;
  Rs274Parameters parameters_;
  MachineState state_;
  Point3 position_;
  std::optional<Point3> programmed_;  // programmed point while compensating
  bool compensation_entry_pending_ = false;
  GCode motion_mode_ = GCode::CycleCancel;
  bool retract_to_r_mode_ = false;  // G99; G98 (back to the old Z) at the start
  std::optional<double> cycle_r_, cycle_z_, cycle_p_, cycle_q_;  // kept cycle words, mm / s
  std::optional<Cycle> cycle_;
  std::vector<std::pair<int, EventBody>> after_cycle_;
  std::deque<Event> queue_;
  std::string text_;
  int line_ = 0;
  bool content_seen_ = false;
  bool ended_ = false;
};

}  // namespace dovetailor
