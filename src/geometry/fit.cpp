#include <algorithm>
#include <cmath>

#include <dovetailor/geometry/fit.hpp>

namespace dovetailor {

namespace {

// Parts that meet line on line come out a few ulps either side of zero; a
// nanometre of interference is no interference.
constexpr double zero_clearance = 1e-6;  // mm

// The base-plane width the mating part sees: the as-cut width with the gib
// allowance given back (the gib fills it).
double functional_width_bottom(const DovetailSection& s) {
  const double sign = s.type == DovetailType::Female ? -1.0 : 1.0;
  return s.width_bottom() + sign * s.gib_allowance;
}

// The functional base-plane width of a measured part (gib allowance given back).
double functional_width_bottom(const MeasuredPart& p, int angled_flanks, double angle) {
  const double cut = width_for_reading(p.type, angled_flanks, p.reading, p.pin_diameter, angle);
  return p.type == DovetailType::Female ? cut - p.gib_allowance : cut + p.gib_allowance;
}

// The reading of a part of functional width `functional`, with its own pins and gib.
double reading_of_functional(const MeasuredPart& p, int angled_flanks, double angle,
                             double functional) {
  const double cut =
      p.type == DovetailType::Female ? functional + p.gib_allowance : functional - p.gib_allowance;
  return reading_for_width(p.type, angled_flanks, cut, p.pin_diameter, angle);
}

// The fit from the functional widths at the female's mouth and the male's root.
Fit fit_from_widths(double female_top, double male_bottom, double female_depth, double male_depth,
                    double angle, int angled_flanks) {
  Fit f;
  f.shelf_clearance = female_top - male_bottom;
  f.lateral_clearance =
      f.shelf_clearance - depth_clearance_loss(female_depth, male_depth, angle, angled_flanks);
  f.normal_clearance = f.lateral_clearance * std::sin(radians(angle));
  f.shelf_gap = std::max(0.0, male_depth - female_depth);
  f.floor_gap = std::max(0.0, female_depth - male_depth);
  f.bearing_height = std::min(female_depth, male_depth);
  f.can_assemble = f.lateral_clearance > -zero_clearance && f.bearing_height > 0;
  return f;
}

}  // namespace

double depth_clearance_loss(double female_depth, double male_depth, double angle,
                            int angled_flanks) {
  const double lift = std::max(0.0, male_depth - female_depth);
  return angled_flanks * lift * cot_deg(angle);
}

Fit fit_of(const DovetailSection& female, const DovetailSection& male) {
  const int n = female.angled_flanks();
  const double female_top = width_top_from_bottom(
      DovetailType::Female, functional_width_bottom(female), female.depth, female.angle, n);
  return fit_from_widths(female_top, functional_width_bottom(male), female.depth, male.depth,
                         female.angle, n);
}

Fit fit_of(const MeasuredPart& female, const MeasuredPart& male, double angle, int angled_flanks) {
  const double female_bottom = functional_width_bottom(female, angled_flanks, angle);
  const double male_bottom = functional_width_bottom(male, angled_flanks, angle);
  const double female_top = width_top_from_bottom(DovetailType::Female, female_bottom, female.depth,
                                                  angle, angled_flanks);
  return fit_from_widths(female_top, male_bottom, female.depth, male.depth, angle, angled_flanks);
}

double reading_for_clearance(const MeasuredPart& other, const MeasuredPart& target, double angle,
                             int angled_flanks, double clearance) {
  const double other_bottom = functional_width_bottom(other, angled_flanks, angle);
  if (other.type == DovetailType::Female) {
    const double female_top = width_top_from_bottom(DovetailType::Female, other_bottom, other.depth,
                                                    angle, angled_flanks);
    const double loss = depth_clearance_loss(other.depth, target.depth, angle, angled_flanks);
    return reading_of_functional(target, angled_flanks, angle, female_top - clearance - loss);
  }
  const double loss = depth_clearance_loss(target.depth, other.depth, angle, angled_flanks);
  const double female_bottom = width_bottom_from_top(
      DovetailType::Female, other_bottom + clearance + loss, target.depth, angle, angled_flanks);
  return reading_of_functional(target, angled_flanks, angle, female_bottom);
}

}  // namespace dovetailor
