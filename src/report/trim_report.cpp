// The trim as text: the report for the terminal and the manual sheet.

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include <dovetailor/base/length.hpp>
#include <dovetailor/base/text_wrap.hpp>
#include <dovetailor/job/job_words.hpp>
#include <dovetailor/report/trim_report.hpp>

#include "unit_text.hpp"

namespace dovetailor {
namespace {

std::string side_words(Side side) { return fmt::format("{} flank", text_of(side)); }

std::string wrapped(const std::string& text, const std::string& indent = "") {
  std::string out;
  for (const auto& line : wrap_words(text, 80 - indent.size())) out += indent + line + "\n";
  return out;
}

// Travel of a pass's cut along Y, in words.
std::string travel_words(const Pass& p) {
  const double travel = p.cut_travel();
  if (std::abs(travel) <= 1e-9) return "along the slide";
  return travel > 0 ? "from the front end toward the back" : "from the back end toward the front";
}

const Checkpoint& checkpoint_of(const Plan& plan, const Trim& t) {
  return plan.checkpoints.at(t.checkpoint);
}

// The heading, the reading against the expected one and each flank's stock.
std::string reading_text(const Plan& plan, const Trim& t) {
  const Units u = plan.job.units;
  const Checkpoint& c = checkpoint_of(plan, t);
  std::string out =
      fmt::format("Trim after checkpoint {}: {} (after pass {})\n", t.letter, c.name, c.after_pass);
  const bool tapered = c.reading_per_length != 0;
  const std::string where =
      tapered || t.at_y != 0 ? fmt::format(" at y = {}", shown(t.at_y, u)) : "";
  out += wrapped(fmt::format("Reading {}{}, expected {}{}: {} {}.", shown(t.reading, u), where,
                             shown(t.expected, u), where.empty() ? "" : " there",
                             shown(std::abs(t.reading_error), u),
                             t.reading_error >= 0 ? "larger" : "smaller"));
  if (tapered)
    out += wrapped(fmt::format(
        "Tapered gib: the reading {} {:.6f} {} per {} toward the back end ({} at the front end, "
        "y = 0); --at gives the y where you measured, else the front end.",
        c.reading_per_length > 0 ? "grows" : "drops", std::abs(c.reading_per_length),
        unit_symbol(u), unit_symbol(u),
        shown(c.expected.value - c.reading_per_length * c.reading_at_y, u)));
  for (const auto& f : t.flanks)
    out += fmt::format("  {}: stock now {:+} (planned {}, error {:+})\n", side_words(f.side),
                       shown(f.now, u), shown(f.planned, u), shown(f.error(), u));
  return out + "\n";
}

// The corrective passes as a table, and the reading to expect after them.
std::string corrective_passes(const Plan& plan, const Trim& t) {
  const Units u = plan.job.units;
  const bool tapered = checkpoint_of(plan, t).reading_per_length != 0;
  std::string out = "Corrective passes with the dovetail cutter:\n";
  out += fmt::format("  {:>4} {:<11} {:<12} {:>9} {:>9} {:>8} {:>8}\n", "Pass", "Role", "Side", "X",
                     "Z", "Step", "Left");
  for (const auto& p : t.passes.operations.front().passes)
    out += fmt::format("  {:>4} {:<11} {:<12} {:>9} {:>9n} {:>8n} {:>8n}\n", p.number,
                       key_of(p.role), side_words(*p.side),
                       fmt::format("{:n}", shown(p.x, u)) + (p.taper_slope != 0 ? "*" : ""),
                       shown(p.z, u), shown(p.radial_step, u), shown(p.stock_left, u));
  out +=
      wrapped("X is the tool axis at the front end (* runs at the gib's taper), Z the tip.", "  ");
  out += wrapped(fmt::format("Expect after the trim: {}{} (good from {:n} to {}).",
                             shown(plan.final_reading.value, u), tapered ? " at the front end" : "",
                             shown(final_reading_band(plan).low, u),
                             shown(final_reading_band(plan).high, u)));
  return out;
}

// What the reading means: stop (cut past size), on size, or trim.
std::string verdict_text(const Plan& plan, const Trim& t) {
  const Units u = plan.job.units;
  const bool female = plan.target.type == DovetailType::Female;
  const auto& tol = plan.job.dovetail.tolerance;
  const double per_flank = t.flanks.empty() ? 0 : t.flanks.front().now;
  const double off_nominal = t.width_error + band_middle(tol);
  const std::string flanks = t.flanks.size() == 2 ? "each angled flank" : "the angled flank";
  switch (t.verdict) {
    case TrimVerdict::OverCut:
      return wrapped(fmt::format(
          "STOP: do not cut on. The flanks are cut past size: the part is already {} {} size "
          "at the base plane (from the nominal), outside the tolerance {:+} to {:+}; {} past the "
          "final size on {}. A trim cannot put metal back; decide with the mating part (for "
          "instance a thicker gib).",
          shown(std::abs(off_nominal), u), female ? "over" : "under", shown(tol.lower, u),
          shown(tol.upper, u), shown(std::abs(per_flank), u), flanks));
    case TrimVerdict::OnSize:
      return wrapped(fmt::format(
          "On size: the width is {:+} from the nominal, within the tolerance {:+} to {:+}. "
          "Nothing to cut; do not take the remaining passes.",
          shown(off_nominal, u), shown(tol.lower, u), shown(tol.upper, u)));
    case TrimVerdict::Trim:
      break;
  }
  return wrapped(fmt::format("Safe to continue: {} of stock is left on {}.", shown(per_flank, u),
                             flanks)) +
         corrective_passes(plan, t);
}

// The measured depth against the expected one; empty without a depth.
std::string depth_text(const Plan& plan, const Trim& t) {
  if (!t.depth) return {};
  const Units u = plan.job.units;
  const auto& d = *t.depth;
  std::string line =
      fmt::format("Depth {}, expected {}: ", shown(d.measured, u), shown(d.expected, u));
  if (!d.beyond())
    line += fmt::format("within {}.", shown(d.tolerance, u));
  else if (d.error() < 0)
    line += fmt::format(
        "{} shallow, more than the {} allowed. Z correction {:+}: the trim passes are "
        "programmed that much lower. Lowering the cutter leaves the pin reading as it is (the "
        "corner stays at the cutter's large radius) and brings the top width toward nominal; "
        "only the strip the cutter sweeps is lowered.",
        shown(-d.error(), u), shown(d.tolerance, u), shown(d.z_correction, u));
  else
    line += fmt::format(
        "{} deep, more than the {} allowed. This cannot be undone: the trim passes keep the "
        "planned Z; check the tool length before cutting on.",
        shown(d.error(), u), shown(d.tolerance, u));
  std::string out = "\n";
  out += wrapped(line);
  return out;
}

// The same correction in the full program (wear offset or parameters), for
// a trim only: on size there is nothing to correct. Empty when there is
// no change to make.
std::string full_program_text(const Plan& plan, const Trim& t, SizingStyle style) {
  if (t.verdict != TrimVerdict::Trim) return {};
  const Units u = plan.job.units;
  const bool last = checkpoint_of(plan, t).remaining_per_flank <= 0;
  const std::string then =
      last ? fmt::format("then run the program again from pass {} (the first finishing pass)",
                         t.first_finishing_pass)
           : "then continue the program from the stop";
  std::string line;
  switch (style) {
    case SizingStyle::CutterCompensation:
      line = fmt::format(
          "Or in the full program: change the wear offset of D{} by {:+} on the radius ({:+} on "
          "the diameter), {}.",
          plan.operations.empty() ? 0 : plan.operations.back().tool, shown(t.offset_change, u),
          shown(2 * t.offset_change, u), then);
      break;
    case SizingStyle::Parameters: {
      std::string which;
      for (const auto& f : t.flanks)
        which += fmt::format("{}#{}", which.empty() ? "" : " and ", flank_parameter(f.side));
      line = fmt::format("Or in the full program: add {:+} to {}, {}.", shown(t.offset_change, u),
                         which, then);
      break;
    }
    case SizingStyle::Plain:
      line =
          "The full program for this post has no compensation or parameters: use the "
          "corrective passes.";
      break;
  }
  if (std::abs(t.offset_change) <= 1e-9 && style != SizingStyle::Plain) return {};
  std::string out = "\n";
  out += wrapped(line);
  return out;
}

}  // namespace

std::string format_trim(const Plan& plan, const Trim& t, SizingStyle style) {
  std::string out = reading_text(plan, t);
  out += verdict_text(plan, t);
  out += depth_text(plan, t);
  out += full_program_text(plan, t, style);
  return out;
}

std::string trim_sheet(const Plan& plan, const Trim& t) {
  const Units u = plan.job.units;
  const Checkpoint& c = checkpoint_of(plan, t);
  std::string out = fmt::format("Trim sheet after checkpoint {} ({}), lengths in {}\n", t.letter,
                                c.name, unit_name(plan.job.units));
  if (t.verdict != TrimVerdict::Trim) return out + format_trim(plan, t, SizingStyle::Plain);
  out += wrapped(
      "X is the cross-slide (tool axis at the front end), Z the tip below the top face. "
      "Conventional milling only; approach every dial setting from the same direction as the "
      "passes before; lock the axes that do not move; measure with the spindle stopped.");
  // The cross-slide stands where the last pass at the checkpoint ran on each flank.
  std::vector<std::pair<Side, double>> dial;
  for (const auto& p : t.passes.operations.front().passes) {
    const double toward = toward_flank(plan.target.type, *p.side);
    auto it =
        std::find_if(dial.begin(), dial.end(), [&](const auto& d) { return d.first == *p.side; });
    if (it == dial.end()) {  // each pass moves toward the flank by its step
      dial.push_back({*p.side, p.x - toward * p.radial_step});
      it = dial.end() - 1;
    }
    const double move = p.x - it->second;
    const std::string how =
        fmt::format("{:n}", shown(std::abs(move), u)) == fmt::format("{:n}", shown(0.0, u))
            ? "same setting"
            : fmt::format("move {} {}, {} the flank", shown(std::abs(move), u),
                          move > 0 ? "+X" : "-X", move * toward > 0 ? "toward" : "away from");
    out += wrapped(fmt::format("{}. {}, {}: set X {:n} ({}), Z {:n}; feed {}.", p.number,
                               key_of(p.role), side_words(*p.side), shown(p.x, u), how,
                               shown(p.z, u), travel_words(p)));
    it->second = p.x;
  }
  out += wrapped(fmt::format("Then measure: expect {}{}.", shown(plan.final_reading.value, u),
                             c.reading_per_length != 0 ? " at the front end" : ""));
  return out;
}

}  // namespace dovetailor
