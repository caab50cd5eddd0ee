#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include <dovetailor/cutting_data.hpp>
#include <dovetailor/deflection.hpp>

#include "planner_detail.hpp"

namespace dovetailor::detail {

double flank_taper_slope(const PlanContext& ctx, Side side) {
  return dovetailor::flank_taper_slope(ctx.job.dovetail, side);
}

double cutter_axis_x(const PlanContext& ctx, Side side, double stock, double tip_above_base) {
  const Flank& f = ctx.target.flank(side);
  const double radius = ctx.cutter.diameter / 2;
  const double run = tip_above_base * cot_deg(ctx.target.angle);
  const double inward = side == Side::Right ? -1.0 : 1.0;  // toward the centre line
  // Female: the cone's outer edge follows the flank from inside the void.
  // Male: the cutter runs outside the tongue.
  const double from_corner = ctx.female() ? run + radius + stock : -(run + radius + stock);
  return f.base.x + inward * from_corner;
}

namespace {

struct Levels {
  std::vector<double> tips;  // tip heights above the base plane, top level first
  double engaged = 0;        // engaged flank height per level
};

// The undercut is cut in levels along the flank when the flutes are shorter
// than the depth: tips spaced so each level overlaps the next, from the top
// level down, so the neck always runs in space the level above has cleared.
Levels levels_for(const PlanContext& ctx) {
  const double depth = ctx.target.depth;
  const double usable = 0.9 * ctx.cutter.flute_length;
  const int n = std::max(1, static_cast<int>(std::ceil(depth / usable - 1e-9)));
  Levels l;
  for (int j = n - 1; j >= 0; --j) l.tips.push_back(depth * j / n);
  l.engaged = std::min(depth, ctx.cutter.flute_length);
  return l;
}

// Lateral distance from the centre of the roughed space to the flank's
// finish position of the cutter axis, expressed as stock left on that flank.
double stock_at_axis(const PlanContext& ctx, Side side, double axis_x, double tip) {
  const double finish = cutter_axis_x(ctx, side, 0, tip);
  return std::abs(finish - axis_x);
}

}  // namespace

Operation undercut_operation(PlanContext& ctx) {
  const Tool& cutter = ctx.cutter;
  const double radius = cutter.diameter / 2;
  const Levels levels = levels_for(ctx);
  const double fz =
      chip_load_for(ctx.material, cutter.diameter) * 0.5;  // dovetail: half, as cutting_data
  double step_limit = max_radial_step(cutter, ctx.material,
                                      {.axial_length = levels.engaged,
                                       .chip_load = fz,
                                       .deflection_limit = ctx.rough_deflection_limit,
                                       .feed_raised_for_chip_thinning = true,
                                       .largest_step = 0.5 * radius});
  // Light radial cuts whatever the beam says: the teeth at the tip of a
  // dovetail cutter chip easily. A tenth of the diameter at most (common
  // practice, from memory).
  step_limit = std::min(step_limit, 0.1 * cutter.diameter);
  if (step_limit < 0.01 * radius)
    throw InputError(
        fmt::format("the dovetail cutter T{} would bend more than {} even at a radial step of {}: "
                    "its neck is too slender for this material; use a stouter cutter, a shorter "
                    "stickout or carbide",
                    cutter.number, ctx.show(ctx.rough_deflection_limit), ctx.show(0.01 * radius)),
        {ctx.job.source}, fmt::format("tool[T{}].neck_diameter", cutter.number));

  Operation op;
  op.kind = OperationKind::Undercut;
  op.tool = cutter.number;
  op.title = "Undercut and finish the flanks";
  const CuttingData rough =
      cutting_data(cutter, ctx.material, ctx.job.machine, {.radial_step = step_limit});
  for (const auto& w : rough.warnings)
    ctx.warnings.push_back(fmt::format("T{}: {}", cutter.number, warning_text(w, ctx.units())));
  // Finishing: half the roughing chip load for the surface (common practice).
  const CuttingData finish =
      cutting_data(cutter, ctx.material, ctx.job.machine,
                   {.radial_step = std::max(ctx.last_cut, ctx.finish_allowance)});
  op.rpm = rough.rpm;
  op.feed = rough.feed;
  op.finish_feed = std::min(rough.feed, finish.feed) * 0.5;
  op.entry = ctx.job.dovetail.ends == Ends::FrontOpen
                 ? "enters at cutting depth from the open front end, outside the stock; backs out "
                   "the same way (never plunges, never rises under the overhang)"
                 : "enters at cutting depth from the front end, outside the stock; leaves past the "
                   "far end (never plunges, never rises under the overhang)";

  const auto& s = ctx.target;
  std::vector<Side> angled;
  if (s.right.angled) angled.push_back(Side::Right);
  if (s.left.angled) angled.push_back(Side::Left);

  const auto add = [&](PassRole role, std::optional<Side> side, double x, double tip, double radial,
                       double stock_left, double feed, double previous_x) {
    Pass p;
    p.number = ctx.next_pass++;
    p.tool = cutter.number;
    p.role = role;
    p.side = side;
    p.x = x;
    p.taper_slope = side ? flank_taper_slope(ctx, *side) : 0;
    p.z = -s.depth + tip;
    p.radial_step = radial;
    p.axial_depth = levels.engaged;
    p.stock_left = stock_left;
    p.feed = feed;
    p.rpm = op.rpm;
    const double fz_pass = feed / (cutter.flutes * op.rpm);
    p.deflection = radial > 0 ? predict_deflection(cutter, ctx.material,
                                                   {.radial_step = radial,
                                                    .axial_length = levels.engaged,
                                                    .feed_per_tooth = fz_pass})
                                    .deflection
                              : 0;
    Along along = Along::Forward;
    if (side) {
      const bool plus_x = engages_plus_x(ctx, *side);
      along = direction_for(plus_x, ctx.mode);
      p.mode = mode_of(plus_x, along);
    }
    add_moves(ctx, p, radius, along, previous_x, op.feed / 2);
    op.passes.push_back(std::move(p));
  };

  // Roughing, level by level from the top.
  for (double tip : levels.tips) {
    // Where the roughed space ends toward each side at this level: the
    // female's slot wall, the male's shoulder wall.
    double start_x = 0;
    if (ctx.female()) {
      const double left_wall = s.left.top.x + ctx.rough_allowance;
      const double right_wall = s.right.top.x - ctx.rough_allowance;
      start_x = (left_wall + right_wall) / 2;
      // Keep the centre pass off a square wall and short of each flank's
      // roughing position.
      const auto limit = [&](Side side) {
        const Flank& f = s.flank(side);
        const double sign = side == Side::Right ? 1.0 : -1.0;
        return f.angled ? cutter_axis_x(ctx, side, ctx.finish_allowance, tip)
                        : f.base.x - sign * (radius + ctx.clearance / 10);
      };
      start_x = std::clamp(start_x, std::min(limit(Side::Left), limit(Side::Right)),
                           std::max(limit(Side::Left), limit(Side::Right)));
      const double first =
          std::max({0.0, start_x + radius - right_wall, left_wall - (start_x - radius)});
      if (first > step_limit)
        ctx.warnings.push_back(fmt::format(
            "the first undercut pass at {} above the floor takes {} per side, more than the "
            "{} step the deflection limit allows: a smaller dovetail cutter or a wider roughing "
            "slot would lighten it",
            ctx.show(tip), ctx.show(first), ctx.show(step_limit)));
      // The centre pass also finishes the floor under the slot.
      add(PassRole::Rough, std::nullopt, start_x, tip, first, 0, op.feed, start_x);
    }
    for (Side side : {Side::Right, Side::Left}) {
      const bool angled_side = s.flank(side).angled;
      const double sign = side == Side::Right ? 1.0 : -1.0;
      // The passes toward a tapered gib's flank run at the taper, the
      // roughing beside them straight: along the slide they close on the
      // roughed wall by up to the taper over the dovetail's length, and
      // start that much further from it, so no pass takes more than a step.
      const double toward_wall = ctx.female() ? sign : -sign;
      const double closing =
          std::max(0.0, toward_wall * flank_taper_slope(ctx, side) * ctx.job.dovetail.length);
      double from_x = start_x;
      double stock_from = 0;
      double end_stock = ctx.finish_allowance;
      if (ctx.female()) {
        stock_from = stock_at_axis(ctx, side, start_x, tip);
        if (!angled_side) {
          // Sweep the floor toward the square wall, stopping short of it.
          const double wall = s.flank(side).base.x;
          const double last_x = wall - sign * (radius + ctx.clearance / 10);
          if (tip > 0) continue;  // only the floor level sweeps toward the square wall
          const double span = std::abs(last_x - start_x);
          const int n = static_cast<int>(std::ceil(span / step_limit - 1e-9));
          for (int i = 1; i <= n; ++i)
            add(PassRole::Rough, side, start_x + (last_x - start_x) * i / n, tip, 0,
                std::abs(wall - (start_x + (last_x - start_x) * i / n + sign * radius)), op.feed,
                start_x + (last_x - start_x) * (i - 1) / n);
          continue;
        }
      } else {
        if (!angled_side) continue;  // the end mill finished the square wall and its shelf
        const double wall = s.flank(side).top.x + sign * ctx.rough_allowance;
        from_x = wall + sign * (radius + closing);
        stock_from = stock_at_axis(ctx, side, from_x, tip);
      }
      if (stock_from <= end_stock + 1e-9) continue;
      // Passes that only skim the floor (female: until the cone reaches the
      // slot wall) step up to 0.8 of the radius; engaged passes step at the
      // deflection limit.
      double engage_stock = stock_from;
      if (ctx.female()) {
        const double wall =
            sign > 0 ? s.right.top.x - ctx.rough_allowance : s.left.top.x + ctx.rough_allowance;
        engage_stock =
            std::min(stock_from, stock_at_axis(ctx, side, wall - sign * (radius + closing), tip));
      }
      engage_stock = std::max(engage_stock, end_stock);
      double stock = stock_from;
      double previous_x = from_x;
      if (stock_from - engage_stock > 1e-9) {
        const int n =
            static_cast<int>(std::ceil((stock_from - engage_stock) / (0.8 * radius) - 1e-9));
        for (int i = 1; i <= n; ++i) {
          stock = stock_from - (stock_from - engage_stock) * i / n;
          const double x = cutter_axis_x(ctx, side, stock, tip);
          add(PassRole::Rough, side, x, tip, 0, stock, op.feed, previous_x);
          previous_x = x;
        }
      }
      const int n =
          std::max(1, static_cast<int>(std::ceil((stock - end_stock) / step_limit - 1e-9)));
      const double step = (stock - end_stock) / n;
      for (int i = 1; i <= n; ++i) {
        const double left = stock - step * i;
        const double x = cutter_axis_x(ctx, side, left, tip);
        add(PassRole::Rough, side, x, tip, step, left, op.feed, previous_x);
        previous_x = x;
      }
    }
  }

  const auto flank_passes = [&](PassRole role, double stock, double taken, double feed) {
    for (Side side : angled)
      for (double tip : levels.tips)
        add(role, side, cutter_axis_x(ctx, side, stock, tip), tip, taken, stock, feed,
            cutter_axis_x(ctx, side, stock + taken, tip));
  };
  if (ctx.last_cut > 0)
    flank_passes(PassRole::SemiFinish, ctx.last_cut, ctx.finish_allowance - ctx.last_cut,
                 op.finish_feed);
  const double final_cut = ctx.last_cut > 0 ? ctx.last_cut : ctx.finish_allowance;
  flank_passes(PassRole::Finish, 0, final_cut, op.finish_feed);
  if (ctx.job.strategy.spring_pass) flank_passes(PassRole::Spring, 0, 0, op.finish_feed);
  return op;
}

}  // namespace dovetailor::detail
