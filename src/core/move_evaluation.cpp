#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include "check_detail.hpp"

namespace dovetailor::detail {
namespace {

Finding finding(FindingKind kind, Severity severity, double amount, double limit,
                std::string text) {
  return {.kind = kind,
          .severity = severity,
          .amount = amount,
          .limit = limit,
          .text = std::move(text)};
}

// The widest lateral cut on either side of the axis: rows through the removed
// area between `low` and `high`. The bottom face takes floor skins (axial
// engagement, not radial), so rows in the lowest quarter of the flutes and
// rows that reach across the axis are left out.
double radial_engagement(const SectionRegion& removed, const Bounds2& b, double axis, double low,
                         double high) {
  constexpr int rows = 16;
  double widest = 0;
  low = std::max(low, b.z_min);
  high = std::min(high, b.z_max);
  if (high <= low) return 0;
  for (int i = 0; i < rows; ++i) {
    const double z = low + (high - low) * (i + 0.5) / rows;
    const auto spans = removed.row(z);
    bool across = false;
    double left = 0, right = 0;
    for (const Span& s : spans) {
      if (s.low < axis && s.high > axis) across = true;
      left += std::max(0.0, std::min(s.high, axis) - s.low);
      right += std::max(0.0, s.high - std::max(s.low, axis));
    }
    if (!across) widest = std::max({widest, left, right});
  }
  return widest;
}

// How thick a cut the flutes take at their top: the removed material's width
// in the row just below the top of the flutes, turned square to the cutting
// edge there (times sin a for a dovetail cutter's cone; an end mill's side is
// upright).
double cut_at_flute_top(const SectionRegion& removed, double flute_top, const SimTool& tool) {
  const double probe = flute_top - 2e-3;  // 2 um below the top: inside the chord profile
  double width = 0;
  for (const Span& s : removed.row(probe)) width += s.high - s.low;
  return tool.dovetail ? width * std::sin(radians(tool.tool.angle)) : width;
}

}  // namespace

Outcome evaluate_move(const Material& material, const StationTarget& target,
                      const StationSweep& sweep, const MoveFacts& facts, const SimTool& tool,
                      Units units) {
  Outcome out;
  if (!sweep.bounds || !material.bounds || !overlaps(*sweep.bounds, *material.bounds)) return out;
  const auto show = [units](double mm) { return show_length(mm, units); };
  const SectionRegion* now = &material.region;

  if (!sweep.flutes.empty()) {
    const SectionRegion removed = intersect(material.region, sweep.flutes);
    const double area = removed.area();
    if (area > least_area) {
      auto after = std::make_shared<Material>();
      after->region = subtract(material.region, sweep.flutes);
      after->bounds = after->region.bounds();
      now = &after->region;
      const auto rb = *removed.bounds();
      const double deep = rb.z_max - rb.z_min;
      if (facts.kind == MotionKind::Rapid) {
        out.findings.push_back(finding(
            FindingKind::RapidThroughMaterial, Severity::Error, deep, 0,
            fmt::format(
                "rapid move meets material: {} of it in the tool's path, {} high",
                fmt::format("{:.4g} {}^2", area / std::pow(to_mm(1, units), 2), unit_symbol(units)),
                show(deep))));
      } else if (!facts.spindle_on) {
        out.findings.push_back(finding(
            FindingKind::SpindleStopped, Severity::Error, deep, 0,
            fmt::format("feed move into material with the spindle stopped ({} high)", show(deep))));
      }
      if (tool.dovetail && facts.plunging) {
        out.findings.push_back(
            finding(FindingKind::Plunge, Severity::Error, deep, 0,
                    fmt::format("dovetail cutter T{} moves down into material ({} of material); it "
                                "has no end-cutting centre and breaks",
                                tool.number, show(deep))));
      }
      if (tool.radial_limit > 0 && facts.along_y && facts.kind != MotionKind::Rapid) {
        const double fl = tool.tool.flute_length;
        const double ae =
            radial_engagement(removed, rb, facts.axis_x, facts.tip_z + 0.25 * fl, facts.tip_z + fl);
        if (ae > tool.radial_limit * 1.02 + 0.005) {
          out.findings.push_back(finding(
              FindingKind::RadialEngagement, Severity::Warning, ae, tool.radial_limit,
              fmt::format("dovetail cutter T{} takes a radial cut of {}; the planner's limit "
                          "for it is {}",
                          tool.number, show(ae), show(tool.radial_limit))));
        }
      }
      // Engaged at their top: a cut there thicker than the tolerance's
      // allowance. A thinner layer is the finished surface as the checker
      // judges it everywhere (neither gouge nor stock left): flutes meeting
      // a surface the level above has finished, by the rounding of the
      // program's positions at the joint of two levels, rub it; they do not
      // cut a chip at their top.
      const double flute_top = facts.tip_z + tool.tool.flute_length;
      if (rb.z_max >= flute_top - 1e-3 && !sweep.column.empty() &&
          cut_at_flute_top(removed, flute_top, tool) > target.allowance) {
        const SectionRegion buried = intersect(after->region, sweep.column);
        if (buried.area() > least_area) {
          const double above = buried.bounds()->z_max - flute_top;
          out.findings.push_back(
              finding(FindingKind::DepthOfCut, Severity::Error, above, tool.tool.flute_length,
                      fmt::format("T{} cuts deeper than its flutes are long ({}): material runs {} "
                                  "above the top of the flutes",
                                  tool.number, show(tool.tool.flute_length), show(above))));
        }
      }
      const SectionRegion gouge = intersect(removed, target.forbidden);
      if (gouge.area() > least_area) {
        const double depth = thickness_of(gouge) + target.allowance;
        const auto gb = *gouge.bounds();
        out.findings.push_back(
            finding(FindingKind::Gouge, Severity::Error, depth, target.allowance,
                    fmt::format("gouge into the finished part about {} deep near x = {}, z = {} "
                                "(allowed {})",
                                show(depth), show((gb.x_min + gb.x_max) / 2),
                                show((gb.z_min + gb.z_max) / 2), show(target.allowance))));
      }
      out.after = std::move(after);
    }
  }

  for (const auto& [part, region] : sweep.others) {
    const auto rb = region.bounds();
    if (!rb || !overlaps(*rb, *material.bounds)) continue;
    const SectionRegion touch = intersect(*now, region);
    if (touch.area() <= least_area) continue;
    const auto tb = *touch.bounds();
    out.findings.push_back(
        finding(FindingKind::BodyCollision, Severity::Error, thickness_of(touch), 0,
                fmt::format("the {} of T{} runs into material about {} deep near x = {}, z = {}",
                            body_part_name(part), tool.number, show(thickness_of(touch)),
                            show((tb.x_min + tb.x_max) / 2), show((tb.z_min + tb.z_max) / 2))));
  }
  return out;
}

}  // namespace dovetailor::detail
