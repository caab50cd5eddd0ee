#pragma once

#include <optional>
#include <string_view>
#include <vector>

#include <dovetailor/geometry/dovetail_section.hpp>
#include <dovetailor/geometry/pin_gauge.hpp>
#include <dovetailor/geometry/section_region.hpp>

namespace dovetailor {

// Measuring a simulated section the way a machinist measures the real part:
// depth from the top face, the flanks' positions, angles and straightness,
// and the reading over or between pins. The target section (its flanks and
// the dovetail type) only says where to look: every figure comes from the
// region. Conventions as in dovetail_section.hpp: centre line x = 0, top
// plane z = 0, base plane z = -depth, x lateral, z up, all in mm.

struct MeasureOptions {
  double pin_diameter = 0;  // mm; must be positive
  // Rows (heights) per flank used to fit its line.
  int flank_samples = 64;
  // Fraction of the flank's height left out at each end of the fit, so that
  // a corner round at the floor or an edge break at the top does not tilt
  // the line. The target's chamfer is left out as well.
  double end_margin = 0.1;
  // Chord error of the rounds the offset makes (mm); the pin's centre itself
  // is a sharp corner of the offset and does not depend on it.
  double arc_tolerance = 1e-4;
};

struct FlankMeasurement {
  bool found = false;  // false when no flank was seen between floor and top
  bool angled = true;  // as the target says
  // The floor (female) or shelf (male) beside this flank, where the pin
  // rests: the top of material below the pin's centre.
  double floor_z = 0;
  // The least-squares line through the flank, at the floor and at the top.
  double base_x = 0;
  double top_x = 0;
  // Degrees between the base plane and the fitted flank, measured inside the
  // void at the base corner (90 for a square flank, like the target angle).
  double angle = 0;
  // The largest distance of the flank from its fitted line, normal to the
  // line, over every row and every vertex height in the fitted band: steps
  // left by coarse radial passes show up here.
  double max_deviation = 0;
  int samples = 0;
  // Angled flank: the centre of a pin resting on the floor pushed into the
  // corner. Square flank: none.
  std::optional<Point2> pin_center;
  // Where the instrument touches: the pin's edge away from the flank (its
  // far side from the corner), or the face itself for a square flank.
  double measuring_x = 0;

  bool operator==(const FlankMeasurement&) const = default;
};

// Why a section could not be measured (the words are the report's,
// report/check_report.hpp).
enum class MeasureProblemKind {
  NoMaterial,     // nothing is left in the section
  NoFlank,        // no flank on `side` between the floor and the top face
  PinDoesNotFit,  // a pin of the given size does not fit into the corner on `side`
};

struct MeasureProblem {
  MeasureProblemKind kind = MeasureProblemKind::NoMaterial;
  Side side = Side::Left;  // NoFlank, PinDoesNotFit

  bool operator==(const MeasureProblem&) const = default;
};

// "no_material", "no_flank", "pin_does_not_fit" (for JSON).
std::string_view measure_problem_name(MeasureProblemKind kind);

struct SectionMeasurement {
  double top_z = 0;  // the highest material, the top face
  // Top face to the shallower of the two floors: the depth still to reach.
  double depth = 0;
  // Between the fitted flank lines, at each flank's floor and at the top.
  double width_bottom = 0;
  double width_top = 0;
  FlankMeasurement left;
  FlankMeasurement right;
  // The reading as a micrometer (or a height gauge from the square side)
  // would give it; none when a flank or a pin position was not found.
  std::optional<PinReading> reading;
  // Why something could not be measured; at least one whenever there is no
  // reading.
  std::vector<MeasureProblem> problems;

  bool operator==(const SectionMeasurement&) const = default;
  const FlankMeasurement& flank(Side side) const { return side == Side::Left ? left : right; }
};

// Measures the part region (material left in one section plane) against the
// target section.
//
// The virtual pin: the void near the dovetail (a window over the part up to
// one pin diameter above the top face, less the part) is shrunk by the pin
// radius (offset with round joins); what is left is where the pin's centre
// can be without entering material. In the half of the section on the
// flank's side (x < 0 for the left flank) and below the top face, the pin's
// centre is the point of that shrunk void furthest in the direction halfway
// between "down" and "toward the flank": for a flat floor and a straight
// flank, exactly the corner at floor + r where the pin touches both, as a pin
// pushed into the corner rests. Two angled flanks: the distance over (male)
// or between (female) the two pins' far edges (handbook method, see
// pin_gauge.hpp). One angled flank: the distance from the square flank's
// face (its point furthest into the void between the margins) to the pin's
// far edge.
SectionMeasurement measure_section(const SectionRegion& part, const DovetailSection& target,
                                   const MeasureOptions& options);

}  // namespace dovetailor
