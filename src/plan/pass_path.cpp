#include <fmt/format.h>

#include <dovetailor/base/length.hpp>

#include "planner_detail.hpp"

namespace dovetailor::detail {

std::string PlanContext::show(double mm) const { return fmt::format("{}", shown(mm, units())); }

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
               AxisLine previous, double plunge_feed) {
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
  const AxisLine own{pass.x, pass.taper_slope};
  const auto at = [&](AxisLine line, double y, double z) {
    return Point3{line.x + line.slope * y, y, z};
  };
  const auto rapid = [](std::vector<Move>& part, Point3 p) {
    part.push_back({MoveKind::Rapid, p, 0});
  };
  const auto feed = [](std::vector<Move>& part, Point3 p, double f) {
    part.push_back({MoveKind::Feed, p, f});
  };
  // Down outside the stock: rapid to the approach height, feed to depth.
  const auto descend = [&](Point3 above) {
    rapid(pass.entry, {above.x, above.y, ctx.safe_z});
    rapid(pass.entry, {above.x, above.y, ctx.near_z});
    feed(pass.entry, {above.x, above.y, pass.z}, plunge_feed);
  };
  const bool dovetail = pass.tool == ctx.cutter.number;

  if (!front_open) {
    const double start = along == Along::Forward ? outside_front : far;
    const double end = along == Along::Forward ? far : outside_front;
    descend(at(own, start, pass.z));
    feed(pass.cut, at(own, end, pass.z), pass.feed);
    rapid(pass.exit, at(own, end, ctx.safe_z));
    return;
  }
  // Front-open: in from the front end. A cut feeding +Y is taken on the way
  // in; the end mill then leaves upward at the closed end, the dovetail
  // cutter (which may never rise inside the slot) comes back on its line. A
  // cut feeding -Y runs in on the cleared line, steps over at the closed end
  // and is taken on the way out.
  if (along == Along::Forward) {
    descend(at(own, outside_front, pass.z));
    feed(pass.cut, at(own, far, pass.z), pass.feed);
    if (!dovetail) {
      feed(pass.exit, at(own, far, ctx.near_z), plunge_feed);
    } else {
      feed(pass.exit, at(own, outside_front, pass.z), pass.feed);
    }
    rapid(pass.exit, at(own, dovetail ? outside_front : far, ctx.safe_z));
    return;
  }
  descend(at(previous, outside_front, pass.z));
  feed(pass.entry, at(previous, far, pass.z), pass.feed);
  feed(pass.entry, at(own, far, pass.z), plunge_feed);
  feed(pass.cut, at(own, outside_front, pass.z), pass.feed);
  rapid(pass.exit, at(own, outside_front, ctx.safe_z));
}

}  // namespace dovetailor::detail
