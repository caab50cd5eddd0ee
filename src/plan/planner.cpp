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
  const Units u = job.units;
  std::vector<std::string> warnings;
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
  if (job.dovetail.angle != given.dovetail.angle) {
    const DovetailSection nominal = section_of(given.dovetail);
    const double diff = angle_difference(cutter, given.dovetail);
    result.notes.push_back(fmt::format(
        "T{} is {:g} deg, {:g} deg {} than the dovetail's {:g} deg (within {:g} deg): the flanks "
        "are planned at {:g} deg. The base-plane width {} is held (the cutter's tip corner sets "
        "it){}; the top-plane width comes out {} ({} at {:g} deg), and the pin readings are those "
        "of {:g} deg flanks.",
        cutter.number, cutter.angle, std::abs(diff), diff > 0 ? "steeper" : "shallower",
        given.dovetail.angle, cutter_angle_tolerance, cutter.angle,
        ctx.show(design_width_bottom(given.dovetail)),
        job.dovetail.gib ? ", the gib's allowance taken at the cutter's angle" : "",
        ctx.show(ctx.target.width_top()), ctx.show(nominal.width_top()), given.dovetail.angle,
        cutter.angle));
  }
  if (const double aim = band_middle(job.dovetail.tolerance); aim != 0)
    result.notes.push_back(fmt::format(
        "Aimed at the middle of the width tolerance: {} at the base plane, {} {} the nominal {}, "
        "so that rounding the program's last decimal keeps the part inside the band.",
        ctx.show(ctx.target.width_bottom()), ctx.show(std::abs(aim)), aim > 0 ? "over" : "under",
        ctx.show(section_of(job.dovetail).width_bottom())));
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
