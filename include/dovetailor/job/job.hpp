#pragma once

#include <array>
#include <optional>
#include <string>
#include <vector>

#include <dovetailor/base/error.hpp>
#include <dovetailor/base/point.hpp>
#include <dovetailor/base/units.hpp>
#include <dovetailor/job/handwheel.hpp>

namespace dovetailor {

// One dovetail job, as read from a job file. All lengths are millimetres
// (converted from the file's `units` on reading); angles are degrees.
//
// Section convention (see README, "Conventions"): X lateral, Z up, the slide
// runs along Y. Work zero is on the top face of the stock, on the dovetail
// centre line, at the front end (y = 0). The top plane of the dovetail is the
// stock's top face (z = 0); the base plane is at z = -depth.

enum class DovetailType { Male, Female };
enum class WidthAt { Bottom, Top };  // which plane `width` is given at
enum class AngledSides { Both, Left, Right };
enum class Ends { Open, FrontOpen, Closed };
enum class Side { Left, Right };  // -X and +X of the centre line
enum class ToolKind { EndMill, Dovetail, Drill, ChamferMill };
enum class ToolMaterial { Hss, Carbide };
enum class MachineKind { Cnc, Manual };
enum class MillingMode { Conventional, Climb, Both };

struct Part {
  std::string name;
  std::string material;  // free text; matched against the material table by the planner

  bool operator==(const Part&) const = default;
};

struct Stock {
  double width = 0;   // along X
  double length = 0;  // along Y
  double height = 0;  // along Z; the stock spans z = -height .. 0

  bool operator==(const Stock&) const = default;
};

// A gib on one angled flank. Its normal thickness widens a female's flank
// (narrows a male's) laterally by thickness / sin(angle).
struct Gib {
  Side side = Side::Right;
  double thickness = 0;
  double taper = 0;  // 0 for a parallel gib, N for a taper of 1:N along the length

  bool operator==(const Gib&) const = default;
};

// An existing mating part, measured over or between pins: the planner derives
// this part's width from it so that the pair has `clearance` (lateral, total
// of both flanks; see fit.hpp).
struct Mate {
  DovetailType type = DovetailType::Male;
  double reading = 0;
  double pin_diameter = 0;
  double depth = 0;      // the mate's depth; needed when the mate is the female
  double clearance = 0;  // wanted lateral clearance of the pair

  bool operator==(const Mate&) const = default;
};

// How the width of this part was derived from its measured mate (fit.hpp
// conventions), mm.
struct MateDerivation {
  double mate_width = 0;  // the mate's width at its base plane: a male's root, a female's floor
  double mate_mouth = 0;  // a female mate's mouth (0 for a male mate)
  // The gap a male deeper than the female closes, n (Hm - Hf) cot a, and
  // that depth difference; both 0 when the male is not deeper.
  double depth_loss = 0;
  double depth_difference = 0;
  double width = 0;  // this part's width: a female's mouth, a male's root

  bool operator==(const MateDerivation&) const = default;
};

enum class CheckpointAt { AfterRoughing, BeforeFinish, AfterFinish };

// How the planner cuts, from the job's [strategy] table; unset values are
// chosen by the planner from the material and the cutters.
struct Strategy {
  std::optional<double> finish_allowance;  // lateral stock per flank left for finishing, mm
  std::optional<double> rough_allowance;   // lateral stock the end mill leaves per side, mm
  std::optional<double> floor_allowance;   // stock the end mill leaves on a female floor, mm
  std::optional<MillingMode> direction;    // on a CNC; manual machines are always conventional
  std::optional<std::vector<CheckpointAt>> checkpoints;  // where to stop and measure
  bool spring_pass = true;
  bool optional_stops = false;  // M1 instead of M0 at checkpoints
  std::optional<int> end_mill;  // T numbers, when the job lists several
  std::optional<int> dovetail_cutter;

  bool operator==(const Strategy&) const = default;
};

// A signed band around a nominal size: the size is good from nominal + lower
// to nominal + upper.
struct Tolerance {
  double lower = 0;
  double upper = 0;

  bool operator==(const Tolerance&) const = default;
};

struct DovetailSpec {
  DovetailType type = DovetailType::Female;
  double angle = 60;  // flank angle, degrees, measured inside the void at the base corner
  double depth = 0;   // base plane to top plane
  double width = 0;   // at `width_at`
  WidthAt width_at = WidthAt::Bottom;
  AngledSides sides = AngledSides::Both;
  double center = 0;    // lateral offset of the dovetail centre line from the middle of the stock
  double length = 0;    // along Y, from y = 0
  Tolerance tolerance;  // on the width
  Ends ends = Ends::Open;
  double chamfer = 0;  // top edge break
  std::optional<Gib> gib;
  std::optional<Mate> mate;
  std::optional<MateDerivation> mate_derivation;  // how the width was derived from the mate

  bool operator==(const DovetailSpec&) const = default;
};

struct Tool {
  int number = 0;
  ToolKind kind = ToolKind::EndMill;
  double diameter = 0;  // dovetail cutter: the large diameter at the tip
  int flutes = 0;
  double flute_length = 0;  // cutting height
  ToolMaterial material = ToolMaterial::Hss;
  // Dovetail cutters only.
  double angle = 0;  // degrees, between the bottom face and the cone
  double neck_diameter = 0;
  double corner_radius = 0;
  // Drills only: the included angle of the point (118 deg by default,
  // common practice, no source).
  double point_angle = 118;
  // Chamfer mills only: `angle` is the included angle of the cone, and the
  // cone runs from this diameter at the tip up to `diameter` (0: pointed).
  double tip_diameter = 0;
  // Optional body data, used for collision checks and deflection.
  std::optional<double> shank_diameter;
  std::optional<double> stickout;  // gauge length, holder face to tip
  std::optional<double> holder_diameter;
  // Optional user overrides of the computed cutting data (see cutting_data.hpp):
  // spindle speed in rev/min, feed in mm/min, chip load (feed per tooth as
  // programmed, no chip-thinning increase applied) in mm. A feed overrides a
  // chip load; the reader refuses both on one tool.
  std::optional<double> rpm = {};
  std::optional<double> feed = {};
  std::optional<double> chip_load = {};

  bool operator==(const Tool&) const = default;
};

struct Gauge {
  double pin_diameter = 0;
  std::string pin_class;  // optional, e.g. "ZZ" (ASME B89.1.5) or a DIN 2269 class

  bool operator==(const Gauge&) const = default;
};

// How the X zero of a manual machine is found. Either way the spindle axis
// ends up beside a side face of the stock, off it by a known radius, and the
// X dial is zeroed there.
enum class XDatumMethod {
  EdgeFinder,  // an edge finder of `edge_finder_diameter` touches the face
  TouchOff,    // the first tool, running, just touches the face
};

// How the Z zero is found: each tool's tip is touched off on the stock's top
// face over a feeler (paper or shim) of `shim` thickness and the Z dial is
// zeroed there, so the tip stands at z = +shim at dial zero.
struct Datum {
  XDatumMethod x_method = XDatumMethod::EdgeFinder;
  Side x_face = Side::Left;         // the stock side face the X zero is found on
  double edge_finder_diameter = 0;  // mm, for XDatumMethod::EdgeFinder
  double shim = 0;                  // mm, feeler under the tip at Z touch-off

  bool operator==(const Datum&) const = default;
};

// A manual machine's feeds, with dials. Directions are the tool's motion
// relative to the work, as the plan's coordinates are (the table or knee
// itself moves the other way).
struct ManualFeeds {
  Handwheel x;  // the cross feed (X)
  Handwheel z;  // the vertical feed (knee or quill, Z)
  Datum datum;

  bool operator==(const ManualFeeds&) const = default;
};

struct Machine {
  MachineKind kind = MachineKind::Cnc;
  // Limits the cutting data is capped at: spindle rev/min, feed in mm/min.
  std::optional<double> max_rpm = {};
  std::optional<double> max_feed = {};
  // Dials and datum procedure; set for kind = manual when the file gives them
  // (the pass sheet then prints dial settings).
  std::optional<ManualFeeds> manual = {};

  bool operator==(const Machine&) const = default;
};

// Something that holds the work and that no part of the tool may touch: a
// vise jaw, a clamp, a stop. A box in work coordinates (mm), from the job's
// [[fixture]] tables; the checker tests every move of the whole tool body
// against it. Boxes may touch the stock but not reach into it.
enum class FixtureKind { ViseJaw, Clamp, Other };

struct Fixture {
  std::string name;  // for messages; "fixture 2" when the file gives none
  FixtureKind kind = FixtureKind::Other;
  double x_min = 0, x_max = 0;
  double y_min = 0, y_max = 0;
  double z_min = 0, z_max = 0;

  bool operator==(const Fixture&) const = default;
};

// Where a program written elsewhere puts its zero and its axes, for the
// checker ([program] in the job file, or check's flags). The checker
// simulates in the job's frame (X lateral, Z up, Y along the slide, zero on
// the top face at the front end of the centre line).
//
// `zero` is the program's zero in the job's frame: the origin of the
// coordinate system the program starts in (#5220, G54 unless a parameter says
// otherwise), with its own offsets. `slide` is the program's axis that runs
// along the slide from the front end toward the back; Z is up in both, so
// the program's frame is the job's turned about Z (never mirrored).
enum class SlideAxis { PlusX, MinusX, PlusY, MinusY };

struct ProgramSetup {
  Point3 zero{};
  SlideAxis slide = SlideAxis::PlusY;
  // Origins of coordinate systems 1..9 (G54 .. G59.3) in machine
  // coordinates, as the control's offset table holds them; systems not
  // given are at machine zero. Index 0 is G54.
  std::array<std::optional<Point3>, 9> offsets{};
  // The G28 and G30 home positions in machine coordinates; when not given, a
  // return goes straight up from its intermediate point (the checker warns).
  std::optional<Point3> g28_home{};
  std::optional<Point3> g30_home{};

  bool operator==(const ProgramSetup&) const = default;
};

struct Job {
  std::string source;  // file name the job was read from, for messages
  Units units = Units::Inch;
  Part part;
  Stock stock;
  DovetailSpec dovetail;
  std::vector<Tool> tools;
  std::optional<Gauge> gauge;
  Machine machine;
  Strategy strategy;
  std::vector<Fixture> fixtures;
  ProgramSetup program;

  bool operator==(const Job&) const = default;
};

// The width tolerance used when the job file gives none: [0, +0.001 in] or
// [0, +0.02 mm] for a female, [-that, 0] for a male.
Tolerance default_tolerance(DovetailType type, Units units);

// The tool with this number, or nullptr.
const Tool* find_tool(const Job& job, int number);

// The first tool of this kind in the job, or nullptr.
const Tool* first_tool(const Job& job, ToolKind kind);

}  // namespace dovetailor
