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

std::string format_plan(const Plan& plan) {
  const Job& job = plan.job;
  const Show s{job.units};
  const auto& t = plan.target;
  const bool female = t.type == DovetailType::Female;
  std::string out;
  const auto line = [&](const std::string& text) { out += text + "\n"; };
  line(fmt::format("Cutting plan: {}", job.part.name.empty() ? job.source : job.part.name));
  out += wrap(fmt::format("{} dovetail {:g} deg, {} angled, depth {}; all lengths in {}.",
                          female ? "Female" : "Male", t.angle,
                          t.angled_flanks() == 2 ? "both flanks" : "one flank", shown(t.depth, s.u),
                          unit_name(job.units)),
              "", "");
  line(fmt::format("Width as cut: {} at the base plane, {} at the top plane.",
                   shown(t.width_bottom(), s.u), shown(t.width_top(), s.u)));
  if (job.gauge)
    out += wrap(
        fmt::format("Final reading {} of {}: {} (good from {:n} to {}).",
                    method_words(plan.final_reading), shown(job.gauge->pin_diameter, s.u),
                    shown(plan.final_reading.value, s.u), shown(final_reading_band(plan).low, s.u),
                    shown(final_reading_band(plan).high, s.u)),
        "", "");
  line("");
  out += safety_cautions();
  line("");
  line("Tools");
  for (const auto& tool : job.tools) {
    const auto passes = detail::passes_of_tool(plan, tool.number);
    if (!passes.empty()) line(tool_line(tool, passes, s));
  }
  int op_number = 0;
  for (const auto& op : plan.operations) {
    line("");
    line(fmt::format("Operation {}: {} with T{}", ++op_number, operation_title(op), op.tool));
    out += wrap(fmt::format("Entry: {}.", entry_words(op, job.dovetail.ends)), "  ", "    ");
    line(fmt::format("  {:>4} {:<6} {:<6} {:>8} {:>8} {:>7} {:>7} {:>6} {:<5} {:>7}", "Pass",
                     "Role", "Side", "X", "Z", "Step", "Left", "Feed", "Mode", "Bend"));
    for (const auto& p : op.passes) {
      line(fmt::format("  {:>4} {:<6} {:<6} {:>8} {:>8n} {:>7n} {:>7n} {:>6} {:<5} {:>7}", p.number,
                       role_name(p.role), side_name(p.side),
                       fmt::format("{:n}", shown(p.x, s.u)) + (p.taper_slope != 0 ? "*" : ""),
                       shown(p.z, s.u), shown(p.radial_step, s.u), shown(p.stock_left, s.u),
                       s.feed(p.feed), mode_name(p.mode),
                       p.deflection > 0 ? fmt::format("{:n}", shown(p.deflection, s.u)) : "-"));
      for (const auto& c : plan.checkpoints)
        if (c.after_pass == p.number)
          line(fmt::format("  ---- STOP: checkpoint \"{}\" (see below) ----", c.name));
    }
    bool taper = false;
    for (const auto& p : op.passes) taper = taper || p.taper_slope != 0;
    if (taper) line("  * X at the front end; the pass runs at the gib's taper along Y.");
  }
  line("");
  out += wrap(fmt::format("X: tool axis; Z: tool tip; Step: new radial engagement; Left: "
                          "stock left on that flank or wall; Feed in {}; Bend: predicted cutter "
                          "deflection.",
                          s.feed_unit()),
              "  ", "  ");
  int letter = 0;
  for (const auto& c : plan.checkpoints) {
    line("");
    line(fmt::format("Checkpoint {}: {} (after pass {})", static_cast<char>('A' + letter++), c.name,
                     c.after_pass));
    line("  Stop the spindle, clear the chips, deburr the edges the pins touch.");
    if (job.gauge) {
      out += wrap(fmt::format("Measure {} of {}: expect {} (final {}).", method_words(c.expected),
                              shown(job.gauge->pin_diameter, s.u), shown(c.expected.value, s.u),
                              shown(c.final_reading.value, s.u)),
                  "  ", "  ");
      if (c.reference_reading)
        line(fmt::format("  Or with one pin on the right flank, from the left stock face: {}.",
                         shown(*c.reference_reading, s.u)));
    }
    line(fmt::format("  Stock left on {}: {} laterally ({} square to the flank).",
                     t.angled_flanks() == 2 ? "each flank" : "the flank",
                     shown(c.remaining_per_flank, s.u), shown(c.remaining_normal, s.u)));
    line(fmt::format("  Depth from the top face: {}.", shown(c.expected_depth, s.u)));
    if (job.gauge) {
      out += wrap(correction_rule(plan, c), "  ", "  ");
      const std::string taper = detail::taper_words(c, job.dovetail.length, s);
      if (!taper.empty()) out += wrap(taper, "  ", "  ");
    }
  }
  if (!plan.notes.empty()) {
    line("");
    line("Notes");
    for (const auto& n : note_texts(plan)) out += wrap(n, "  - ", "    ");
  }
  if (!plan.warnings.empty()) {
    line("");
    line("Warnings");
    for (const auto& w : warning_texts(plan)) out += wrap(w, "  ! ", "    ");
  }
  return out;
}

}  // namespace dovetailor
