#pragma once

#include <vector>

#include <dovetailor/base/arc.hpp>
#include <dovetailor/base/point.hpp>
#include <dovetailor/geometry/section_region.hpp>
#include <dovetailor/geometry/tool_body.hpp>

namespace dovetailor {

// The area one move of the tool sweeps in a section plane y = plane_y across
// the slide. The tool axis is vertical (parallel to Z); a move carries the
// tip from one point to another in work coordinates (mm). The checker adds
// up these areas per body part and takes the flutes' area from the stock;
// any other part's area that overlaps the work is a collision.
//
// Geometry. A body part is a convex body of revolution (tool_body.hpp). Cut
// by a plane at distance d from its axis it leaves its chord profile: at each
// height h, half-width sqrt(r(h)^2 - d^2) where r(h) >= |d|. The area a
// straight move sweeps in the plane is the plane's cut through (part swept
// along the line), a convex set, so every piece returned here is one convex
// ring, and no clipping is needed per move.
//  - Move along the slide (only y changes): exactly the chord profile at the
//    point of the move nearest the plane; the full silhouette (d = 0) when
//    the move crosses the plane.
//  - Move at constant y (in the plane, or in a parallel plane off by d): the
//    chord profile swept along the segment, exactly the convex hull of its
//    two end positions (Minkowski sum of a convex polygon with a segment).
//  - Any other line: the convex hull of chord profiles sampled along the
//    move (17 even samples, the point nearest the plane, then halving). The
//    support function of a section of a convex set is concave along the
//    move, so over an interval it exceeds its chord by at most twice the
//    middle sample's rise; an interval is split until that bound stays
//    within tolerance/2 of the hull of all samples, in 64 directions 5.6
//    degrees apart. At most 1024 samples per part and move (reached only by
//    a part grazing the plane along a long move, where the slivers missed
//    are the thinnest).
//  - Arcs: replaced by chords no further than `tolerance` from the arc, one
//    convex piece per chord.
// Where the chord profile is curved (cones and corner rounds off the axis
// plane) it is replaced by chords inside the curve, no further than
// `tolerance` from it. In all, every piece lies within about 2 x tolerance
// (0.2 um by default) of the exact area, and never outside it except for
// arcs (chords cut inside a convex arc, so up to `tolerance` of the arc's
// inner side may be swept too far toward its centre).

struct SweepOptions {
  double tolerance = 1e-4;  // mm, the chord error of every curve replaced by chords
};

// The area one body part sweeps: convex rings (counter-clockwise) whose
// union is the area. Parts that do not reach the plane are left out.
struct SweptPart {
  BodyPart part = BodyPart::Flutes;
  std::vector<Ring> pieces;

  bool operator==(const SweptPart&) const = default;
};

// The chord profile of one body part cut by a plane at distance `d` from its
// axis, with the tip at the origin (x lateral, z up); d = 0 gives the
// silhouette. Convex, counter-clockwise; empty when |d| >= the part's largest
// radius.
Ring chord_profile(const BodySection& section, double d, double tolerance = 1e-4);

// Whether any part of the body crosses the plane during the move: the plane
// lies closer to the move's path in y than the body's largest radius. The
// cheap test the checker runs first (most moves miss most planes).
bool reaches_plane(const ToolBody& body, const Point3& from, const Point3& to, double plane_y);

// The area a straight move (G0/G1) sweeps in the plane y = plane_y.
std::vector<SweptPart> sweep_line(const ToolBody& body, const Point3& from, const Point3& to,
                                  double plane_y, const SweepOptions& options = {});

// The area a circular or helical move (G2/G3) sweeps in the plane
// y = plane_y: the chords of path_points (base/arc.hpp) swept as lines.
// `arc.arc` must be set.
std::vector<SweptPart> sweep_arc(const ToolBody& body, const PathSegment& arc, double plane_y,
                                 const SweepOptions& options = {});

// The area of one swept part as a region (the union of its pieces).
SectionRegion region_of(const SweptPart& swept);

}  // namespace dovetailor
