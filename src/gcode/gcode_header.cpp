// The comment text of a program: its header and the checkpoint stops.

#include <cmath>

#include <fmt/format.h>

#include <dovetailor/base/text_wrap.hpp>
#include <dovetailor/report/plan_note_text.hpp>
#include <dovetailor/report/plan_report.hpp>

#include "gcode_writer_detail.hpp"
#include "report/unit_text.hpp"

namespace dovetailor::detail {
namespace {

std::string file_name(const std::string& path) {
  const auto slash = path.find_last_of("/\\");
  return slash == std::string::npos ? path : path.substr(slash + 1);
}

// The tool with the speeds and feeds its passes run at (the F and S words).
std::string tool_words(const Tool& t, const Plan& plan, const ProgramShow& s) {
  const std::string material = t.material == ToolMaterial::Hss ? "HSS" : "carbide";
  const UnitText u{s.units};
  const PassFeeds f = pass_feeds(passes_of_tool(plan, t.number));
  const std::string cutting =
      fmt::format("{}, {}", rpm_words(f, "rpm"),
                  feed_words(
                      f, [&](double v) { return u.feed(v); }, u.feed_unit()));
  if (t.kind == ToolKind::EndMill)
    return fmt::format("T{} end mill {} dia, {} flutes, {}; {}", t.number, s.len(t.diameter),
                       t.flutes, material, cutting);
  return fmt::format(
      "T{} dovetail cutter {} dia x {:g} deg, {} flutes, neck {}, corner radius {}, {}; {}",
      t.number, s.len(t.diameter), t.angle, t.flutes, s.len(t.neck_diameter),
      s.len(t.corner_radius), material, cutting);
}

const Tool* cutter_of(const Plan& plan) {
  for (const auto& op : plan.operations)
    if (op.kind == OperationKind::Undercut) return find_tool(plan.job, op.tool);
  return nullptr;
}

std::string sizing_words(const Plan& plan, const Post& post, SizingStyle style,
                         const ProgramShow& s) {
  const bool female = plan.target.type == DovetailType::Female;
  const int n = plan.target.angled_flanks();
  const double thou = plan.job.units == Units::Inch ? to_mm(0.001, Units::Inch) : 0.01;
  const std::string reading_change =
      fmt::format("the pin reading {} by {}", female ? "drops" : "rises", s.len(n * thou));
  const Tool* cutter = cutter_of(plan);
  const int t = cutter ? cutter->number : 0;
  switch (style) {
    case SizingStyle::CutterCompensation:
      return fmt::format(
          "SIZING: the finishing passes of T{0}, semi-finish, finish and spring, run with cutter "
          "radius compensation G41/G42 D{0} along the flank line. Set D{0} to the cutter's "
          "large diameter {1}, radius {2}, as your control's tool table expects it. A positive "
          "wear offset on D{0} leaves more stock: each {3} of radius leaves {3} more on each "
          "flank and {4}. A negative one cuts deeper. Rerun from the first finishing pass.",
          t, s.len(cutter ? cutter->diameter : 0), s.len(cutter ? cutter->diameter / 2 : 0),
          s.len(thou), reading_change);
    case SizingStyle::Parameters:
      return fmt::format(
          "SIZING: the finishing passes' X words read [base - #n] or [base + #n]: #{} for the "
          "left flank, #{} for the right flank, both set to 0 below. Raising #n by {} moves that "
          "flank's cut {} away from the material and leaves more stock; with both raised {}; "
          "lowering it moves the cut toward the material. Rerun from the first finishing pass.",
          flank_parameter(Side::Left), flank_parameter(Side::Right), s.len(thou), s.len(thou),
          reading_change);
    case SizingStyle::Plain:
      break;
  }
  std::string why = post.cutter_compensation && plan.job.dovetail.ends != Ends::Open
                        ? "cutter compensation is not used because the dovetail is closed at the "
                          "back end (compensation must start and end outside the stock) and "
                        : "";
  return "SIZING: " + why +
         "this control takes no compensation or parameters here: the program follows the "
         "cutter's axis. After measuring, run dovetailor trim for a short corrective program.";
}

}  // namespace

std::vector<std::string> header_lines(const Plan& plan, const Post& post,
                                      const ProgramOptions& options, Units units,
                                      SizingStyle style) {
  const ProgramShow s{units};
  const Job& job = plan.job;
  const auto& t = plan.target;
  const bool female = t.type == DovetailType::Female;
  const std::string part = job.part.name.empty() ? file_name(job.source) : job.part.name;
  std::vector<std::string> out;
  out.push_back(options.title.empty() ? "dovetailor program: " + part : options.title);
  out.push_back(fmt::format("job file {}; post {}", file_name(job.source), post.name));
  if (!options.date.empty()) out.push_back("written " + options.date);
  out.push_back(fmt::format("units: {}, {}; feeds in {}/min", unit_name(units),
                            units == Units::Inch ? "G20" : "G21", unit_symbol(units)));
  out.push_back(
      "work zero, set in the active work offset: top face of the stock, on the dovetail centre "
      "line, "
      "at the front end; the slide runs along +Y");
  out.push_back(fmt::format("stock {} x {} x {}, X by Y by Z, below Z0", s.num(job.stock.width),
                            s.num(job.stock.length), s.len(job.stock.height)));
  out.push_back(fmt::format(
      "target: {} dovetail {:g} deg, {}, depth {}, width {} at the base plane, {} at the top",
      female ? "female" : "male", t.angle,
      t.angled_flanks() == 2 ? "both flanks angled" : "one flank angled", s.len(t.depth),
      s.len(t.width_bottom()), s.len(t.width_top())));
  if (t.gib_side)
    out.push_back(fmt::format("gib on the {} flank: that flank is cut {} for it",
                              *t.gib_side == Side::Left ? "left" : "right",
                              s.len(t.gib_allowance)));
  if (job.gauge) {
    const ReadingBand band = final_reading_band(plan);
    out.push_back(fmt::format("final reading {} of {}: {}, good from {} to {}",
                              method_words(plan.final_reading), s.len(job.gauge->pin_diameter),
                              s.len(plan.final_reading.value), s.num(band.low), s.len(band.high)));
  }
  out.push_back("tools:");
  for (const auto& op : plan.operations) {
    bool seen = false;
    for (const auto& other : plan.operations) {
      if (&other == &op) break;
      seen = seen || other.tool == op.tool;
    }
    const Tool* tool = find_tool(job, op.tool);
    if (tool && !seen) out.push_back(tool_words(*tool, plan, s));
  }
  if (!post.tool_length_offset)
    out.push_back(
        "no tool length offsets: touch off each tool on the top face, Z0, after the "
        "change");
  switch (options.coolant) {
    case CoolantChoice::Flood:
      out.push_back(fmt::format("coolant: flood, M{}, as asked when the program was written",
                                post.coolant.flood.value_or(0)));
      break;
    case CoolantChoice::Mist:
      out.push_back(fmt::format("coolant: mist, M{}, as asked when the program was written",
                                post.coolant.mist.value_or(0)));
      break;
    case CoolantChoice::Off:
      out.push_back("coolant: none, cut dry");
      break;
  }
  out.push_back(sizing_words(plan, post, style, s));
  // The plan's warnings, as the text plan gives them (the writer makes
  // parentheses in them brackets, so no comment nests).
  for (const auto& w : warning_texts(plan)) out.push_back("WARNING: " + w);
  out.push_back(
      "CAUTION: advice, not a guarantee. Secure the work and the tool; guards and eye "
      "protection. Measure only with the spindle stopped. Never plunge the dovetail cutter or "
      "raise it under the overhang; light cuts; clear the chips. Follow your shop's rules.");
  out.push_back(
      "VERIFY BY DRY RUN BEFORE CUTTING: run it above the work, in single block, with the feed "
      "override low, and read every line first.");
  return out;
}

std::vector<std::string> checkpoint_lines(const Plan& plan, const Checkpoint& c, char letter,
                                          Units units, SizingStyle style) {
  const ProgramShow s{units};
  const Job& job = plan.job;
  const int n = plan.target.angled_flanks();
  std::vector<std::string> out;
  out.push_back(
      fmt::format("CHECKPOINT {}: {}, after pass {}. Spindle stopped: clear the "
                  "chips, deburr the edges the pins touch.",
                  letter, c.name, c.after_pass));
  if (job.gauge) {
    out.push_back(fmt::format("Measure {} of {}: expect {}, final {}.", method_words(c.expected),
                              s.len(job.gauge->pin_diameter), s.len(c.expected.value),
                              s.len(c.final_reading.value)));
    if (c.reference_reading)
      out.push_back(fmt::format("Or with one pin on the right flank, from the left stock face: {}.",
                                s.len(*c.reference_reading)));
  }
  out.push_back(fmt::format("Check the depth from the top face: {}.", s.len(c.expected_depth)));
  out.push_back(fmt::format("Stock left on {}: {} laterally.", n == 2 ? "each flank" : "the flank",
                            s.len(c.remaining_per_flank)));
  if (job.gauge) {
    out.push_back("Rule, in job units: " + correction_rule(plan, c));
    const std::string taper = taper_words(c, job.dovetail.length, UnitText{units});
    if (!taper.empty()) out.push_back(taper);
  }
  switch (style) {
    case SizingStyle::CutterCompensation:
      out.push_back(
          "To correct: change the wear offset on D of the dovetail cutter, or run "
          "dovetailor trim with the reading.");
      break;
    case SizingStyle::Parameters:
      out.push_back(fmt::format(
          "To correct: change #{} for the left flank or #{} for the right, or run dovetailor "
          "trim with the reading.",
          flank_parameter(Side::Left), flank_parameter(Side::Right)));
      break;
    case SizingStyle::Plain:
      out.push_back("To correct: run dovetailor trim with the reading.");
      break;
  }
  return out;
}

std::string ProgramShow::num(double mm) const {
  std::string text = fmt::format("{:.{}f}", from_mm(mm, units), length_decimals(units));
  if (text.starts_with("-") && text.find_first_not_of("-0.") == std::string::npos) text.erase(0, 1);
  return text;
}

std::string ProgramShow::len(double mm) const {
  return num(mm) + " " + std::string(unit_symbol(units));
}

}  // namespace dovetailor::detail
