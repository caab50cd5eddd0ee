#include <cmath>

#include <fmt/format.h>

#include <dovetailor/base/length.hpp>
#include <dovetailor/report/plan_note_text.hpp>

namespace dovetailor {
namespace {

template <class... F>
struct Overload : F... {
  using F::operator()...;
};
template <class... F>
Overload(F...) -> Overload<F...>;

// A mate's figures one decimal finer than the plan's lengths: they are
// derived from a reading taken to the micrometer's last figure.
std::string fine_length(double mm, Units units) {
  return fmt::format("{} {}", fixed_text(from_mm(mm, units), length_decimals(units) + 1),
                     unit_symbol(units));
}

std::string mate_text(const MateNote& n, Units u) {
  const auto show = [u](double mm) { return fine_length(mm, u); };
  const Mate& m = n.mate;
  const MateDerivation& d = n.derivation;
  const bool male = m.type == DovetailType::Male;
  const std::string depths =
      d.depth_loss > 0 ? fmt::format(" {} {} for the male {} deeper than the female",
                                     male ? '+' : '-', show(d.depth_loss), show(d.depth_difference))
                       : "";
  if (male)
    return fmt::format(
        "mate: male read {} over {} pins -> root width {}; mouth = root + clearance {}{} = {}",
        show(m.reading), show(m.pin_diameter), show(d.mate_width), show(m.clearance), depths,
        show(d.width));
  return fmt::format(
      "mate: female read {} between {} pins, depth {} -> floor width {}, mouth {}; "
      "root = mouth - clearance {}{} = {}",
      show(m.reading), show(m.pin_diameter), show(m.depth), show(d.mate_width), show(d.mate_mouth),
      show(m.clearance), depths, show(d.width));
}

std::string cutter_angle_text(const CutterAngleNote& n, Units u) {
  // Rounded so that a file's 59.9 against 60 reads 0.1, not 0.1000000000000014.
  const double diff = std::round((n.cutter_angle - n.dovetail_angle) * 1e6) / 1e6;
  return fmt::format(
      "T{} is {:g} deg, {:g} deg {} than the dovetail's {:g} deg (within {:g} deg): the flanks "
      "are planned at {:g} deg. The base-plane width {} is held (the cutter's tip corner sets "
      "it){}; the top-plane width comes out {} ({} at {:g} deg), and the pin readings are those "
      "of {:g} deg flanks.",
      n.tool, n.cutter_angle, std::abs(diff), diff > 0 ? "steeper" : "shallower", n.dovetail_angle,
      n.tolerance, n.cutter_angle, fmt::format("{}", shown(n.width_bottom, u)),
      n.gib ? ", the gib's allowance taken at the cutter's angle" : "",
      fmt::format("{}", shown(n.width_top, u)), fmt::format("{}", shown(n.nominal_width_top, u)),
      n.dovetail_angle, n.cutter_angle);
}

}  // namespace

std::string note_text(const PlanNote& note, Units u) {
  const auto show = [u](double mm) { return fmt::format("{}", shown(mm, u)); };
  return std::visit(
      Overload{
          [&](const MateNote& n) { return mate_text(n, u); },
          [&](const CutterAngleNote& n) { return cutter_angle_text(n, u); },
          [&](const AimedWidthNote& n) {
            return fmt::format(
                "Aimed at the middle of the width tolerance: {} at the base plane, {} {} the "
                "nominal {}, so that rounding the program's last decimal keeps the part inside "
                "the band.",
                show(n.width_bottom), show(std::abs(n.offset)), n.offset > 0 ? "over" : "under",
                show(n.nominal_width_bottom));
          },
          [&](const MillingNote& n) {
            return fmt::format("Material: {}. Milling {} on the flanks{}.", n.material,
                               n.mode == MillingMode::Climb ? "climb" : "conventional",
                               n.manual ? " (manual machine: always conventional)" : "");
          },
          [&](const AllowanceNote& n) {
            return fmt::format(
                "Allowances: end mill leaves {} per side{}; the dovetail cutter leaves {} per "
                "flank for finishing{}.",
                show(n.rough), n.floor ? fmt::format(" and {} on the floor", show(*n.floor)) : "",
                show(n.finish),
                n.last_cut > 0
                    ? fmt::format(", then a semi-finish pass leaves {}", show(n.last_cut))
                    : "");
          },
          [&](const BendLimitNote& n) {
            return fmt::format(
                "Radial steps are sized so the predicted bend of the dovetail cutter stays under "
                "{}; the finishing pass should bend it under {} (a quarter of the tolerance). A "
                "spring pass at the same setting takes out what the cutter sprang away on the "
                "finishing pass.",
                show(n.rough), show(n.finish));
          },
      },
      note);
}

std::string warning_text(const PlanWarning& warning, Units u) {
  return std::visit(
      Overload{
          [&](const CuttingDataWarning& w) {
            return fmt::format("T{}: {}", w.tool, warning_text(w.warning, u));
          },
          [](const ClimbOnManualWarning&) {
            return std::string(
                "strategy.direction = \"climb\" is ignored on a manual machine: table "
                "backlash can pull the work into the cutter; every pass is conventional");
          },
          [](const LargeFinishAllowanceWarning&) {
            return std::string("the finish allowance is unusually large");
          },
          [&](const FinishBendWarning& w) {
            return fmt::format(
                "pass {}: predicted deflection {} on the finishing pass is more than a quarter "
                "of the tolerance; the spring pass matters, and a smaller finish allowance "
                "would help",
                w.pass, fmt::format("{}", shown(w.deflection, u)));
          },
          [](const NoGaugeWarning&) {
            return std::string(
                "no [gauge] pin_diameter: the checkpoints give widths but no pin readings");
          },
      },
      warning);
}

std::string operation_title(const Operation& op) {
  if (op.corrective) return "Trim the flanks to size";
  switch (op.kind) {
    case OperationKind::RoughSlot:
      return "Rough the slot";
    case OperationKind::RoughShoulders:
      return "Rough the shoulders";
    case OperationKind::FinishSquareWall: {
      const bool left = !op.passes.empty() && op.passes.front().side == Side::Left;
      return fmt::format("Finish the square {} wall", left ? "left" : "right");
    }
    case OperationKind::Undercut:
      return "Undercut and finish the flanks";
  }
  return "";
}

std::string entry_words(const Operation& op, Ends ends) {
  const bool front_open = ends == Ends::FrontOpen;
  if (op.kind == OperationKind::Undercut)
    return front_open ? "enters at cutting depth from the open front end, outside the stock; "
                        "backs out the same way (never plunges, never rises under the overhang)"
                      : "enters at cutting depth from the front end, outside the stock; leaves "
                        "past the far end (never plunges, never rises under the overhang)";
  return front_open ? "enters at depth from the open front end, feeding along Y; leaves upward at "
                      "the closed end, or steps over there and cuts on the way out"
                    : "enters at depth from the front end, feeding along Y; leaves past the far "
                      "end";
}

std::vector<std::string> note_texts(const Plan& plan) {
  std::vector<std::string> out;
  for (const auto& n : plan.notes) out.push_back(note_text(n, plan.job.units));
  return out;
}

std::vector<std::string> warning_texts(const Plan& plan) {
  std::vector<std::string> out;
  for (const auto& w : plan.warnings) out.push_back(warning_text(w, plan.job.units));
  return out;
}

std::string_view note_kind(const PlanNote& note) {
  return std::visit(Overload{
                        [](const MateNote&) { return std::string_view("mate"); },
                        [](const CutterAngleNote&) { return std::string_view("cutter_angle"); },
                        [](const AimedWidthNote&) { return std::string_view("aimed_width"); },
                        [](const MillingNote&) { return std::string_view("milling"); },
                        [](const AllowanceNote&) { return std::string_view("allowances"); },
                        [](const BendLimitNote&) { return std::string_view("bend_limits"); },
                    },
                    note);
}

std::string_view warning_kind(const PlanWarning& warning) {
  return std::visit(
      Overload{
          [](const CuttingDataWarning&) { return std::string_view("cutting_data"); },
          [](const ClimbOnManualWarning&) { return std::string_view("climb_on_manual"); },
          [](const LargeFinishAllowanceWarning&) {
            return std::string_view("large_finish_allowance");
          },
          [](const FinishBendWarning&) { return std::string_view("finish_bend"); },
          [](const NoGaugeWarning&) { return std::string_view("no_gauge"); },
      },
      warning);
}

}  // namespace dovetailor
