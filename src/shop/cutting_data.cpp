#include <algorithm>
#include <cassert>
#include <cmath>

#include <fmt/format.h>

#include <dovetailor/shop/cutting_data.hpp>

namespace dovetailor {

double spindle_speed(double surface_speed, double diameter) {
  assert(diameter > 0);
  return 1000.0 * surface_speed / (pi * diameter);
}

double spindle_speed_inch(double surface_feet_per_minute, double diameter_inch) {
  assert(diameter_inch > 0);
  return 12.0 * surface_feet_per_minute / (pi * diameter_inch);
}

double surface_speed(double rpm, double diameter) { return pi * diameter * rpm / 1000.0; }

double feed_rate(double chip_load, int flutes, double rpm) { return chip_load * flutes * rpm; }

double engagement_angle(double radial_step, double diameter) {
  assert(diameter > 0 && radial_step >= 0);
  if (radial_step >= diameter) return pi;
  return std::acos(1.0 - 2.0 * radial_step / diameter);
}

double chip_thinning_factor(double radial_step, double diameter, double limit) {
  assert(limit >= 1);
  if (radial_step <= 0) return limit;
  if (radial_step >= diameter / 2) return 1.0;
  const double factor = diameter / (2.0 * std::sqrt(radial_step * (diameter - radial_step)));
  return std::min(factor, limit);
}

CuttingData cutting_data(const Tool& tool, const Material& material, const Machine& machine,
                         const CuttingOptions& options) {
  assert(tool.diameter > 0 && tool.flutes > 0);
  const bool dovetail = tool.kind == ToolKind::Dovetail;
  CuttingData out;

  if (tool.rpm) {
    out.rpm = *tool.rpm;
    out.rpm_from = FigureSource::ToolOverride;
  } else {
    const auto& range = speed_range(material, tool.material);
    double vc = range.low + options.speed_fraction * (range.high - range.low);
    if (dovetail) vc *= options.dovetail_speed_factor;
    out.rpm = spindle_speed(vc, tool.diameter);
  }
  if (machine.max_rpm && out.rpm > *machine.max_rpm) {
    out.warnings.push_back({CuttingWarningKind::RpmCapped, out.rpm, *machine.max_rpm});
    out.rpm = *machine.max_rpm;
  }
  out.surface_speed = surface_speed(out.rpm, tool.diameter);

  if (tool.feed) {
    out.feed = *tool.feed;
    out.feed_from = FigureSource::ToolOverride;
  } else if (tool.chip_load) {
    out.chip_load = *tool.chip_load;
    out.feed = feed_rate(out.chip_load, tool.flutes, out.rpm);
    out.feed_from = FigureSource::ToolOverride;
  } else {
    double fz = chip_load_for(material, tool.diameter);
    if (dovetail) fz *= options.dovetail_chip_load_factor;
    const double ae = options.radial_step > 0 ? options.radial_step : tool.diameter;
    out.chip_thinning = chip_thinning_factor(ae, tool.diameter, options.chip_thinning_limit);
    out.chip_load = fz * out.chip_thinning;
    out.feed = feed_rate(out.chip_load, tool.flutes, out.rpm);
  }
  if (machine.max_feed && out.feed > *machine.max_feed) {
    out.warnings.push_back({CuttingWarningKind::FeedCapped, out.feed, *machine.max_feed});
    out.feed = *machine.max_feed;
  }
  out.chip_load = out.feed / (tool.flutes * out.rpm);
  return out;
}

std::string warning_text(const CuttingWarning& warning, Units units) {
  switch (warning.kind) {
    case CuttingWarningKind::RpmCapped:
      return fmt::format(
          "spindle speed {:.0f} rev/min is above the machine's {:.0f} rev/min; "
          "using {:.0f}",
          warning.wanted, warning.used, warning.used);
    case CuttingWarningKind::FeedCapped: {
      const int decimals = units == Units::Inch ? 1 : 0;
      const auto unit = fmt::format("{}/min", unit_symbol(units));
      return fmt::format("feed {:.{}f} {} is above the machine's {:.{}f} {}; using {:.{}f}",
                         from_mm(warning.wanted, units), decimals, unit,
                         from_mm(warning.used, units), decimals, unit, from_mm(warning.used, units),
                         decimals);
    }
  }
  return {};
}

}  // namespace dovetailor
