#pragma once

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include <dovetailor/geometry/pin_gauge.hpp>
#include <dovetailor/geometry/section_measure.hpp>
#include <dovetailor/geometry/tool_body.hpp>
#include <dovetailor/job/job.hpp>
#include <dovetailor/rs274/rs274_events.hpp>

namespace dovetailor {

// What the checker found in a program (checker.hpp). Lengths in mm, as
// everywhere in the core; the report writers (report/check_report.hpp) show
// them in the job's units.

enum class FindingKind {
  Gouge,                  // a move cut into the finished part deeper than the tolerance
  StockLeft,              // material left outside the finished part, thicker than the tolerance
  BodyCollision,          // neck, shank or holder touched material
  FixtureCollision,       // any part of the tool touched a [[fixture]] box
  RapidThroughMaterial,   // a rapid (G0) move met material
  SpindleStopped,         // a feed move met material with the spindle stopped
  Plunge,                 // a dovetail cutter moved down into material
  DepthOfCut,             // flutes engaged to their top with material above them
  CutterOverload,         // a dovetail cutter slotted, or took a wider radial cut than planned
  RapidBelowSafeHeight,   // a rapid ran below the safe height over the stock outline
  SpindleSpeed,           // S above machine.max_rpm
  UnknownTool,            // the program cuts with a tool the job does not list
  ReadingOutOfTolerance,  // the virtual pin reading at a station misses the target band
  NoProgramEnd,           // the program ran out without M2, M30 or '%'
  HomeNotGiven,           // G28/G30 with no home position given: taken as straight up
};

// The word used in JSON and in the text report: "gouge", "stock_left", ...
std::string_view finding_kind_name(FindingKind kind);

// Errors make the program unfit to run (exit code 1); warnings deserve a look.
enum class Severity { Error, Warning };
std::string_view severity_name(Severity severity);  // "error", "warning"

// What named a tool the job does not list (UnknownTool).
enum class ToolWord {
  None,  // no tool at all: moves below the top face before any T and M6
  T,     // the program cuts with the tool a T word selected (no M6 for it)
  M6,    // M6 loads it
  D,     // a D word (cutter radius compensation) names it
  H,     // an H word (tool length offset) names it
};
std::string_view tool_word_name(ToolWord word);  // "none", "t", "m6", "d", "h"

// How a dovetail cutter was overloaded (CutterOverload).
enum class Overload {
  Slot,       // engaged across its diameter: material on its axis
  RadialCut,  // a lateral cut on one side wider than the planner's step
};
std::string_view overload_name(Overload overload);  // "slot", "radial_cut"

// A finding is data: the writers (report/check_report.hpp) put it in words
// and in the job's units. Every length is in mm; every position in the
// section plane (x across, z up) or in the job's frame.
struct Finding {
  FindingKind kind = FindingKind::Gouge;
  Severity severity = Severity::Error;
  // The program line of the move (1-based); for findings about the result
  // (stock left, reading) the line where the program ended.
  int line = 0;
  // The station plane (y, mm) where it was seen; none for findings that are
  // not tied to a section (plan-view, spindle speed, fixtures, tools).
  std::optional<double> station_y{};
  // The main figure and the limit it was held against, by kind:
  //  Gouge: depth into the finished part / the allowance (half the band).
  //  StockLeft: thickness / the allowance.
  //  BodyCollision: how deep the part runs into material / 0.
  //  RapidThroughMaterial, SpindleStopped, Plunge: height of the material
  //    met / 0.
  //  DepthOfCut: how far material runs above the flutes / flute length.
  //  CutterOverload: the cut's width (Slot) or radial cut (RadialCut) /
  //    the planner's radial step.
  //  RapidBelowSafeHeight: how far below / the safe height (z, mm).
  //  SpindleSpeed: S / machine.max_rpm (rev/min).
  //  UnknownTool: the tool number (as `tool`) / 0.
  //  ReadingOutOfTolerance: the reading (0 when none) / the target reading.
  double amount = 0;
  double limit = 0;

  // What else each kind says; fields a kind does not use keep their
  // defaults.
  // The T number: the tool of every finding about a move, the tool not
  // listed for UnknownTool (0: no tool in the spindle).
  int tool = 0;
  ToolWord named_by = ToolWord::None;  // UnknownTool
  // BodyCollision (neck, shank, holder), FixtureCollision (any part).
  std::optional<BodyPart> part{};
  // FixtureCollision: the index of the box in the job's [[fixture]] list
  // (CheckReport::fixtures has their names).
  int fixture = -1;
  // Section coordinates (x, z): Gouge, the middle of its deepest part;
  // BodyCollision, the middle of the touch.
  std::optional<Point2> at{};
  // StockLeft: the bounds of the material left, section coordinates.
  std::optional<Bounds2> extent{};
  double area = 0;  // RapidThroughMaterial: material in the tool's path, mm^2
  // CutterOverload: how; for a Slot, the height of material on the axis.
  Overload overload = Overload::RadialCut;
  double on_axis = 0;
  int home_return = 0;  // HomeNotGiven: 28 or 30 (G28, G30)
  // ReadingOutOfTolerance: the readings that are good (mm), the pins'
  // diameter, and why there is no reading (none when there is one).
  double band_low = 0;
  double band_high = 0;
  double pin_diameter = 0;
  std::optional<MeasureProblem> problem{};

  bool operator==(const Finding&) const = default;
};

// How many findings of one kind there were in all; only the first few of each
// kind are kept as Finding values so the report stays bounded however long
// the program is.
struct FindingCount {
  FindingKind kind = FindingKind::Gouge;
  long count = 0;

  bool operator==(const FindingCount&) const = default;
};

// The simulated section at one station, measured as the machinist will
// measure the real part, next to the target at that y (a tapered gib moves
// one flank along the length).
struct StationResult {
  double y = 0;
  SectionMeasurement measured;
  double target_depth = 0;
  double target_width_bottom = 0;
  double target_width_top = 0;
  PinReading target_reading;
  // The target is the middle of the width tolerance band (aimed_spec in
  // dovetail_section.hpp); the reading is good from target + tolerance.lower
  // - m to target + tolerance.upper - m, m = band_middle(tolerance) (the pin
  // reading moves one for one with the width at the base plane, pin_gauge.hpp).
  bool reading_in_tolerance = false;
  // The regions behind the figures, for drawing (check_drawing.hpp), as
  // rings in section coordinates (mm; outer rings counter-clockwise, holes
  // clockwise): the material the simulation left, the finished part wanted
  // here, material cut from the part deeper than the tolerance (the Gouge
  // findings' result) and stock left outside it thicker than the tolerance
  // (the StockLeft finding's region). A few hundred points per station,
  // however long the program.
  std::vector<Ring> section;
  std::vector<Ring> target_part;
  std::vector<Ring> gouged;
  std::vector<Ring> leftover;

  bool operator==(const StationResult&) const = default;
};

struct CheckReport {
  std::string program;  // the program's name, for the report
  // The job's [[fixture]] names, by index (Finding::fixture).
  std::vector<std::string> fixtures;
  ProgramSetup setup;  // the program's frame, offsets and homes the check used
  Units units = Units::Millimetre;
  DovetailType type = DovetailType::Female;
  Tolerance tolerance;               // on the width, and so on the reading
  std::vector<Finding> findings;     // in program order within each kind
  std::vector<FindingCount> counts;  // every kind that occurred
  std::vector<StationResult> stations;
  // How the reading changes along the slide: (last - first) / (y_last -
  // y_first), and the largest minus the smallest reading. Zero with fewer
  // than two measured stations.
  double reading_taper = 0;
  double reading_spread = 0;
  long lines = 0;  // program lines read
  long moves = 0;  // motion events simulated
  EndKind end = EndKind::EndOfInput;

  bool operator==(const CheckReport&) const = default;

  bool has_errors() const;
  long count(FindingKind kind) const;
};

}  // namespace dovetailor
