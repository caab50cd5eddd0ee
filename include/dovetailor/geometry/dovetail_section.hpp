#pragma once

#include <vector>

#include <dovetailor/base/point.hpp>
#include <dovetailor/job/job.hpp>

namespace dovetailor {

// One flank as cut, from its corner on the base plane to its edge on the top
// plane. A square flank has base.x == top.x.
struct Flank {
  Point2 base;
  Point2 top;
  bool angled = true;

  bool operator==(const Flank&) const = default;
};

// The finished dovetail in the section plane, in work coordinates: the
// centre line is x = 0 (the midpoint of the design width at the base plane),
// the top plane z = 0, the base plane z = -depth. The flanks are where the
// cutter must leave them, that is with the gib allowance taken into account.
struct DovetailSection {
  DovetailType type = DovetailType::Female;
  double angle = 60;  // degrees
  double depth = 0;
  double chamfer = 0;
  Flank left;
  Flank right;
  // The lateral allowance on the gib side (0 without a gib): it moves that
  // flank outward on a female, inward on a male.
  double gib_allowance = 0;
  std::optional<Side> gib_side;

  bool operator==(const DovetailSection&) const = default;

  // Widths as cut, between the flanks, at the base and top planes.
  double width_bottom() const { return right.base.x - left.base.x; }
  double width_top() const { return right.top.x - left.top.x; }
  const Flank& flank(Side side) const { return side == Side::Left ? left : right; }
  int angled_flanks() const { return (left.angled ? 1 : 0) + (right.angled ? 1 : 0); }
};

// cot(angle) for an angle in degrees.
double cot_deg(double angle);

// The width at the other plane, for a dovetail with `angled` angled flanks
// (1 or 2): female W_top = W_bottom - n*H*cot(a), male W_top = W_bottom + n*H*cot(a)
// (trigonometry of the trapezoid; domain brief, "Conventions").
double width_top_from_bottom(DovetailType type, double width_bottom, double depth, double angle,
                             int angled);
double width_bottom_from_top(DovetailType type, double width_top, double depth, double angle,
                             int angled);

// The section of a job's dovetail. Does not validate; the job reader does.
DovetailSection section_of(const DovetailSpec& spec);

// The middle of a width tolerance band, (lower + upper) / 2: how far from the
// nominal the planner aims the finished width. There a control's positioning
// step (half its last decimal on each flank) stays inside the band whichever
// side of the nominal the band lies, and a band that excludes the nominal
// (say [+0.02, +0.05] mm) is hit at all.
double band_middle(const Tolerance& tolerance);

// The spec with its width moved to the middle of its tolerance band: the
// dovetail the planner cuts and the checker measures against. The tolerance
// is left as the job gives it (on the nominal width).
DovetailSpec aimed_spec(const DovetailSpec& spec);

// How fast a flank moves sideways along the slide, dx/dy: non-zero only for
// the flank of a tapered gib. The gib thickens by 1/N per unit length toward
// the back end (+Y), so its flank moves out (female) or in (male) by
// 1 / (N sin a) per unit length (geometry of the flank).
double flank_taper_slope(const DovetailSpec& spec, Side side);

// The section at distance y along the slide: section_of(spec) with a tapered
// gib's flank moved by flank_taper_slope * y.
DovetailSection section_at(const DovetailSpec& spec, double y);

// The design width at the base plane, before the gib allowance: the width the
// mating part sees.
double design_width_bottom(const DovetailSpec& spec);

// Lateral allowance for a gib of normal thickness t on a flank at angle a:
// t / sin(a) (geometry of the flank; domain brief, "Fit of a pair").
double gib_lateral_allowance(double thickness, double angle);

// Lateral position of a flank at height z (between base and top plane).
double flank_x_at(const Flank& flank, double z);

// The finished part's outline in the section (counter-clockwise), inside the
// stock rectangle; `stock_left`/`stock_right` are the stock faces in work X
// and the stock spans z = -stock_height .. 0. The chamfer is not drawn.
std::vector<Point2> part_outline(const DovetailSection& section, double stock_left,
                                 double stock_right, double stock_height);

// The stock faces in work X: the stock is centred on x = -spec.center.
double stock_left_x(const Job& job);
double stock_right_x(const Job& job);

// +1 when the flank on `side` lies at +X of the dovetail cutter that cuts it
// (female right, male left), -1 otherwise (female left, male right).
double toward_flank(DovetailType type, Side side);

}  // namespace dovetailor
