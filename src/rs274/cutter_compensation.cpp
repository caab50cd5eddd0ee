#include "cutter_compensation.hpp"

#include <cmath>

#include <dovetailor/base/units.hpp>

namespace dovetailor::detail {

namespace {

constexpr double half_pi = pi / 2;
constexpr double two_pi = 2 * pi;
// Largest concave turn accepted, radians (NIST TOLERANCE_CONCAVE_CORNER,
// from memory).
constexpr double concave_tolerance = 0.01;

Point3 offset(const Point3& p, double angle, double radius, double z) {
  return {p.x + radius * std::cos(angle), p.y + radius * std::sin(angle), z};
}

}  // namespace

CompensatedMove compensate_entry(const Point3& tool, const Point3& programmed_end, double radius,
                                 CompensationSide side) {
  const double distance = std::hypot(programmed_end.x - tool.x, programmed_end.y - tool.y);
  if (distance <= radius) return {CompensationFault::EntryInsideRadius, {}};
  const double theta = std::acos(radius / distance);
  const double back = std::atan2(tool.y - programmed_end.y, tool.x - programmed_end.x);
  const double alpha = side == CompensationSide::Left ? back - theta : back + theta;
  return {CompensationFault::None,
          {PathSegment{tool, offset(programmed_end, alpha, radius, programmed_end.z), {}}}};
}

CompensatedMove compensate_move(const Point3& tool, const PathSegment& programmed, double radius,
                                CompensationSide side, bool corner_arc) {
  const Point3& start = programmed.start;
  const Point3& end = programmed.end;
  const bool left = side == CompensationSide::Left;
  // Direction of travel at the start.
  double alpha = 0;
  bool inside_arc = false;
  double arc_radius = 0;
  if (programmed.arc) {
    const auto& c = programmed.arc->centre;
    const bool ccw = programmed.arc->direction == ArcDirection::Counterclockwise;
    alpha = std::atan2(start.y - c.y, start.x - c.x) + (ccw ? half_pi : -half_pi);
    inside_arc = left == ccw;
    arc_radius = std::hypot(start.x - c.x, start.y - c.y);
    if (inside_arc && arc_radius <= radius) return {CompensationFault::ArcRadiusNotGreater, {}};
  } else {
    if (start.x == end.x && start.y == end.y)
      return {CompensationFault::None, {PathSegment{tool, {tool.x, tool.y, end.z}, {}}}};
    alpha = std::atan2(end.y - start.y, end.x - start.x);
  }
  // The NIST corner test: theta is where the tool stands seen from the
  // programmed corner, beta how far the path turns away from the tool side.
  double theta = std::atan2(tool.y - start.y, tool.x - start.x);
  double beta = 0;
  if (left) {
    if (theta < alpha) theta += two_pi;
    beta = theta - alpha - half_pi;
  } else {
    if (alpha < theta) alpha += two_pi;
    beta = alpha - theta - half_pi;
  }
  const double normal = left ? alpha + half_pi : alpha - half_pi;
  const bool at_corner = std::hypot(tool.x - start.x, tool.y - start.y) > radius * 0.5;
  if (at_corner && (beta < -concave_tolerance || beta > pi + concave_tolerance))
    return {CompensationFault::ConcaveCorner, {}};

  CompensatedMove result;
  const Point3 mid = offset(start, normal, radius, tool.z);
  Point3 from = tool;
  if (corner_arc && at_corner && beta > concave_tolerance) {
    result.tool_centre.push_back(
        PathSegment{tool, mid,
                    ArcShape{{start.x, start.y, tool.z},
                             Plane::XY,
                             left ? ArcDirection::Clockwise : ArcDirection::Counterclockwise,
                             1}});
    from = mid;
  }
  if (!programmed.arc) {
    result.tool_centre.push_back(PathSegment{from, offset(end, normal, radius, end.z), {}});
    return result;
  }
  const auto& c = programmed.arc->centre;
  const double new_radius = inside_arc ? arc_radius - radius : arc_radius + radius;
  const double end_angle = std::atan2(end.y - c.y, end.x - c.x);
  const double start_angle = std::atan2(start.y - c.y, start.x - c.x);
  Point3 arc_start = offset(c, start_angle, new_radius, from.z);
  // Without a corner arc the tool may be a hair off the offset circle; start
  // the arc where the tool is so the path stays continuous.
  if (result.tool_centre.empty()) arc_start = from;
  result.tool_centre.push_back(PathSegment{
      arc_start, offset(c, end_angle, new_radius, end.z),
      ArcShape{{c.x, c.y, from.z}, Plane::XY, programmed.arc->direction, programmed.arc->turns}});
  return result;
}

}  // namespace dovetailor::detail
