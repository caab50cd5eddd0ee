#include <algorithm>
#include <cmath>

#include "check_detail.hpp"

namespace dovetailor::detail {
namespace {

constexpr double touch = 1e-6;  // mm; closer than this is touching, not meeting

Point3 lerp(const Point3& a, const Point3& b, double t) {
  return {a.x + t * (b.x - a.x), a.y + t * (b.y - a.y), a.z + t * (b.z - a.z)};
}

// Liang-Barsky: whether the segment crosses the rectangle in plan view.
bool crosses(const Point3& a, const Point3& b, const PlanRect& r) {
  double t0 = 0, t1 = 1;
  const double dx = b.x - a.x, dy = b.y - a.y;
  const double p[] = {-dx, dx, -dy, dy};
  const double q[] = {a.x - r.x_min, r.x_max - a.x, a.y - r.y_min, r.y_max - a.y};
  for (int i = 0; i < 4; ++i) {
    if (p[i] == 0) {
      if (q[i] < 0) return false;
      continue;
    }
    const double t = q[i] / p[i];
    if (p[i] < 0)
      t0 = std::max(t0, t);
    else
      t1 = std::min(t1, t);
    if (t0 > t1) return false;
  }
  return true;
}

double point_to_rect(double x, double y, const PlanRect& r) {
  const double dx = std::max({r.x_min - x, 0.0, x - r.x_max});
  const double dy = std::max({r.y_min - y, 0.0, y - r.y_max});
  return std::hypot(dx, dy);
}

double point_to_segment(double x, double y, const Point3& a, const Point3& b) {
  const double dx = b.x - a.x, dy = b.y - a.y;
  const double len2 = dx * dx + dy * dy;
  double t = len2 > 0 ? ((x - a.x) * dx + (y - a.y) * dy) / len2 : 0;
  t = std::clamp(t, 0.0, 1.0);
  return std::hypot(x - (a.x + t * dx), y - (a.y + t * dy));
}

// The t-interval within [0, 1] where lo < z0 + t*dz + offset < hi ... written
// as where the part's height band [z + h0, z + h1] overlaps (z_lo, z_hi).
bool band_overlap(double z0, double dz, double h0, double h1, double z_lo, double z_hi, double& t0,
                  double& t1) {
  t0 = 0;
  t1 = 1;
  // z + h0 < z_hi - touch  and  z + h1 > z_lo + touch
  const auto below = [&](double offset, double limit) {  // z + offset < limit
    if (dz == 0) return z0 + offset < limit;
    const double t = (limit - offset - z0) / dz;
    if (dz > 0)
      t1 = std::min(t1, t);
    else
      t0 = std::max(t0, t);
    return true;
  };
  const auto above = [&](double offset, double limit) {  // z + offset > limit
    if (dz == 0) return z0 + offset > limit;
    const double t = (limit - offset - z0) / dz;
    if (dz > 0)
      t0 = std::max(t0, t);
    else
      t1 = std::min(t1, t);
    return true;
  };
  if (!below(h0, z_hi - touch) || !above(h1, z_lo + touch)) return false;
  return t0 <= t1;
}

}  // namespace

double plan_distance(const Point3& a, const Point3& b, const PlanRect& rect) {
  if (crosses(a, b, rect)) return 0;
  double d = std::min(point_to_rect(a.x, a.y, rect), point_to_rect(b.x, b.y, rect));
  for (double x : {rect.x_min, rect.x_max})
    for (double y : {rect.y_min, rect.y_max}) d = std::min(d, point_to_segment(x, y, a, b));
  return d;
}

std::optional<BodyPart> body_meets_box(const ToolBody& body, const Point3& from, const Point3& to,
                                       const Fixture& box) {
  const PlanRect rect{box.x_min, box.x_max, box.y_min, box.y_max};
  for (const BodySection& section : body.sections) {
    double t0 = 0, t1 = 1;
    if (!band_overlap(from.z, to.z - from.z, section.bottom(), section.top(), box.z_min, box.z_max,
                      t0, t1))
      continue;
    if (plan_distance(lerp(from, to, t0), lerp(from, to, t1), rect) < section.max_radius() - touch)
      return section.part;
  }
  return std::nullopt;
}

std::optional<double> rapid_below(const Point3& from, const Point3& to, double safe_z,
                                  double radius, const PlanRect& rect) {
  const bool straight_up =
      std::abs(to.x - from.x) <= 1e-9 && std::abs(to.y - from.y) <= 1e-9 && to.z >= from.z;
  if (straight_up) return std::nullopt;
  const double limit = safe_z - 1e-6;
  if (from.z >= limit && to.z >= limit) return std::nullopt;
  double t0 = 0, t1 = 1;
  const double dz = to.z - from.z;
  if (dz != 0) {
    const double t = (limit - from.z) / dz;
    if (dz > 0)
      t1 = std::min(1.0, t);
    else
      t0 = std::max(0.0, t);
  }
  if (plan_distance(lerp(from, to, t0), lerp(from, to, t1), rect) >= radius - touch)
    return std::nullopt;
  return safe_z - std::min(from.z, to.z);
}

}  // namespace dovetailor::detail
