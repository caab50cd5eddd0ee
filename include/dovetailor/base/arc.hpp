#pragma once

#include <optional>
#include <vector>

#include <dovetailor/base/point.hpp>

namespace dovetailor {

// The one model of a straight, circular or helical move that every stage
// shares: the RS-274 interpreter makes these, cutter compensation offsets
// them, the program frame turns them, the swept regions and the checker
// sample them. Lengths in mm, work coordinates (x lateral, y along the
// slide, z up).

// The plane an arc lies in and its normal axis: XY (G17, normal Z),
// ZX (G18, normal Y), YZ (G19, normal X) (NISTIR 6556 section 3.5.6, from
// memory).
enum class Plane { XY, ZX, YZ };

// Seen from the positive end of the plane's normal axis looking toward the
// origin: G2 is clockwise, G3 counterclockwise (NISTIR 6556 section 3.5.3,
// from memory).
enum class ArcDirection { Clockwise, Counterclockwise };

// How a segment bends between its two ends.
struct ArcShape {
  // Centre in the plane; only its two in-plane coordinates count.
  Point3 centre;
  Plane plane = Plane::XY;
  ArcDirection direction = ArcDirection::Clockwise;
  // Times round: 1 for any arc up to one full circle. A segment whose start
  // and end agree in the plane is a full circle. The normal-axis coordinate
  // goes linearly from start to end (a helix when they differ).
  int turns = 1;

  bool operator==(const ArcShape&) const = default;
};

// A straight line when `arc` is empty, else an arc or helix from `start`
// to `end`.
struct PathSegment {
  Point3 start;
  Point3 end;
  std::optional<ArcShape> arc;

  bool operator==(const PathSegment&) const = default;
};

// The two in-plane coordinates and the normal one, in the order RS-274 uses
// (XY: x, y, z; ZX: z, x, y; YZ: y, z, x), so that counterclockwise in
// (first, second) is counterclockwise seen from the positive normal axis.
struct PlaneCoordinates {
  double first = 0;
  double second = 0;
  double normal = 0;

  bool operator==(const PlaneCoordinates&) const = default;
};
PlaneCoordinates in_plane(const Point3& p, Plane plane);
Point3 from_plane(const PlaneCoordinates& c, Plane plane);

// The angle an arc sweeps in radians, in (0, 2 pi] times its turns (a full
// circle when the ends agree in the plane). `segment.arc` must be set.
double swept_angle(const PathSegment& segment);

// Length of a line, arc or helix: for a helix the hypotenuse of the arc's
// length in the plane and the rise along the normal (the helix unrolled).
double path_length(const PathSegment& segment);

// The segment as a chain of points, first `start`, last `end`, whose chords
// lie no further than `tolerance` (mm, > 0) from the arc; a line gives its
// two ends. The radius blends linearly from the start radius to the end
// radius (they differ only by a program's rounding), the normal coordinate
// linearly from start to end.
std::vector<Point3> path_points(const PathSegment& segment, double tolerance);

}  // namespace dovetailor
