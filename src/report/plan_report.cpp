#include <cmath>

#include <fmt/format.h>

#include <dovetailor/base/length_text.hpp>
#include <dovetailor/base/text_wrap.hpp>
#include <dovetailor/report/plan_note_text.hpp>
#include <dovetailor/report/plan_report.hpp>

#include "unit_text.hpp"

namespace dovetailor {
namespace {

using Show = detail::UnitText;
using detail::method_words;
using detail::role_name;
using detail::side_name;

std::string mode_name(MillingMode m) {
  switch (m) {
    case MillingMode::Conventional:
      return "conv";
    case MillingMode::Climb:
      return "climb";
    case MillingMode::Both:
      return "both";
  }
  return "";
}

std::string tool_line(const Tool& t, const std::vector<const Pass*>& passes, const Show& s) {
  std::string what =
      t.kind == ToolKind::EndMill
          ? fmt::format("end mill {} dia, {} flutes, {}", s.len(t.diameter), t.flutes,
                        t.material == ToolMaterial::Hss ? "HSS" : "carbide")
          : fmt::format("dovetail cutter {} dia x {:g} deg, {} flutes, neck {}, {}",
                        s.len(t.diameter), t.angle, t.flutes, s.num(t.neck_diameter),
                        t.material == ToolMaterial::Hss ? "HSS" : "carbide");
  std::string line = fmt::format("  T{:<3} {}", t.number, what);
  const detail::PassFeeds f = detail::pass_feeds(passes);
  const std::string cutting =
      fmt::format("{}; {}", detail::rpm_words(f, "rev/min"),
                  detail::feed_words(
                      f, [&](double v) { return s.feed(v); }, s.feed_unit()));
  for (const auto& part : wrap_words(cutting, 80 - 8)) line += "\n        " + part;
  return line;
}

// Words of `text` in lines of at most `width` columns, the first starting
// with `first`, the rest with `rest`.
std::string wrap(const std::string& text, const std::string& first, const std::string& rest,
                 std::size_t width = 80) {
  std::string out, row = first;
  bool empty = true;
  for (std::size_t start = 0; start <= text.size();) {
    std::size_t end = text.find(' ', start);
    if (end == std::string::npos) end = text.size();
    const std::string word = text.substr(start, end - start);
    start = end + 1;
    if (word.empty()) continue;
    if (!empty && row.size() + 1 + word.size() > width) {
      out += row + "\n";
      row = rest;
      empty = true;
    }
    row += (empty ? "" : " ") + word;
    empty = false;
  }
  return out + row + "\n";
}

}  // namespace

const std::string& safety_cautions() {
  static const std::string text =
      "CAUTION: these figures are advice, not a guarantee. Verify every program by a\n"
      "dry run above the work and in single block. Secure the work and the tool; use\n"
      "guards and eye protection; measure only with the spindle stopped. Dovetail\n"
      "cutters are fragile: never plunge them, take light cuts, clear the chips, and\n"
      "never raise one while it is under the overhang. Follow your shop's rules and\n"
      "the machine maker's instructions.\n";
  return text;
}

std::string correction_rule(const Plan& plan, const Checkpoint& c) {
  const Show s{plan.job.units};
  const bool female = plan.target.type == DovetailType::Female;
  const int n = plan.target.angled_flanks();
  const std::string each = n == 2 ? "each flank" : "the angled flank";
  const double unit = plan.job.units == Units::Inch ? to_mm(0.001, Units::Inch) : 0.01;
  const double per = std::abs(c.correction_per_reading) * unit;
  if (c.remaining_per_flank <= 0) {
    // After finishing: in tolerance, under size (trim), or over size.
    const auto [low, high] = final_reading_band(plan);
    const double trim_from = female ? low : high;
    return fmt::format(
        "Good from {} to {}. A reading {} {} means stock is left: {} has {} to cut for every "
        "{} of difference; take a trim pass. A reading {} {} means the flanks are cut past "
        "size: stop and decide with the mating part.",
        s.num(low), s.len(high), female ? "below" : "above", s.len(trim_from), each, s.len(per),
        s.len(unit), female ? "above" : "below", s.len(female ? high : low));
  }
  std::string rule = fmt::format(
      "Every {} the reading is {} than {} leaves {} less on {} ({} more when it is {}).",
      s.len(unit), female ? "larger" : "smaller", s.num(c.expected.value), s.len(per), each,
      s.len(per), female ? "smaller" : "larger");
  // remaining(error) = remaining + error * correction_per_reading reaches zero here.
  const double at_size = c.expected.value - c.remaining_per_flank / c.correction_per_reading;
  rule +=
      fmt::format(" A reading {} {} means {} is already at size: stop, do not take the next pass.",
                  female ? "at or above" : "at or below", s.len(at_size), each);
  return rule;
}

namespace {

// Title, the target section and the final reading.
std::string target_lines(const Plan& plan, const Show& s) {
  const Job& job = plan.job;
  const auto& t = plan.target;
  std::string out =
      fmt::format("Cutting plan: {}\n", job.part.name.empty() ? job.source : job.part.name);
  out += wrap(fmt::format("{} dovetail {:g} deg, {} angled, depth {}; all lengths in {}.",
                          t.type == DovetailType::Female ? "Female" : "Male", t.angle,
                          t.angled_flanks() == 2 ? "both flanks" : "one flank", s.len(t.depth),
                          unit_name(job.units)),
              "", "");
  out += fmt::format("Width as cut: {} at the base plane, {} at the top plane.\n",
                     s.len(t.width_bottom()), s.len(t.width_top()));
  if (job.gauge)
    out += wrap(fmt::format("Final reading {} of {}: {} (good from {} to {}).",
                            method_words(plan.final_reading), s.len(job.gauge->pin_diameter),
                            s.len(plan.final_reading.value), s.num(final_reading_band(plan).low),
                            s.len(final_reading_band(plan).high)),
                "", "");
  return out;
}

std::string tool_list(const Plan& plan, const Show& s) {
  std::string out = "Tools\n";
  for (const auto& tool : plan.job.tools) {
    const auto passes = detail::passes_of_tool(plan, tool.number);
    if (!passes.empty()) out += tool_line(tool, passes, s) + "\n";
  }
  return out;
}

// One operation: its title, how the tool enters and its pass table, with a
// STOP line after each pass a checkpoint follows.
std::string pass_table(const Plan& plan, const Operation& op, int number, const Show& s) {
  const auto row = [](const auto&... cells) {
    return fmt::format("  {:>4} {:<6} {:<6} {:>8} {:>8} {:>7} {:>7} {:>6} {:<5} {:>7}\n", cells...);
  };
  std::string out =
      fmt::format("Operation {}: {} with T{}\n", number, operation_title(op), op.tool);
  out += wrap(fmt::format("Entry: {}.", entry_words(op, plan.job.dovetail.ends)), "  ", "    ");
  out += row("Pass", "Role", "Side", "X", "Z", "Step", "Left", "Feed", "Mode", "Bend");
  bool taper = false;
  for (const auto& p : op.passes) {
    out += row(p.number, role_name(p.role), side_name(p.side),
               s.num(p.x) + (p.taper_slope != 0 ? "*" : ""), s.num(p.z), s.num(p.radial_step),
               s.num(p.stock_left), s.feed(p.feed), mode_name(p.mode),
               p.deflection > 0 ? s.num(p.deflection) : "-");
    for (const auto& c : plan.checkpoints)
      if (c.after_pass == p.number)
        out += fmt::format("  ---- STOP: checkpoint \"{}\" (see below) ----\n", c.name);
    taper = taper || p.taper_slope != 0;
  }
  if (taper) out += "  * X at the front end; the pass runs at the gib's taper along Y.\n";
  return out;
}

// One checkpoint: how to measure, the reading to expect, the stock left and
// the correction rule.
std::string checkpoint_section(const Plan& plan, const Checkpoint& c, char letter, const Show& s) {
  const Job& job = plan.job;
  std::string out =
      fmt::format("Checkpoint {}: {} (after pass {})\n", letter, c.name, c.after_pass);
  out += "  Stop the spindle, clear the chips, deburr the edges the pins touch.\n";
  if (job.gauge) {
    out += wrap(fmt::format("Measure {} of {}: expect {} (final {}).", method_words(c.expected),
                            s.len(job.gauge->pin_diameter), s.len(c.expected.value),
                            s.len(c.final_reading.value)),
                "  ", "  ");
    if (c.reference_reading)
      out += fmt::format("  Or with one pin on the right flank, from the left stock face: {}.\n",
                         s.len(*c.reference_reading));
  }
  out += fmt::format("  Stock left on {}: {} laterally ({} square to the flank).\n",
                     plan.target.angled_flanks() == 2 ? "each flank" : "the flank",
                     s.len(c.remaining_per_flank), s.len(c.remaining_normal));
  out += fmt::format("  Depth from the top face: {}.\n", s.len(c.expected_depth));
  if (job.gauge) {
    out += wrap(correction_rule(plan, c), "  ", "  ");
    const std::string taper = detail::taper_words(c, job.dovetail.length, s);
    if (!taper.empty()) out += wrap(taper, "  ", "  ");
  }
  return out;
}

// The notes, then the warnings, each under its heading; nothing when empty.
std::string notes_and_warnings(const Plan& plan) {
  std::string out;
  if (!plan.notes.empty()) {
    out += "\nNotes\n";
    for (const auto& n : note_texts(plan)) out += wrap(n, "  - ", "    ");
  }
  if (!plan.warnings.empty()) {
    out += "\nWarnings\n";
    for (const auto& w : warning_texts(plan)) out += wrap(w, "  ! ", "    ");
  }
  return out;
}

}  // namespace

std::string format_plan(const Plan& plan) {
  const Show s{plan.job.units};
  std::string out = target_lines(plan, s);
  out += '\n';
  out += safety_cautions();
  out += '\n';
  out += tool_list(plan, s);
  int op_number = 0;
  for (const auto& op : plan.operations) {
    out += '\n';
    out += pass_table(plan, op, ++op_number, s);
  }
  out += "\n";
  out += wrap(fmt::format("X: tool axis; Z: tool tip; Step: new radial engagement; Left: "
                          "stock left on that flank or wall; Feed in {}; Bend: predicted cutter "
                          "deflection.",
                          s.feed_unit()),
              "  ", "  ");
  int letter = 0;
  for (const auto& c : plan.checkpoints) {
    out += '\n';
    out += checkpoint_section(plan, c, static_cast<char>('A' + letter++), s);
  }
  return out + notes_and_warnings(plan);
}

}  // namespace dovetailor
