#pragma once

#include <array>
#include <optional>
#include <variant>
#include <vector>

#include <dovetailor/base/arc.hpp>
#include <dovetailor/base/point.hpp>
#include <dovetailor/base/units.hpp>
#include <dovetailor/base/words.hpp>

namespace dovetailor {

// The canonical events the RS-274 interpreter produces, one stream per
// program, in the order the machine would act. All lengths are millimetres
// in work coordinates (the coordinate system selected by G54..G59.3), all
// positions are of the tool tip (after any tool length offset), feeds are
// mm/min, spindle speeds rev/min, times seconds.

// Arcs, planes and path segments: base/arc.hpp.

enum class MotionKind { Rapid, Feed, Arc };

// One programmed move (or one move of a canned cycle).
struct Motion {
  MotionKind kind = MotionKind::Rapid;
  // The programmed path of the tool tip. With cutter compensation on it is
  // the contour the program describes, not where the tool centre goes.
  PathSegment programmed;
  // Where the tool centre (its axis, at the tip) actually goes: the
  // programmed path itself without compensation; with compensation the
  // offset path, which may start with an arc round an outside corner.
  // At most two segments.
  std::vector<PathSegment> tool_centre;
  double feed_mm_per_min = 0;  // 0 for rapids (machine's rapid rate)
  bool canned_cycle = false;   // made by G81..G89 rather than written out
  int home_return = 0;         // 28 or 30 for the move of G28/G30 to its home, else 0

  bool operator==(const Motion&) const = default;
};

struct Dwell {
  double seconds = 0;
  bool operator==(const Dwell&) const = default;
};

// M0 program stop, M1 optional stop (only if the operator's switch is on),
// M60 pallet-shuttle stop (treated as a program stop).
enum class StopKind { Program, Optional };
struct Stop {
  StopKind kind = StopKind::Program;
  bool operator==(const Stop&) const = default;
};

// M6: the tool selected by T goes into the spindle.
struct ToolChange {
  int tool = 0;
  bool operator==(const ToolChange&) const = default;
};

enum class SpindleDirection { Stopped, Clockwise, Counterclockwise };
struct SpindleChange {
  SpindleDirection direction = SpindleDirection::Stopped;
  double rpm = 0;
  bool operator==(const SpindleChange&) const = default;
};

struct Coolant {
  bool mist = false;   // M7
  bool flood = false;  // M8
  bool operator==(const Coolant&) const = default;
};
struct CoolantChange {
  Coolant coolant;
  bool operator==(const CoolantChange&) const = default;
};

// A D or H word named a tool the tool table does not hold, and the
// interpreter was told to go on (InterpreterOptions::missing_tools_are_zero):
// the block used zero radius or length instead.
struct MissingTool {
  int tool = 0;
  char word = 'H';  // 'D' or 'H'
  bool operator==(const MissingTool&) const = default;
};

// How the program ended: M2, M30, a closing '%' line, or the input ran out
// without any of them (a checker may warn about that).
enum class EndKind { M2, M30, Percent, EndOfInput };
// Keys for JSON; texts for the check report ("... ended at M30").
constexpr std::array<EnumWord<EndKind>, 4> word_table(EndKind) {
  return {{{EndKind::M2, "m2", "M2"},
           {EndKind::M30, "m30", "M30"},
           {EndKind::Percent, "percent", "'%'"},
           {EndKind::EndOfInput, "end_of_input", "the end of the file (no M2, M30 or '%')"}}};
}
struct ProgramEnd {
  EndKind how = EndKind::M2;
  bool operator==(const ProgramEnd&) const = default;
};

enum class CompensationSide { Off, Left, Right };     // G40, G41, G42
enum class FeedMode { UnitsPerMinute, InverseTime };  // G94, G93
enum class DistanceMode { Absolute, Incremental };    // G90, G91

// The modal state in force when an event happens (after the block's own
// mode changes).
struct MachineState {
  Units program_units = Units::Millimetre;  // G20/G21; values here are mm anyway
  Plane plane = Plane::XY;
  DistanceMode distance = DistanceMode::Absolute;
  FeedMode feed_mode = FeedMode::UnitsPerMinute;
  double feed_mm_per_min = 0;  // the F word in G94 (0 until set)
  SpindleDirection spindle = SpindleDirection::Stopped;
  double spindle_rpm = 0;
  int tool = 0;                       // in the spindle (0: none)
  int selected_tool = 0;              // by the last T word
  bool length_offset_active = false;  // G43
  double length_offset_mm = 0;
  CompensationSide compensation = CompensationSide::Off;
  double compensation_radius_mm = 0;
  int coordinate_system = 1;  // 1 = G54 .. 6 = G59, 7..9 = G59.1..G59.3
  // Work zero in machine coordinates: machine = work + work_offset +
  // axis_offset (+ tool length offset on Z for the spindle's gauge point).
  // work_offset is the origin of the selected system (G54..G59.3, set by
  // parameters or G10), axis_offset the G92 offset applied to every system.
  Point3 work_offset_mm;
  Point3 axis_offset_mm;
  Coolant coolant;

  bool operator==(const MachineState&) const = default;
};

using EventBody = std::variant<Motion, Dwell, Stop, ToolChange, SpindleChange, CoolantChange,
                               ProgramEnd, MissingTool>;

struct Event {
  int line = 0;  // 1-based source line that caused it
  MachineState state;
  EventBody body;

  bool operator==(const Event&) const = default;
};

}  // namespace dovetailor
