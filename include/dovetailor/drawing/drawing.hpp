#pragma once

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include <dovetailor/geometry/dovetail_section.hpp>
#include <dovetailor/plan/plan.hpp>

namespace dovetailor {

// The cross-section of a job as a drawing model, in section coordinates (mm,
// x lateral, z up, work zero on the top face at the centre line): filled
// regions, outlines, pins and dimensions. It says what to draw, not how it
// looks on paper; drawing_scene.hpp lays it out to scale and gives it the
// palette, and the SVG and cairo painters only paint the scene.
//
// Regions are painted in order, so a later layer (for instance a simulated
// section from the checker, with gouges and leftover stock as their own
// regions) can be added over the target without changing the rest.

// How a region is filled; drawing_scene.hpp gives each one a colour and a
// hatch that stay distinct in greyscale print.
enum class RegionFill {
  Part,       // the finished part
  Removed,    // material an operation removes (`index` picks its hatch)
  Simulated,  // a simulated section (check_drawing.hpp)
  Gouge,      // material cut that the target keeps
  Leftover,   // material left that the target removes
};

struct Region {
  RegionFill fill = RegionFill::Part;
  int index = 0;  // for Removed: 0 for the first operation, 1 for the next, ...
  std::vector<std::vector<Point2>> polygons;  // outer rings, counter-clockwise
  std::string label;                          // legend text

  bool operator==(const Region&) const = default;
};

enum class OutlineStyle {
  Stock,      // the stock as supplied
  ToolFirst,  // a tool at an early pass
  ToolFinal,  // a tool at a finishing pass
  Target,     // the finished part drawn over a simulated section
};

// A closed outline drawn without fill: the stock, or a tool's silhouette.
struct Outline {
  OutlineStyle style = OutlineStyle::Stock;
  std::vector<Point2> points;
  std::string label;  // legend text; empty: no legend entry (a second ring of one thing)
  std::string tag;    // short text beside it on the drawing ("T2 p5"), may be empty

  bool operator==(const Outline&) const = default;
};

struct PinMark {
  Point2 center;
  double diameter = 0;

  bool operator==(const PinMark&) const = default;
};

enum class DimensionKind { Horizontal, Vertical, Angle };

// A dimension with its text in the job's units. Linear: from `a` to `b`
// (measured along X or Z), the dimension line drawn `offset` mm away from
// the points (+ up or right, - down or left; 0 draws it through them).
// Angle: vertex `a`, an arc from direction `from_deg` to `to_deg`
// (counter-clockwise, degrees from +X) at radius `offset`.
struct Dimension {
  DimensionKind kind = DimensionKind::Horizontal;
  Point2 a;
  Point2 b;
  double offset = 0;
  double from_deg = 0;
  double to_deg = 0;
  double value = 0;  // mm (linear) or degrees (angle), as the text shows it
  std::string text;

  bool operator==(const Dimension&) const = default;
};

struct Drawing {
  std::string title;     // part name
  std::string subtitle;  // what is shown, units
  std::vector<Region> regions;
  std::vector<Outline> outlines;
  std::vector<PinMark> pins;
  std::string pin_label;  // legend text for the pins
  std::vector<Dimension> dimensions;
  // The section's extent without tools (mm): the stock box.
  Point2 stock_min;
  Point2 stock_max;

  bool operator==(const Drawing&) const = default;
};

// The drawing of a plan: the stock, the finished part, what each operation
// removes (the sweep of its passes' tool silhouettes, clipped to the stock,
// less what earlier operations took), the dovetail cutter at its first and
// its finishing pass, the pins of the last checkpoint with the measured
// distance, the widths at the base and top planes, the depth and the angle.
Drawing build_drawing(const Plan& plan);

// The stock as supplied, in a drawing of `job`: sets the drawing's extent
// (stock_min, stock_max), adds its dashed outline, and returns the ring.
std::vector<Point2> add_stock(Drawing& drawing, const Job& job);

// The silhouette of a tool in the section with its axis at x and its tip at
// z, up to `top` (mm): the profile of its body (tool_body.hpp, the model the
// planner and the checker use, with the same assumptions for what the job
// leaves out): flutes with any corner radius, then neck, shank and holder.
std::vector<Point2> tool_silhouette(const Tool& tool, double x, double z, double top);

// How a reading is taken, as a legend says it: "over the pins", "between
// the pins", "square side to pin".
std::string_view reading_words(ReadingMethod method);

// Area enclosed by a ring (positive counter-clockwise), mm^2.
double ring_area(const std::vector<Point2>& ring);

}  // namespace dovetailor
