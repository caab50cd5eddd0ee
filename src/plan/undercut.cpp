#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include <dovetailor/shop/cutting_data.hpp>
#include <dovetailor/shop/deflection.hpp>

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

std::vector<double> level_tips(const PlanContext& ctx) {
  const double depth = ctx.target.depth;
  const double usable = 0.9 * ctx.cutter.flute_length;
  const int n = std::max(1, static_cast<int>(std::ceil(depth / usable - 1e-9)));
  // 0.001 in or 0.01 mm: a whole number of steps of any control that writes
  // at least 3 decimals in inch or 2 in mm.
  const double round = ctx.units() == Units::Inch ? to_mm(0.001, Units::Inch) : 0.01;
  std::vector<double> tips;
  for (int j = n - 1; j >= 0; --j) tips.push_back(std::round(depth * j / n / round) * round);
  return tips;
}

namespace {

struct Levels {
  std::vector<double> tips;  // tip heights above the base plane, top level first
  double engaged = 0;        // engaged flank height per level
};

Levels levels_for(const PlanContext& ctx) {
  return {level_tips(ctx), std::min(ctx.target.depth, ctx.cutter.flute_length)};
}

// Lateral distance from the centre of the roughed space to the flank's
// finish position of the cutter axis, expressed as stock left on that flank.
double stock_at_axis(const PlanContext& ctx, Side side, double axis_x, double tip) {
  const double finish = cutter_axis_x(ctx, side, 0, tip);
  return std::abs(finish - axis_x);
}

// The dovetail cutter's first pass down a female's roughed slot at one level.
struct FirstPass {
  double x = 0;                   // tool axis at y = 0
  std::optional<Side> side = {};  // the one wall it cuts; none when it cuts neither or both
  bool both = false;              // it cuts both walls (slotting: one side climbs)
  double step = 0;                // its deepest cut into a wall, at the large diameter
};

// Places the first pass. The cutter's large diameter reaches across the
// roughed slot's vertical walls wherever the slot is narrower than the cutter;
// a square wall is already finished and stays out of its reach. A pass that
// cuts no wall is taken when there is room for one. Otherwise a CNC runs
// down the middle, cutting both walls alike; a manual machine, which must mill
// conventionally, cuts one wall only: the left wall feeding +Y or the right
// wall feeding -Y (the first step toward that flank), and with a front-open
// dovetail only the left, since the first pass cuts on its way in. Refused
// when the cut is more than `step_limit` or no pass can be conventional.
FirstPass first_female_pass(const PlanContext& ctx, double tip, double step_limit) {
  const auto& s = ctx.target;
  const Tool& cutter = ctx.cutter;
  const double radius = cutter.diameter / 2;
  const double left_wall = s.left.top.x + ctx.rough_allowance;
  const double right_wall = s.right.top.x - ctx.rough_allowance;
  // Keep the pass off a square wall and short of each flank's roughing position.
  const auto limit = [&](Side side) {
    const Flank& f = s.flank(side);
    const double sign = side == Side::Right ? 1.0 : -1.0;
    return f.angled ? cutter_axis_x(ctx, side, ctx.finish_allowance, tip)
                    : f.base.x - sign * (radius + ctx.clearance / 10);
  };
  const double lo = std::min(limit(Side::Left), limit(Side::Right));
  const double hi = std::max(limit(Side::Left), limit(Side::Right));
  const auto at = [&](double x) {
    const double cut_left = s.left.angled ? std::max(0.0, left_wall - (x - radius)) : 0.0;
    const double cut_right = s.right.angled ? std::max(0.0, x + radius - right_wall) : 0.0;
    FirstPass p{.x = x, .step = std::max(cut_left, cut_right)};
    const bool l = cut_left > 1e-9, r = cut_right > 1e-9;
    p.both = l && r;
    if (l != r) p.side = l ? Side::Left : Side::Right;
    return p;
  };
  const double middle = (left_wall + right_wall) / 2;
  // Axis positions where the cone reaches neither slot wall.
  const double clear_lo = std::max(lo, s.left.angled ? left_wall + radius : lo);
  const double clear_hi = std::min(hi, s.right.angled ? right_wall - radius : hi);
  if (clear_lo <= clear_hi + 1e-12) return at(std::clamp(middle, clear_lo, clear_hi));

  const bool manual = ctx.job.machine.kind == MachineKind::Manual;
  const bool front_open = ctx.job.dovetail.ends == Ends::FrontOpen;
  FirstPass pick = at(std::clamp(middle, lo, hi));
  if (manual) {
    std::optional<FirstPass> one_wall;
    for (double x : {clear_hi, clear_lo}) {
      const FirstPass p = at(std::clamp(x, lo, hi));
      if (!p.side || (front_open && *p.side != Side::Left)) continue;
      if (!one_wall || p.step < one_wall->step) one_wall = p;
    }
    if (!one_wall) {
      const double slot = right_wall - left_wall;
      throw InputError(
          fmt::format("the roughed slot is {} wide and the dovetail cutter T{} {}: its first pass "
                      "down the slot cuts the right wall, and with the front end open it cuts on "
                      "its way in (+Y), which is climb milling; a manual machine must mill "
                      "conventionally. Use a dovetail cutter no larger than the slot, or leave "
                      "the front and back ends open",
                      ctx.show(slot), cutter.number, ctx.show(cutter.diameter)),
          {ctx.job.source}, fmt::format("tool[T{}].diameter", cutter.number));
    }
    pick = *one_wall;
  }
  if (pick.step > step_limit * (1 + 1e-9)) {
    const double slot = right_wall - left_wall;
    // The cut grows with the diameter: by half of it on each wall when the
    // cutter runs in the middle, by all of it when it cuts one wall.
    const double largest = cutter.diameter - (pick.both ? 2 : 1) * (pick.step - step_limit);
    throw InputError(
        fmt::format("the roughed slot is {} wide (the mouth {} less {} per side) and the dovetail "
                    "cutter T{} {}: its first pass down the slot would cut {} into {}, more than "
                    "the {} radial step its bend limit and a tenth of its diameter allow{}. Use a "
                    "dovetail cutter of about {} or less, or leave less rough allowance "
                    "([strategy] rough_allowance)",
                    ctx.show(slot), ctx.show(s.width_top()), ctx.show(ctx.rough_allowance),
                    cutter.number, ctx.show(cutter.diameter), ctx.show(pick.step),
                    pick.both ? "each wall" : "the wall", ctx.show(step_limit),
                    manual ? " (a manual machine cuts one wall at a time, conventionally)" : "",
                    ctx.show(largest)),
        {ctx.job.source}, fmt::format("tool[T{}].diameter", cutter.number));
  }
  return pick;
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
    ctx.warnings.push_back(CuttingDataWarning{cutter.number, w});
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

  // `first`: the first pass down a female's slot, which runs parallel to the
  // slot's walls (not at a gib's taper) and, with the front end open, cuts on
  // its way in since no line is cleared for it yet.
  const bool front_open = ctx.job.dovetail.ends == Ends::FrontOpen;
  // `slant`: the share of the flank's taper the pass runs at (a tapered
  // gib's flank; 1 for the passes that follow the flank, less for the
  // roughing passes that turn from a straight wall toward it);
  // `previous_slant` that of the line `previous_x` lies on.
  const auto add = [&](PassRole role, std::optional<Side> side, double x, double tip, double radial,
                       double stock_left, double feed, double previous_x, double slant = 1,
                       double previous_slant = 1, bool first = false) {
    Pass p;
    p.number = ctx.next_pass++;
    p.tool = cutter.number;
    p.role = role;
    p.side = side;
    p.x = x;
    const double taper = side ? flank_taper_slope(ctx, *side) : 0;
    p.taper_slope = slant * taper;
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
      along = first && front_open ? Along::Forward : direction_for(plus_x, ctx.mode);
      p.mode = mode_of(plus_x, along);
    }
    add_moves(ctx, p, radius, along, {previous_x, previous_slant * taper}, op.feed / 2);
    op.passes.push_back(std::move(p));
  };

  // Roughing, level by level from the top.
  for (double tip : levels.tips) {
    // Where the roughed space ends toward each side at this level: the
    // female's slot wall, the male's shoulder wall.
    double start_x = 0;
    if (ctx.female()) {
      // The first pass also finishes the floor under the slot; cutting one
      // wall, it is the first step toward that flank.
      const FirstPass first = first_female_pass(ctx, tip, step_limit);
      start_x = first.x;
      add(PassRole::Rough, first.side, start_x, tip, first.step,
          first.side ? stock_at_axis(ctx, *first.side, start_x, tip) : 0, op.feed, start_x, 0, 0,
          true);
    }
    for (Side side : {Side::Right, Side::Left}) {
      const bool angled_side = s.flank(side).angled;
      const double sign = side == Side::Right ? 1.0 : -1.0;
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
                start_x + (last_x - start_x) * (i - 1) / n, 0, 0);
          continue;
        }
      } else {
        if (!angled_side) continue;  // the end mill finished the square wall and its shelf
        const double wall = s.flank(side).top.x + sign * ctx.rough_allowance;
        from_x = wall + sign * radius;
        stock_from = stock_at_axis(ctx, side, from_x, tip);
      }
      if (stock_from <= end_stock + 1e-9) continue;
      // Passes that only skim the floor (female: until the cone reaches the
      // slot wall) step up to 0.8 of the radius, straight; engaged passes step
      // at the deflection limit.
      double engage_stock = stock_from;
      if (ctx.female()) {
        const double wall =
            sign > 0 ? s.right.top.x - ctx.rough_allowance : s.left.top.x + ctx.rough_allowance;
        engage_stock = std::min(stock_from, stock_at_axis(ctx, side, wall - sign * radius, tip));
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
          add(PassRole::Rough, side, x, tip, 0, stock, op.feed, previous_x, 0, 0);
          previous_x = x;
        }
      }
      // The engaged passes turn from the straight line the last pass ran on
      // to the line that leaves the finish allowance, which runs at a tapered
      // gib's taper: each runs at its share of the taper, so none cuts more
      // than the step anywhere along the slide (the straight slot or shoulder
      // wall and the tapered flank grow apart toward the back end).
      // The gap to the gib's flank widens toward the back end by the drift.
      const double drift = std::abs(flank_taper_slope(ctx, side)) * ctx.job.dovetail.length;
      const int n =
          std::max(1, static_cast<int>(std::ceil((stock - end_stock + drift) / step_limit - 1e-9)));
      const double step = (stock - end_stock) / n;
      for (int i = 1; i <= n; ++i) {
        const double left = stock - step * i;
        const double x = cutter_axis_x(ctx, side, left, tip);
        add(PassRole::Rough, side, x, tip, step + drift / n, left, op.feed, previous_x,
            static_cast<double>(i) / n, static_cast<double>(i - 1) / n);
        previous_x = x;
      }
    }
  }

  const double final_cut = ctx.last_cut > 0 ? ctx.last_cut : ctx.finish_allowance;
  // A spring pass runs in (front-open, feeding back) on the line before the
  // finish, clear of the flank, so it meets the flank only feeding the way
  // the finish did.
  const auto flank_passes = [&](PassRole role, double stock, double taken, double feed) {
    const double run_in = role == PassRole::Spring ? final_cut : stock + taken;
    for (Side side : angled)
      for (double tip : levels.tips)
        add(role, side, cutter_axis_x(ctx, side, stock, tip), tip, taken, stock, feed,
            cutter_axis_x(ctx, side, run_in, tip));
  };
  // The finishing cuts are light by design; one the roughing step would not
  // allow is refused rather than warned of.
  const double semi_cut = ctx.finish_allowance - ctx.last_cut;
  for (double cut : {semi_cut, final_cut}) {
    const double bend =
        predict_deflection(cutter, ctx.material,
                           {.radial_step = cut,
                            .axial_length = levels.engaged,
                            .feed_per_tooth = op.finish_feed / (cutter.flutes * op.rpm)})
            .deflection;
    if (cut > 0.1 * cutter.diameter * (1 + 1e-9) || bend > ctx.rough_deflection_limit * (1 + 1e-9))
      throw InputError(
          fmt::format(
              "the finish allowance {} leaves the dovetail cutter T{} a finishing cut of {} "
              "(predicted bend {}), more than a tenth of its diameter or a bend of {}; give "
              "a smaller [strategy] finish_allowance",
              ctx.show(ctx.finish_allowance), cutter.number, ctx.show(cut), ctx.show(bend),
              ctx.show(ctx.rough_deflection_limit)),
          {ctx.job.source}, "strategy.finish_allowance");
  }
  if (ctx.last_cut > 0) flank_passes(PassRole::SemiFinish, ctx.last_cut, semi_cut, op.finish_feed);
  flank_passes(PassRole::Finish, 0, final_cut, op.finish_feed);
  if (ctx.job.strategy.spring_pass) flank_passes(PassRole::Spring, 0, 0, op.finish_feed);
  return op;
}

}  // namespace dovetailor::detail
