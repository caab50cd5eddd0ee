// The trim as text: the report for the terminal and the manual sheet.

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include <dovetailor/base/text_wrap.hpp>
#include <dovetailor/report/trim_report.hpp>

#include "unit_text.hpp"

namespace dovetailor {
namespace {

using detail::UnitText;

std::string side_words(Side side) { return side == Side::Left ? "left flank" : "right flank"; }

std::string signed_len(const UnitText& s, double mm) {
  const std::string text = s.len(std::abs(mm));
  return (mm < 0 && s.num(std::abs(mm)) != s.num(0) ? "-" : "+") + text;
}

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

}  // namespace

std::string format_trim(const Plan& plan, const Trim& t, SizingStyle style) {
  const UnitText s{plan.job.units};
  const Checkpoint& c = checkpoint_of(plan, t);
  const bool female = plan.target.type == DovetailType::Female;
  const auto& tol = plan.job.dovetail.tolerance;
  std::string out;
  out +=
      fmt::format("Trim after checkpoint {}: {} (after pass {})\n", t.letter, c.name, c.after_pass);
  const bool tapered = c.reading_per_length != 0;
  const std::string where = tapered || t.at_y != 0 ? fmt::format(" at y = {}", s.len(t.at_y)) : "";
  out += wrapped(fmt::format("Reading {}{}, expected {}{}: {} {}.", s.len(t.reading), where,
                             s.len(t.expected), where.empty() ? "" : " there",
                             s.len(std::abs(t.reading_error)),
                             t.reading_error >= 0 ? "larger" : "smaller"));
  if (tapered)
    out += wrapped(fmt::format(
        "Tapered gib: the reading {} {:.6f} {} per {} toward the back end ({} at the front end, "
        "y = 0); --at gives the y where you measured, else the front end.",
        c.reading_per_length > 0 ? "grows" : "drops", std::abs(c.reading_per_length),
        unit_symbol(plan.job.units), unit_symbol(plan.job.units),
        s.len(c.expected.value - c.reading_per_length * c.reading_at_y)));
  for (const auto& f : t.flanks)
    out += fmt::format("  {}: stock now {} (planned {}, error {})\n", side_words(f.side),
                       signed_len(s, f.now), s.len(f.planned), signed_len(s, f.error()));
  out += "\n";
  const double per_flank = t.flanks.empty() ? 0 : t.flanks.front().now;
  const double off_nominal = t.width_error + band_middle(tol);
  switch (t.verdict) {
    case TrimVerdict::OverCut:
      out += wrapped(fmt::format(
          "STOP: do not cut on. The flanks are cut past size: the part is already {} {} size "
          "at the base plane (from the nominal), outside the tolerance {} to {}; {} past the "
          "final size on {}. A trim cannot put metal back; decide with the mating part (for "
          "instance a thicker gib).",
          s.len(std::abs(off_nominal)), female ? "over" : "under", signed_len(s, tol.lower),
          signed_len(s, tol.upper), s.len(std::abs(per_flank)),
          t.flanks.size() == 2 ? "each angled flank" : "the angled flank"));
      break;
    case TrimVerdict::OnSize:
      out += wrapped(fmt::format(
          "On size: the width is {} from the nominal, within the tolerance {} to {}. Nothing to "
          "cut; do not take the remaining passes.",
          signed_len(s, off_nominal), signed_len(s, tol.lower), signed_len(s, tol.upper)));
      break;
    case TrimVerdict::Trim: {
      out += wrapped(fmt::format("Safe to continue: {} of stock is left on {}.", s.len(per_flank),
                                 t.flanks.size() == 2 ? "each angled flank" : "the angled flank"));
      out += "Corrective passes with the dovetail cutter:\n";
      out += fmt::format("  {:>4} {:<11} {:<12} {:>9} {:>9} {:>8} {:>8}\n", "Pass", "Role", "Side",
                         "X", "Z", "Step", "Left");
      for (const auto& p : t.passes.operations.front().passes)
        out += fmt::format("  {:>4} {:<11} {:<12} {:>9} {:>9} {:>8} {:>8}\n", p.number,
                           pass_role_word(p.role), side_words(*p.side),
                           s.num(p.x) + (p.taper_slope != 0 ? "*" : ""), s.num(p.z),
                           s.num(p.radial_step), s.num(p.stock_left));
      out += wrapped("X is the tool axis at the front end (* runs at the gib's taper), Z the tip.",
                     "  ");
      out += wrapped(
          fmt::format("Expect after the trim: {}{} (good from {} to {}).",
                      s.len(plan.final_reading.value), tapered ? " at the front end" : "",
                      s.num(final_reading_band(plan).low), s.len(final_reading_band(plan).high)));
      break;
    }
  }
  if (t.depth) {
    const auto& d = *t.depth;
    std::string line = fmt::format("Depth {}, expected {}: ", s.len(d.measured), s.len(d.expected));
    if (!d.beyond())
      line += fmt::format("within {}.", s.len(d.tolerance));
    else if (d.error() < 0)
      line += fmt::format(
          "{} shallow, more than the {} allowed. Z correction {}: the trim passes are "
          "programmed that much lower. Lowering the cutter leaves the pin reading as it is (the "
          "corner stays at the cutter's large radius) and brings the top width toward nominal; "
          "only the strip the cutter sweeps is lowered.",
          s.len(-d.error()), s.len(d.tolerance), signed_len(s, d.z_correction));
    else
      line += fmt::format(
          "{} deep, more than the {} allowed. This cannot be undone: the trim passes keep the "
          "planned Z; check the tool length before cutting on.",
          s.len(d.error()), s.len(d.tolerance));
    {
      out += '\n';
      out += wrapped(line);
    }
  }
  // On size there is nothing to correct: no offset change is offered beside
  // "nothing to cut".
  if (t.verdict == TrimVerdict::Trim) {
    const bool last = c.remaining_per_flank <= 0;
    const std::string then =
        last ? fmt::format("then run the program again from pass {} (the first finishing pass)",
                           t.first_finishing_pass)
             : "then continue the program from the stop";
    std::string line;
    switch (style) {
      case SizingStyle::CutterCompensation:
        line = fmt::format(
            "Or in the full program: change the wear offset of D{} by {} on the radius ({} on "
            "the diameter), {}.",
            plan.operations.empty() ? 0 : plan.operations.back().tool,
            signed_len(s, t.offset_change), signed_len(s, 2 * t.offset_change), then);
        break;
      case SizingStyle::Parameters: {
        std::string which;
        for (const auto& f : t.flanks)
          which += fmt::format("{}#{}", which.empty() ? "" : " and ", flank_parameter(f.side));
        line = fmt::format("Or in the full program: add {} to {}, {}.",
                           signed_len(s, t.offset_change), which, then);
        break;
      }
      case SizingStyle::Plain:
        line =
            "The full program for this post has no compensation or parameters: use the "
            "corrective passes.";
        break;
    }
    if (std::abs(t.offset_change) > 1e-9 || style == SizingStyle::Plain) {
      out += '\n';
      out += wrapped(line);
    }
  }
  return out;
}

std::string trim_sheet(const Plan& plan, const Trim& t) {
  const UnitText s{plan.job.units};
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
        s.num(std::abs(move)) == s.num(0)
            ? "same setting"
            : fmt::format("move {} {}, {} the flank", s.len(std::abs(move)), move > 0 ? "+X" : "-X",
                          move * toward > 0 ? "toward" : "away from");
    out += wrapped(fmt::format("{}. {}, {}: set X {} ({}), Z {}; feed {}.", p.number,
                               pass_role_word(p.role), side_words(*p.side), s.num(p.x), how,
                               s.num(p.z), travel_words(p)));
    it->second = p.x;
  }
  out += wrapped(fmt::format("Then measure: expect {}{}.", s.len(plan.final_reading.value),
                             c.reading_per_length != 0 ? " at the front end" : ""));
  return out;
}

}  // namespace dovetailor
