#include <fmt/format.h>

#include <dovetailor/length_text.hpp>

#include "planner_detail.hpp"

namespace dovetailor::detail {

std::string PlanContext::show(double mm) const { return length_text(mm, units()); }

bool engages_plus_x(const PlanContext& ctx, Side side) {
  // A female's flank is outboard of the cutter; a male's flank (and the
  // tongue) is inboard of it.
  const bool right = side == Side::Right;
  return ctx.female() ? right : !right;
}

Along direction_for(bool plus_x_engaged, MillingMode mode) {
  const bool climb = mode == MillingMode::Climb;
  return plus_x_engaged == climb ? Along::Forward : Along::Back;
}

MillingMode mode_of(bool plus_x_engaged, Along along) {
  return (along == Along::Forward) == plus_x_engaged ? MillingMode::Climb
                                                     : MillingMode::Conventional;
}

void add_moves(const PlanContext& ctx, Pass& pass, double tool_radius, Along along,
               double previous_x, double plunge_feed) {
  if (pass.number > max_passes)
    throw InputError(
        fmt::format("this job would need more than {} passes: check the sizes and units (a "
                    "stock or depth far larger than the tools, or tools far too small)",
                    max_passes),
        {ctx.job.source}, "stock.size");
  const double length = ctx.job.dovetail.length;
  const double outside_front = -(tool_radius + ctx.clearance);
  const bool front_open = ctx.job.dovetail.ends == Ends::FrontOpen;
  const double far = front_open ? length - tool_radius : length + tool_radius + ctx.clearance;
  const auto at = [&](double x_at_zero, double y, double z) {
    return Point3{x_at_zero + pass.taper_slope * y, y, z};
  };
  auto& m = pass.moves;
  const auto rapid = [&](Point3 p) { m.push_back({MoveKind::Rapid, p, 0}); };
  const auto feed = [&](Point3 p, double f) { m.push_back({MoveKind::Feed, p, f}); };
  const bool dovetail = pass.tool == ctx.cutter.number;

  if (!front_open) {
    const double start = along == Along::Forward ? outside_front : far;
    const double end = along == Along::Forward ? far : outside_front;
    rapid(at(pass.x, start, ctx.safe_z));
    rapid(at(pass.x, start, ctx.near_z));
    feed(at(pass.x, start, pass.z), plunge_feed);
    feed(at(pass.x, end, pass.z), pass.feed);
    rapid(at(pass.x, end, ctx.safe_z));
    return;
  }
  // Front-open: in from the front end, and out the same way; the dovetail
  // cutter may never rise inside the slot.
  const bool cut_going_in = along == Along::Forward || !dovetail;
  const double in_x = cut_going_in ? pass.x : previous_x;
  rapid(at(in_x, outside_front, ctx.safe_z));
  rapid(at(in_x, outside_front, ctx.near_z));
  feed(at(in_x, outside_front, pass.z), plunge_feed);
  feed(at(in_x, far, pass.z), pass.feed);
  if (!dovetail) {
    feed(at(in_x, far, ctx.near_z), plunge_feed);
    rapid(at(in_x, far, ctx.safe_z));
    return;
  }
  if (!cut_going_in) feed(at(pass.x, far, pass.z), plunge_feed);
  feed(at(pass.x, outside_front, pass.z), pass.feed);
  rapid(at(pass.x, outside_front, ctx.safe_z));
}

}  // namespace dovetailor::detail
