#pragma once

// Shared by the planner's source files. Internal to the core library.

#include <string>
#include <vector>

#include <dovetailor/plan/plan.hpp>
#include <dovetailor/shop/material_table.hpp>

namespace dovetailor::detail {

struct PlanContext {
  const Job& job;
  const Material& material;
  const Tool& end_mill;
  const Tool& cutter;
  DovetailSection target;  // at the front end (y = 0)
  double safe_z = 0;       // rapids at or above
  double near_z = 0;       // feed from here into the work
  double clearance = 0;    // outside the stock ends and faces
  double rough_allowance = 0;
  double floor_allowance = 0;
  double finish_allowance = 0;  // lateral per flank left by roughing
  double last_cut = 0;          // lateral per flank left by the semi-finish pass
  double rough_deflection_limit = 0;
  double finish_deflection_limit = 0;
  MillingMode mode = MillingMode::Climb;  // wanted on the flanks
  std::vector<PlanWarning>& warnings;
  int next_pass = 1;

  Units units() const { return job.units; }
  bool female() const { return job.dovetail.type == DovetailType::Female; }
  // A length for messages: "0.0100 in".
  std::string show(double mm) const;
};

// A plan is refused beyond this many passes: no dovetail needs it, and it
// keeps a mistyped job from filling memory.
inline constexpr int max_passes = 5000;

// Direction of a cut along the slide.
enum class Along { Forward, Back };  // +Y, -Y

// Which side of the tool touches the work when it works toward `side`'s flank.
bool engages_plus_x(const PlanContext& ctx, Side side);

// The direction that gives `mode` with the spindle turning clockwise (M3)
// seen from above. A tooth on the tool's +X side moves toward -Y, so when the
// tool feeds +Y with the work on its +X side each tooth enters the uncut
// stock ahead at full chip thickness and leaves thin: climb milling (the
// tool is left of the work, as with G41). Feeding -Y there is conventional.
Along direction_for(bool plus_x_engaged, MillingMode mode);
MillingMode mode_of(bool plus_x_engaged, Along along);

// A line along the slide the tool axis runs on: x = x + slope * y.
struct AxisLine {
  double x = 0;  // at y = 0
  double slope = 0;
};

// Fills the pass's entry, cut and exit (plan.hpp): from the safe height
// outside the stock, down outside the work, the cut along Y (respecting the
// job's ends), out and up again.
// `previous` is the line the last pass at this level ran on, already cleared:
// with a front-open dovetail a pass that cuts feeding -Y runs in there, steps
// over at the closed end and cuts on the way out; one that cuts feeding +Y
// cuts on the way in.
void add_moves(const PlanContext& ctx, Pass& pass, double tool_radius, Along along,
               AxisLine previous, double plunge_feed);

// End-mill roughing (slot or shoulders, and a square wall's finish).
std::vector<Operation> rough_operations(PlanContext& ctx);

// The dovetail cutter's operation: undercut, semi-finish, finish, spring.
Operation undercut_operation(PlanContext& ctx);

// Lateral axis position of the dovetail cutter working `side`'s flank with
// `stock` left, the tip at `tip_above_base` above the base plane, at y = 0.
double cutter_axis_x(const PlanContext& ctx, Side side, double stock, double tip_above_base);

// The dovetail cutter's tip heights above the base plane, top level first:
// one level (0) when its flutes cover the depth with a tenth to spare, else
// levels spaced so each overlaps the next by at least a tenth of the flutes,
// cut from the top down so the neck always runs in space the level above has
// cleared. Each height is a whole multiple of 0.001 in / 0.01 mm above the
// base plane, so that a control rounding the tip's Z word rounds every level
// alike: the levels then meet on one flank line, up to the rounding of X.
std::vector<double> level_tips(const PlanContext& ctx);

// dx/dy of a flank in plan view: non-zero only for a tapered gib flank.
double flank_taper_slope(const PlanContext& ctx, Side side);

}  // namespace dovetailor::detail
