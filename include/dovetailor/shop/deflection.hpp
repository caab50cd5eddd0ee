#pragma once

#include <vector>

#include <dovetailor/geometry/tool_body.hpp>
#include <dovetailor/job/job.hpp>
#include <dovetailor/shop/material_table.hpp>

namespace dovetailor {

// How far a cutter springs away from the work under the cutting force, so the
// planner can size roughing steps and keep the finishing pass's spring well
// inside the tolerance. Units: lengths mm, forces N, moduli N/mm^2 (MPa).
//
// The estimate is a model for choosing steps, not a measurement: it ignores
// the holder's and spindle's own give, runout and tool wear, which all add to
// it. The planner should keep a margin.

// Young's modulus of the tool material: HSS about 200 GPa, cemented carbide
// about 550-650 GPa (domain brief; the carbide range is from memory), the
// middle of the range taken: 600 GPa.
inline constexpr double hss_modulus = 200'000.0;      // N/mm^2
inline constexpr double carbide_modulus = 600'000.0;  // N/mm^2
double youngs_modulus(ToolMaterial material);

// Specific cutting force kc = kc11 * h^(-mc), N/mm^2, for a chip thickness h
// (mm, > 0) (Kienzle; domain brief, "Reference values").
double specific_cutting_force(const Material& material, double chip_thickness);

// Tangential cutting force Fc = kc * b * h (N) on a chip of width b and
// thickness h, mm (Kienzle). 0 for h = 0.
double cutting_force(const Material& material, double chip_width, double chip_thickness);

// Second moment of area of a round section, I = pi d^4 / 64 (mm^4).
double round_second_moment(double diameter);

// Deflection under the load of a uniform round cantilever, fixed at one end
// and loaded at the other: d = F L^3 / (3 E I) (Euler-Bernoulli beam; domain
// brief, "Reference values").
double cantilever_deflection(double force, double length, double diameter, double modulus);

// One round length of a stepped beam.
struct BeamSection {
  double length = 0;
  double diameter = 0;

  bool operator==(const BeamSection&) const = default;
};

// Deflection at the load point of a stepped round cantilever: `sections` run
// from the fixed end (the holder face) outward, the load F acts at
// `load_at` from the fixed end (within the beam's length). Closed form by the
// moment-area method (Euler-Bernoulli): with the bending moment F (a - x),
//   d = F / (3 E) * sum_i [(a - x_i)^3 - (a - x_i+1)^3] / I_i
// over the sections between the fixed end and the load (x_i their starts,
// clipped at a). With one diameter throughout it is F a^3 / (3 E I).
double stepped_cantilever_deflection(double force, double load_at,
                                     const std::vector<BeamSection>& sections, double modulus);

// The fluted length bends like a round bar of 0.8 x its diameter (flutes
// remove core; 0.8 is a figure often used for the equivalent diameter, from
// memory); for a dovetail cutter, 0.8 x the cone's small diameter but not
// less than the neck. This project's assumption, on the cautious side.
inline constexpr double fluted_diameter_factor = 0.8;

// A tool as a stepped cantilever, holder face first: neck, shank and
// stickout are body_dimensions(tool) (tool_body.hpp), the model the planner's
// clearance checks and the checker share, with its assumptions where the job
// gives no body data.
struct ToolBeam {
  std::vector<BeamSection> sections;  // from the holder face to the tip
  double modulus = 0;                 // N/mm^2
  bool stickout_assumed = false;
  bool shank_assumed = false;

  double length() const;  // the stickout

  bool operator==(const ToolBeam&) const = default;
};
ToolBeam tool_beam(const Tool& tool);

// One pass of a cutter along the work.
struct PassLoad {
  double radial_step = 0;     // ae, mm, measured at the cutter's (large) diameter
  double axial_length = 0;    // engaged length along the axis from the tip, mm (ap)
  double feed_per_tooth = 0;  // fz as programmed, mm

  bool operator==(const PassLoad&) const = default;
};

struct DeflectionEstimate {
  double engagement_angle = 0;     // radians
  double chip_thickness = 0;       // thickest chip, mm
  double mean_chip_thickness = 0;  // mm
  double teeth_in_cut = 0;         // on average
  double force = 0;                // bending load, N
  double deflection = 0;           // at the load point, mm

  bool operator==(const DeflectionEstimate&) const = default;
};

// Predicted deflection for a pass. Force model (Kienzle for milling, textbook
// form, from memory): the edge works at the lead angle k (90 deg for an end
// mill, the cutter angle for a dovetail cutter), so the chip is
// h = fz sin(k) sin(theta) thick and b = ap / sin(k) wide; the engagement
// angle phi from engagement_angle(). The bending load is the larger of
//   - one tooth at the thickest chip: Fc(h_max), h_max = fz sin(k) sin(min(phi, 90 deg)),
//   - the mean force of the teeth in the cut: Fc(h_m) * z phi / (2 pi),
//     h_m = fz sin(k) (1 - cos phi) / phi,
// taken as acting at the middle of the engaged length (ap, at most the flute
// length). The radial force component is left out; it adds to the resultant
// and is one reason to keep a margin.
DeflectionEstimate predict_deflection(const Tool& tool, const Material& material,
                                      const PassLoad& pass);

struct StepSearch {
  double axial_length = 0;      // ap, mm
  double chip_load = 0;         // feed per tooth, mm
  double deflection_limit = 0;  // mm, > 0
  // When true the feed per tooth for a step ae is chip_load times
  // chip_thinning_factor(ae, D, chip_thinning_limit), as cutting_data()
  // programs it; when false chip_load is the feed per tooth at any step.
  bool feed_raised_for_chip_thinning = false;
  double chip_thinning_limit = 2.0;
  double largest_step = 0;  // upper end of the search, mm; 0 means the tool diameter

  bool operator==(const StepSearch&) const = default;
};

// The largest radial step whose predicted deflection stays within
// search.deflection_limit (to 1e-9 of the diameter). The predicted deflection
// never falls as the step grows, so the answer is one number: every smaller
// step is also within the limit. Returns the largest step when even that is
// within the limit. A tiny answer means the feed or the tool is wrong for the
// limit, and the caller should say so.
double max_radial_step(const Tool& tool, const Material& material, const StepSearch& search);

}  // namespace dovetailor
