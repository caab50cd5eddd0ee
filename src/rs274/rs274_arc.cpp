#include "rs274_arc.hpp"

#include <cmath>

namespace dovetailor::detail {

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

ArcCentre centre_from_radius(const Point3& start, const Point3& end, double radius,
                             ArcDirection direction, Plane plane, double tolerance) {
  const auto s = in_plane(start, plane);
  const auto e = in_plane(end, plane);
  const double dx = e.first - s.first;
  const double dy = e.second - s.second;
  const double chord = std::hypot(dx, dy);
  if (chord <= tolerance) return {start, ArcFault::SameEndPoints};
  const double r = std::fabs(radius);
  if (r == 0) return {start, ArcFault::ZeroRadius};
  const double half = chord / 2;
  if (r < half - tolerance) return {start, ArcFault::RadiusTooSmall};
  const double rise = r > half ? std::sqrt(r * r - half * half) : 0.0;
  // Left of the chord for a counterclockwise arc of up to 180 degrees.
  double side = direction == ArcDirection::Counterclockwise ? 1.0 : -1.0;
  if (radius < 0) side = -side;
  const double nx = -dy / chord;
  const double ny = dx / chord;
  const PlaneCoordinates c{s.first + dx / 2 + side * rise * nx,
                           s.second + dy / 2 + side * rise * ny, s.normal};
  return {from_plane(c, plane), ArcFault::None};
}

ArcCentre centre_from_offsets(const Point3& start, const Point3& end, double first_offset,
                              double second_offset, Plane plane, double tolerance) {
  const auto s = in_plane(start, plane);
  const auto e = in_plane(end, plane);
  const PlaneCoordinates c{s.first + first_offset, s.second + second_offset, s.normal};
  const double r_start = std::hypot(first_offset, second_offset);
  const double r_end = std::hypot(e.first - c.first, e.second - c.second);
  if (r_start == 0) return {start, ArcFault::ZeroRadius};
  if (std::fabs(r_start - r_end) > tolerance) return {start, ArcFault::RadiiDiffer};
  return {from_plane(c, plane), ArcFault::None};
}

double swept_angle(const PathSegment& segment) {
  const auto& arc = *segment.arc;
  const auto s = in_plane(segment.start, arc.plane);
  const auto e = in_plane(segment.end, arc.plane);
  const auto c = in_plane(arc.centre, arc.plane);
  const double a0 = std::atan2(s.second - c.second, s.first - c.first);
  const double a1 = std::atan2(e.second - c.second, e.first - c.first);
  constexpr double two_pi = 6.283185307179586;
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

}  // namespace dovetailor::detail
