#pragma once

#include <optional>
#include <string_view>
#include <vector>

#include <dovetailor/job/job.hpp>

namespace dovetailor {

// The whole tool as a body of revolution about the spindle axis, described
// by its profile: radius as a function of height above the tip (mm). The
// simulation sweeps this body, not just the cutting edge, so a neck, shank or
// holder that rubs the work is found as well as flutes that cut too much.

// Which part of the body a piece of profile belongs to. Only the flutes cut;
// any other part touching the work is a collision.
enum class BodyPart { Flutes, Neck, Shank, Holder };

std::string_view body_part_name(BodyPart part);  // "flutes", "neck", "shank", "holder"

// One point of a profile: `radius` at `height` above the tip.
struct ProfilePoint {
  double height = 0;
  double radius = 0;

  bool operator==(const ProfilePoint&) const = default;
};

// One part of the body: its profile from its lowest to its highest point,
// heights non-decreasing, the radius linear between points. Every part of
// the bodies built here is convex (the radius is a concave function of
// height), which the sweep relies on.
struct BodySection {
  BodyPart part = BodyPart::Flutes;
  std::vector<ProfilePoint> profile;

  bool operator==(const BodySection&) const = default;

  double bottom() const { return profile.front().height; }
  double top() const { return profile.back().height; }
  double max_radius() const;
  // Radius at height h; 0 outside [bottom(), top()].
  double radius_at(double h) const;
};

struct ToolBody {
  std::vector<BodySection> sections;  // tip upward

  bool operator==(const ToolBody&) const = default;

  double top() const { return sections.back().top(); }
  double max_radius() const;
  // The largest radius of any part at height h above the tip.
  double radius_at(double h) const;
};

// The tool's body data with the job's gaps filled: the one model of the
// cutter body that the planner's clearance checks, the deflection beam
// (deflection.hpp) and the checker's sweep all build on, so that they agree
// on what touches. Where the job leaves them out, this project's
// assumptions, from common tool proportions (from memory), apply:
//  - a dovetail cutter's neck is 0.5 x its large diameter long (and ends at
//    the stickout when that is shorter);
//  - the shank is as large as the cutter (end mill), or half the large
//    diameter but not less than the neck (dovetail cutter);
//  - the stickout (holder face to tip) is the flute length plus 0.5 x the
//    shank diameter (end mill), or the flute length plus the neck plus one
//    shank diameter (dovetail cutter);
//  - the holder is there only when its diameter is given: from the stickout
//    (given or assumed) up. Without it the shank runs on upward.
inline constexpr double neck_length_factor = 0.5;

struct BodyDimensions {
  // Where the flutes end: a dovetail cutter's small diameter D - 2 h_f cot(a)
  // at the flute length h_f, else the tool's diameter.
  double flute_top_diameter = 0;
  double neck_diameter = 0;  // dovetail cutter; 0 for an end mill
  double neck_length = 0;    // from the top of the flutes; 0 for an end mill
  double shank_diameter = 0;
  double stickout = 0;  // holder face to tip
  std::optional<double> holder_diameter;
  bool shank_assumed = false;
  bool stickout_assumed = false;

  bool operator==(const BodyDimensions&) const = default;
};

// The tool data must be valid as the job reader checks it (positive
// diameters, a stickout no shorter than the flutes).
BodyDimensions body_dimensions(const Tool& tool);

// How the body is turned into profiles.
struct ToolBodyOptions {
  // Corner radii are replaced by chords no further than this from the true
  // arc, always inside it (mm); 0.1 um is 1/200 of a 0.02 mm tolerance.
  double chord_tolerance = 1e-4;
  // How far the topmost part (shank, or holder when its diameter is given)
  // reaches above the tip: far above any stock, so that plunging deep never
  // leaves a phantom gap above the tool.
  double body_top = 1000;
};

// The body of a job's tool, tip at height 0.
//
// End mill: flutes of the tool's diameter up to the flute length (with a
// corner radius if one is given: a bull-nose end mill), then the shank.
// Dovetail cutter (domain brief, "The dovetail cutter"): the large diameter D
// at the tip, the cone at the tool's angle a rising to the small diameter
// D - 2*h_f*cot(a) at the flute length h_f, the corner radius rounding the
// sharp tip corner (the cone line still passes through the sharp corner at
// D/2, so a pin-measured flank is where a sharp cutter would put it), then
// the neck of the neck diameter, then the shank.
//
// Drill: a cone of the point angle (included) from the point on the axis up
// to the diameter, then the diameter to the flute length. Chamfer mill: a
// cone of its included angle from the tip diameter up to the diameter, then
// the diameter to the flute length. Both then the shank.
//
// Neck, shank, stickout and holder are body_dimensions(tool): where the job
// leaves them out, its assumptions. The tool data must be valid as the job
// reader checks it (positive diameters, a cone that does not close within
// the flutes).
ToolBody tool_body(const Tool& tool, const ToolBodyOptions& options = {});

}  // namespace dovetailor
