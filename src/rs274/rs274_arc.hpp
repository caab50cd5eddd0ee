#pragma once

// Finding an arc's centre from the words of an RS-274 block: the centre
// format (I J K) and the radius format (R). The arc itself, its plane
// coordinates, angle and length are base/arc.hpp. Internal to the rs274
// stage.

#include <dovetailor/rs274/rs274_events.hpp>

namespace dovetailor::detail {

enum class ArcFault { None, SameEndPoints, RadiusTooSmall, RadiiDiffer, ZeroRadius };

// The centre the words give, or why they give none.
struct FoundCentre {
  Point3 centre;
  ArcFault fault = ArcFault::None;
};

// Radius format (NISTIR 6556 section 3.5.3.1, from memory): |R| is the
// radius; R > 0 asks for the arc of 180 degrees or less, R < 0 for the arc
// of more than 180 degrees. Start and end must differ in the plane; |R| may
// fall short of half the chord by at most `tolerance` (then the arc is a
// half circle).
FoundCentre centre_from_radius(const Point3& start, const Point3& end, double radius,
                               ArcDirection direction, Plane plane, double tolerance);

// Centre format (section 3.5.3.2, from memory): the centre is the start plus
// the offsets (always incremental); the radii to start and end may differ by
// at most `tolerance`.
FoundCentre centre_from_offsets(const Point3& start, const Point3& end, double first_offset,
                                double second_offset, Plane plane, double tolerance);

}  // namespace dovetailor::detail
