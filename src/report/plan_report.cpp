#include <cmath>

#include <fmt/format.h>

#include <dovetailor/base/caution.hpp>
#include <dovetailor/base/length.hpp>
#include <dovetailor/base/text_wrap.hpp>
#include <dovetailor/job/job_words.hpp>
#include <dovetailor/report/plan_note_text.hpp>
#include <dovetailor/report/plan_report.hpp>

#include "unit_text.hpp"

namespace dovetailor {
namespace {

using Show = detail::UnitText;
using detail::method_words;
using detail::role_name;
using detail::side_name;

// A pass's milling mode for the table column: "conv", "climb", "both".
std::string mode_name(MillingMode m) {
  return m == MillingMode::Conventional ? "conv" : std::string(key_of(m));
}

std::string tool_line(const Tool& t, const std::vector<const Pass*>& passes, const Show& s) {
  std::string what =
      t.kind == ToolKind::EndMill
          ? fmt::format("end mill {} dia, {} flutes, {}", shown(t.diameter, s.u), t.flutes,
                        text_of(t.material))
          : fmt::format("dovetail cutter {} dia x {:g} deg, {} flutes, neck {:n}, {}",
                        shown(t.diameter, s.u), t.angle, t.flutes, shown(t.neck_diameter, s.u),
                        text_of(t.material));
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
  static const std::string text = wrap(caution_paragraph(), "", "");
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
        "Good from {:n} to {}. A reading {} {} means stock is left: {} has {} to cut for every "
        "{} of difference; take a trim pass. A reading {} {} means the flanks are cut past "
        "size: stop and decide with the mating part.",
        shown(low, s.u), shown(high, s.u), female ? "below" : "above", shown(trim_from, s.u), each,
        shown(per, s.u), shown(unit, s.u), female ? "above" : "below",
        shown(female ? high : low, s.u));
  }
  std::string rule = fmt::format(
      "Every {} the reading is {} than {:n} leaves {} less on {} ({} more when it is {}).",
      shown(unit, s.u), female ? "larger" : "smaller", shown(c.expected.value, s.u),
      shown(per, s.u), each, shown(per, s.u), female ? "smaller" : "larger");
  // remaining(error) = remaining + error * correction_per_reading reaches zero here.
  const double at_size = c.expected.value - c.remaining_per_flank / c.correction_per_reading;
  rule +=
      fmt::format(" A reading {} {} means {} is already at size: stop, do not take the next pass.",
                  female ? "at or above" : "at or below", shown(at_size, s.u), each);
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
                          t.angled_flanks() == 2 ? "both flanks" : "one flank", shown(t.depth, s.u),
                          unit_name(job.units)),
              "", "");
  out += fmt::format("Width as cut: {} at the base plane, {} at the top plane.\n",
                     shown(t.width_bottom(), s.u), shown(t.width_top(), s.u));
  if (job.gauge)
    out += wrap(
        fmt::format("Final reading {} of {}: {} (good from {:n} to {}).",
                    method_words(plan.final_reading), shown(job.gauge->pin_diameter, s.u),
                    shown(plan.final_reading.value, s.u), shown(final_reading_band(plan).low, s.u),
                    shown(final_reading_band(plan).high, s.u)),
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
  std::string out =
      fmt::format("Operation {}: {} with T{}\n", number, operation_title(op), op.tool);
  out += wrap(fmt::format("Entry: {}.", entry_words(op, plan.job.dovetail.ends)), "  ", "    ");
  out += fmt::format("  {:>4} {:<6} {:<6} {:>8} {:>8} {:>7} {:>7} {:>6} {:<5} {:>7}\n", "Pass",
                     "Role", "Side", "X", "Z", "Step", "Left", "Feed", "Mode", "Bend");
  bool taper = false;
  for (const auto& p : op.passes) {
    out += fmt::format("  {:>4} {:<6} {:<6} {:>8} {:>8n} {:>7n} {:>7n} {:>6} {:<5} {:>7}\n",
                       p.number, role_name(p.role), side_name(p.side),
                       fmt::format("{:n}", shown(p.x, s.u)) + (p.taper_slope != 0 ? "*" : ""),
                       shown(p.z, s.u), shown(p.radial_step, s.u), shown(p.stock_left, s.u),
                       s.feed(p.feed), mode_name(p.mode),
                       p.deflection > 0 ? fmt::format("{:n}", shown(p.deflection, s.u)) : "-");
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
                            shown(job.gauge->pin_diameter, s.u), shown(c.expected.value, s.u),
                            shown(c.final_reading.value, s.u)),
                "  ", "  ");
    if (c.reference_reading)
      out += fmt::format("  Or with one pin on the right flank, from the left stock face: {}.\n",
                         shown(*c.reference_reading, s.u));
  }
  out += fmt::format("  Stock left on {}: {} laterally ({} square to the flank).\n",
                     plan.target.angled_flanks() == 2 ? "each flank" : "the flank",
                     shown(c.remaining_per_flank, s.u), shown(c.remaining_normal, s.u));
  out += fmt::format("  Depth from the top face: {}.\n", shown(c.expected_depth, s.u));
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
  out += '\n';
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
  out += notes_and_warnings(plan);
  return out;
}

}  // namespace dovetailor
