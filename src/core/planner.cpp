#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include <dovetailor/deflection.hpp>
#include <dovetailor/material_table.hpp>
#include <dovetailor/planner.hpp>

#include "planner_detail.hpp"

namespace dovetailor {
namespace {

using detail::PlanContext;

// Defaults in the job's units: {inch value, mm value}. Common practice, no
// source: a few thousandths of an inch left for finishing, a light last cut.
double by_units(Units u, double inch, double mm) { return u == Units::Inch ? to_mm(inch, u) : mm; }

const Tool& pick_tool(const Job& job, ToolKind kind, std::optional<int> number, const char* what) {
  const Tool* tool = number ? find_tool(job, *number) : first_tool(job, kind);
  if (!tool)
    throw InputError(fmt::format("the job lists no {}; add a [[tool]] with kind = \"{}\"", what,
                                 kind == ToolKind::EndMill ? "end-mill" : "dovetail"),
                     {job.source}, "tool");
  return *tool;
}

// The dovetail cutter's radius at `h` above its tip: the cone over the
// flutes, then the neck, the shank and the holder (tool_beam's body).
double cutter_radius_at(const Tool& t, double h) {
  if (h <= t.flute_length) return t.diameter / 2 - h * cot_deg(t.angle);
  const ToolBeam beam = tool_beam(t);
  const double neck = beam.sections.size() > 1 ? beam.sections[1].length : 0;
  if (h <= t.flute_length + neck) return t.neck_diameter / 2;
  if (h <= beam.length()) return beam.sections.front().diameter / 2;
  return t.holder_diameter.value_or(beam.sections.front().diameter) / 2;
}

// Refuses a job whose cutter body would touch the finished part when it sits
// at a finishing position: the large diameter cutting the opposite flank, the
// neck or shank hitting the overhang or the top face.
void check_cutter_fits(const PlanContext& ctx) {
  const auto& s = ctx.target;
  const Tool& t = ctx.cutter;
  const double depth = s.depth;
  const double usable = 0.9 * t.flute_length;
  const int levels = std::max(1, static_cast<int>(std::ceil(depth / usable - 1e-9)));
  for (Side side : {Side::Left, Side::Right}) {
    if (!s.flank(side).angled) continue;
    for (int j = 0; j < levels; ++j) {
      const double tip = depth * j / levels;
      const double x = detail::cutter_axis_x(ctx, side, 0, tip);
      // Sample the body from the tip to well above the top plane.
      for (int k = 0; k <= 400; ++k) {
        const double h = (depth - tip + ctx.safe_z) * k / 400.0;
        const double z = -depth + tip + h;
        if (z > 0) break;  // above the top plane the body is in the clear
        const double r = cutter_radius_at(t, h);
        const double lx = flank_x_at(s.left, z), rx = flank_x_at(s.right, z);
        const double slack = 1e-6;
        std::string part = h <= t.flute_length ? "the cutting cone" : "the neck or shank";
        bool hit = false;
        if (ctx.female()) {
          hit = x - r < lx - slack || x + r > rx + slack;
        } else {
          hit = x + r > lx + slack && x - r < rx - slack;
        }
        if (hit)
          throw InputError(
              fmt::format("finishing the {} flank with T{}, {} at {} above the base plane would "
                          "cut into the {} (cutter radius there {}); {}",
                          side == Side::Left ? "left" : "right", t.number, part, ctx.show(tip + h),
                          ctx.female() ? "opposite side of the groove" : "tongue", ctx.show(r),
                          h <= t.flute_length
                              ? "use a cutter with a smaller large diameter"
                              : "use a cutter with a slimmer or longer neck, or longer flutes"),
              {ctx.job.source}, fmt::format("tool[T{}]", t.number));
      }
    }
  }
}

void check_job(const PlanContext& ctx) {
  const Job& job = ctx.job;
  const auto& d = job.dovetail;
  const auto& s = ctx.target;
  const SourcePlace where{job.source};
  if (std::abs(ctx.cutter.angle - d.angle) > 0.1)
    throw InputError(
        fmt::format("the dovetail cutter T{} is {:g} deg but the dovetail is {:g} deg; "
                    "the flank would come out at the cutter's angle",
                    ctx.cutter.number, ctx.cutter.angle, d.angle),
        where, "tool.angle");
  if (d.ends == Ends::Closed)
    throw InputError(
        "a dovetail closed at both ends cannot be undercut: the cutter cannot plunge. "
        "Give ends = \"front-open\" (or \"open\"), or drill and mill a relief "
        "pocket at one end first and plan from there",
        where, "dovetail.ends");
  if (d.ends == Ends::Open && std::abs(d.length - job.stock.length) > 1e-6)
    throw InputError(
        "open ends mean the dovetail runs the whole stock length; give "
        "ends = \"front-open\" for one that stops short of the back end",
        where, "dovetail.length");
  if (d.ends == Ends::FrontOpen && d.length >= job.stock.length - 1e-6)
    throw InputError("a front-open dovetail must stop short of the back end of the stock", where,
                     "dovetail.length");
  if (d.ends == Ends::FrontOpen && d.length <= ctx.cutter.diameter)
    throw InputError(fmt::format("the dovetail is only {} long; the cutter needs more than its "
                                 "{} diameter to run in from the open end",
                                 ctx.show(d.length), ctx.show(ctx.cutter.diameter)),
                     where, "dovetail.length");
  if (ctx.end_mill.flute_length < s.depth)
    throw InputError(
        fmt::format("the end mill T{} has {} of flutes, less than the {} depth",
                    ctx.end_mill.number, ctx.show(ctx.end_mill.flute_length), ctx.show(s.depth)),
        where, "tool.flute_length");
  if (ctx.female()) {
    const double slot = s.width_top() - 2 * ctx.rough_allowance;
    if (ctx.end_mill.diameter > slot + 1e-9)
      throw InputError(
          fmt::format("the end mill T{} ({}) is wider than the roughing slot ({} = "
                      "mouth {} less {} per side); use an end mill no larger than {}",
                      ctx.end_mill.number, ctx.show(ctx.end_mill.diameter), ctx.show(slot),
                      ctx.show(s.width_top()), ctx.show(ctx.rough_allowance), ctx.show(slot)),
          where, "tool.diameter");
  }
  check_cutter_fits(ctx);
  if (job.gauge) {
    const auto problems = pin_problems(s, job.gauge->pin_diameter, ctx.cutter.corner_radius,
                                       job.units, stock_faces(job));
    if (!problems.empty()) throw InputError(problems.front(), where, "gauge.pin_diameter");
  }
  // A CNC positions to the last written decimal; the band must hold a few.
  const double resolution = by_units(job.units, 0.0001, 0.001);
  const double band = d.tolerance.upper - d.tolerance.lower;
  if (band < 2 * resolution)
    throw InputError(fmt::format("the tolerance band {} is finer than the machine can hold (it "
                                 "moves in steps of {}); give a band of at least {}",
                                 ctx.show(band), ctx.show(resolution), ctx.show(2 * resolution)),
                     where, "dovetail.tolerance");
}

Checkpoint make_checkpoint(const PlanContext& ctx, const Plan& plan, std::string name,
                           int after_pass, double stock) {
  const auto& s = ctx.target;
  const int n = s.angled_flanks();
  const double sign = ctx.female() ? -1.0 : 1.0;
  Checkpoint c;
  c.after_pass = after_pass;
  c.name = std::move(name);
  c.final_reading = plan.final_reading;
  c.expected = plan.final_reading;
  c.expected.value += sign * n * stock;
  c.remaining_per_flank = stock;
  c.remaining_normal = stock * std::sin(radians(s.angle));
  c.correction_per_reading = (ctx.female() ? -1.0 : 1.0) / n;
  c.expected_depth = s.depth;
  if (!ctx.female() && plan.job.gauge && n == 2) {
    const double face = stock_left_x(plan.job);
    c.reference_reading =
        reference_reading(s, Side::Right, plan.job.gauge->pin_diameter, face) + stock;
  }
  return c;
}

int last_pass_of(const Operation& op, PassRole role) {
  int last = 0;
  for (const auto& p : op.passes)
    if (p.role == role) last = p.number;
  return last;
}

}  // namespace

std::string_view pass_role_word(PassRole role) {
  switch (role) {
    case PassRole::Rough:
      return "rough";
    case PassRole::SemiFinish:
      return "semi-finish";
    case PassRole::Finish:
      return "finish";
    case PassRole::Spring:
      return "spring";
  }
  return "";
}

std::vector<const Pass*> all_passes(const Plan& plan) {
  std::vector<const Pass*> out;
  for (const auto& op : plan.operations)
    for (const auto& p : op.passes) out.push_back(&p);
  return out;
}

Plan plan(const Job& job) {
  if (job.part.material.empty())
    throw InputError(
        "the planner needs the work material for speeds, feeds and cutting forces; "
        "add [part] material = \"...\"",
        {job.source}, "part.material");
  const Material& material = find_material(builtin_materials(), job.part.material, {job.source});
  const Tool& end_mill = pick_tool(job, ToolKind::EndMill, job.strategy.end_mill, "end mill");
  const Tool& cutter =
      pick_tool(job, ToolKind::Dovetail, job.strategy.dovetail_cutter, "dovetail cutter");
  const Units u = job.units;
  std::vector<std::string> warnings;
  PlanContext ctx{.job = job,
                  .material = material,
                  .end_mill = end_mill,
                  .cutter = cutter,
                  .target = section_of(job.dovetail),
                  .warnings = warnings};
  ctx.safe_z = by_units(u, 0.2, 5);
  ctx.near_z = by_units(u, 0.05, 1);
  ctx.clearance = by_units(u, 0.1, 2.5);
  const auto& st = job.strategy;
  ctx.rough_allowance = st.rough_allowance.value_or(by_units(u, 0.010, 0.25));
  ctx.floor_allowance = st.floor_allowance.value_or(by_units(u, 0.005, 0.12));
  ctx.finish_allowance = st.finish_allowance.value_or(by_units(u, 0.008, 0.2));
  // Over a few thousandths, a semi-finish pass leaves a light last cut and a
  // checkpoint comes before the finish.
  const double few = by_units(u, 0.004, 0.1);
  ctx.last_cut = ctx.finish_allowance > few ? by_units(u, 0.002, 0.05) : 0;
  const double band = job.dovetail.tolerance.upper - job.dovetail.tolerance.lower;
  // Roughing guards the cutter more than the size: the finish passes take
  // out what roughing leaves (common practice, no source; this project's figure).
  ctx.rough_deflection_limit = by_units(u, 0.004, 0.1);
  ctx.finish_deflection_limit = 0.25 * band;
  const bool manual = job.machine.kind == MachineKind::Manual;
  ctx.mode = manual ? MillingMode::Conventional : st.direction.value_or(MillingMode::Climb);
  if (manual && st.direction == MillingMode::Climb)
    warnings.push_back(
        "strategy.direction = \"climb\" is ignored on a manual machine: table "
        "backlash can pull the work into the cutter; every pass is conventional");
  if (ctx.finish_allowance >= ctx.rough_allowance + by_units(u, 0.2, 5))
    warnings.push_back("the finish allowance is unusually large");

  check_job(ctx);

  Plan result;
  result.job = job;
  result.target = ctx.target;
  result.safe_z = ctx.safe_z;
  result.clearance = ctx.clearance;
  const double pin = job.gauge ? job.gauge->pin_diameter : 0;
  result.final_reading = reading_of(ctx.target, pin);
  if (!job.dovetail.mate_derivation.empty()) result.notes.push_back(job.dovetail.mate_derivation);
  result.operations = detail::rough_operations(ctx);
  result.operations.push_back(detail::undercut_operation(ctx));
  const Operation& undercut = result.operations.back();

  result.notes.push_back(fmt::format("Material: {}. Milling {} on the flanks{}.", material.name,
                                     ctx.mode == MillingMode::Climb ? "climb" : "conventional",
                                     manual ? " (manual machine: always conventional)" : ""));
  result.notes.push_back(fmt::format(
      "Allowances: end mill leaves {} per side{}; the dovetail cutter leaves {} per flank for "
      "finishing{}.",
      ctx.show(ctx.rough_allowance),
      ctx.female() ? fmt::format(" and {} on the floor", ctx.show(ctx.floor_allowance)) : "",
      ctx.show(ctx.finish_allowance),
      ctx.last_cut > 0 ? fmt::format(", then a semi-finish pass leaves {}", ctx.show(ctx.last_cut))
                       : ""));
  result.notes.push_back(fmt::format(
      "Radial steps are sized so the predicted bend of the dovetail cutter stays under {}; the "
      "finishing pass should bend it under {} (a quarter of the tolerance). A spring pass at the "
      "same setting takes out what the cutter sprang away on the finishing pass.",
      ctx.show(ctx.rough_deflection_limit), ctx.show(ctx.finish_deflection_limit)));
  for (const auto& p : undercut.passes)
    if (p.role == PassRole::Finish && p.deflection > ctx.finish_deflection_limit) {
      warnings.push_back(fmt::format(
          "pass {}: predicted deflection {} on the finishing pass is more than a quarter of the "
          "tolerance; the spring pass matters, and a smaller finish allowance would help",
          p.number, ctx.show(p.deflection)));
      break;
    }

  // Checkpoints.
  std::vector<CheckpointAt> at = st.checkpoints.value_or(std::vector<CheckpointAt>{
      CheckpointAt::AfterRoughing, CheckpointAt::BeforeFinish, CheckpointAt::AfterFinish});
  const int after_rough = last_pass_of(undercut, PassRole::Rough);
  const int after_semi = last_pass_of(undercut, PassRole::SemiFinish);
  int after_finish = last_pass_of(undercut, PassRole::Spring);
  if (after_finish == 0) after_finish = last_pass_of(undercut, PassRole::Finish);
  const bool have_pin = job.gauge.has_value();
  if (!have_pin)
    warnings.push_back("no [gauge] pin_diameter: the checkpoints give widths but no pin readings");
  for (CheckpointAt a : at) {
    if (a == CheckpointAt::AfterRoughing)
      result.checkpoints.push_back(
          make_checkpoint(ctx, result, "after roughing", after_rough, ctx.finish_allowance));
    if (a == CheckpointAt::BeforeFinish && after_semi > 0)
      result.checkpoints.push_back(
          make_checkpoint(ctx, result, "before finishing", after_semi, ctx.last_cut));
    if (a == CheckpointAt::AfterFinish)
      result.checkpoints.push_back(
          make_checkpoint(ctx, result, "after finishing", after_finish, 0));
  }
  std::sort(result.checkpoints.begin(), result.checkpoints.end(),
            [](const Checkpoint& a, const Checkpoint& b) { return a.after_pass < b.after_pass; });
  result.warnings = std::move(warnings);
  return result;
}

}  // namespace dovetailor
