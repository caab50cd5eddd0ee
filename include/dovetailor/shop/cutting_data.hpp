#pragma once

#include <string>
#include <vector>

#include <dovetailor/job/job.hpp>
#include <dovetailor/shop/material_table.hpp>

namespace dovetailor {

// Spindle speed and feed for one cutter in one material. Internal units:
// lengths mm, surface speed m/min, spindle speed rev/min, feed mm/min.
// The figures are starting points for a machinist, not guarantees.

// Spindle speed n = 1000 * Vc / (pi * D), Vc in m/min, D in mm, n in rev/min
// (textbook formula; domain brief, "Reference values").
double spindle_speed(double surface_speed, double diameter);

// The same in inch units: n = 12 * V / (pi * D), V in ft/min, D in inches
// (textbook formula). For the edges that work in inches.
double spindle_speed_inch(double surface_feet_per_minute, double diameter_inch);

// The surface speed (m/min) of a cutter of `diameter` (mm) at `rpm`: the
// inverse of spindle_speed.
double surface_speed(double rpm, double diameter);

// Table feed = chip load x flutes x rpm (mm/min for a chip load in mm;
// textbook relation).
double feed_rate(double chip_load, int flutes, double rpm);

// The engagement angle (radians) of a cutter of `diameter` taking a radial
// step `radial_step` in side milling: phi = acos(1 - 2 ae / D), pi for a full
// slot (ae >= D). Geometry of the circular tooth path (textbook).
double engagement_angle(double radial_step, double diameter);

// Radial chip thinning. With a radial step ae under half the diameter the
// chip never reaches the feed per tooth: its thickest part is
// h_max = fz * sin(phi) (geometry of the tooth path; the relation is printed
// in tool makers' catalogues, quoted here from memory). To cut the intended
// chip the feed per tooth is raised by 1 / sin(phi) = D / (2 sqrt(ae (D - ae))),
// capped at `limit` (very light steps would otherwise ask for feeds that
// mark the work and load the cutter when the step comes out heavier than
// planned). 1 for ae >= D/2; `limit` for ae <= 0.
double chip_thinning_factor(double radial_step, double diameter, double limit);

struct CuttingOptions {
  // Radial step (ae, mm) the feed is for; 0 means a full-width slot.
  double radial_step = 0;
  // Where in the material's speed range to start: 0 the low end, 1 the high
  // end. The middle is the usual starting point (common practice).
  double speed_fraction = 0.5;
  // Dovetail cutters are slow and light: speed is taken from the large
  // diameter, then reduced by these factors against an end mill of that
  // diameter. Common practice says "slower and lighter" without one figure;
  // 0.6 and 0.5 are this project's choice: the fine-pitch teeth have little
  // chip room and the neck is the weakest section of any cutter in the job.
  double dovetail_speed_factor = 0.6;
  double dovetail_chip_load_factor = 0.5;
  // Highest chip-thinning increase applied (see chip_thinning_factor); 2 is
  // this project's choice.
  double chip_thinning_limit = 2.0;

  bool operator==(const CuttingOptions&) const = default;
};

enum class CuttingWarningKind {
  RpmCapped,   // the speed asked for is above machine.max_rpm; the maximum is used
  FeedCapped,  // the feed asked for is above machine.max_feed; the maximum is used
};

// A limit the cutting data ran into, as data for the caller to show.
struct CuttingWarning {
  CuttingWarningKind kind = CuttingWarningKind::RpmCapped;
  double wanted = 0;  // rev/min or mm/min before the cap
  double used = 0;    // after the cap

  bool operator==(const CuttingWarning&) const = default;
};

// Where the speed and feed figures came from.
enum class FigureSource { Material, ToolOverride };

struct CuttingData {
  double rpm = 0;            // spindle speed, rev/min
  double surface_speed = 0;  // m/min at that rpm on the cutter's (large) diameter
  double chip_load = 0;      // feed per tooth as programmed, mm
  double feed = 0;           // mm/min
  double chip_thinning = 1;  // factor applied to the material's chip load (1: none)
  FigureSource rpm_from = FigureSource::Material;
  FigureSource feed_from = FigureSource::Material;
  std::vector<CuttingWarning> warnings;

  bool operator==(const CuttingData&) const = default;
};

// Cutting data for `tool` in `material` on `machine`:
//  1. rpm: tool.rpm if given, else spindle_speed of the material's speed for
//     the tool material (at options.speed_fraction) on tool.diameter (the
//     large diameter of a dovetail cutter), times dovetail_speed_factor for
//     dovetail cutters; capped at machine.max_rpm.
//  2. chip load: tool.chip_load if given (used as given); else the material's
//     chip load for tool.diameter, times dovetail_chip_load_factor for
//     dovetail cutters, times the chip-thinning factor for options.radial_step.
//  3. feed: tool.feed if given, else chip load x flutes x the (capped) rpm;
//     capped at machine.max_feed (the chip load reported is then the one the
//     capped feed gives).
// Caps are reported in `warnings`, nothing is printed.
CuttingData cutting_data(const Tool& tool, const Material& material, const Machine& machine,
                         const CuttingOptions& options = {});

// One line for a machinist, lengths in `units`, e.g. "spindle speed 3200
// rev/min is above the machine's 2500 rev/min; using 2500".
std::string warning_text(const CuttingWarning& warning, Units units);

}  // namespace dovetailor
