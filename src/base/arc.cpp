#include <algorithm>
#include <cassert>
#include <cmath>

#include <dovetailor/base/arc.hpp>
#include <dovetailor/base/units.hpp>

namespace dovetailor {

PlaneCoordinates in_plane(const Point3& p, Plane plane) {
  switch (plane) {
    case Plane::XY:
      return {p.x, p.y, p.z};
    case Plane::ZX:
      return {p.z, p.x, p.y};
    case Plane::YZ:
      return {p.y, p.z, p.x};
  }
  return {};
}

Point3 from_plane(const PlaneCoordinates& c, Plane plane) {
  switch (plane) {
    case Plane::XY:
      return {c.first, c.second, c.normal};
    case Plane::ZX:
      return {c.second, c.normal, c.first};
    case Plane::YZ:
      return {c.normal, c.first, c.second};
  }
  return {};
}

double swept_angle(const PathSegment& segment) {
  assert(segment.arc);
  const auto& arc = *segment.arc;
  const auto s = in_plane(segment.start, arc.plane);
  const auto e = in_plane(segment.end, arc.plane);
  const auto c = in_plane(arc.centre, arc.plane);
  const double a0 = std::atan2(s.second - c.second, s.first - c.first);
  const double a1 = std::atan2(e.second - c.second, e.first - c.first);
  constexpr double two_pi = 2 * pi;
  double sweep = arc.direction == ArcDirection::Counterclockwise ? a1 - a0 : a0 - a1;
  while (sweep <= 1e-12) sweep += two_pi;
  while (sweep > two_pi + 1e-12) sweep -= two_pi;
  return sweep + two_pi * (arc.turns - 1);
}

double path_length(const PathSegment& segment) {
  if (!segment.arc)
    return std::hypot(segment.end.x - segment.start.x, segment.end.y - segment.start.y,
                      segment.end.z - segment.start.z);
  const auto s = in_plane(segment.start, segment.arc->plane);
  const auto e = in_plane(segment.end, segment.arc->plane);
  const auto c = in_plane(segment.arc->centre, segment.arc->plane);
  const double r = std::hypot(s.first - c.first, s.second - c.second);
  return std::hypot(r * swept_angle(segment), e.normal - s.normal);
}

std::vector<Point3> path_points(const PathSegment& segment, double tolerance) {
  assert(tolerance > 0);
  if (!segment.arc) return {segment.start, segment.end};
  const Plane plane = segment.arc->plane;
  const auto a = in_plane(segment.start, plane);
  const auto b = in_plane(segment.end, plane);
  const auto c = in_plane(segment.arc->centre, plane);
  const double r0 = std::hypot(a.first - c.first, a.second - c.second);
  const double r1 = std::hypot(b.first - c.first, b.second - c.second);
  const double theta0 = std::atan2(a.second - c.second, a.first - c.first);
  const double sweep = segment.arc->direction == ArcDirection::Counterclockwise
                           ? swept_angle(segment)
                           : -swept_angle(segment);
  // A chord of angle `step` on radius r lies r (1 - cos(step / 2)) inside it.
  const double radius = std::max(r0, r1);
  const double step = radius > tolerance ? 2 * std::acos(1 - tolerance / radius) : pi / 2;
  const int n = std::max(1, static_cast<int>(std::ceil(std::abs(sweep) / step)));
  std::vector<Point3> points;
  points.reserve(static_cast<std::size_t>(n) + 1);
  points.push_back(segment.start);
  for (int i = 1; i < n; ++i) {
    const double s = static_cast<double>(i) / n;
    const double theta = theta0 + s * sweep;
    const double r = r0 + s * (r1 - r0);
    points.push_back(from_plane({c.first + r * std::cos(theta), c.second + r * std::sin(theta),
                                 a.normal + s * (b.normal - a.normal)},
                                plane));
  }
  points.push_back(segment.end);
  return points;
}

}  // namespace dovetailor
