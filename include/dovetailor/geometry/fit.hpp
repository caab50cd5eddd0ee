#pragma once

#include <dovetailor/geometry/dovetail_section.hpp>
#include <dovetailor/geometry/pin_gauge.hpp>

namespace dovetailor {

// The fit of a male and a female dovetail of the same angle.
//
// Assembly convention: the female is laid top face down over the male, and
// comes to rest as low as it can go. Its groove is H_f deep, the male's
// tongue H_m high; in the section both flanks are lines at the angle a, so
// the lateral gap between them is the same at every height where both exist.
//
//  - H_m <= H_f: the female's top face rests on the male's shelf and the
//    male's top clears the female's floor by H_f - H_m. The lateral gap is
//      c0 = W_top(female) - W_bottom(male)
//         = W_bottom(female) - n*H_f*cot(a) - W_bottom(male)
//    with n the number of angled flanks (domain brief, "Fit of a pair"; the
//    dovetail trapezoid of Machinery's Handbook, "Measuring Dovetail Slides").
//  - H_m > H_f: the male's top meets the female's floor first, and holds the
//    female's top face g = H_m - H_f above the shelf. Lifted by g, each of
//    the female's angled flanks stands g*cot(a) further in at every height
//    (its flank line x = x0 + z*cot(a) moved up by g), so the gap is
//      c = c0 - n*g*cot(a).
//    The female cannot sit lower (the tongue holds its floor) and sitting
//    higher closes the gap further, so a negative c cannot assemble.
//
// The flanks face each other over min(H_f, H_m); positive c is clearance,
// negative interference. The clearance normal to the flanks is c*sin(a).
struct Fit {
  double lateral_clearance = 0;  // total, both flanks together, where the parts come to rest
  double normal_clearance = 0;   // lateral * sin(a)
  double shelf_clearance = 0;    // c0: the gap if the top face sat on the shelf
  double shelf_gap = 0;          // the female's top face above the male's shelf, g
  double floor_gap = 0;          // the male's top below the female's floor, H_f - H_m or 0
  double bearing_height = 0;     // the height over which the flanks face each other
  bool can_assemble = true;      // clearance not negative and the flanks face each other

  bool operator==(const Fit&) const = default;
};

// One part as measured: its pin reading, the pin and its depth (base plane
// to top plane, both types: the fit depends on both depths).
struct MeasuredPart {
  DovetailType type = DovetailType::Female;
  double reading = 0;
  double pin_diameter = 0;
  double depth = 0;
  // Lateral gib allowance included in the reading: the pins measure the part
  // as cut, and in assembly the gib fills this much of the width.
  double gib_allowance = 0;

  bool operator==(const MeasuredPart&) const = default;
};

// The lateral clearance the depths take away: n*(H_m - H_f)*cot(a) when the
// male is the deeper, else 0 (see Fit).
double depth_clearance_loss(double female_depth, double male_depth, double angle,
                            int angled_flanks);

// From two designed sections (one male, one female, same angle and flank set;
// the caller checks that). The widths are the functional ones: the gib
// allowance is taken off again, because the gib fills it.
Fit fit_of(const DovetailSection& female, const DovetailSection& male);

// From two readings. `angled_flanks` is 2 for full dovetails, 1 for half.
Fit fit_of(const MeasuredPart& female, const MeasuredPart& male, double angle, int angled_flanks);

// The reading to aim for on the part not yet made, given the other part as
// measured and the wanted lateral clearance where the parts come to rest.
// `target` says the type, pin and depth of the part to make; its reading is
// ignored.
double reading_for_clearance(const MeasuredPart& other, const MeasuredPart& target, double angle,
                             int angled_flanks, double clearance);

}  // namespace dovetailor
