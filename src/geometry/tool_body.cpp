#include <algorithm>
#include <cassert>
#include <cmath>

#include <dovetailor/geometry/tool_body.hpp>

namespace dovetailor {

std::string_view body_part_name(BodyPart part) {
  switch (part) {
    case BodyPart::Flutes:
      return "flutes";
    case BodyPart::Neck:
      return "neck";
    case BodyPart::Shank:
      return "shank";
    case BodyPart::Holder:
      return "holder";
  }
  return "?";
}

double BodySection::max_radius() const {
  double r = 0;
  for (const ProfilePoint& p : profile) r = std::max(r, p.radius);
  return r;
}

double BodySection::radius_at(double h) const {
  if (profile.empty() || h < bottom() || h > top()) return 0;
  for (std::size_t i = 0; i + 1 < profile.size(); ++i) {
    const ProfilePoint& a = profile[i];
    const ProfilePoint& b = profile[i + 1];
    if (h > b.height) continue;
    if (b.height == a.height) return std::max(a.radius, b.radius);
    return a.radius + (h - a.height) / (b.height - a.height) * (b.radius - a.radius);
  }
  return profile.back().radius;
}

double ToolBody::max_radius() const {
  double r = 0;
  for (const BodySection& s : sections) r = std::max(r, s.max_radius());
  return r;
}

double ToolBody::radius_at(double h) const {
  double r = 0;
  for (const BodySection& s : sections) r = std::max(r, s.radius_at(h));
  return r;
}

namespace {

// The tip: a flat bottom of radius `radius` meeting a side that rises at
// `angle` degrees from the bottom face (90 for a cylinder, the cone angle for
// a dovetail cutter), the sharp corner rounded with `corner` radius. Points
// from the axis outward and up, ending on the side at the top of the round.
std::vector<ProfilePoint> tip_profile(double radius, double angle, double corner,
                                      double chord_tolerance) {
  std::vector<ProfilePoint> points{{0, 0}};
  if (corner <= 0) {
    points.push_back({0, radius});
    return points;
  }
  const double a = radians(angle);
  const double tangent = corner / std::tan(a / 2);  // corner to tangent points
  const ProfilePoint centre{corner, radius - tangent};
  // The round turns from straight down (bottom face) to the side's normal.
  const double start = -pi / 2;
  const double end = pi / 2 - a;
  const double ratio = std::clamp(1 - chord_tolerance / corner, -1.0, 1.0);
  const double step = 2 * std::acos(ratio);
  const int n = std::max(1, static_cast<int>(std::ceil((end - start) / step)));
  for (int i = 0; i <= n; ++i) {
    const double t = start + (end - start) * i / n;
    points.push_back({centre.height + corner * std::sin(t), centre.radius + corner * std::cos(t)});
  }
  points[1].height = 0;  // exactly on the bottom face
  return points;
}

BodySection cylinder(BodyPart part, double bottom, double top, double radius) {
  return {part, {{bottom, radius}, {top, radius}}};
}

}  // namespace

BodyDimensions body_dimensions(const Tool& tool) {
  assert(tool.diameter > 0 && tool.flute_length > 0);
  BodyDimensions d;
  d.shank_assumed = !tool.shank_diameter;
  d.stickout_assumed = !tool.stickout;
  d.holder_diameter = tool.holder_diameter;
  d.flute_top_diameter = tool.diameter;
  if (tool.kind != ToolKind::Dovetail) {
    d.shank_diameter = tool.shank_diameter.value_or(tool.diameter);
    d.stickout = tool.stickout.value_or(tool.flute_length + 0.5 * d.shank_diameter);
    return d;
  }
  const double cot_a = 1 / std::tan(radians(tool.angle));
  d.flute_top_diameter = 2 * (tool.diameter / 2 - tool.flute_length * cot_a);
  d.neck_diameter = tool.neck_diameter > 0 ? tool.neck_diameter : d.flute_top_diameter;
  d.shank_diameter = tool.shank_diameter.value_or(std::max(d.neck_diameter, 0.5 * tool.diameter));
  d.neck_length = neck_length_factor * tool.diameter;
  d.stickout = tool.stickout.value_or(tool.flute_length + d.neck_length + d.shank_diameter);
  d.neck_length = std::max(0.0, std::min(d.neck_length, d.stickout - tool.flute_length));
  return d;
}

ToolBody tool_body(const Tool& tool, const ToolBodyOptions& options) {
  assert(tool.diameter > 0 && tool.flute_length > 0);
  const BodyDimensions dims = body_dimensions(tool);
  const double big = tool.diameter / 2;
  const double flutes_top = tool.flute_length;
  ToolBody body;

  double shank_bottom = flutes_top;
  if (tool.kind == ToolKind::EndMill) {
    auto profile = tip_profile(big, 90, tool.corner_radius, options.chord_tolerance);
    profile.push_back({flutes_top, big});
    body.sections.push_back({BodyPart::Flutes, std::move(profile)});
  } else if (tool.kind == ToolKind::Drill || tool.kind == ToolKind::ChamferMill) {
    // A cone about the axis from the tip's radius (0 for a drill's point)
    // widening at half the included angle up to the diameter, then straight
    // to the top of the flutes.
    const bool drill = tool.kind == ToolKind::Drill;
    const double included = drill ? tool.point_angle : tool.angle;
    assert(included > 0 && included < 180);
    const double tip = drill ? 0 : tool.tip_diameter / 2;
    const double cone = (big - tip) / std::tan(radians(included / 2));
    std::vector<ProfilePoint> profile{{0, 0}};
    if (tip > 0) profile.push_back({0, tip});
    profile.push_back({std::min(cone, flutes_top), big});
    if (flutes_top > cone) profile.push_back({flutes_top, big});
    body.sections.push_back({BodyPart::Flutes, std::move(profile)});
  } else {
    assert(tool.angle > 0 && tool.angle < 90);
    const double small = dims.flute_top_diameter / 2;
    assert(small > 0);
    auto profile = tip_profile(big, tool.angle, tool.corner_radius, options.chord_tolerance);
    profile.push_back({flutes_top, small});
    body.sections.push_back({BodyPart::Flutes, std::move(profile)});
    shank_bottom = flutes_top + dims.neck_length;
    if (shank_bottom > flutes_top)
      body.sections.push_back(
          cylinder(BodyPart::Neck, flutes_top, shank_bottom, dims.neck_diameter / 2));
  }

  const bool holder = dims.holder_diameter.has_value();
  const double shank_top = holder ? std::max(dims.stickout, shank_bottom) : options.body_top;
  if (shank_top > shank_bottom)
    body.sections.push_back(
        cylinder(BodyPart::Shank, shank_bottom, shank_top, dims.shank_diameter / 2));
  if (holder && options.body_top > shank_top)
    body.sections.push_back(
        cylinder(BodyPart::Holder, shank_top, options.body_top, *dims.holder_diameter / 2));
  return body;
}

}  // namespace dovetailor
