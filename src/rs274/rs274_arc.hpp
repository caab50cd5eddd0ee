#pragma once

// Arc geometry for the RS-274 interpreter: plane coordinates, centres from
// the centre format (I J K) and the radius format (R), path lengths.
// Internal to the core library.

#include <dovetailor/rs274/rs274_events.hpp>

namespace dovetailor::detail {

// The two in-plane coordinates and the normal one, in the order the NIST
// interpreter uses (XY: x, y, z; ZX: z, x, y; YZ: y, z, x), so that
// counterclockwise in (first, second) is counterclockwise seen from the
// positive normal axis.
struct PlaneCoordinates {
  double first = 0;
  double second = 0;
  double normal = 0;
};
PlaneCoordinates in_plane(const Point3& p, Plane plane);
Point3 from_plane(const PlaneCoordinates& c, Plane plane);

enum class ArcFault { None, SameEndPoints, RadiusTooSmall, RadiiDiffer, ZeroRadius };

struct ArcCentre {
  Point3 centre;
  ArcFault fault = ArcFault::None;
};

// Radius format (NISTIR 6556 section 3.5.3.1, from memory): |R| is the
// radius; R > 0 asks for the arc of 180 degrees or less, R < 0 for the arc
// of more than 180 degrees. Start and end must differ in the plane; |R| may
// fall short of half the chord by at most `tolerance` (then the arc is a
// half circle).
ArcCentre centre_from_radius(const Point3& start, const Point3& end, double radius,
                             ArcDirection direction, Plane plane, double tolerance);

// Centre format (section 3.5.3.2, from memory): the centre is the start plus
// the offsets (always incremental); the radii to start and end may differ by
// at most `tolerance`.
ArcCentre centre_from_offsets(const Point3& start, const Point3& end, double first_offset,
                              double second_offset, Plane plane, double tolerance);

// Swept angle in radians, in (0, 2*pi] (a full circle when the ends agree
// in the plane), times the turns.
double swept_angle(const PathSegment& arc_segment);
// Length of a line, arc or helix.
double path_length(const PathSegment& segment);

}  // namespace dovetailor::detail
