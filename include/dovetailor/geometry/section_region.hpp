#pragma once

#include <cstddef>
#include <cstdint>
#include <optional>
#include <vector>

#include <dovetailor/geometry/dovetail_section.hpp>

namespace dovetailor {

// A region of one section plane across the slide (x lateral, z up): stock,
// a part as cut, or the area a tool body sweeps. Booleans are done by the
// Clipper polygon clipping library (Debian libpolyclipping) on 64-bit
// integer coordinates, so they are exact and never fail on touching or
// collinear edges.
//
// Scale: 100000 grid units per millimetre, one unit = 10 nm = 0.0000004 in.
// Points are rounded to that grid once, when they enter a region; every
// boolean after that is exact on the grid. Coordinates up to +-10 m stay in
// Clipper's fast 62-bit range. 10 nm is 1/100 of the finest figure a reading
// is shown with (0.001 mm) and 1/250 of 0.0001 in.
inline constexpr double region_units_per_mm = 100000.0;

// Half a grid step: the most a point moves when it is rounded onto the grid.
inline constexpr double region_rounding = 0.5 / region_units_per_mm;

// One closed polygon ring in mm. The last point is not repeated.
using Ring = std::vector<Point2>;

// A point on the region grid (units of 1 / region_units_per_mm mm).
struct GridPoint {
  std::int64_t x = 0;
  std::int64_t z = 0;

  bool operator==(const GridPoint&) const = default;
};

struct Bounds2 {
  double x_min = 0;
  double z_min = 0;
  double x_max = 0;
  double z_max = 0;

  bool operator==(const Bounds2&) const = default;
};

// Where a horizontal or vertical line runs inside a region: from `low` to
// `high` along the line (x for a row, z for a column), mm.
struct Span {
  double low = 0;
  double high = 0;

  bool operator==(const Span&) const = default;
};

class SectionRegion {
 public:
  // The empty region.
  SectionRegion() = default;

  // The inside of one simple ring, given in either orientation.
  static SectionRegion from_ring(const Ring& ring);

  // The inside of a set of rings by the even-odd rule: a ring inside another
  // makes a hole, whatever the orientations.
  static SectionRegion from_rings(const std::vector<Ring>& rings);

  // The union of the insides of many rings (each in either orientation),
  // done in one pass: the cheap way to add up many swept pieces.
  static SectionRegion union_of(const std::vector<Ring>& rings);

  // The axis-parallel rectangle between two corners.
  static SectionRegion rectangle(double x0, double z0, double x1, double z1);

  bool empty() const { return rings_.empty(); }

  // Area in mm^2 (holes subtracted).
  double area() const;

  // The smallest axis-parallel box holding the region; nothing when empty.
  std::optional<Bounds2> bounds() const;

  // The region as rings in mm: outer boundaries counter-clockwise (x right,
  // z up), holes clockwise; no two rings cross.
  std::vector<Ring> rings() const;

  // The spans of the horizontal line at height z inside the region, left to
  // right, with touching spans merged. A line along an edge counts that edge
  // as inside only when the region lies above it.
  std::vector<Span> row(double z) const;

  // The spans of the vertical line at x inside the region, bottom to top.
  // A line along an edge counts it as inside only when the region lies to
  // its right.
  std::vector<Span> column(double x) const;

  std::size_t vertex_count() const;

  // The rings on the grid, as Clipper returned them.
  const std::vector<std::vector<GridPoint>>& grid_rings() const { return rings_; }

  // A region made from rings already on the grid and already normalised
  // (outer counter-clockwise, holes clockwise, no crossings).
  static SectionRegion from_grid_rings(std::vector<std::vector<GridPoint>> rings);

 private:
  std::vector<std::vector<GridPoint>> rings_;
};

// Booleans, exact on the grid.
SectionRegion unite(const SectionRegion& a, const SectionRegion& b);
SectionRegion subtract(const SectionRegion& a, const SectionRegion& b);
SectionRegion intersect(const SectionRegion& a, const SectionRegion& b);

// The union of many regions in one pass.
SectionRegion unite_all(const std::vector<SectionRegion>& regions);

// The region grown (distance > 0) or shrunk (distance < 0) by `distance` mm
// normal to its boundary, with round joins: every point of the result lies at
// `distance` from the original boundary. Convex corners that the offset
// rounds are replaced by chords no further than `arc_tolerance` mm inside the
// true arc; corners that the offset closes (a shrunk region's acute corners)
// come out sharp and exact to the grid. Shrinking the space around a pin by
// the pin's radius leaves the places its centre can reach.
SectionRegion offset(const SectionRegion& region, double distance, double arc_tolerance = 1e-4);

// A coordinate in mm rounded onto the grid, and back.
std::int64_t to_grid(double mm);
double from_grid(std::int64_t units);

}  // namespace dovetailor
