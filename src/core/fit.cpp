#include <cmath>

#include <dovetailor/fit.hpp>

namespace dovetailor {

namespace {

Fit from_lateral(double lateral, double angle) {
  return {lateral, lateral * std::sin(radians(angle))};
}

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

}  // namespace

Fit fit_of(const DovetailSection& female, const DovetailSection& male) {
  const double female_top =
      width_top_from_bottom(DovetailType::Female, functional_width_bottom(female), female.depth,
                            female.angle, female.angled_flanks());
  return from_lateral(female_top - functional_width_bottom(male), female.angle);
}

Fit fit_of(const MeasuredPart& female, const MeasuredPart& male, double angle, int angled_flanks) {
  const double female_bottom = functional_width_bottom(female, angled_flanks, angle);
  const double male_bottom = functional_width_bottom(male, angled_flanks, angle);
  const double female_top = width_top_from_bottom(DovetailType::Female, female_bottom, female.depth,
                                                  angle, angled_flanks);
  return from_lateral(female_top - male_bottom, angle);
}

double reading_for_clearance(const MeasuredPart& other, const MeasuredPart& target, double angle,
                             int angled_flanks, double clearance) {
  const double other_bottom = functional_width_bottom(other, angled_flanks, angle);
  if (other.type == DovetailType::Female) {
    const double female_top = width_top_from_bottom(DovetailType::Female, other_bottom, other.depth,
                                                    angle, angled_flanks);
    return reading_of_functional(target, angled_flanks, angle, female_top - clearance);
  }
  const double female_bottom = width_bottom_from_top(DovetailType::Female, other_bottom + clearance,
                                                     target.depth, angle, angled_flanks);
  return reading_of_functional(target, angled_flanks, angle, female_bottom);
}

}  // namespace dovetailor
