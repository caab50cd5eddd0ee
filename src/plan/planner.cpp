#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include <dovetailor/geometry/tool_body.hpp>
#include <dovetailor/plan/planner.hpp>
#include <dovetailor/shop/deflection.hpp>
#include <dovetailor/shop/material_table.hpp>

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

// Refuses a job whose cutter body would touch the finished part when it sits
// at a finishing position: the large diameter cutting the opposite flank, the
// neck, shank or holder hitting the overhang. The body is the checker's
// (tool_body.hpp, the same defaults for what the job leaves out), so the
// planner refuses exactly what the checker would find touching there. Each
// part's profile is piecewise linear in height and so is the flank: testing
// the profile's points, and where a part crosses the top plane, is exact.
void check_cutter_fits(const PlanContext& ctx) {
  const auto& s = ctx.target;
  const Tool& t = ctx.cutter;
  const ToolBody body = tool_body(t);
  const double depth = s.depth;
  constexpr double slack = 1e-6;
  for (Side side : {Side::Left, Side::Right}) {
    if (!s.flank(side).angled) continue;
    for (const double tip : detail::level_tips(ctx)) {
      const double x = detail::cutter_axis_x(ctx, side, 0, tip);
      const double below_top = depth - tip;  // the top plane, above the tip
      for (const BodySection& section : body.sections) {
        if (section.bottom() >= below_top) break;  // above the top plane all is clear
        std::vector<ProfilePoint> points = section.profile;
        if (section.top() > below_top) points.push_back({below_top, section.radius_at(below_top)});
        for (const ProfilePoint& p : points) {
          if (p.height > below_top) continue;
          const double z = -depth + tip + p.height;
          const double r = p.radius;
          const double lx = flank_x_at(s.left, z), rx = flank_x_at(s.right, z);
          const bool hit = ctx.female() ? x - r < lx - slack || x + r > rx + slack
                                        : x + r > lx + slack && x - r < rx - slack;
          if (!hit) continue;
          const bool cone = section.part == BodyPart::Flutes;
          throw InputError(
              fmt::format("finishing the {} flank with T{}, {} at {} above the base plane would "
                          "cut into the {} (cutter radius there {}); {}",
                          side == Side::Left ? "left" : "right", t.number,
                          cone ? std::string("the cutting cone")
                               : fmt::format("the {}", body_part_name(section.part)),
                          ctx.show(tip + p.height),
                          ctx.female() ? "opposite side of the groove" : "tongue", ctx.show(r),
                          cone ? "use a cutter with a smaller large diameter"
                               : "use a cutter with a slimmer or longer neck, or longer flutes, "
                                 "or give its shank_diameter and stickout if they differ from "
                                 "the assumed ones"),
              {ctx.job.source}, fmt::format("tool[T{}]", t.number));
        }
      }
    }
  }
}

void check_job(const PlanContext& ctx) {
  const Job& job = ctx.job;
  const auto& d = job.dovetail;
  const auto& s = ctx.target;
  const SourcePlace where{job.source};
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

// Angles closer than this count as equal: a file's 59.9 and 60 differ by
// 0.1000000000000014 in binary.
constexpr double angle_slack = 1e-9;

// The cutter's angle less the dovetail's, rounded for messages.
double angle_difference(const Tool& cutter, const DovetailSpec& d) {
  return std::round((cutter.angle - d.angle) * 1e6) / 1e6;
}

// Refuses a dovetail cutter whose angle differs from the dovetail's by more
// than cutter_angle_tolerance either way: its cone would cut the flank at its
// own angle, and no setting of the machine puts that right.
void check_cutter_angle(const Job& job, const Tool& cutter) {
  const double diff = angle_difference(cutter, job.dovetail);
  if (std::abs(diff) <= cutter_angle_tolerance + angle_slack) return;
  throw InputError(
      fmt::format("the dovetail cutter T{} is {:g} deg and the dovetail {:g} deg: {:g} deg {}, "
                  "more than the {:g} deg allowed either way. Its cone cuts the flank at its own "
                  "angle; use a cutter of the dovetail's angle",
                  cutter.number, cutter.angle, job.dovetail.angle, std::abs(diff),
                  diff > 0 ? "steeper" : "shallower", cutter_angle_tolerance),
      {job.source}, "tool.angle");
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
  // The readings hold at the front end. A tapered gib's flank (and every
  // pass on it) runs at its slope, so the stock left is the same all along
  // and the width at the base plane changes by the flanks' slopes; each
  // reading moves one for one with the flank it touches (domain brief,
  // "Sensitivity").
  const auto& spec = plan.job.dovetail;
  c.reading_at_y = 0;
  c.reading_per_length = flank_taper_slope(spec, Side::Right) - flank_taper_slope(spec, Side::Left);
  c.reference_per_length = flank_taper_slope(spec, Side::Right);
  return c;
}

int last_pass_of(const Operation& op, PassRole role) {
  int last = 0;
  for (const auto& p : op.passes)
    if (p.role == role) last = p.number;
  return last;
}

}  // namespace

ReadingBand final_reading_band(const Plan& plan) {
  const Tolerance& tol = plan.job.dovetail.tolerance;
  const double nominal = plan.final_reading.value - band_middle(tol);
  return {nominal + tol.lower, nominal + tol.upper};
}

std::vector<Move> Pass::moves() const {
  std::vector<Move> out = entry;
  out.insert(out.end(), cut.begin(), cut.end());
  out.insert(out.end(), exit.begin(), exit.end());
  return out;
}

std::vector<const Pass*> all_passes(const Plan& plan) {
  std::vector<const Pass*> out;
  for (const auto& op : plan.operations)
    for (const auto& p : op.passes) out.push_back(&p);
  return out;
}

DovetailSpec dovetail_as_cut(const Job& job) {
  DovetailSpec spec = job.dovetail;
  const auto& number = job.strategy.dovetail_cutter;
  const Tool* cutter = number ? find_tool(job, *number) : first_tool(job, ToolKind::Dovetail);
  if (!cutter || cutter->kind != ToolKind::Dovetail) return spec;
  const double diff = cutter->angle - spec.angle;
  if (diff == 0 || std::abs(diff) > cutter_angle_tolerance + angle_slack) return spec;
  spec.width = design_width_bottom(job.dovetail);
  spec.width_at = WidthAt::Bottom;
  spec.angle = cutter->angle;
  return spec;
}

namespace {

// The planner's settings for `job`, in its units (common practice, no
// source): heights and clearances, allowances, bend limits and the milling
// direction. Warns of settings the planner overrides or finds unusual.
PlanContext make_context(const Job& job, const Material& material, const Tool& end_mill,
                         const Tool& cutter, std::vector<PlanWarning>& warnings) {
  const Units u = job.units;
  PlanContext ctx{.job = job,
                  .material = material,
                  .end_mill = end_mill,
                  .cutter = cutter,
                  .target = section_of(aimed_spec(job.dovetail)),
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
  if (manual && st.direction == MillingMode::Climb) warnings.push_back(ClimbOnManualWarning{});
  if (ctx.finish_allowance >= ctx.rough_allowance + by_units(u, 0.2, 5))
    warnings.push_back(
        LargeFinishAllowanceWarning{.finish = ctx.finish_allowance, .rough = ctx.rough_allowance});
  return ctx;
}

// How the target was derived from the job `given`: from the mate, at the
// cutter's angle, aimed at the middle of the band.
void note_the_target(const PlanContext& ctx, const Job& given, std::vector<PlanNote>& notes) {
  const Job& job = ctx.job;
  if (job.dovetail.mate && job.dovetail.mate_derivation)
    notes.push_back(MateNote{*job.dovetail.mate, *job.dovetail.mate_derivation});
  if (job.dovetail.angle != given.dovetail.angle)
    notes.push_back(CutterAngleNote{.tool = ctx.cutter.number,
                                    .cutter_angle = ctx.cutter.angle,
                                    .dovetail_angle = given.dovetail.angle,
                                    .tolerance = cutter_angle_tolerance,
                                    .width_bottom = design_width_bottom(given.dovetail),
                                    .gib = job.dovetail.gib.has_value(),
                                    .width_top = ctx.target.width_top(),
                                    .nominal_width_top = section_of(given.dovetail).width_top()});
  if (const double aim = band_middle(job.dovetail.tolerance); aim != 0)
    notes.push_back(
        AimedWidthNote{.width_bottom = ctx.target.width_bottom(),
                       .offset = aim,
                       .nominal_width_bottom = section_of(job.dovetail).width_bottom()});
}

// The choices the passes were planned with.
void note_the_choices(const PlanContext& ctx, std::vector<PlanNote>& notes) {
  notes.push_back(MillingNote{.material = ctx.material.name,
                              .mode = ctx.mode,
                              .manual = ctx.job.machine.kind == MachineKind::Manual});
  notes.push_back(
      AllowanceNote{.rough = ctx.rough_allowance,
                    .floor = ctx.female() ? std::optional(ctx.floor_allowance) : std::nullopt,
                    .finish = ctx.finish_allowance,
                    .last_cut = ctx.last_cut});
  notes.push_back(
      BendLimitNote{.rough = ctx.rough_deflection_limit, .finish = ctx.finish_deflection_limit});
}

// Warns of the first finishing pass predicted to bend past its limit.
void check_finish_bend(const PlanContext& ctx, const Operation& undercut) {
  for (const auto& p : undercut.passes)
    if (p.role == PassRole::Finish && p.deflection > ctx.finish_deflection_limit) {
      ctx.warnings.push_back(FinishBendWarning{
          .pass = p.number, .deflection = p.deflection, .limit = ctx.finish_deflection_limit});
      return;
    }
}

// The stops the job asks for (by default after roughing, before finishing
// and after finishing), in the order of the passes they follow.
std::vector<Checkpoint> place_checkpoints(const PlanContext& ctx, const Plan& plan,
                                          const Operation& undercut) {
  const std::vector<CheckpointAt> at =
      ctx.job.strategy.checkpoints.value_or(std::vector<CheckpointAt>{
          CheckpointAt::AfterRoughing, CheckpointAt::BeforeFinish, CheckpointAt::AfterFinish});
  const int after_rough = last_pass_of(undercut, PassRole::Rough);
  const int after_semi = last_pass_of(undercut, PassRole::SemiFinish);
  int after_finish = last_pass_of(undercut, PassRole::Spring);
  if (after_finish == 0) after_finish = last_pass_of(undercut, PassRole::Finish);
  std::vector<Checkpoint> out;
  for (CheckpointAt a : at) {
    if (a == CheckpointAt::AfterRoughing)
      out.push_back(
          make_checkpoint(ctx, plan, "after roughing", after_rough, ctx.finish_allowance));
    if (a == CheckpointAt::BeforeFinish && after_semi > 0)
      out.push_back(make_checkpoint(ctx, plan, "before finishing", after_semi, ctx.last_cut));
    if (a == CheckpointAt::AfterFinish)
      out.push_back(make_checkpoint(ctx, plan, "after finishing", after_finish, 0));
  }
  std::sort(out.begin(), out.end(),
            [](const Checkpoint& a, const Checkpoint& b) { return a.after_pass < b.after_pass; });
  return out;
}

}  // namespace

Plan plan(const Job& given) {
  if (given.part.material.empty())
    throw InputError(
        "the planner needs the work material for speeds, feeds and cutting forces; "
        "add [part] material = \"...\"",
        {given.source}, "part.material");
  const Material& material =
      find_material(builtin_materials(), given.part.material, {given.source});
  const Tool& end_mill = pick_tool(given, ToolKind::EndMill, given.strategy.end_mill, "end mill");
  const Tool& cutter =
      pick_tool(given, ToolKind::Dovetail, given.strategy.dovetail_cutter, "dovetail cutter");
  check_cutter_angle(given, cutter);
  // Everything below plans the dovetail the cutter will really cut.
  Job job = given;
  job.dovetail = dovetail_as_cut(given);
  std::vector<PlanWarning> warnings;
  PlanContext ctx = make_context(job, material, end_mill, cutter, warnings);
  check_job(ctx);

  Plan result;
  result.job = job;
  result.target = ctx.target;
  result.safe_z = ctx.safe_z;
  result.clearance = ctx.clearance;
  const double pin = job.gauge ? job.gauge->pin_diameter : 0;
  result.final_reading = reading_of(ctx.target, pin);
  note_the_target(ctx, given, result.notes);
  result.operations = detail::rough_operations(ctx);
  result.operations.push_back(detail::undercut_operation(ctx));
  const Operation& undercut = result.operations.back();
  note_the_choices(ctx, result.notes);
  check_finish_bend(ctx, undercut);
  if (!job.gauge) warnings.push_back(NoGaugeWarning{});
  result.checkpoints = place_checkpoints(ctx, result, undercut);
  result.warnings = std::move(warnings);
  return result;
}

}  // namespace dovetailor
