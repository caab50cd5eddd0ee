#include <algorithm>
#include <array>
#include <cassert>
#include <cmath>

#include <dovetailor/geometry/swept_region.hpp>

namespace dovetailor {

namespace {

// Moves shorter than this along an axis are taken as not moving along it.
constexpr double still = 1e-9;
// Deepest refinement of a curve or a general line (2^-40 of it: far below a
// grid step), and the most chord profiles sampled along one general line.
constexpr int deepest = 40;
constexpr int most_samples = 1024;
// Sample points kept before they are reduced to their hull.
constexpr std::size_t most_points = 8192;

double cross(const Point2& o, const Point2& a, const Point2& b) {
  return (a.x - o.x) * (b.z - o.z) - (a.z - o.z) * (b.x - o.x);
}

// Andrew's monotone chain: counter-clockwise, collinear points dropped.
Ring convex_hull(std::vector<Point2> points) {
  std::sort(points.begin(), points.end(), [](const Point2& a, const Point2& b) {
    return a.x < b.x || (a.x == b.x && a.z < b.z);
  });
  points.erase(std::unique(points.begin(), points.end()), points.end());
  if (points.size() < 3) return {};
  Ring hull(2 * points.size());
  std::size_t k = 0;
  for (const Point2& p : points) {
    while (k >= 2 && cross(hull[k - 2], hull[k - 1], p) <= 0) --k;
    hull[k++] = p;
  }
  for (std::size_t i = points.size() - 1, lower = k + 1; i-- > 0;) {
    while (k >= lower && cross(hull[k - 2], hull[k - 1], points[i]) <= 0) --k;
    hull[k++] = points[i];
  }
  hull.resize(k - 1);
  if (hull.size() < 3) return {};
  return hull;
}

double distance_to_line(const Point2& p, const Point2& a, const Point2& b) {
  const double len = std::hypot(b.x - a.x, b.z - a.z);
  if (len == 0) return std::hypot(p.x - a.x, p.z - a.z);
  return std::abs(cross(a, b, p)) / len;
}

// The right half of a chord profile, bottom to top, for |d| no larger than
// the part's largest radius (at equality: the zero-width line where r = |d|).
class HalfProfile {
 public:
  HalfProfile(double d, double tolerance) : d_(std::abs(d)), tolerance_(tolerance) {}

  std::vector<Point2> build(const BodySection& section) {
    const auto& profile = section.profile;
    for (std::size_t i = 0; i + 1 < profile.size(); ++i) segment(profile[i], profile[i + 1]);
    return std::move(points_);
  }

 private:
  Point2 at(const ProfilePoint& a, const ProfilePoint& b, double s) const {
    const double r = a.radius + s * (b.radius - a.radius);
    return {std::sqrt(std::max(0.0, r * r - d_ * d_)), a.height + s * (b.height - a.height)};
  }

  void push(const Point2& p) {
    if (points_.empty() || !(points_.back() == p)) points_.push_back(p);
  }

  void segment(const ProfilePoint& a, const ProfilePoint& b) {
    if (a.radius < d_ && b.radius < d_) return;
    double s0 = 0, s1 = 1;
    if (a.radius < d_) s0 = (d_ - a.radius) / (b.radius - a.radius);
    if (b.radius < d_) s1 = (d_ - a.radius) / (b.radius - a.radius);
    const Point2 p0 = at(a, b, s0), p1 = at(a, b, s1);
    push(p0);
    // Straight where the radius is constant or the plane holds the axis.
    if (d_ > 0 && a.radius != b.radius) refine(a, b, s0, p0, s1, p1, 0);
    push(p1);
  }

  // Chords of the curve sqrt(r(s)^2 - d^2) until each is within tolerance.
  void refine(const ProfilePoint& a, const ProfilePoint& b, double s0, const Point2& p0, double s1,
              const Point2& p1, int depth) {
    const double sm = (s0 + s1) / 2;
    const Point2 pm = at(a, b, sm);
    if (depth >= deepest || distance_to_line(pm, p0, p1) <= tolerance_ / 2) return;
    refine(a, b, s0, p0, sm, pm, depth + 1);
    push(pm);
    refine(a, b, sm, pm, s1, p1, depth + 1);
  }

  double d_;
  double tolerance_;
  std::vector<Point2> points_;
};

// All points of the chord profile at distance d (clamped to the part's
// largest radius), tip at `tip`: the right half and its mirror.
std::vector<Point2> profile_points(const BodySection& section, double d, double tolerance,
                                   const Point2& tip) {
  const double radius = section.max_radius();
  const double ad = std::min(std::abs(d), radius);
  std::vector<Point2> half = HalfProfile(ad, tolerance).build(section);
  std::vector<Point2> points;
  points.reserve(2 * half.size());
  for (const Point2& p : half) points.push_back({tip.x + p.x, tip.z + p.z});
  for (auto it = half.rbegin(); it != half.rend(); ++it)
    if (it->x != 0) points.push_back({tip.x - it->x, tip.z + it->z});
  return points;
}

double support(const std::vector<Point2>& points, double ux, double uz) {
  double best = -HUGE_VAL;
  for (const Point2& p : points) best = std::max(best, ux * p.x + uz * p.z);
  return best;
}

// Support values of a point set in 64 even directions (5.6 degrees apart).
constexpr std::size_t directions = 64;
using Supports = std::array<double, directions>;

Supports supports_of(const std::vector<Point2>& points) {
  static const auto unit = [] {
    std::array<std::array<double, 2>, directions> d{};
    for (std::size_t i = 0; i < directions; ++i) {
      const double t = 2 * pi * static_cast<double>(i) / static_cast<double>(directions);
      d[i] = {std::cos(t), std::sin(t)};
    }
    return d;
  }();
  Supports result;
  for (std::size_t i = 0; i < directions; ++i) result[i] = support(points, unit[i][0], unit[i][1]);
  return result;
}

struct Line {
  Point3 from;
  Point3 to;
  double plane_y;

  double d(double t) const { return plane_y - (from.y + t * (to.y - from.y)); }
  Point2 tip(double t) const {
    return {from.x + t * (to.x - from.x), from.z + t * (to.z - from.z)};
  }
};

// The general line: hull of chord profiles sampled along the move. An
// interval [ta, tb] needs no more samples when, in every direction, the most
// the swept area can reach there -- the larger end value plus twice the
// middle sample's rise over the chord, by concavity -- stays within
// tolerance/2 of the hull of all samples so far (which only grows).
class LineSampler {
 public:
  LineSampler(const BodySection& section, const Line& line, double tolerance)
      : section_(section), line_(line), tolerance_(tolerance) {
    hull_.fill(-HUGE_VAL);
  }

  Ring sweep(double t_lo, double t_hi, double t_mid) {
    constexpr int seeds = 16;
    std::vector<double> splits;
    splits.reserve(seeds + 2);
    for (int i = 0; i <= seeds; ++i) splits.push_back(t_lo + (t_hi - t_lo) * i / seeds);
    if (t_mid > t_lo && t_mid < t_hi) splits.push_back(t_mid);
    std::sort(splits.begin(), splits.end());
    std::vector<Supports> seen;
    seen.reserve(splits.size());
    for (double t : splits) seen.push_back(at(t));
    for (std::size_t i = 1; i < splits.size(); ++i)
      refine(splits[i - 1], seen[i - 1], splits[i], seen[i], 0);
    return convex_hull(std::move(all_));
  }

 private:
  // Profiles a quarter of the tolerance from the truth, so that their own
  // chords cannot keep the test below failing however fine the samples.
  Supports at(double t) {
    ++samples_;
    std::vector<Point2> points =
        convex_hull(profile_points(section_, line_.d(t), tolerance_ / 4, line_.tip(t)));
    const Supports s = supports_of(points);
    for (std::size_t i = 0; i < directions; ++i) hull_[i] = std::max(hull_[i], s[i]);
    all_.insert(all_.end(), points.begin(), points.end());
    if (all_.size() > most_points) all_ = convex_hull(std::move(all_));
    return s;
  }

  void refine(double ta, const Supports& a, double tb, const Supports& b, int depth) {
    if (depth >= deepest || samples_ >= most_samples) return;
    const double tm = (ta + tb) / 2;
    const Supports m = at(tm);
    bool settled = true;
    for (std::size_t i = 0; i < directions && settled; ++i) {
      const double reach = std::max(a[i], b[i]) + 2 * (m[i] - (a[i] + b[i]) / 2);
      settled = reach <= hull_[i] + tolerance_ / 2;
    }
    if (settled) return;
    refine(ta, a, tm, m, depth + 1);
    refine(tm, m, tb, b, depth + 1);
  }

  const BodySection& section_;
  const Line& line_;
  double tolerance_;
  int samples_ = 0;
  Supports hull_;
  std::vector<Point2> all_;
};

Ring sweep_section(const BodySection& section, const Line& line, double tolerance) {
  const double radius = section.max_radius();
  const double d0 = line.d(0), d1 = line.d(1);
  const bool crosses = (d0 <= 0 && d1 >= 0) || (d0 >= 0 && d1 <= 0);
  const double nearest = crosses ? 0 : std::min(std::abs(d0), std::abs(d1));
  if (nearest >= radius) return {};

  const Point2 start = line.tip(0), end = line.tip(1);
  const bool moves_in_y = std::abs(line.to.y - line.from.y) > still;
  const bool moves_in_plane =
      std::abs(end.x - start.x) > still || std::abs(end.z - start.z) > still;

  if (!moves_in_y) {
    // Chord profile swept along a segment: the hull of its two positions.
    std::vector<Point2> points = profile_points(section, d0, tolerance, start);
    if (moves_in_plane) {
      const std::vector<Point2> moved = profile_points(section, d0, tolerance, end);
      points.insert(points.end(), moved.begin(), moved.end());
    }
    return convex_hull(std::move(points));
  }
  if (!moves_in_plane) return convex_hull(profile_points(section, nearest, tolerance, start));

  // The part of the move where the part reaches the plane: |d(t)| <= radius.
  const double slope = d1 - d0;
  const double ta = (radius - d0) / slope, tb = (-radius - d0) / slope;
  const double t_lo = std::max(0.0, std::min(ta, tb));
  const double t_hi = std::min(1.0, std::max(ta, tb));
  const double t_mid = -d0 / slope;
  return LineSampler(section, line, tolerance).sweep(t_lo, t_hi, t_mid);
}

void add_piece(std::vector<SweptPart>& parts, BodyPart part, Ring piece) {
  if (piece.empty()) return;
  for (SweptPart& swept : parts) {
    if (swept.part == part) {
      swept.pieces.push_back(std::move(piece));
      return;
    }
  }
  parts.push_back({part, {std::move(piece)}});
}

}  // namespace

Ring chord_profile(const BodySection& section, double d, double tolerance) {
  if (std::abs(d) >= section.max_radius()) return {};
  return convex_hull(profile_points(section, d, tolerance, {0, 0}));
}

bool reaches_plane(const ToolBody& body, const Point3& from, const Point3& to, double plane_y) {
  const double d0 = plane_y - from.y, d1 = plane_y - to.y;
  if ((d0 <= 0 && d1 >= 0) || (d0 >= 0 && d1 <= 0)) return true;
  return std::min(std::abs(d0), std::abs(d1)) < body.max_radius();
}

std::vector<SweptPart> sweep_line(const ToolBody& body, const Point3& from, const Point3& to,
                                  double plane_y, const SweepOptions& options) {
  std::vector<SweptPart> parts;
  if (!reaches_plane(body, from, to, plane_y)) return parts;
  const Line line{from, to, plane_y};
  for (const BodySection& section : body.sections)
    add_piece(parts, section.part, sweep_section(section, line, options.tolerance));
  return parts;
}

std::vector<SweptPart> sweep_arc(const ToolBody& body, const PathSegment& arc, double plane_y,
                                 const SweepOptions& options) {
  assert(arc.arc);
  std::vector<SweptPart> parts;
  const std::vector<Point3> points = path_points(arc, options.tolerance);
  for (std::size_t i = 0; i + 1 < points.size(); ++i) {
    for (SweptPart& swept : sweep_line(body, points[i], points[i + 1], plane_y, options))
      for (Ring& piece : swept.pieces) add_piece(parts, swept.part, std::move(piece));
  }
  return parts;
}

SectionRegion region_of(const SweptPart& swept) { return SectionRegion::union_of(swept.pieces); }

}  // namespace dovetailor
