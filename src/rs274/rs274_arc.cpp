#include "rs274_arc.hpp"

#include <cmath>

namespace dovetailor::detail {

FoundCentre centre_from_radius(const Point3& start, const Point3& end, double radius,
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

FoundCentre centre_from_offsets(const Point3& start, const Point3& end, double first_offset,
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

}  // namespace dovetailor::detail
