#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include <dovetailor/base/length.hpp>
#include <dovetailor/drawing/drawing.hpp>
#include <dovetailor/geometry/pin_gauge.hpp>
#include <dovetailor/geometry/section_region.hpp>
#include <dovetailor/geometry/tool_body.hpp>
#include <dovetailor/report/plan_note_text.hpp>

namespace dovetailor {
namespace {

// The direction (degrees from +X) from a flank's base corner along the base
// plane into the void: toward the middle on a female, away from it on a male.
double floor_direction(const DovetailSection& s, Side side) {
  const bool toward_plus_x = (side == Side::Left) == (s.type == DovetailType::Female);
  return toward_plus_x ? 0.0 : 180.0;
}

}  // namespace

std::string_view reading_words(ReadingMethod method) { return text_of(method); }

double ring_area(const std::vector<Point2>& ring) {
  double twice = 0;
  for (std::size_t i = 0; i < ring.size(); ++i) {
    const auto& p = ring[i];
    const auto& q = ring[(i + 1) % ring.size()];
    twice += p.x * q.z - q.x * p.z;
  }
  return twice / 2;
}

std::vector<Point2> tool_silhouette(const Tool& tool, double x, double z, double top) {
  // Up the body's right side to `top`, then down its left.
  const double height = top - z;
  std::vector<Point2> ring;
  for (const BodySection& section : tool_body(tool).sections) {
    for (const ProfilePoint& p : section.profile) {
      if (p.height > height) break;
      ring.push_back({x + p.radius, z + p.height});
    }
    if (section.top() > height) {
      ring.push_back({x + section.radius_at(height), top});
      break;
    }
  }
  for (std::size_t i = ring.size(); i-- > 0;)
    if (ring[i].x > x) ring.push_back({2 * x - ring[i].x, ring[i].z});
  return ring;
}

std::vector<Point2> add_stock(Drawing& drawing, const Job& job) {
  const double left = stock_left_x(job), right = stock_right_x(job), height = job.stock.height;
  drawing.stock_min = {left, -height};
  drawing.stock_max = {right, 0};
  std::vector<Point2> ring = {{left, -height}, {right, -height}, {right, 0}, {left, 0}};
  drawing.outlines.push_back({OutlineStyle::Stock, ring, "Stock as supplied", ""});
  return ring;
}

namespace {

// What each operation removes: the sweep of its passes, inside the stock,
// less what the operations before it removed. `above`: how far the tools are
// drawn up past the top face.
void add_removed_regions(Drawing& d, const Plan& plan, const SectionRegion& stock, double above) {
  SectionRegion removed_before;
  int index = 0;
  for (const auto& op : plan.operations) {
    const Tool* tool = find_tool(plan.job, op.tool);
    if (!tool) continue;
    std::vector<Ring> silhouettes;
    silhouettes.reserve(op.passes.size());
    for (const auto& p : op.passes) silhouettes.push_back(tool_silhouette(*tool, p.x, p.z, above));
    const SectionRegion inside = intersect(SectionRegion::union_of(silhouettes), stock);
    const SectionRegion fresh = subtract(inside, removed_before);
    removed_before = unite(removed_before, inside);
    d.regions.push_back(
        {RegionFill::Removed, index++, fresh.rings(),
         fmt::format("Removed by operation {}: {} (T{})", index, operation_title(op), op.tool)});
  }
}

// The dovetail cutter at its first pass and its finishing pass, drawn up to
// `tool_top`.
void add_cutter_outlines(Drawing& d, const Plan& plan, double tool_top) {
  const Job& job = plan.job;
  const Pass* first = nullptr;
  const Pass* finish = nullptr;
  for (const Pass* p : all_passes(plan)) {
    const Tool* tool = find_tool(job, p->tool);
    if (!tool || tool->kind != ToolKind::Dovetail) continue;
    if (!first) first = p;
    if (!finish && p->role == PassRole::Finish) finish = p;
  }
  for (const Pass* p : {first, finish}) {
    if (!p) continue;
    const Tool* tool = find_tool(job, p->tool);
    const bool final_pass = p == finish;
    d.outlines.push_back({final_pass ? OutlineStyle::ToolFinal : OutlineStyle::ToolFirst,
                          tool_silhouette(*tool, p->x, p->z, tool_top),
                          fmt::format("T{} at pass {} ({})", p->tool, p->number,
                                      final_pass ? "finishing" : "first cut"),
                          fmt::format("T{} p{}", p->tool, p->number)});
  }
}

// The pins of the last checkpoint in the finished section, and the reading
// over (or between) them.
void add_pins(Drawing& d, const Plan& plan, const Gauge& gauge) {
  const Units u = plan.job.units;
  const auto& t = plan.target;
  const double pin = gauge.pin_diameter;
  const auto& r = plan.final_reading;
  std::vector<PinPlacement> placed;
  for (Side side : {Side::Left, Side::Right})
    if (t.flank(side).angled) placed.push_back(place_pin(t, side, pin));
  for (const auto& p : placed) d.pins.push_back({p.center, pin});
  d.pin_label = fmt::format("Pin{} {} dia, reading {} {}", placed.size() > 1 ? "s" : "",
                            shown(pin, u), shown(r.value, u), reading_words(r.method));
  double from = 0, to = 0;
  if (placed.size() == 2) {
    from = placed[0].measuring_edge_x;
    to = placed[1].measuring_edge_x;
  } else if (placed.size() == 1) {
    const Flank& square = t.left.angled ? t.right : t.left;
    from = square.base.x;
    to = placed[0].measuring_edge_x;
  }
  if (from > to) std::swap(from, to);
  const double z = placed.empty() ? 0 : placed[0].center.z;
  d.dimensions.push_back({DimensionKind::Horizontal,
                          {from, z},
                          {to, z},
                          0,
                          0,
                          0,
                          r.value,
                          fmt::format("{}", shown(r.value, u))});
}

// The widths at the base and top planes, the depth and the flank angle.
void add_section_dimensions(Drawing& d, const Plan& plan, double tool_top) {
  const Job& job = plan.job;
  const Units u = job.units;
  const auto& t = plan.target;
  const double right = d.stock_max.x, height = -d.stock_min.z;
  const double base_z = -t.depth;
  d.dimensions.push_back({DimensionKind::Horizontal, t.left.base, t.right.base,
                          -(height - t.depth) - 0.12 * height, 0, 0, t.width_bottom(),
                          fmt::format("{}", shown(t.width_bottom(), u))});
  d.dimensions.push_back({DimensionKind::Horizontal, t.left.top, t.right.top,
                          tool_top + 0.1 * height, 0, 0, t.width_top(),
                          fmt::format("{}", shown(t.width_top(), u))});
  d.dimensions.push_back({DimensionKind::Vertical,
                          {right, 0},
                          {right, base_z},
                          0.12 * height,
                          0,
                          0,
                          t.depth,
                          fmt::format("{}", shown(t.depth, u))});
  const Side angled = t.left.angled ? Side::Left : Side::Right;
  const Flank& f = t.flank(angled);
  const double floor_deg = floor_direction(t, angled);
  const double flank_deg = degrees(std::atan2(f.top.z - f.base.z, f.top.x - f.base.x));
  // The arc clears the pin (it reaches 1.5 D from the corner at 60 deg).
  const double arc = std::max(0.6 * t.depth, job.gauge ? 1.7 * job.gauge->pin_diameter : 0.0);
  d.dimensions.push_back({DimensionKind::Angle, f.base, f.top, arc, std::min(floor_deg, flank_deg),
                          std::max(floor_deg, flank_deg), t.angle,
                          fmt::format("{:g}\u00b0", t.angle)});
}

}  // namespace

Drawing build_drawing(const Plan& plan) {
  const Job& job = plan.job;
  const auto& t = plan.target;
  Drawing d;
  d.title = job.part.name.empty() ? job.source : job.part.name;
  d.subtitle = fmt::format("Section across the slide, looking from the front end; {}",
                           job.units == Units::Inch ? "dimensions in inches" : "dimensions in mm");
  const SectionRegion stock = SectionRegion::from_ring(add_stock(d, job));
  const double left = d.stock_min.x, right = d.stock_max.x, height = -d.stock_min.z;
  const double above = 0.5 * t.depth;  // tools drawn up past the top face
  add_removed_regions(d, plan, stock, above);
  d.regions.push_back(
      {RegionFill::Part, 0, {part_outline(t, left, right, height)}, "Finished part"});
  const double tool_top = above + 0.25 * t.depth;
  add_cutter_outlines(d, plan, tool_top);
  if (job.gauge) add_pins(d, plan, *job.gauge);
  add_section_dimensions(d, plan, tool_top);
  return d;
}

}  // namespace dovetailor
