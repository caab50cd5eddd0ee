#pragma once

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include <dovetailor/geometry/pin_gauge.hpp>
#include <dovetailor/geometry/section_measure.hpp>
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

struct Finding {
  FindingKind kind = FindingKind::Gouge;
  Severity severity = Severity::Error;
  // The program line of the move (1-based); for findings about the result
  // (stock left, reading) the line where the program ended.
  int line = 0;
  // The station plane (y, mm) where it was seen; none for findings that are
  // not tied to a section (plan-view, spindle speed, fixtures, tools).
  std::optional<double> station_y{};
  // The main figure: how deep, how thick, how wide, how fast (mm, mm of
  // radial cut, rev/min), and the limit it was held against.
  double amount = 0;
  double limit = 0;
  // What happened, in words a machinist reads, figures in the job's units.
  std::string text{};

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
  ProgramSetup setup;   // the program's frame, offsets and homes the check used
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
