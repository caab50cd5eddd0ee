#include <dovetailor/fit.hpp>

#include <cmath>

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

}  // namespace

Fit fit_of(const DovetailSection& female, const DovetailSection& male) {
  const double female_top = width_top_from_bottom(DovetailType::Female,
                                                  functional_width_bottom(female), female.depth,
                                                  female.angle, female.angled_flanks());
  return from_lateral(female_top - functional_width_bottom(male), female.angle);
}

Fit fit_of(const MeasuredPart& female, const MeasuredPart& male, double angle, int angled_flanks) {
  const double female_bottom = width_for_reading(DovetailType::Female, angled_flanks,
                                                 female.reading, female.pin_diameter, angle);
  const double male_bottom =
      width_for_reading(DovetailType::Male, angled_flanks, male.reading, male.pin_diameter, angle);
  const double female_top = width_top_from_bottom(DovetailType::Female, female_bottom,
                                                  female.depth, angle, angled_flanks);
  return from_lateral(female_top - male_bottom, angle);
}

double reading_for_clearance(const MeasuredPart& other, const MeasuredPart& target, double angle,
                             int angled_flanks, double clearance) {
  if (other.type == DovetailType::Female) {
    const double female_bottom = width_for_reading(DovetailType::Female, angled_flanks,
                                                   other.reading, other.pin_diameter, angle);
    const double female_top = width_top_from_bottom(DovetailType::Female, female_bottom,
                                                    other.depth, angle, angled_flanks);
    return reading_for_width(DovetailType::Male, angled_flanks, female_top - clearance,
                             target.pin_diameter, angle);
  }
  const double male_bottom =
      width_for_reading(DovetailType::Male, angled_flanks, other.reading, other.pin_diameter, angle);
  const double female_bottom = width_bottom_from_top(DovetailType::Female, male_bottom + clearance,
                                                     target.depth, angle, angled_flanks);
  return reading_for_width(DovetailType::Female, angled_flanks, female_bottom,
                           target.pin_diameter, angle);
}

}  // namespace dovetailor
