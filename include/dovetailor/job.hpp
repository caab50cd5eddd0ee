#pragma once

#include <optional>
#include <string>
#include <vector>

#include <dovetailor/error.hpp>
#include <dovetailor/units.hpp>

namespace dovetailor {

// One dovetail job, as read from a job file. All lengths are millimetres
// (converted from the file's `units` on reading); angles are degrees.
//
// Section convention (see README, "Conventions"): X lateral, Z up, the slide
// runs along Y. Work zero is on the top face of the stock, on the dovetail
// centre line, at the front end (y = 0). The top plane of the dovetail is the
// stock's top face (z = 0); the base plane is at z = -depth.

enum class DovetailType { Male, Female };
enum class WidthAt { Bottom, Top };        // which plane `width` is given at
enum class AngledSides { Both, Left, Right };
enum class Ends { Open, FrontOpen, Closed };
enum class Side { Left, Right };           // -X and +X of the centre line
enum class ToolKind { EndMill, Dovetail };
enum class ToolMaterial { Hss, Carbide };
enum class MachineKind { Cnc, Manual };

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
  double center = 0;  // lateral offset of the dovetail centre line from the middle of the stock
  double length = 0;  // along Y, from y = 0
  Tolerance tolerance;  // on the width
  Ends ends = Ends::Open;
  double chamfer = 0;  // top edge break
  std::optional<Gib> gib;

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

struct Machine {
  MachineKind kind = MachineKind::Cnc;
  // Limits the cutting data is capped at: spindle rev/min, feed in mm/min.
  std::optional<double> max_rpm = {};
  std::optional<double> max_feed = {};

  bool operator==(const Machine&) const = default;
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
