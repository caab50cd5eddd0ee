#include <algorithm>
#include <cmath>
#include <set>

#include <fmt/format.h>

#include <dovetailor/check/checker.hpp>
#include <dovetailor/check/program_frame.hpp>
#include <dovetailor/plan/planner.hpp>
#include <dovetailor/rs274/rs274_interpreter.hpp>

#include "check_detail.hpp"
#include "station_simulator.hpp"

namespace dovetailor {
namespace {

using detail::FindingSink;
using detail::MoveFacts;
using detail::SimTool;
using detail::StationSimulator;
using detail::StationTarget;

double by_units(Units units, double inch, double mm) {
  return units == Units::Inch ? to_mm(inch, Units::Inch) : mm;
}

double largest_tool_radius(const Job& job) {
  double r = 0;
  for (const Tool& t : job.tools) r = std::max(r, t.diameter / 2);
  return r;
}

// What the planner says about this job: the safe height and, per dovetail
// cutter, the largest radial step it takes; and the floor skin the
// cutters' bottom faces take (how far the end mill's roughing stops above
// the deepest dovetail pass: a female's floor allowance). Jobs it cannot
// plan fall back to its fixed figures.
struct PlannerRules {
  double safe_z = 0;
  double floor_skin = 0;
  std::vector<std::pair<int, double>> radial_limits;
};

// The planner's default floor allowance (planner.cpp).
double default_floor_skin(Units units) { return by_units(units, 0.005, 0.12); }

PlannerRules planner_rules(const Job& job) {
  PlannerRules rules;
  rules.safe_z = by_units(job.units, 0.2, 5);
  if (job.dovetail.type == DovetailType::Female)
    rules.floor_skin = job.strategy.floor_allowance.value_or(default_floor_skin(job.units));
  for (const Tool& t : job.tools)
    if (t.kind == ToolKind::Dovetail) rules.radial_limits.emplace_back(t.number, 0.1 * t.diameter);
  try {
    const Plan p = plan(job);
    rules.safe_z = p.safe_z;
    for (auto& [number, limit] : rules.radial_limits) {
      double largest = 0;
      for (const Pass* pass : all_passes(p))
        if (pass->tool == number) largest = std::max(largest, pass->radial_step);
      if (largest > 0) limit = largest;
    }
    double roughed = HUGE_VAL, undercut = HUGE_VAL;
    for (const Operation& op : p.operations) {
      const bool rough =
          op.kind == OperationKind::RoughSlot || op.kind == OperationKind::RoughShoulders;
      for (const Pass& pass : op.passes) {
        if (rough) roughed = std::min(roughed, pass.z);
        if (op.kind == OperationKind::Undercut) undercut = std::min(undercut, pass.z);
      }
    }
    if (roughed < HUGE_VAL && undercut < HUGE_VAL)
      rules.floor_skin = std::max(0.0, roughed - undercut);
  } catch (const InputError&) {
    // A job the planner refuses can still be checked; its fixed rules apply.
  }
  return rules;
}

StationTarget target_at(const Job& job, double y, int id, double allowance) {
  StationTarget t;
  t.id = id;
  // Aimed at the middle of the width band (aimed_spec). The section the job's dovetail cutter cuts:
  // at its own angle when that is within the planner's tolerance (planner.hpp, dovetail_as_cut).
  t.section = section_at(aimed_spec(dovetail_as_cut(job)), y);
  t.allowance = allowance;
  t.part = SectionRegion::from_ring(
      part_outline(t.section, stock_left_x(job), stock_right_x(job), job.stock.height));
  t.forbidden = offset(t.part, -allowance);
  // A chamfer on the top edges may be cut: no gouge there.
  if (t.section.chamfer > 0)
    for (const Flank* f : {&t.section.left, &t.section.right})
      t.forbidden = subtract(t.forbidden, detail::disc(f->top, 2 * t.section.chamfer + allowance));
  return t;
}

class Checker {
 public:
  Checker(const Job& job, const CheckOptions& options)
      : job_(job), options_(options), sink_(options.findings_per_kind) {}

  CheckReport run(ProgramSource& program);

 private:
  void prepare_tools();
  StationSimulator make_simulator();
  void read_program(ProgramSource& program, StationSimulator& sim, CheckReport& report);
  void handle(const Event& event, StationSimulator& sim, CheckReport& report);
  void home_return(const Event& event, const Motion& m);
  void missing_tool(const Event& event, const MissingTool& missing);
  void tool_change(const Event& event, const ToolChange& change);
  void spindle_change(const Event& event, const SpindleChange& spindle);
  void program_end(const Event& event, const ProgramEnd& end, CheckReport& report);
  void unknown_tool(int line, int number, ToolWord named_by);
  void motion(const Event& event, const Motion& m, StationSimulator& sim);
  // The move in the job's frame: from the event's work coordinates through
  // machine coordinates to the program frame (the system the program started
  // in), then turned and shifted (program_frame.hpp).
  Motion in_job_frame(const Event& event, const Motion& m) const;
  InterpreterOptions interpreter_options() const;
  void fixtures(const SimTool& tool, const Point3& from, const Point3& to, int line);
  const SimTool* tool_for(const Event& event);

  const Job& job_;
  const CheckOptions& options_;
  FindingSink sink_;
  PlannerRules rules_;
  std::vector<SimTool> tools_;
  std::set<int> unknown_reported_;
  bool no_tool_reported_ = false;
  int hand_changed_ = 0;  // tool fitted by hand at a program stop
  int end_line_ = 0;
  long moves_ = 0;
  Point3 start_origin_;  // origin of the system the program starts in, machine coordinates
};

Motion Checker::in_job_frame(const Event& event, const Motion& m) const {
  const ProgramSetup& setup = job_.program;
  const Point3& w = event.state.work_offset_mm;
  const Point3& g92 = event.state.axis_offset_mm;
  const Point3 d{w.x + g92.x - start_origin_.x, w.y + g92.y - start_origin_.y,
                 w.z + g92.z - start_origin_.z};
  const auto moved = [&](const Point3& p) { return Point3{p.x + d.x, p.y + d.y, p.z + d.z}; };
  const auto segment = [&](const PathSegment& s) {
    PathSegment out{moved(s.start), moved(s.end), s.arc};
    if (out.arc) out.arc->centre = moved(s.arc->centre);
    return program_to_job(setup, out);
  };
  Motion out = m;
  out.programmed = segment(m.programmed);
  for (PathSegment& s : out.tool_centre) s = segment(s);
  return out;
}

// The job's offsets and homes become the control's parameters, in the job's
// units (NISTIR 6556 parameter table, from memory: #5161-#5163 G28 home,
// #5181-#5183 G30 home, #5221 + 20 (n - 1) the origin of system n).
InterpreterOptions Checker::interpreter_options() const {
  const ProgramSetup& setup = job_.program;
  InterpreterOptions io;
  for (const Tool& t : job_.tools) io.tools.push_back({t.number, t.diameter / 2, 0});
  io.initial_units = job_.units;
  io.missing_tools_are_zero = true;
  const auto put = [&](int first, const Point3& p) {
    io.parameters.emplace_back(first, from_mm(p.x, job_.units));
    io.parameters.emplace_back(first + 1, from_mm(p.y, job_.units));
    io.parameters.emplace_back(first + 2, from_mm(p.z, job_.units));
  };
  for (std::size_t n = 0; n < setup.offsets.size(); ++n)
    if (setup.offsets[n]) put(5221 + 20 * static_cast<int>(n), *setup.offsets[n]);
  // A return with no home given goes straight up, to 250 mm / 10 in above
  // the top face (the top of a mill's Z travel is far above the work;
  // common practice, no source).
  const double rise = start_origin_.z - setup.zero.z + by_units(job_.units, 10, 250);
  if (setup.g28_home)
    put(5161, *setup.g28_home);
  else
    io.g28_rise_to_mm = rise;
  if (setup.g30_home)
    put(5181, *setup.g30_home);
  else
    io.g30_rise_to_mm = rise;
  io.start_mm = job_to_program(setup, {0, 0, rules_.safe_z});
  return io;
}

const SimTool* Checker::tool_for(const Event& event) {
  // A control without a tool changer stops (M0/M1) for the operator to fit
  // the tool the last T word named: from such a stop on, that tool is in.
  const int number = hand_changed_ != 0 && hand_changed_ == event.state.selected_tool
                         ? hand_changed_
                         : (event.state.tool != 0 ? event.state.tool : event.state.selected_tool);
  for (const SimTool& t : tools_)
    if (t.number == number) return &t;
  const auto& m = std::get<Motion>(event.body);
  const bool low = std::min(m.programmed.start.z, m.programmed.end.z) < 0;
  if (number == 0) {
    if (low && !no_tool_reported_) {
      no_tool_reported_ = true;
      sink_.add({.kind = FindingKind::UnknownTool,
                 .severity = Severity::Warning,
                 .line = event.line,
                 .named_by = ToolWord::None});
    }
    return nullptr;
  }
  if (unknown_reported_.insert(number).second) unknown_tool(event.line, number, ToolWord::T);
  return nullptr;
}

void Checker::unknown_tool(int line, int number, ToolWord named_by) {
  sink_.add({.kind = FindingKind::UnknownTool,
             .severity = Severity::Error,
             .line = line,
             .amount = static_cast<double>(number),
             .tool = number,
             .named_by = named_by});
}

void Checker::fixtures(const SimTool& tool, const Point3& from, const Point3& to, int line) {
  for (std::size_t i = 0; i < job_.fixtures.size(); ++i) {
    if (auto part = detail::body_meets_box(tool.body, from, to, job_.fixtures[i])) {
      sink_.add({.kind = FindingKind::FixtureCollision,
                 .severity = Severity::Error,
                 .line = line,
                 .tool = tool.number,
                 .part = part,
                 .fixture = static_cast<int>(i)});
      return;
    }
  }
}

void Checker::motion(const Event& event, const Motion& m, StationSimulator& sim) {
  ++moves_;
  const SimTool* tool = tool_for(event);
  if (!tool) return;
  const bool spindle_on =
      event.state.spindle != SpindleDirection::Stopped && event.state.spindle_rpm > 0;
  const detail::PlanRect outline{stock_left_x(job_), stock_right_x(job_), 0, job_.stock.length};
  for (const PathSegment& seg : m.tool_centre) {
    MoveFacts facts{.line = event.line,
                    .kind = m.kind,
                    .spindle_on = spindle_on,
                    .plunging = seg.end.z < seg.start.z - 1e-9};
    if (seg.arc) {
      if (seg.arc->plane != Plane::XY) facts.plunging = true;  // part of it runs downward
      sim.arc(*tool, seg, facts);
      if (!job_.fixtures.empty()) {
        const auto points = path_points(seg, 0.01);
        for (std::size_t i = 0; i + 1 < points.size(); ++i)
          fixtures(*tool, points[i], points[i + 1], event.line);
      }
      continue;
    }
    sim.line(*tool, seg.start, seg.end, facts);
    fixtures(*tool, seg.start, seg.end, event.line);
    if (m.kind != MotionKind::Rapid) continue;
    const double radius = tool->body.sections.front().max_radius();
    if (auto below = detail::rapid_below(seg.start, seg.end, rules_.safe_z, radius, outline))
      sink_.add({.kind = FindingKind::RapidBelowSafeHeight,
                 .severity = Severity::Warning,
                 .line = event.line,
                 .amount = *below,
                 .limit = rules_.safe_z,
                 .tool = tool->number});
  }
}

void Checker::prepare_tools() {
  rules_ = planner_rules(job_);
  for (const Tool& t : job_.tools) {
    detail::CutterLimits limits{
        .floor_skin = rules_.floor_skin,
        .skin_across = std::max(rules_.floor_skin, default_floor_skin(job_.units))};
    for (const auto& [number, l] : rules_.radial_limits)
      if (number == t.number) limits.radial_step = l;
    tools_.push_back(detail::make_sim_tool(t, static_cast<int>(tools_.size()), limits));
  }
}

// The stations, each with the finished part it must hold (one shared target
// unless a flank tapers), and the stock rectangle in all of them.
StationSimulator Checker::make_simulator() {
  const std::vector<double> ys = station_positions(job_, options_.stations);
  const Tolerance& tol = job_.dovetail.tolerance;
  const double allowance = std::max((tol.upper - tol.lower) / 2, 0.001);
  const bool tapered = flank_taper_slope(job_.dovetail, Side::Left) != 0 ||
                       flank_taper_slope(job_.dovetail, Side::Right) != 0;
  std::vector<StationTarget> targets;
  for (std::size_t i = 0; i < ys.size(); ++i)
    if (tapered || i == 0)
      targets.push_back(target_at(job_, ys[i], static_cast<int>(i), allowance));
    else
      targets.push_back(targets.front());
  const SectionRegion stock =
      SectionRegion::rectangle(stock_left_x(job_), -job_.stock.height, stock_right_x(job_), 0);
  return StationSimulator(ys, std::move(targets), stock, sink_);
}

void Checker::home_return(const Event& event, const Motion& m) {
  const bool home_given = m.home_return == 28   ? job_.program.g28_home.has_value()
                          : m.home_return == 30 ? job_.program.g30_home.has_value()
                                                : true;
  if (!home_given)
    sink_.add({.kind = FindingKind::HomeNotGiven,
               .severity = Severity::Warning,
               .line = event.line,
               .home_return = m.home_return});
}

void Checker::missing_tool(const Event& event, const MissingTool& missing) {
  if (unknown_reported_.insert(missing.tool).second)
    unknown_tool(event.line, missing.tool, missing.word == 'D' ? ToolWord::D : ToolWord::H);
}

void Checker::tool_change(const Event& event, const ToolChange& change) {
  hand_changed_ = 0;
  if (change.tool != 0 && !find_tool(job_, change.tool) &&
      unknown_reported_.insert(change.tool).second)
    unknown_tool(event.line, change.tool, ToolWord::M6);
}

void Checker::spindle_change(const Event& event, const SpindleChange& spindle) {
  const auto& max = job_.machine.max_rpm;
  if (max && spindle.direction != SpindleDirection::Stopped && spindle.rpm > *max * 1.000001)
    sink_.add({.kind = FindingKind::SpindleSpeed,
               .severity = Severity::Warning,
               .line = event.line,
               .amount = spindle.rpm,
               .limit = *max});
}

void Checker::program_end(const Event& event, const ProgramEnd& end, CheckReport& report) {
  report.end = end.how;
  end_line_ = event.line;
  if (end.how == EndKind::EndOfInput)
    sink_.add(
        {.kind = FindingKind::NoProgramEnd, .severity = Severity::Warning, .line = event.line});
}

void Checker::handle(const Event& event, StationSimulator& sim, CheckReport& report) {
  if (const auto* m = std::get_if<Motion>(&event.body)) {
    home_return(event, *m);
    motion(event, in_job_frame(event, *m), sim);
  } else if (const auto* missing = std::get_if<MissingTool>(&event.body)) {
    missing_tool(event, *missing);
  } else if (std::holds_alternative<Stop>(event.body)) {
    if (event.state.selected_tool != event.state.tool) hand_changed_ = event.state.selected_tool;
  } else if (const auto* change = std::get_if<ToolChange>(&event.body)) {
    tool_change(event, *change);
  } else if (const auto* spindle = std::get_if<SpindleChange>(&event.body)) {
    spindle_change(event, *spindle);
  } else if (const auto* end = std::get_if<ProgramEnd>(&event.body)) {
    program_end(event, *end, report);
  }
}

void Checker::read_program(ProgramSource& program, StationSimulator& sim, CheckReport& report) {
  start_origin_ = job_.program.offsets[0].value_or(Point3{});
  Rs274Interpreter reader(program, interpreter_options());
  long next_progress = options_.progress_every;
  while (auto event = reader.next()) {
    if (options_.progress && event->line >= next_progress) {
      options_.progress(event->line);
      next_progress = event->line + options_.progress_every;
    }
    report.lines = event->line;
    if (event->line > options_.max_lines)
      throw InputError(fmt::format("the program is longer than {} lines; a dovetail program is "
                                   "far shorter: is this the right file?",
                                   options_.max_lines),
                       {program.name(), event->line}, "program length");
    handle(*event, sim, report);
  }
  sim.flush();
  if (options_.progress) options_.progress(report.lines);
}

CheckReport Checker::run(ProgramSource& program) {
  prepare_tools();
  StationSimulator sim = make_simulator();
  CheckReport report;
  report.program = program.name();
  report.setup = job_.program;
  for (const Fixture& f : job_.fixtures) report.fixtures.push_back(f.name);
  read_program(program, sim, report);
  report.units = job_.units;
  report.type = job_.dovetail.type;
  report.tolerance = job_.dovetail.tolerance;
  report.moves = moves_;
  detail::measure_stations(job_, sim, sink_, end_line_, report);
  report.findings = sink_.take_findings();
  report.counts = sink_.counts();
  return report;
}

}  // namespace

std::vector<double> station_positions(const Job& job, int stations) {
  const double margin = by_units(job.units, 0.04, 1);
  const double radius = largest_tool_radius(job);
  const Ends ends = job.dovetail.ends;
  const double start = ends == Ends::Closed ? radius : 0;
  const double end = ends == Ends::Open ? job.dovetail.length : job.dovetail.length - radius;
  double lo = start + margin, hi = end - margin;
  if (hi < lo) lo = hi = (start + end) / 2;
  std::vector<double> ys;
  if (stations == 1) return {(lo + hi) / 2};
  ys.reserve(static_cast<std::size_t>(stations));
  for (int i = 0; i < stations; ++i) ys.push_back(lo + (hi - lo) * i / (stations - 1));
  return ys;
}

CheckReport check(ProgramSource& program, const Job& job, const CheckOptions& options) {
  if (options.stations < 1 || options.stations > 1000)
    throw InputError(fmt::format("{} stations: give 1 to 1000", options.stations), {}, "stations");
  return Checker(job, options).run(program);
}

}  // namespace dovetailor
