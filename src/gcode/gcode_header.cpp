// The comment text of a program: its header and the checkpoint stops.

#include <cmath>

#include <fmt/format.h>

#include <dovetailor/base/caution.hpp>
#include <dovetailor/base/length.hpp>
#include <dovetailor/base/text_wrap.hpp>
#include <dovetailor/job/job_words.hpp>
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
std::string tool_words(const Tool& t, const Plan& plan, Units u) {
  const std::string_view material = text_of(t.material);
  const PassFeeds f = pass_feeds(passes_of_tool(plan, t.number));
  const std::string cutting =
      fmt::format("{}, {}", rpm_words(f, "rpm"),
                  feed_words(
                      f, [&](double v) { return UnitText{u}.feed(v); }, UnitText{u}.feed_unit()));
  if (t.kind == ToolKind::EndMill)
    return fmt::format("T{} end mill {} dia, {} flutes, {}; {}", t.number, shown(t.diameter, u),
                       t.flutes, material, cutting);
  return fmt::format(
      "T{} dovetail cutter {} dia x {:g} deg, {} flutes, neck {}, corner radius {}, {}; {}",
      t.number, shown(t.diameter, u), t.angle, t.flutes, shown(t.neck_diameter, u),
      shown(t.corner_radius, u), material, cutting);
}

const Tool* cutter_of(const Plan& plan) {
  for (const auto& op : plan.operations)
    if (op.kind == OperationKind::Undercut) return find_tool(plan.job, op.tool);
  return nullptr;
}

std::string sizing_words(const Plan& plan, const Post& post, SizingStyle style, Units u) {
  const bool female = plan.target.type == DovetailType::Female;
  const int n = plan.target.angled_flanks();
  const double thou = plan.job.units == Units::Inch ? to_mm(0.001, Units::Inch) : 0.01;
  const std::string reading_change =
      fmt::format("the pin reading {} by {}", female ? "drops" : "rises", shown(n * thou, u));
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
          t, shown(cutter ? cutter->diameter : 0, u), shown(cutter ? cutter->diameter / 2 : 0, u),
          shown(thou, u), reading_change);
    case SizingStyle::Parameters:
      return fmt::format(
          "SIZING: the finishing passes' X words read [base - #n] or [base + #n]: #{} for the "
          "left flank, #{} for the right flank, both set to 0 below. Raising #n by {} moves that "
          "flank's cut {} away from the material and leaves more stock; with both raised {}; "
          "lowering it moves the cut toward the material. Rerun from the first finishing pass.",
          flank_parameter(Side::Left), flank_parameter(Side::Right), shown(thou, u), shown(thou, u),
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

// The stock, the target and its final reading.
void part_lines(std::vector<std::string>& out, const Plan& plan, Units u) {
  const Job& job = plan.job;
  const auto& t = plan.target;
  out.push_back(fmt::format("stock {:n} x {:n} x {}, X by Y by Z, below Z0",
                            shown(job.stock.width, u), shown(job.stock.length, u),
                            shown(job.stock.height, u)));
  out.push_back(fmt::format(
      "target: {} dovetail {:g} deg, {}, depth {}, width {} at the base plane, {} at the top",
      key_of(t.type), t.angle, t.angled_flanks() == 2 ? "both flanks angled" : "one flank angled",
      shown(t.depth, u), shown(t.width_bottom(), u), shown(t.width_top(), u)));
  if (t.gib_side)
    out.push_back(fmt::format("gib on the {} flank: that flank is cut {} for it",
                              text_of(*t.gib_side), shown(t.gib_allowance, u)));
  if (job.gauge) {
    const ReadingBand band = final_reading_band(plan);
    out.push_back(fmt::format("final reading {} of {}: {}, good from {:n} to {}",
                              method_words(plan.final_reading), shown(job.gauge->pin_diameter, u),
                              shown(plan.final_reading.value, u), shown(band.low, u),
                              shown(band.high, u)));
  }
}

// Each tool once, in the order the operations first use it, and how tool
// lengths are set.
void tool_lines(std::vector<std::string>& out, const Plan& plan, const Post& post, Units u) {
  out.push_back("tools:");
  for (const auto& op : plan.operations) {
    bool seen = false;
    for (const auto& other : plan.operations) {
      if (&other == &op) break;
      seen = seen || other.tool == op.tool;
    }
    const Tool* tool = find_tool(plan.job, op.tool);
    if (tool && !seen) out.push_back(tool_words(*tool, plan, u));
  }
  if (!post.tool_length_offset)
    out.push_back(
        "no tool length offsets: touch off each tool on the top face, Z0, after the "
        "change");
}

std::string coolant_line(CoolantChoice coolant, const Post& post) {
  switch (coolant) {
    case CoolantChoice::Flood:
      return fmt::format("coolant: flood, M{}, as asked when the program was written",
                         post.coolant.flood.value_or(0));
    case CoolantChoice::Mist:
      return fmt::format("coolant: mist, M{}, as asked when the program was written",
                         post.coolant.mist.value_or(0));
    case CoolantChoice::Off:
      break;
  }
  return "coolant: none, cut dry";
}

}  // namespace

std::vector<std::string> header_lines(const Plan& plan, const Post& post,
                                      const ProgramOptions& options, Units units,
                                      SizingStyle style) {
  const Job& job = plan.job;
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
  part_lines(out, plan, units);
  tool_lines(out, plan, post, units);
  out.push_back(coolant_line(options.coolant, post));
  out.push_back(sizing_words(plan, post, style, units));
  // The plan's warnings, as the text plan gives them (the writer makes
  // parentheses in them brackets, so no comment nests).
  for (const auto& w : warning_texts(plan)) out.push_back("WARNING: " + w);
  for (const Caution& c : cautions)
    out.push_back(fmt::format("{}{}", &c == &cautions.front() ? "CAUTION: " : "",
                              caution_line(c, CautionForm::Short)));
  return out;
}

std::vector<std::string> checkpoint_lines(const Plan& plan, const Checkpoint& c, char letter,
                                          Units units, SizingStyle style) {
  const Units u = units;
  const Job& job = plan.job;
  const int n = plan.target.angled_flanks();
  std::vector<std::string> out;
  out.push_back(
      fmt::format("CHECKPOINT {}: {}, after pass {}. Spindle stopped: clear the "
                  "chips, deburr the edges the pins touch.",
                  letter, c.name, c.after_pass));
  if (job.gauge) {
    out.push_back(fmt::format("Measure {} of {}: expect {}, final {}.", method_words(c.expected),
                              shown(job.gauge->pin_diameter, u), shown(c.expected.value, u),
                              shown(c.final_reading.value, u)));
    if (c.reference_reading)
      out.push_back(fmt::format("Or with one pin on the right flank, from the left stock face: {}.",
                                shown(*c.reference_reading, u)));
  }
  out.push_back(fmt::format("Check the depth from the top face: {}.", shown(c.expected_depth, u)));
  out.push_back(fmt::format("Stock left on {}: {} laterally.", n == 2 ? "each flank" : "the flank",
                            shown(c.remaining_per_flank, u)));
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

}  // namespace dovetailor::detail
