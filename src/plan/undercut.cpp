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

// The roughed slot at one tip height, as the dovetail cutter's first pass
// meets it: the vertical walls the end mill left and where the cutter's axis
// may run.
struct RoughedSlot {
  const DovetailSection& target;
  double radius = 0;     // the cutter's large radius
  double left_wall = 0;  // x of the roughed walls
  double right_wall = 0;
  double lo = 0, hi = 0;  // the axis kept off a square wall and short of each flank's roughing
  double clear_lo = 0, clear_hi = 0;  // where the cone reaches neither wall (empty if lo > hi)

  double width() const { return right_wall - left_wall; }
  double middle() const { return (left_wall + right_wall) / 2; }
  // The pass with the axis at `x`: which walls it cuts and how deep.
  FirstPass pass_at(double x) const {
    const double cut_left = target.left.angled ? std::max(0.0, left_wall - (x - radius)) : 0.0;
    const double cut_right = target.right.angled ? std::max(0.0, x + radius - right_wall) : 0.0;
    FirstPass p{.x = x, .step = std::max(cut_left, cut_right)};
    const bool l = cut_left > 1e-9, r = cut_right > 1e-9;
    p.both = l && r;
    if (l != r) p.side = l ? Side::Left : Side::Right;
    return p;
  }
};

RoughedSlot roughed_slot(const PlanContext& ctx, double tip) {
  const auto& s = ctx.target;
  RoughedSlot slot{.target = s, .radius = ctx.cutter.diameter / 2};
  slot.left_wall = s.left.top.x + ctx.rough_allowance;
  slot.right_wall = s.right.top.x - ctx.rough_allowance;
  // Keep the pass off a square wall and short of each flank's roughing position.
  const auto limit = [&](Side side) {
    const Flank& f = s.flank(side);
    const double sign = side == Side::Right ? 1.0 : -1.0;
    return f.angled ? cutter_axis_x(ctx, side, ctx.finish_allowance, tip)
                    : f.base.x - sign * (slot.radius + ctx.clearance / 10);
  };
  slot.lo = std::min(limit(Side::Left), limit(Side::Right));
  slot.hi = std::max(limit(Side::Left), limit(Side::Right));
  slot.clear_lo = std::max(slot.lo, s.left.angled ? slot.left_wall + slot.radius : slot.lo);
  slot.clear_hi = std::min(slot.hi, s.right.angled ? slot.right_wall - slot.radius : slot.hi);
  return slot;
}

[[noreturn]] void refuse_climbing_first_pass(const PlanContext& ctx, const RoughedSlot& slot) {
  const Tool& cutter = ctx.cutter;
  throw InputError(
      fmt::format("the roughed slot is {} wide and the dovetail cutter T{} {}: its first pass "
                  "down the slot cuts the right wall, and with the front end open it cuts on "
                  "its way in (+Y), which is climb milling; a manual machine must mill "
                  "conventionally. Use a dovetail cutter no larger than the slot, or leave "
                  "the front and back ends open",
                  ctx.show(slot.width()), cutter.number, ctx.show(cutter.diameter)),
      {ctx.job.source}, fmt::format("tool[T{}].diameter", cutter.number));
}

[[noreturn]] void refuse_heavy_first_pass(const PlanContext& ctx, const RoughedSlot& slot,
                                          const FirstPass& pick, double step_limit) {
  const Tool& cutter = ctx.cutter;
  const bool manual = ctx.job.machine.kind == MachineKind::Manual;
  // The cut grows with the diameter: by half of it on each wall when the
  // cutter runs in the middle, by all of it when it cuts one wall.
  const double largest = cutter.diameter - (pick.both ? 2 : 1) * (pick.step - step_limit);
  throw InputError(
      fmt::format("the roughed slot is {} wide (the mouth {} less {} per side) and the dovetail "
                  "cutter T{} {}: its first pass down the slot would cut {} into {}, more than "
                  "the {} radial step its bend limit and a tenth of its diameter allow{}. Use a "
                  "dovetail cutter of about {} or less, or leave less rough allowance "
                  "([strategy] rough_allowance)",
                  ctx.show(slot.width()), ctx.show(ctx.target.width_top()),
                  ctx.show(ctx.rough_allowance), cutter.number, ctx.show(cutter.diameter),
                  ctx.show(pick.step), pick.both ? "each wall" : "the wall", ctx.show(step_limit),
                  manual ? " (a manual machine cuts one wall at a time, conventionally)" : "",
                  ctx.show(largest)),
      {ctx.job.source}, fmt::format("tool[T{}].diameter", cutter.number));
}

// On a manual machine: the lighter of the passes that cut one wall only, on
// the side a conventional cut can take (with the front end open, the left).
FirstPass conventional_first_pass(const PlanContext& ctx, const RoughedSlot& slot) {
  const bool front_open = ctx.job.dovetail.ends == Ends::FrontOpen;
  std::optional<FirstPass> one_wall;
  for (double x : {slot.clear_hi, slot.clear_lo}) {
    const FirstPass p = slot.pass_at(std::clamp(x, slot.lo, slot.hi));
    if (!p.side || (front_open && *p.side != Side::Left)) continue;
    if (!one_wall || p.step < one_wall->step) one_wall = p;
  }
  if (!one_wall) refuse_climbing_first_pass(ctx, slot);
  return *one_wall;
}

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
  const RoughedSlot slot = roughed_slot(ctx, tip);
  if (slot.clear_lo <= slot.clear_hi + 1e-12)
    return slot.pass_at(std::clamp(slot.middle(), slot.clear_lo, slot.clear_hi));
  const FirstPass pick = ctx.job.machine.kind == MachineKind::Manual
                             ? conventional_first_pass(ctx, slot)
                             : slot.pass_at(std::clamp(slot.middle(), slot.lo, slot.hi));
  if (pick.step > step_limit * (1 + 1e-9)) refuse_heavy_first_pass(ctx, slot, pick, step_limit);
  return pick;
}

// The largest radial step of the dovetail cutter's roughing passes: what its
// bend limit allows at the roughing chip load, at most a tenth of its
// diameter. Refused when even a very light step bends it too far.
double roughing_step_limit(const PlanContext& ctx, const Levels& levels) {
  const Tool& cutter = ctx.cutter;
  const double radius = cutter.diameter / 2;
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
  return step_limit;
}

// The operation's speeds and feeds and how the cutter enters, no passes yet.
Operation start_undercut(PlanContext& ctx, double step_limit) {
  const Tool& cutter = ctx.cutter;
  Operation op;
  op.kind = OperationKind::Undercut;
  op.tool = cutter.number;
  const CuttingData rough =
      cutting_data(cutter, ctx.material, ctx.job.machine, {.radial_step = step_limit});
  for (const auto& w : rough.warnings) ctx.warnings.push_back(CuttingDataWarning{cutter.number, w});
  // Finishing: half the roughing chip load for the surface (common practice).
  const CuttingData finish =
      cutting_data(cutter, ctx.material, ctx.job.machine,
                   {.radial_step = std::max(ctx.last_cut, ctx.finish_allowance)});
  op.rpm = rough.rpm;
  op.feed = rough.feed;
  op.finish_feed = std::min(rough.feed, finish.feed) * 0.5;
  return op;
}

// The finishing cuts are light by design; one the roughing step would not
// allow is refused rather than warned of.
void refuse_heavy_finishing_cuts(const PlanContext& ctx, const Operation& op,
                                 const Levels& levels) {
  const Tool& cutter = ctx.cutter;
  const double final_cut = ctx.last_cut > 0 ? ctx.last_cut : ctx.finish_allowance;
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
}

// Adds the dovetail cutter's passes to its operation, level by level.
class UndercutPasses {
 public:
  UndercutPasses(PlanContext& ctx, Operation& op, const Levels& levels, double step_limit)
      : ctx_(ctx), op_(op), levels_(levels), step_limit_(step_limit) {}

  // Roughing at the level with the tip `tip` above the base plane: a
  // female's first pass down the slot, then toward each flank.
  void rough_level(double tip) {
    // Where the roughed space ends toward each side at this level: the
    // female's slot wall, the male's shoulder wall.
    double start_x = 0;
    if (ctx_.female()) {
      // The first pass also finishes the floor under the slot; cutting one
      // wall, it is the first step toward that flank.
      const FirstPass first = first_female_pass(ctx_, tip, step_limit_);
      start_x = first.x;
      add(PassRole::Rough, first.side, start_x, tip, first.step,
          first.side ? stock_at_axis(ctx_, *first.side, start_x, tip) : 0, op_.feed, start_x, 0, 0,
          true);
    }
    for (Side side : {Side::Right, Side::Left}) rough_toward(side, tip, start_x);
  }

  // The semi-finish, finish or spring passes on every angled flank and level.
  // A spring pass runs in (front-open, feeding back) on the line before the
  // finish, clear of the flank, so it meets the flank only feeding the way
  // the finish did.
  void flank_passes(PassRole role, double stock, double taken, double feed) {
    const double final_cut = ctx_.last_cut > 0 ? ctx_.last_cut : ctx_.finish_allowance;
    const double run_in = role == PassRole::Spring ? final_cut : stock + taken;
    for (Side side : {Side::Right, Side::Left}) {
      if (!ctx_.target.flank(side).angled) continue;
      for (double tip : levels_.tips)
        add(role, side, cutter_axis_x(ctx_, side, stock, tip), tip, taken, stock, feed,
            cutter_axis_x(ctx_, side, run_in, tip));
    }
  }

 private:
  // Roughing toward `side` from the axis `start_x` of the pass before (a
  // female's first pass; 0 on a male, which starts at its shoulder wall).
  void rough_toward(Side side, double tip, double start_x) {
    const auto& s = ctx_.target;
    const double radius = ctx_.cutter.diameter / 2;
    const double sign = side == Side::Right ? 1.0 : -1.0;
    double from_x = start_x;
    double stock_from = 0;
    if (ctx_.female()) {
      if (!s.flank(side).angled) {
        if (tip <= 0) sweep_floor_to_square_wall(side, tip, start_x);
        return;
      }
      stock_from = stock_at_axis(ctx_, side, start_x, tip);
    } else {
      if (!s.flank(side).angled) return;  // the end mill finished the square wall and its shelf
      const double wall = s.flank(side).top.x + sign * ctx_.rough_allowance;
      from_x = wall + sign * radius;
      stock_from = stock_at_axis(ctx_, side, from_x, tip);
    }
    if (stock_from <= ctx_.finish_allowance + 1e-9) return;
    const Reached skimmed = skim_the_floor(side, tip, from_x, stock_from);
    step_into_the_flank(side, tip, skimmed);
  }

  // Where a run of passes left off: the stock left on the flank and the
  // axis of the last pass.
  struct Reached {
    double stock = 0;
    double x = 0;
  };

  // Passes that only skim the floor (female: until the cone reaches the slot
  // wall) step up to 0.8 of the radius, straight.
  Reached skim_the_floor(Side side, double tip, double from_x, double stock_from) {
    const auto& s = ctx_.target;
    const double radius = ctx_.cutter.diameter / 2;
    const double sign = side == Side::Right ? 1.0 : -1.0;
    double engage_stock = stock_from;
    if (ctx_.female()) {
      const double wall =
          sign > 0 ? s.right.top.x - ctx_.rough_allowance : s.left.top.x + ctx_.rough_allowance;
      engage_stock = std::min(stock_from, stock_at_axis(ctx_, side, wall - sign * radius, tip));
    }
    engage_stock = std::max(engage_stock, ctx_.finish_allowance);
    Reached at{stock_from, from_x};
    if (stock_from - engage_stock <= 1e-9) return at;
    const int n = static_cast<int>(std::ceil((stock_from - engage_stock) / (0.8 * radius) - 1e-9));
    for (int i = 1; i <= n; ++i) {
      at.stock = stock_from - (stock_from - engage_stock) * i / n;
      const double x = cutter_axis_x(ctx_, side, at.stock, tip);
      add(PassRole::Rough, side, x, tip, 0, at.stock, op_.feed, at.x, 0, 0);
      at.x = x;
    }
    return at;
  }

  // The engaged passes, at the deflection limit, turn from the straight line
  // the last pass ran on to the line that leaves the finish allowance, which
  // runs at a tapered gib's taper: each runs at its share of the taper, so
  // none cuts more than the step anywhere along the slide (the straight slot
  // or shoulder wall and the tapered flank grow apart toward the back end).
  void step_into_the_flank(Side side, double tip, Reached from) {
    const double end_stock = ctx_.finish_allowance;
    // The gap to the gib's flank widens toward the back end by the drift.
    const double drift = std::abs(flank_taper_slope(ctx_, side)) * ctx_.job.dovetail.length;
    const int n = std::max(
        1, static_cast<int>(std::ceil((from.stock - end_stock + drift) / step_limit_ - 1e-9)));
    const double step = (from.stock - end_stock) / n;
    double previous_x = from.x;
    for (int i = 1; i <= n; ++i) {
      const double left = from.stock - step * i;
      const double x = cutter_axis_x(ctx_, side, left, tip);
      add(PassRole::Rough, side, x, tip, step + drift / n, left, op_.feed, previous_x,
          static_cast<double>(i) / n, static_cast<double>(i - 1) / n);
      previous_x = x;
    }
  }

  // Sweeps the floor toward a female's square wall, stopping short of it.
  void sweep_floor_to_square_wall(Side side, double tip, double start_x) {
    const double radius = ctx_.cutter.diameter / 2;
    const double sign = side == Side::Right ? 1.0 : -1.0;
    const double wall = ctx_.target.flank(side).base.x;
    const double last_x = wall - sign * (radius + ctx_.clearance / 10);
    const double span = std::abs(last_x - start_x);
    const int n = static_cast<int>(std::ceil(span / step_limit_ - 1e-9));
    for (int i = 1; i <= n; ++i)
      add(PassRole::Rough, side, start_x + (last_x - start_x) * i / n, tip, 0,
          std::abs(wall - (start_x + (last_x - start_x) * i / n + sign * radius)), op_.feed,
          start_x + (last_x - start_x) * (i - 1) / n, 0, 0);
  }

  // One pass of the cutter at `x`, the tip `tip` above the base plane.
  // `first`: the first pass down a female's slot, which runs parallel to the
  // slot's walls (not at a gib's taper) and, with the front end open, cuts on
  // its way in since no line is cleared for it yet. `slant`: the share of
  // the flank's taper the pass runs at (a tapered gib's flank; 1 for the
  // passes that follow the flank, less for the roughing passes that turn
  // from a straight wall toward it); `previous_slant` that of the line
  // `previous_x` lies on.
  void add(PassRole role, std::optional<Side> side, double x, double tip, double radial,
           double stock_left, double feed, double previous_x, double slant = 1,
           double previous_slant = 1, bool first = false) {
    const Tool& cutter = ctx_.cutter;
    Pass p;
    p.number = ctx_.next_pass++;
    p.tool = cutter.number;
    p.role = role;
    p.side = side;
    p.x = x;
    const double taper = side ? flank_taper_slope(ctx_, *side) : 0;
    p.taper_slope = slant * taper;
    p.z = -ctx_.target.depth + tip;
    p.radial_step = radial;
    p.axial_depth = levels_.engaged;
    p.stock_left = stock_left;
    p.feed = feed;
    p.rpm = op_.rpm;
    const double fz_pass = feed / (cutter.flutes * op_.rpm);
    p.deflection = radial > 0 ? predict_deflection(cutter, ctx_.material,
                                                   {.radial_step = radial,
                                                    .axial_length = levels_.engaged,
                                                    .feed_per_tooth = fz_pass})
                                    .deflection
                              : 0;
    Along along = Along::Forward;
    if (side) {
      const bool plus_x = engages_plus_x(ctx_, *side);
      const bool front_open = ctx_.job.dovetail.ends == Ends::FrontOpen;
      along = first && front_open ? Along::Forward : direction_for(plus_x, ctx_.mode);
      p.mode = mode_of(plus_x, along);
    }
    add_moves(ctx_, p, cutter.diameter / 2, along, {previous_x, previous_slant * taper},
              op_.feed / 2);
    op_.passes.push_back(std::move(p));
  }

  PlanContext& ctx_;
  Operation& op_;
  const Levels& levels_;
  double step_limit_ = 0;
};

}  // namespace

Operation undercut_operation(PlanContext& ctx) {
  const Levels levels = levels_for(ctx);
  const double step_limit = roughing_step_limit(ctx, levels);
  Operation op = start_undercut(ctx, step_limit);
  UndercutPasses passes(ctx, op, levels, step_limit);
  // Roughing, level by level from the top.
  for (double tip : levels.tips) passes.rough_level(tip);
  refuse_heavy_finishing_cuts(ctx, op, levels);
  const double final_cut = ctx.last_cut > 0 ? ctx.last_cut : ctx.finish_allowance;
  const double semi_cut = ctx.finish_allowance - ctx.last_cut;
  if (ctx.last_cut > 0)
    passes.flank_passes(PassRole::SemiFinish, ctx.last_cut, semi_cut, op.finish_feed);
  passes.flank_passes(PassRole::Finish, 0, final_cut, op.finish_feed);
  if (ctx.job.strategy.spring_pass) passes.flank_passes(PassRole::Spring, 0, 0, op.finish_feed);
  return op;
}

}  // namespace dovetailor::detail
