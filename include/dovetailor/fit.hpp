#pragma once

#include <dovetailor/dovetail_section.hpp>
#include <dovetailor/pin_gauge.hpp>

namespace dovetailor {

// The fit of a male and a female dovetail of the same angle.
//
// Assembly convention: the female's top face rests on the male's shelf (its
// base plane), so both parts meet in one plane. Their flanks are parallel, so
// the lateral gap is the same at every height:
//   c = W_top(female) - W_bottom(male)
//     = W_bottom(female) - n*H_female*cot(a) - W_bottom(male)
// with n the number of angled flanks. Positive c is clearance, negative is
// interference. The clearance normal to the flanks is c*sin(a).
struct Fit {
  double lateral_clearance = 0;  // total, both flanks together
  double normal_clearance = 0;   // lateral * sin(a)

  bool operator==(const Fit&) const = default;
};

// One part as measured: its pin reading, the pin, and (for a female) its depth.
struct MeasuredPart {
  DovetailType type = DovetailType::Female;
  double reading = 0;
  double pin_diameter = 0;
  double depth = 0;  // needed for the female only
  // Lateral gib allowance included in the reading: the pins measure the part
  // as cut, and in assembly the gib fills this much of the width.
  double gib_allowance = 0;

  bool operator==(const MeasuredPart&) const = default;
};

// From two designed sections (one male, one female, same angle and flank set;
// the caller checks that). The widths are the functional ones: the gib
// allowance is taken off again, because the gib fills it.
Fit fit_of(const DovetailSection& female, const DovetailSection& male);

// From two readings. `angled_flanks` is 2 for full dovetails, 1 for half.
Fit fit_of(const MeasuredPart& female, const MeasuredPart& male, double angle, int angled_flanks);

// The reading to aim for on the part not yet made, given the other part as
// measured and the wanted lateral clearance. `target` says the type, pin and
// (for a female) depth of the part to make; its reading is ignored.
double reading_for_clearance(const MeasuredPart& other, const MeasuredPart& target, double angle,
                             int angled_flanks, double clearance);

}  // namespace dovetailor
