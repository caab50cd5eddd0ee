#include <algorithm>
#include <cassert>
#include <cmath>
#include <set>

#include <dovetailor/geometry/section_measure.hpp>

namespace dovetailor {

namespace {

// Most vertex heights added to the flank's sample rows.
constexpr std::size_t most_vertex_rows = 2000;

// +1 when the void lies toward +x of this flank, -1 toward -x.
double into_void(DovetailType type, Side side) {
  const double toward_middle = side == Side::Left ? 1.0 : -1.0;
  return type == DovetailType::Female ? toward_middle : -toward_middle;
}

// The flank's lateral position on the row at height z: the edges of the gap
// around the centre line (female) or of the tongue over it (male).
std::optional<double> flank_on_row(const SectionRegion& part, DovetailType type, Side side,
                                   double z) {
  const std::vector<Span> spans = part.row(z);
  if (type == DovetailType::Male) {
    for (const Span& s : spans)
      if (s.low <= 0 && 0 <= s.high) return side == Side::Left ? s.low : s.high;
    return std::nullopt;
  }
  std::optional<double> left, right;
  for (const Span& s : spans) {
    if (s.low <= 0 && 0 <= s.high) return std::nullopt;  // material on the centre line
    if (s.high < 0) left = s.high;
    if (s.low > 0 && !right) right = s.low;
  }
  return side == Side::Left ? left : right;
}

struct Sample {
  double z;
  double x;
};

FlankMeasurement measure_flank(const SectionRegion& part, const DovetailSection& target, Side side,
                               double top_z, const MeasureOptions& options) {
  FlankMeasurement m;
  const Flank& flank = target.flank(side);
  m.angled = flank.angled;
  const double r = options.pin_diameter / 2;
  const double dir = into_void(target.type, side);

  // The floor where the pin touches it, straight below the pin's centre.
  const double reach = flank.angled ? r * cot_deg(target.angle / 2) : r;
  const std::vector<Span> column = part.column(flank.base.x + dir * reach);
  m.floor_z = column.empty() ? -HUGE_VAL : column.front().high;
  const double height = top_z - m.floor_z;
  if (!(height > 0) || !std::isfinite(height)) return m;

  const double z_lo = m.floor_z + options.end_margin * height;
  const double z_hi = top_z - options.end_margin * height - target.chamfer;
  if (z_hi <= z_lo) return m;

  std::vector<Sample> fit_rows;
  const int n = options.flank_samples;
  for (int i = 0; i < n; ++i) {
    const double z = z_lo + (z_hi - z_lo) * (i + 0.5) / n;
    if (auto x = flank_on_row(part, target.type, side, z)) fit_rows.push_back({z, *x});
  }
  m.samples = static_cast<int>(fit_rows.size());
  if (fit_rows.size() < 2) return m;

  // Least squares x = slope * z + intercept (the flank is steep, so x on z).
  double sz = 0, sx = 0, szz = 0, szx = 0;
  for (const Sample& s : fit_rows) {
    sz += s.z;
    sx += s.x;
    szz += s.z * s.z;
    szx += s.z * s.x;
  }
  const double count = static_cast<double>(fit_rows.size());
  const double denominator = count * szz - sz * sz;
  if (denominator <= 0) return m;
  const double slope = (count * szx - sz * sx) / denominator;
  const double intercept = (sx - slope * sz) / count;

  // Every vertex height in the band too, so a step between rows is seen.
  std::set<double> heights;
  for (const auto& ring : part.grid_rings())
    for (const GridPoint& p : ring) {
      const double z = from_grid(p.z);
      if (z > z_lo && z < z_hi) heights.insert(z);
    }
  std::vector<Sample> rows = fit_rows;
  const std::size_t stride = heights.size() / most_vertex_rows + 1;
  std::size_t k = 0;
  for (double z : heights) {
    if (k++ % stride != 0) continue;
    // Just above and just below the vertex, where a step's two levels are.
    for (double dz : {-2 * region_rounding, 2 * region_rounding})
      if (auto x = flank_on_row(part, target.type, side, z + dz)) rows.push_back({z + dz, *x});
  }

  const double normal = std::sqrt(1 + slope * slope);
  for (const Sample& s : rows)
    m.max_deviation = std::max(m.max_deviation, std::abs(s.x - (slope * s.z + intercept)) / normal);
  const bool leans_in = (target.type == DovetailType::Female) == (side == Side::Left);
  m.angle = degrees(std::atan2(1.0, (leans_in ? 1.0 : -1.0) * slope));
  m.base_x = slope * m.floor_z + intercept;
  m.top_x = slope * top_z + intercept;
  m.found = true;
  if (!flank.angled) {
    // A square face is touched at its point furthest into the void.
    m.measuring_x = rows.front().x;
    for (const Sample& s : rows)
      if (dir * s.x > dir * m.measuring_x) m.measuring_x = s.x;
  }
  return m;
}

// The pin's centre in the corner of an angled flank, from the shrunk void.
std::optional<Point2> pin_centre(const SectionRegion& shrunk_void, const Bounds2& bounds,
                                 double top_z, DovetailType type, Side side) {
  const double margin = 1;
  const SectionRegion half =
      side == Side::Left
          ? SectionRegion::rectangle(bounds.x_min - margin, bounds.z_min - margin, 0, top_z)
          : SectionRegion::rectangle(0, bounds.z_min - margin, bounds.x_max + margin, top_z);
  const SectionRegion reachable = intersect(shrunk_void, half);
  const double toward_flank = -into_void(type, side);
  std::optional<Point2> best;
  double best_score = -HUGE_VAL;
  for (const Ring& ring : reachable.rings()) {
    for (const Point2& p : ring) {
      const double score = toward_flank * p.x - p.z;
      if (score > best_score) {
        best_score = score;
        best = p;
      }
    }
  }
  return best;
}

}  // namespace

std::string_view measure_problem_name(MeasureProblemKind kind) {
  switch (kind) {
    case MeasureProblemKind::NoMaterial:
      return "no_material";
    case MeasureProblemKind::NoFlank:
      return "no_flank";
    case MeasureProblemKind::PinDoesNotFit:
      return "pin_does_not_fit";
  }
  return "?";
}

SectionMeasurement measure_section(const SectionRegion& part, const DovetailSection& target,
                                   const MeasureOptions& options) {
  assert(options.pin_diameter > 0 && options.flank_samples >= 2);
  SectionMeasurement result;
  const auto bounds = part.bounds();
  if (!bounds) {
    result.problems.push_back({MeasureProblemKind::NoMaterial});
    return result;
  }
  result.top_z = bounds->z_max;
  const double r = options.pin_diameter / 2;

  const SectionRegion window = SectionRegion::rectangle(bounds->x_min, bounds->z_min, bounds->x_max,
                                                        result.top_z + options.pin_diameter + 1);
  const SectionRegion shrunk_void = offset(subtract(window, part), -r, options.arc_tolerance);

  for (Side side : {Side::Left, Side::Right}) {
    FlankMeasurement m = measure_flank(part, target, side, result.top_z, options);
    if (!m.found) {
      result.problems.push_back({MeasureProblemKind::NoFlank, side});
    } else if (m.angled) {
      m.pin_center = pin_centre(shrunk_void, *bounds, result.top_z, target.type, side);
      if (m.pin_center)
        m.measuring_x = m.pin_center->x + into_void(target.type, side) * r;
      else
        result.problems.push_back({MeasureProblemKind::PinDoesNotFit, side});
    }
    (side == Side::Left ? result.left : result.right) = m;
  }

  result.depth = result.top_z - std::max(result.left.floor_z, result.right.floor_z);
  result.width_bottom = result.right.base_x - result.left.base_x;
  result.width_top = result.right.top_x - result.left.top_x;
  const bool measured = result.left.found && result.right.found &&
                        (!result.left.angled || result.left.pin_center) &&
                        (!result.right.angled || result.right.pin_center);
  if (measured) {
    const int angled = target.angled_flanks();
    result.reading = PinReading{reading_method(target.type, angled), angled, options.pin_diameter,
                                std::abs(result.right.measuring_x - result.left.measuring_x)};
  }
  return result;
}

}  // namespace dovetailor
