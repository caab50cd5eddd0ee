#include <cmath>

#include <nlohmann/json.hpp>

#include <dovetailor/base/length.hpp>
#include <dovetailor/job/job_words.hpp>
#include <dovetailor/report/plan_note_text.hpp>
#include <dovetailor/report/plan_report.hpp>

#include "unit_text.hpp"

namespace dovetailor {
namespace {

double len(double mm, Units u) { return length_value(mm, u); }

const char* mode_key(MillingMode m) {
  switch (m) {
    case MillingMode::Conventional:
      return "conventional";
    case MillingMode::Climb:
      return "climb";
    case MillingMode::Both:
      return "both";
  }
  return "";
}

template <class... F>
struct Overload : F... {
  using F::operator()...;
};
template <class... F>
Overload(F...) -> Overload<F...>;

nlohmann::json pass_json(const Pass& p, Units u) {
  nlohmann::json q;
  q["number"] = p.number;
  q["tool"] = p.tool;
  q["role"] = std::string(key_of(p.role));
  q["side"] = p.side ? (*p.side == Side::Left ? "left" : "right") : "centre";
  q["x"] = len(p.x, u);
  q["taper_slope"] = p.taper_slope;
  q["z"] = len(p.z, u);
  q["radial_step"] = len(p.radial_step, u);
  q["stock_left"] = len(p.stock_left, u);
  q["feed"] = len(p.feed, u);
  q["rpm"] = std::round(p.rpm);
  q["deflection"] = len(p.deflection, u);
  q["mode"] = mode_key(p.mode);
  return q;
}

nlohmann::json operation_json(const Plan& plan, const Operation& op) {
  const Units u = plan.job.units;
  nlohmann::json o;
  o["title"] = operation_title(op);
  o["tool"] = op.tool;
  o["entry"] = entry_words(op, plan.job.dovetail.ends);
  // From the passes, as the text writers state them: the highest roughing
  // and finishing feed (either one when the operation has only one kind).
  const detail::PassFeeds f = detail::pass_feeds(detail::passes_of(op));
  o["rpm"] = f.rpm.empty() ? std::round(op.rpm) : std::round(f.rpm.high);
  const double rough = f.rough.empty() ? f.finish.high : f.rough.high;
  const double finish = f.finish.empty() ? f.rough.high : f.finish.high;
  o["feed"] = f.rough.empty() && f.finish.empty() ? len(op.feed, u) : len(rough, u);
  o["finish_feed"] = f.rough.empty() && f.finish.empty() ? len(op.finish_feed, u) : len(finish, u);
  auto& passes = o["passes"] = nlohmann::json::array();
  for (const auto& p : op.passes) passes.push_back(pass_json(p, u));
  return o;
}

nlohmann::json checkpoint_json(const Plan& plan, const Checkpoint& c) {
  const Units u = plan.job.units;
  nlohmann::json k;
  k["name"] = c.name;
  k["after_pass"] = c.after_pass;
  k["pin_diameter"] = len(c.expected.pin_diameter, u);
  k["expected_reading"] = len(c.expected.value, u);
  k["final_reading"] = len(c.final_reading.value, u);
  k["remaining_per_flank"] = len(c.remaining_per_flank, u);
  k["remaining_normal"] = len(c.remaining_normal, u);
  k["correction_per_reading"] = c.correction_per_reading;
  k["expected_depth"] = len(c.expected_depth, u);
  if (c.reference_reading) k["reference_reading"] = len(*c.reference_reading, u);
  k["reading_at_y"] = len(c.reading_at_y, u);
  k["reading_per_length"] = c.reading_per_length;
  if (c.reference_reading) k["reference_per_length"] = c.reference_per_length;
  k["rule"] = correction_rule(plan, c);
  return k;
}

// A note's figures, lengths in the job's units, angles in degrees.
nlohmann::json note_json(const PlanNote& note, Units u) {
  nlohmann::json j;
  j["kind"] = std::string(note_kind(note));
  std::visit(Overload{
                 [&](const MateNote& n) {
                   j["mate_type"] = n.mate.type == DovetailType::Female ? "female" : "male";
                   j["mate_reading"] = len(n.mate.reading, u);
                   j["mate_pin_diameter"] = len(n.mate.pin_diameter, u);
                   j["mate_depth"] = len(n.mate.depth, u);
                   j["clearance"] = len(n.mate.clearance, u);
                   j["mate_width"] = len(n.derivation.mate_width, u);
                   j["mate_mouth"] = len(n.derivation.mate_mouth, u);
                   j["depth_loss"] = len(n.derivation.depth_loss, u);
                   j["depth_difference"] = len(n.derivation.depth_difference, u);
                   j["width"] = len(n.derivation.width, u);
                 },
                 [&](const CutterAngleNote& n) {
                   j["tool"] = n.tool;
                   j["cutter_angle"] = n.cutter_angle;
                   j["dovetail_angle"] = n.dovetail_angle;
                   j["angle_tolerance"] = n.tolerance;
                   j["width_bottom"] = len(n.width_bottom, u);
                   j["width_top"] = len(n.width_top, u);
                   j["nominal_width_top"] = len(n.nominal_width_top, u);
                   j["gib"] = n.gib;
                 },
                 [&](const AimedWidthNote& n) {
                   j["width_bottom"] = len(n.width_bottom, u);
                   j["offset"] = len(n.offset, u);
                   j["nominal_width_bottom"] = len(n.nominal_width_bottom, u);
                 },
                 [&](const MillingNote& n) {
                   j["material"] = n.material;
                   j["mode"] = mode_key(n.mode);
                   j["manual"] = n.manual;
                 },
                 [&](const AllowanceNote& n) {
                   j["rough_allowance"] = len(n.rough, u);
                   if (n.floor) j["floor_allowance"] = len(*n.floor, u);
                   j["finish_allowance"] = len(n.finish, u);
                   j["last_cut"] = len(n.last_cut, u);
                 },
                 [&](const BendLimitNote& n) {
                   j["rough_limit"] = len(n.rough, u);
                   j["finish_limit"] = len(n.finish, u);
                 },
             },
             note);
  return j;
}

nlohmann::json warning_json(const PlanWarning& warning, Units u) {
  nlohmann::json j;
  j["kind"] = std::string(warning_kind(warning));
  std::visit(Overload{
                 [&](const CuttingDataWarning& w) {
                   j["tool"] = w.tool;
                   const bool rpm = w.warning.kind == CuttingWarningKind::RpmCapped;
                   j["capped"] = rpm ? "rpm" : "feed";
                   j["wanted"] = rpm ? std::round(w.warning.wanted) : len(w.warning.wanted, u);
                   j["used"] = rpm ? std::round(w.warning.used) : len(w.warning.used, u);
                 },
                 [](const ClimbOnManualWarning&) {},
                 [&](const LargeFinishAllowanceWarning& w) {
                   j["finish_allowance"] = len(w.finish, u);
                   j["rough_allowance"] = len(w.rough, u);
                 },
                 [&](const FinishBendWarning& w) {
                   j["pass"] = w.pass;
                   j["deflection"] = len(w.deflection, u);
                   j["limit"] = len(w.limit, u);
                 },
                 [](const NoGaugeWarning&) {},
             },
             warning);
  return j;
}

}  // namespace

std::string plan_json(const Plan& plan) {
  const Units u = plan.job.units;
  nlohmann::json j;
  j["units"] = unit_name(u);
  j["part"] = plan.job.part.name;
  j["type"] = key_of(plan.target.type);
  j["angle"] = plan.target.angle;
  j["depth"] = len(plan.target.depth, u);
  j["width_bottom"] = len(plan.target.width_bottom(), u);
  j["width_top"] = len(plan.target.width_top(), u);
  j["pin_diameter"] = len(plan.final_reading.pin_diameter, u);
  j["final_reading"] = len(plan.final_reading.value, u);
  j["safe_z"] = len(plan.safe_z, u);
  auto& ops = j["operations"] = nlohmann::json::array();
  for (const auto& op : plan.operations) ops.push_back(operation_json(plan, op));
  auto& cps = j["checkpoints"] = nlohmann::json::array();
  for (const auto& c : plan.checkpoints) cps.push_back(checkpoint_json(plan, c));
  j["notes"] = note_texts(plan);
  j["warnings"] = warning_texts(plan);
  auto& notes = j["note_data"] = nlohmann::json::array();
  for (const auto& n : plan.notes) notes.push_back(note_json(n, u));
  auto& warnings = j["warning_data"] = nlohmann::json::array();
  for (const auto& w : plan.warnings) warnings.push_back(warning_json(w, u));
  return j.dump(2);
}

}  // namespace dovetailor
