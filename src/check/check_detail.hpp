#pragma once

// Internals of the checker (checker.hpp), shared by its source files.

#include <cstdint>
#include <memory>
#include <optional>
#include <vector>

#include <dovetailor/check/check_result.hpp>
#include <dovetailor/geometry/section_region.hpp>
#include <dovetailor/geometry/swept_region.hpp>
#include <dovetailor/geometry/tool_body.hpp>
#include <dovetailor/job/job.hpp>

namespace dovetailor::detail {

// Areas below this (mm^2) are rounding, not material: 1 um x 10 um.
inline constexpr double least_area = 1e-5;

// Collects findings: the first `per_kind` of each kind are kept, all are
// counted. A move seen at several stations gives one finding (same kind and
// line); findings about the result are kept per station.
class FindingSink {
 public:
  explicit FindingSink(int per_kind) : per_kind_(per_kind) {}

  void add(Finding finding, bool per_station = false);
  std::vector<Finding> take_findings() { return std::move(findings_); }
  std::vector<FindingCount> counts() const;
  bool seen(FindingKind kind, int line) const;

 private:
  int per_kind_;
  std::vector<Finding> findings_;
  std::vector<long> count_ = std::vector<long>(16, 0);
  std::vector<int> last_line_ = std::vector<int>(16, -1);
};

// What a dovetail cutter may take (checker.hpp), mm: the largest radial
// step the planner takes with it; the floor skin its bottom face takes in
// the planner's passes (a female's floor allowance; the radial engagement
// is read above it); and the skin it may take across its whole diameter
// (at least the planner's default floor allowance: a male's shelf cleaned
// up by the cutter is no slot).
struct CutterLimits {
  double radial_step = 0;
  double floor_skin = 0;
  double skin_across = 0;
};

// A tool ready to sweep: its body, and the "column" above its flutes (a
// cylinder of the flutes' top radius from their top upward) used to tell
// buried flutes. Silhouettes (chord profiles at d = 0) are kept on the grid
// for the fast path: a move along Y across a station sweeps exactly them.
struct SimTool {
  int number = 0;
  int index = 0;  // in the checker's tool list
  Tool tool;
  ToolBody body;
  ToolBody column;
  bool dovetail = false;
  CutterLimits limits;  // dovetail cutters only; radial_step 0: not checked
  struct Silhouette {
    BodyPart part = BodyPart::Flutes;
    std::vector<GridPoint> ring;
  };
  std::vector<Silhouette> silhouettes;
  std::vector<GridPoint> column_silhouette;
};

SimTool make_sim_tool(const Tool& tool, int index, const CutterLimits& limits);

// Station-independent facts about one move.
struct MoveFacts {
  int line = 0;
  MotionKind kind = MotionKind::Feed;
  bool spindle_on = false;
  bool plunging = false;  // the tip moves down
  // The engagement of a dovetail cutter is measured for moves along Y and
  // for straight moves within 45 deg of Y where they cross a station: the
  // tool axis and the tip there, and the move's dx/dy.
  bool along_y = false;
  double axis_x = 0;
  double axis_z = 0;
  double axis_slope = 0;
  double tip_z = 0;  // the highest tip height of the move near the station
};

// The area one move sweeps in one station plane, by purpose.
struct StationSweep {
  SectionRegion flutes;
  std::vector<std::pair<BodyPart, SectionRegion>> others;  // neck, shank, holder
  SectionRegion column;
  std::optional<Bounds2> bounds;  // of everything
};

StationSweep sweep_from_parts(const std::vector<SweptPart>& body,
                              const std::vector<SweptPart>& column);
StationSweep sweep_silhouettes(const SimTool& tool, double x, double z);

// The same sweep moved by (dx, dz) grid units: exact on the grid.
StationSweep shifted(const StationSweep& sweep, std::int64_t dx, std::int64_t dz);

// One station's material; shared between stations while they hold the same.
struct Material {
  std::uint64_t id = 0;
  SectionRegion region;
  std::optional<Bounds2> bounds;
};
using MaterialPtr = std::shared_ptr<const Material>;

// What the finished part at a station forbids: removing material from
// `forbidden` (the finished part shrunk by `allowance`) is a gouge.
struct StationTarget {
  int id = 0;  // stations with the same target share it
  DovetailSection section;
  SectionRegion part;       // the finished part in this plane
  SectionRegion forbidden;  // part shrunk by the allowance
  double allowance = 0;
};

// The result of one move against one material: the material after it (null
// when unchanged) and the findings, without line and station (added by the
// caller).
struct Outcome {
  std::shared_ptr<Material> after;
  std::vector<Finding> findings;
};

Outcome evaluate_move(const Material& material, const StationTarget& target,
                      const StationSweep& sweep, const MoveFacts& facts, const SimTool& tool);

// Thickness of a thin region, 2 * area / perimeter (exact for a long strip).
double thickness_of(const SectionRegion& region);

bool overlaps(const Bounds2& a, const Bounds2& b);

// A disc as a 32-sided polygon inside the circle (for allowances at corners,
// where a chord short of the arc errs toward a finding).
SectionRegion disc(Point2 centre, double radius);

}  // namespace dovetailor::detail

namespace dovetailor::detail {

// Plan view (x, y): an axis-parallel rectangle.
struct PlanRect {
  double x_min = 0, x_max = 0;
  double y_min = 0, y_max = 0;
};

// The shortest plan-view distance between the segment a-b and the rectangle;
// 0 when they meet.
double plan_distance(const Point3& a, const Point3& b, const PlanRect& rect);

// The first part of the body (each part taken as a cylinder of its largest
// radius over its height) that meets the fixture's box during the straight
// move; none when the body stays clear (touching is not meeting).
std::optional<BodyPart> body_meets_box(const ToolBody& body, const Point3& from, const Point3& to,
                                       const Fixture& box);

// Whether a rapid move runs below `safe_z` within `radius` of the rectangle in
// plan view; a move straight up (a retract) never does. Gives how far below
// the safe height the move gets there, or none.
std::optional<double> rapid_below(const Point3& from, const Point3& to, double safe_z,
                                  double radius, const PlanRect& rect);

}  // namespace dovetailor::detail
