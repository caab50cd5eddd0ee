#include <algorithm>
#include <cmath>

#include <dovetailor/shop/cutting_data.hpp>

#include "planner_detail.hpp"

namespace dovetailor::detail {
namespace {

// Axial depth per level for an end mill, as a fraction of its diameter:
// full in soft materials (aluminium, brass, plastics: Kienzle kc1.1 under
// 1000 N/mm^2), half in steels and iron. Common practice, from memory.
double axial_step(const PlanContext& ctx, const Tool& tool) {
  const double fraction = ctx.material.kc11 < 1000 ? 1.0 : 0.5;
  return std::min(fraction * tool.diameter, 0.9 * tool.flute_length);
}

// Radial stepover of an end mill across a wide area: 40 % of its diameter
// (common practice, no source).
constexpr double stepover_fraction = 0.4;

// Evenly spaced levels from the top down to `bottom` (negative), none deeper
// than `step`.
std::vector<double> levels_down_to(double bottom, double step) {
  const int n = std::max(1, static_cast<int>(std::ceil(-bottom / step - 1e-9)));
  std::vector<double> z;
  for (int i = 1; i <= n; ++i) z.push_back(bottom * i / n);
  return z;
}

// `count` positions from `first` to `last` inclusive, evenly spaced.
std::vector<double> spaced(double first, double last, double max_step) {
  const int n = std::max(1, static_cast<int>(std::ceil(std::abs(last - first) / max_step - 1e-9)));
  std::vector<double> x;
  for (int i = 0; i <= n; ++i) x.push_back(first + (last - first) * i / n);
  return x;
}

Operation start_operation(const PlanContext& ctx, OperationKind kind, double radial_step) {
  const Tool& tool = ctx.end_mill;
  const CuttingData data =
      cutting_data(tool, ctx.material, ctx.job.machine, {.radial_step = radial_step});
  for (const auto& w : data.warnings) ctx.warnings.push_back(CuttingDataWarning{tool.number, w});
  Operation op;
  op.kind = kind;
  op.tool = tool.number;
  op.rpm = data.rpm;
  op.feed = data.feed;
  op.finish_feed = data.feed;
  return op;
}

// `previous_x`: the line the last pass at this level ran on (see add_moves).
Pass make_pass(PlanContext& ctx, const Operation& op, std::optional<Side> side, double x, double z,
               double radial, double stock_left, Along along, bool plus_x, double previous_x) {
  Pass p;
  p.number = ctx.next_pass++;
  p.tool = op.tool;
  p.role = PassRole::Rough;
  p.side = side;
  p.x = x;
  p.z = z;
  p.radial_step = radial;
  p.axial_depth = 0;
  p.stock_left = stock_left;
  p.feed = op.feed;
  p.rpm = op.rpm;
  p.mode = side ? mode_of(plus_x, along) : MillingMode::Both;
  add_moves(ctx, p, ctx.end_mill.diameter / 2, along, {previous_x, 0}, op.feed / 2);
  return p;
}

Operation rough_slot(PlanContext& ctx) {
  const auto& s = ctx.target;
  const double r = ctx.end_mill.diameter / 2;
  const double left_wall = s.left.top.x + ctx.rough_allowance;
  const double right_wall = s.right.top.x - ctx.rough_allowance;
  const double lateral = std::max(0.0, (right_wall - left_wall) / 2 - r);
  const double middle = (left_wall + right_wall) / 2;
  Operation op = start_operation(ctx, OperationKind::RoughSlot, 0);
  std::vector<double> xs = {middle};
  if (lateral > 1e-9) {
    for (double d : spaced(0, lateral, stepover_fraction * ctx.end_mill.diameter)) {
      if (d <= 0) continue;
      xs.push_back(middle + d);
      xs.push_back(middle - d);
    }
  }
  double previous = 0;
  for (double z : levels_down_to(-s.depth + ctx.floor_allowance, axial_step(ctx, ctx.end_mill))) {
    double last_left = middle, last_right = middle;  // lines cleared at this level
    for (double x : xs) {
      const std::optional<Side> side =
          x > middle + 1e-9 ? std::optional(Side::Right)
                            : (x < middle - 1e-9 ? std::optional(Side::Left) : std::nullopt);
      const bool plus_x = side == Side::Right;
      const Along along = side ? direction_for(plus_x, ctx.mode) : Along::Forward;
      const double wall_stock = side == Side::Right ? right_wall + ctx.rough_allowance - (x + r)
                                                    : (x - r) - (left_wall - ctx.rough_allowance);
      double& last = side == Side::Left ? last_left : last_right;
      Pass p = make_pass(ctx, op, side, x, z, side ? std::abs(x - middle) : 2 * r, wall_stock,
                         along, plus_x, last);
      last = x;
      p.axial_depth = z - previous;
      op.passes.push_back(std::move(p));
    }
    previous = z;
  }
  for (auto& p : op.passes) p.axial_depth = std::abs(p.axial_depth);
  return op;
}

Operation rough_shoulders(PlanContext& ctx) {
  const auto& s = ctx.target;
  const double r = ctx.end_mill.diameter / 2;
  Operation op = start_operation(ctx, OperationKind::RoughShoulders,
                                 stepover_fraction * ctx.end_mill.diameter);
  const double stock_left = -ctx.job.dovetail.center - ctx.job.stock.width / 2;
  const double stock_right = -ctx.job.dovetail.center + ctx.job.stock.width / 2;
  const auto levels = levels_down_to(-s.depth, axial_step(ctx, ctx.end_mill));
  for (Side side : {Side::Right, Side::Left}) {
    const bool right = side == Side::Right;
    const double wall =
        right ? s.right.top.x + ctx.rough_allowance : s.left.top.x - ctx.rough_allowance;
    const double edge = right ? stock_right : stock_left;
    const double last = right ? wall + r : wall - r;  // axis at the finished roughing wall
    const double reach = std::abs(edge - wall);       // shoulder width to clear
    if (reach <= 1e-9) continue;
    const double step = stepover_fraction * ctx.end_mill.diameter;
    // The first pass takes one stepover off the stock edge, the last runs on
    // the roughing wall; evenly spaced between.
    const double first = right ? edge + r - step : edge - r + step;
    const double span = right ? first - last : last - first;
    if (span < -1e-9) continue;
    const int n = std::max(0, static_cast<int>(std::ceil(span / step - 1e-9)));
    const double spacing = n > 0 ? span / n : 0;
    const bool plus_x = !right;  // the material lies toward the tongue
    const Along along = direction_for(plus_x, ctx.mode);
    double previous = 0;
    for (double z : levels) {
      double line = right ? edge + r + ctx.clearance : edge - r - ctx.clearance;  // outside
      for (int i = n; i >= 0; --i) {
        const double x = last + (right ? 1 : -1) * spacing * i;
        const double radial = i == n ? std::min(step, reach) : spacing;
        const double left_on_wall = (right ? x - r - wall : wall - (x + r)) + ctx.rough_allowance;
        Pass p = make_pass(ctx, op, side, x, z, radial, left_on_wall, along, plus_x, line);
        line = x;
        p.axial_depth = previous - z;
        op.passes.push_back(std::move(p));
      }
      previous = z;
    }
  }
  return op;
}

// A square flank (half dovetail) is finished by the end mill's side at full depth.
std::optional<Operation> finish_square_wall(PlanContext& ctx) {
  const auto& s = ctx.target;
  std::optional<Side> square;
  if (!s.left.angled) square = Side::Left;
  if (!s.right.angled) square = Side::Right;
  if (!square) return std::nullopt;
  const double r = ctx.end_mill.diameter / 2;
  const bool right = square == Side::Right;
  const Flank& wall = s.flank(*square);
  // Female: the wall is outboard of the tool; male: inboard.
  const bool tool_inside = ctx.female();
  const double x = tool_inside ? (right ? wall.base.x - r : wall.base.x + r)
                               : (right ? wall.base.x + r : wall.base.x - r);
  Operation op = start_operation(ctx, OperationKind::FinishSquareWall, ctx.rough_allowance);
  const bool plus_x = tool_inside == right;
  const Along along = direction_for(plus_x, ctx.mode);
  // The roughing ran on the line the rough allowance away from the wall.
  const double rough_line = x + (plus_x ? -1 : 1) * ctx.rough_allowance;
  for (double z : levels_down_to(-s.depth, axial_step(ctx, ctx.end_mill))) {
    Pass p = make_pass(ctx, op, square, x, z, ctx.rough_allowance, 0, along, plus_x, rough_line);
    p.role = PassRole::Finish;
    p.axial_depth = s.depth;
    op.passes.push_back(std::move(p));
  }
  return op;
}

}  // namespace

std::vector<Operation> rough_operations(PlanContext& ctx) {
  std::vector<Operation> ops;
  ops.push_back(ctx.female() ? rough_slot(ctx) : rough_shoulders(ctx));
  if (auto wall = finish_square_wall(ctx)) ops.push_back(std::move(*wall));
  return ops;
}

}  // namespace dovetailor::detail
