#include <algorithm>
#include <cmath>

#include "check_detail.hpp"

namespace dovetailor::detail {
namespace {

// A finding about a move by `tool` (line and station are the caller's).
Finding finding(FindingKind kind, double amount, double limit, const SimTool& tool) {
  return {.kind = kind,
          .severity = Severity::Error,
          .amount = amount,
          .limit = limit,
          .tool = tool.number};
}

Point2 middle(const Bounds2& b) { return {(b.x_min + b.x_max) / 2, (b.z_min + b.z_max) / 2}; }

// Engagement of a dovetail cutter: a thin margin over the planner's own
// figures. 5 um covers the rounding of positions in a program (a step
// between two passes written at 3 decimals in mm or 4 in inch is off by at
// most one unit of the last decimal, 2.54 um) and the section's chords;
// 2 % more radial step bends the neck about 2 % more than the plan's bend
// limit allows for, far from what breaks a cutter.
double beyond(double limit) { return limit * 1.02 + 0.005; }

// How a dovetail cutter's flutes meet what one move removes, in the
// section up to `high`: how much material it removes on its axis above
// `across_from` (it is engaged across its whole diameter there: it slots),
// and the widest cut on either side of the axis in the rows above `low`
// (its radial engagement; rows that run across the axis are a skin under
// it, or the slot just measured). The width of a polygon on one side of a
// vertical line is piecewise linear in height between its vertices and
// the heights where its edges cross the line, so the rows there (and a
// hair either side, for horizontal edges) hold the widest.
struct Engagement {
  double across = 0;  // height of material removed on the axis above `across_from`
  double widest = 0;  // widest lateral cut on one side of the axis
  double width = 0;   // widest row of the cut, both sides together
};

Engagement engagement(const SectionRegion& removed, const Bounds2& b, double axis, double low,
                      double across_from, double high) {
  Engagement e;
  low = std::max(low, b.z_min);
  high = std::min(high, b.z_max);
  if (high <= low) return e;
  std::vector<double> heights{low, high};
  const auto within = [&](double z) {
    if (z > low && z < high) heights.push_back(z);
  };
  for (const Span& s : removed.column(axis)) {
    e.across += std::max(0.0, std::min(s.high, high) - std::max(s.low, across_from));
    within(s.low);
    within(s.high);
  }
  for (const auto& ring : removed.grid_rings())
    for (const GridPoint& p : ring) within(from_grid(p.z));
  std::sort(heights.begin(), heights.end());
  heights.erase(std::unique(heights.begin(), heights.end()), heights.end());
  constexpr double hair = 1e-6;
  for (const double h : heights) {
    for (const double z : {h - hair, h, h + hair}) {
      if (z < low || z > high) continue;
      double left = 0, right = 0;
      bool across = false;
      for (const Span& s : removed.row(z)) {
        across = across || (s.low < axis && s.high > axis);
        left += std::max(0.0, std::min(s.high, axis) - s.low);
        right += std::max(0.0, s.high - std::max(s.low, axis));
      }
      e.width = std::max(e.width, left + right);
      if (!across) e.widest = std::max({e.widest, left, right});
    }
  }
  return e;
}

// How deep a gouge reaches into the finished part: the largest distance of
// any of its points from the part's outline (square to the surface it was
// cut into; for a cut down into a face, its depth below the face), and
// where that is. Found by halving on the part shrunk by a trial depth
// (round joins: the points at least that far inside) until the depth is
// within 0.1 um; every point of the gouge is at least `shallowest` deep.
struct GougeDepth {
  double depth = 0;
  Bounds2 deepest;  // the part of the gouge within 0.1 um of that depth
};

GougeDepth gouge_depth(const SectionRegion& gouge, const SectionRegion& part, double shallowest) {
  const auto pb = *part.bounds();
  double lo = shallowest;
  double hi = std::min(pb.x_max - pb.x_min, pb.z_max - pb.z_min) / 2;
  GougeDepth g{.depth = lo, .deepest = *gouge.bounds()};
  while (hi - lo > 1e-4) {
    const double mid = (lo + hi) / 2;
    const SectionRegion deeper = intersect(gouge, offset(part, -mid));
    if (deeper.empty()) {
      hi = mid;
    } else {
      lo = mid;
      g.deepest = *deeper.bounds();
    }
  }
  g.depth = lo;
  return g;
}

// How thick a cut the flutes take at their top: the removed material's width
// in the row just below the top of the flutes, turned square to the cutting
// edge there (times sin a for a dovetail cutter's cone; an end mill's side is
// upright).
double cut_at_flute_top(const SectionRegion& removed, double flute_top, const SimTool& tool) {
  const double probe = flute_top - 2e-3;  // 2 um below the top: inside the chord profile
  double width = 0;
  for (const Span& s : removed.row(probe)) width += s.high - s.low;
  return tool.dovetail ? width * std::sin(radians(tool.tool.angle)) : width;
}

// A dovetail cutter's engagement against its limits (checker.hpp): a slot,
// or a radial cut wider than the planner's step; none for other tools,
// rapids and moves not along Y.
std::optional<Finding> cutter_overload(const SectionRegion& removed, const Bounds2& rb,
                                       const MoveFacts& facts, const SimTool& tool) {
  const CutterLimits& limits = tool.limits;
  if (limits.radial_step <= 0 || !facts.along_y || facts.kind == MotionKind::Rapid) return {};
  // Read across the move: a slanted pass's section is sqrt(1 + s^2)
  // wider than the cut square to its path.
  const double across_path = 1 / std::hypot(1.0, facts.axis_slope);
  const double tip = facts.axis_z;
  const Engagement e = engagement(removed, rb, facts.axis_x, tip + beyond(limits.floor_skin),
                                  tip + beyond(limits.skin_across), tip + tool.tool.flute_length);
  const double ae = e.widest * across_path;
  if (e.across > 1e-4) {
    Finding f =
        finding(FindingKind::CutterOverload, e.width * across_path, limits.radial_step, tool);
    f.overload = Overload::Slot;
    f.on_axis = e.across;
    return f;
  }
  if (ae > beyond(limits.radial_step)) {
    Finding f = finding(FindingKind::CutterOverload, ae, limits.radial_step, tool);
    f.overload = Overload::RadialCut;
    return f;
  }
  return {};
}

// Engaged at their top: a cut there thicker than the tolerance's
// allowance, with material left above the flutes. A thinner layer is the
// finished surface as the checker judges it everywhere (neither gouge nor
// stock left): flutes meeting a surface the level above has finished, by
// the rounding of the program's positions at the joint of two levels, rub
// it; they do not cut a chip at their top.
std::optional<Finding> depth_of_cut(const SectionRegion& removed, const Bounds2& rb,
                                    const SectionRegion& after, const StationSweep& sweep,
                                    const MoveFacts& facts, const SimTool& tool, double allowance) {
  const double flute_top = facts.tip_z + tool.tool.flute_length;
  if (rb.z_max < flute_top - 1e-3 || sweep.column.empty() ||
      cut_at_flute_top(removed, flute_top, tool) <= allowance)
    return {};
  const SectionRegion buried = intersect(after, sweep.column);
  if (buried.area() <= least_area) return {};
  const double above = buried.bounds()->z_max - flute_top;
  return finding(FindingKind::DepthOfCut, above, tool.tool.flute_length, tool);
}

}  // namespace

Outcome evaluate_move(const Material& material, const StationTarget& target,
                      const StationSweep& sweep, const MoveFacts& facts, const SimTool& tool) {
  Outcome out;
  if (!sweep.bounds || !material.bounds || !overlaps(*sweep.bounds, *material.bounds)) return out;
  const SectionRegion* now = &material.region;

  if (!sweep.flutes.empty()) {
    const SectionRegion removed = intersect(material.region, sweep.flutes);
    const double area = removed.area();
    if (area > least_area) {
      auto after = std::make_shared<Material>();
      after->region = subtract(material.region, sweep.flutes);
      after->bounds = after->region.bounds();
      now = &after->region;
      const auto rb = *removed.bounds();
      const double deep = rb.z_max - rb.z_min;
      if (facts.kind == MotionKind::Rapid) {
        Finding f = finding(FindingKind::RapidThroughMaterial, deep, 0, tool);
        f.area = area;
        out.findings.push_back(f);
      } else if (!facts.spindle_on) {
        out.findings.push_back(finding(FindingKind::SpindleStopped, deep, 0, tool));
      }
      if (tool.dovetail && facts.plunging) {
        out.findings.push_back(finding(FindingKind::Plunge, deep, 0, tool));
      }
      if (auto f = cutter_overload(removed, rb, facts, tool)) out.findings.push_back(*f);
      if (auto f = depth_of_cut(removed, rb, after->region, sweep, facts, tool, target.allowance))
        out.findings.push_back(*f);
      const SectionRegion gouge = intersect(removed, target.forbidden);
      if (gouge.area() > least_area) {
        const GougeDepth g = gouge_depth(gouge, target.part, target.allowance);
        Finding f = finding(FindingKind::Gouge, g.depth, target.allowance, tool);
        f.at = middle(g.deepest);
        out.findings.push_back(f);
      }
      out.after = std::move(after);
    }
  }

  for (const auto& [part, region] : sweep.others) {
    const auto rb = region.bounds();
    if (!rb || !overlaps(*rb, *material.bounds)) continue;
    const SectionRegion touch = intersect(*now, region);
    if (touch.area() <= least_area) continue;
    Finding f = finding(FindingKind::BodyCollision, thickness_of(touch), 0, tool);
    f.part = part;
    f.at = middle(*touch.bounds());
    out.findings.push_back(f);
  }
  return out;
}

}  // namespace dovetailor::detail
