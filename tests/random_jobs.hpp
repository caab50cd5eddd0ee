#pragma once

// Random valid jobs for property tests: male and female, both or one angled
// flank, angles 45 to 60 deg, inch and mm, with and without a gib, with an
// end mill and a dovetail cutter sized to fit. A quarter have a dovetail
// cutter with flutes shorter than the depth (cut in levels); a third a
// tolerance band of their own, half of those excluding the nominal (as
// [+0.02, +0.05] mm on a female); the cutter's shank, stickout and holder are
// given, given in part or left to the defaults, and a given shank may be too
// thick for a deep slot (the planner must refuse those). Fixed seeds keep
// runs repeatable. The numbers are invented; only their relations matter.

#include <algorithm>
#include <cmath>
#include <optional>
#include <random>

#include <dovetailor/base/error.hpp>
#include <dovetailor/geometry/dovetail_section.hpp>
#include <dovetailor/job/job.hpp>
#include <dovetailor/plan/planner.hpp>

namespace dovetailor::testing {

// What a property test may pin down; unset, each is drawn at random. The
// draws are the same either way, so a seed gives the same jobs otherwise.
struct RandomJobOptions {
  std::optional<DovetailType> type = {};
  std::optional<AngledSides> sides = {};
  std::optional<MachineKind> machine = {};
  // Female only: a mouth of 0.86 to 1.0 times the dovetail cutter's diameter,
  // so that the roughed slot is narrower than the cutter and its first pass
  // down the slot cuts into the slot's walls (the base-plane width stays at
  // least the cutter's diameter, so the cutter can finish each flank).
  bool narrow_slot = false;
  // The dovetail cutter's angle off the dovetail's by up to 0.1 deg either
  // way (drawn last, after everything else).
  bool cutter_off_angle = false;
};

inline Job random_job(std::mt19937_64& rng, const RandomJobOptions& options = {}) {
  std::uniform_real_distribution<double> unit(0.0, 1.0);
  const auto between = [&](double a, double b) { return a + (b - a) * unit(rng); };
  Job job;
  job.source = "random.toml";
  job.units = unit(rng) < 0.5 ? Units::Inch : Units::Millimetre;
  const double in = 25.4;
  job.part = {"random part", unit(rng) < 0.5 ? "cast iron" : "6061"};
  auto& d = job.dovetail;
  d.type = unit(rng) < 0.5 ? DovetailType::Male : DovetailType::Female;
  d.type = options.type.value_or(d.type);
  const double angles[] = {45, 50, 55, 60};
  d.angle = angles[static_cast<int>(unit(rng) * 4) % 4];
  const double r = unit(rng);
  d.sides = r < 0.7 ? AngledSides::Both : (r < 0.85 ? AngledSides::Left : AngledSides::Right);
  d.sides = options.sides.value_or(d.sides);
  d.depth = between(0.15, 0.45) * in;
  const double cot = 1 / std::tan(radians(d.angle));
  const int n = d.sides == AngledSides::Both ? 2 : 1;
  // The dovetail cutter: large diameter, flutes at least the depth, neck
  // slim enough to clear the overhang (R - r_neck >= depth * cot a).
  Tool cutter;
  cutter.number = 2;
  cutter.kind = ToolKind::Dovetail;
  cutter.angle = d.angle;
  cutter.flutes = 6;
  cutter.material = unit(rng) < 0.7 ? ToolMaterial::Hss : ToolMaterial::Carbide;
  const bool levels = unit(rng) < 0.25;
  cutter.flute_length = d.depth * (levels ? between(0.45, 0.95) : between(1.05, 1.4));
  const double run = std::max(cutter.flute_length, d.depth) * cot;
  cutter.diameter = 2 * run + between(0.25, 0.5) * in;
  const double small = cutter.diameter - 2 * cutter.flute_length * cot;
  cutter.neck_diameter = std::min(small, cutter.diameter - 2 * d.depth * cot) * between(0.6, 0.95);
  cutter.corner_radius = unit(rng) < 0.5 ? 0 : 0.005 * in;
  // Body data: all given, in part, or none (the defaults of tool_body.hpp).
  const double body = unit(rng);
  if (body < 0.6) {
    if (unit(rng) < 0.7)
      cutter.shank_diameter = std::max(cutter.neck_diameter, cutter.diameter * between(0.3, 0.9));
    if (unit(rng) < 0.7)
      cutter.stickout = cutter.flute_length + cutter.diameter * between(0.05, 2.0);
    if (unit(rng) < 0.4)
      cutter.holder_diameter = cutter.shank_diameter.value_or(cutter.diameter) * between(1.5, 3);
  }
  // Widths: the female floor at least the cutter diameter plus room for the
  // neck; the male root at least a pin's worth.
  Tool mill;
  mill.number = 1;
  mill.kind = ToolKind::EndMill;
  mill.flutes = 3;
  mill.material = ToolMaterial::Carbide;
  mill.flute_length = d.depth * between(1.2, 3.0);
  if (d.type == DovetailType::Female) {
    const double room = between(0.2, 1.0);
    double bottom = cutter.diameter + n * d.depth * cot + room * in;
    if (options.narrow_slot)
      bottom = std::max(cutter.diameter * (0.86 + 0.175 * (room - 0.2)) + n * d.depth * cot,
                        cutter.diameter + 0.01 * in);
    d.width = bottom;
    d.width_at = WidthAt::Bottom;
    const double mouth = bottom - n * d.depth * cot;
    mill.diameter = (mouth - 0.02 * in) * between(0.4, 0.95);
  } else {
    d.width = between(0.5, 1.5) * in;
    d.width_at = WidthAt::Bottom;
    mill.diameter = between(0.25, 0.75) * in;
  }
  if (unit(rng) < 0.3 && d.sides == AngledSides::Both) {
    Gib gib;
    gib.side = unit(rng) < 0.5 ? Side::Left : Side::Right;
    gib.thickness = between(0.06, 0.12) * in;
    gib.taper = unit(rng) < 0.5 ? 0 : 60 + 40 * unit(rng);
    d.gib = gib;
  }
  const double top = width_top_from_bottom(d.type, d.width, d.depth, d.angle, n);
  const double widest = std::max(d.width, top) + (d.gib ? 0.3 * in : 0);
  job.stock = {widest + between(1.0, 2.0) * in, between(2.0, 6.0) * in,
               d.depth + between(0.3, 1.0) * in};
  d.length = job.stock.length;
  d.ends = Ends::Open;
  if (unit(rng) < 0.2) {
    d.ends = Ends::FrontOpen;
    d.length = job.stock.length * 0.8;
  }
  d.tolerance = default_tolerance(d.type, job.units);
  if (unit(rng) < 0.35) {
    // A band of the job's own: 0.0004 to 0.003 in or 0.01 to 0.08 mm wide,
    // straddling the nominal or (half of them) wholly on the side that
    // leaves room to fit (wider female, narrower male).
    const double band =
        job.units == Units::Inch ? to_mm(between(0.0004, 0.003), Units::Inch) : between(0.01, 0.08);
    const double lower = unit(rng) < 0.5 ? between(0.1, 1.0) * band : -between(0.0, 1.0) * band;
    d.tolerance = {lower, lower + band};
    if (d.type == DovetailType::Male) d.tolerance = {-d.tolerance.upper, -d.tolerance.lower};
  }
  job.tools = {mill, cutter};
  // A pin touching in the middle of the flank and clear of the corner radius.
  Gauge g;
  g.pin_diameter = std::max(0.5 * d.depth / (0.5 * (1 + std::cos(radians(d.angle)))),
                            2.5 * cutter.corner_radius + 0.01);
  job.gauge = g;
  job.machine.kind = unit(rng) < 0.3 ? MachineKind::Manual : MachineKind::Cnc;
  job.machine.kind = options.machine.value_or(job.machine.kind);
  if (options.cutter_off_angle) job.tools[1].angle += between(-0.1, 0.1);
  return job;
}

// The plan of a random job, or nothing when the planner refuses it (refused
// jobs are the planner tests' business).
inline std::optional<Plan> plan_if_accepted(const Job& job) {
  try {
    return plan(job);
  } catch (const InputError&) {
    return std::nullopt;
  }
}

}  // namespace dovetailor::testing
