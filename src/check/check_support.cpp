#include <algorithm>
#include <cmath>

#include "check_detail.hpp"

namespace dovetailor::detail {

void FindingSink::add(Finding finding, bool per_station) {
  const auto k = static_cast<std::size_t>(finding.kind);
  if (!per_station && last_line_[k] == finding.line) return;
  last_line_[k] = finding.line;
  ++count_[k];
  if (count_[k] <= per_kind_) findings_.push_back(std::move(finding));
}

bool FindingSink::seen(FindingKind kind, int line) const {
  return last_line_[static_cast<std::size_t>(kind)] == line;
}

std::vector<FindingCount> FindingSink::counts() const {
  std::vector<FindingCount> result;
  for (std::size_t k = 0; k < count_.size(); ++k)
    if (count_[k] > 0) result.push_back({static_cast<FindingKind>(k), count_[k]});
  return result;
}

SectionRegion disc(Point2 centre, double radius) {
  Ring ring;
  constexpr int sides = 32;
  for (int i = 0; i < sides; ++i) {
    const double t = 2 * pi * i / sides;
    ring.push_back({centre.x + radius * std::cos(t), centre.z + radius * std::sin(t)});
  }
  return SectionRegion::from_ring(ring);
}

bool overlaps(const Bounds2& a, const Bounds2& b) {
  return a.x_min < b.x_max && b.x_min < a.x_max && a.z_min < b.z_max && b.z_min < a.z_max;
}

double thickness_of(const SectionRegion& region) {
  double perimeter = 0;
  for (const auto& ring : region.grid_rings()) {
    for (std::size_t i = 0; i < ring.size(); ++i) {
      const GridPoint& a = ring[i];
      const GridPoint& b = ring[(i + 1) % ring.size()];
      perimeter += std::hypot(static_cast<double>(b.x - a.x), static_cast<double>(b.z - a.z));
    }
  }
  if (perimeter <= 0) return 0;
  return 2 * region.area() / (perimeter * from_grid(1));
}

namespace {

std::vector<GridPoint> on_grid(const Ring& ring) {
  std::vector<GridPoint> points;
  points.reserve(ring.size());
  for (const Point2& p : ring) points.push_back({to_grid(p.x), to_grid(p.z)});
  return points;
}

// A region (normalised rings on the grid) moved by whole grid steps: exact.
// Empty rings are dropped.
SectionRegion shifted(std::vector<std::vector<GridPoint>> rings, std::int64_t dx, std::int64_t dz) {
  std::erase_if(rings, [](const std::vector<GridPoint>& ring) { return ring.empty(); });
  for (auto& ring : rings)
    for (GridPoint& p : ring) {
      p.x += dx;
      p.z += dz;
    }
  return SectionRegion::from_grid_rings(std::move(rings));
}

void widen(std::optional<Bounds2>& bounds, const SectionRegion& region) {
  const auto b = region.bounds();
  if (!b) return;
  if (!bounds) {
    bounds = b;
    return;
  }
  bounds->x_min = std::min(bounds->x_min, b->x_min);
  bounds->z_min = std::min(bounds->z_min, b->z_min);
  bounds->x_max = std::max(bounds->x_max, b->x_max);
  bounds->z_max = std::max(bounds->z_max, b->z_max);
}

void add_other(StationSweep& sweep, BodyPart part, SectionRegion region) {
  if (region.empty()) return;
  for (auto& [p, r] : sweep.others) {
    if (p == part) {
      r = unite(r, region);
      return;
    }
  }
  sweep.others.emplace_back(part, std::move(region));
}

}  // namespace

SimTool make_sim_tool(const Tool& tool, int index, const CutterLimits& limits) {
  SimTool sim;
  sim.number = tool.number;
  sim.index = index;
  sim.tool = tool;
  sim.body = tool_body(tool);
  sim.dovetail = tool.kind == ToolKind::Dovetail;
  if (sim.dovetail) sim.limits = limits;
  const double top_radius = body_dimensions(tool).flute_top_diameter / 2;
  sim.column.sections.push_back(
      {BodyPart::Flutes, {{tool.flute_length, top_radius}, {sim.body.top(), top_radius}}});
  for (const BodySection& section : sim.body.sections)
    sim.silhouettes.push_back({section.part, on_grid(chord_profile(section, 0))});
  sim.column_silhouette = on_grid(chord_profile(sim.column.sections.front(), 0));
  return sim;
}

StationSweep sweep_from_parts(const std::vector<SweptPart>& body,
                              const std::vector<SweptPart>& column) {
  StationSweep sweep;
  for (const SweptPart& part : body) {
    SectionRegion region = region_of(part);
    if (part.part == BodyPart::Flutes)
      sweep.flutes = sweep.flutes.empty() ? std::move(region) : unite(sweep.flutes, region);
    else
      add_other(sweep, part.part, std::move(region));
  }
  for (const SweptPart& part : column) {
    SectionRegion region = region_of(part);
    sweep.column = sweep.column.empty() ? std::move(region) : unite(sweep.column, region);
  }
  widen(sweep.bounds, sweep.flutes);
  for (const auto& other : sweep.others) widen(sweep.bounds, other.second);
  return sweep;
}

StationSweep sweep_silhouettes(const SimTool& tool, double x, double z) {
  StationSweep sweep;
  const std::int64_t dx = to_grid(x), dz = to_grid(z);
  for (const auto& s : tool.silhouettes) {
    SectionRegion region = shifted({s.ring}, dx, dz);
    if (s.part == BodyPart::Flutes)
      sweep.flutes = sweep.flutes.empty() ? std::move(region) : unite(sweep.flutes, region);
    else
      add_other(sweep, s.part, std::move(region));
  }
  sweep.column = shifted({tool.column_silhouette}, dx, dz);
  widen(sweep.bounds, sweep.flutes);
  for (const auto& other : sweep.others) widen(sweep.bounds, other.second);
  return sweep;
}

StationSweep shifted(const StationSweep& sweep, std::int64_t dx, std::int64_t dz) {
  StationSweep out;
  out.flutes = shifted(sweep.flutes.grid_rings(), dx, dz);
  for (const auto& [part, region] : sweep.others)
    out.others.emplace_back(part, shifted(region.grid_rings(), dx, dz));
  out.column = shifted(sweep.column.grid_rings(), dx, dz);
  widen(out.bounds, out.flutes);
  for (const auto& other : out.others) widen(out.bounds, other.second);
  return out;
}

}  // namespace dovetailor::detail
