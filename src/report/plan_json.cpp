#include <cmath>

#include <nlohmann/json.hpp>

#include <dovetailor/base/length.hpp>
#include <dovetailor/job/job_words.hpp>
#include <dovetailor/report/plan_report.hpp>

#include "unit_text.hpp"

namespace dovetailor {
namespace {

double len(double mm, Units u) { return length_value(mm, u); }

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
  for (const auto& op : plan.operations) {
    nlohmann::json o;
    o["title"] = op.title;
    o["tool"] = op.tool;
    o["entry"] = op.entry;
    // From the passes, as the text writers state them: the highest roughing
    // and finishing feed (either one when the operation has only one kind).
    const detail::PassFeeds f = detail::pass_feeds(detail::passes_of(op));
    o["rpm"] = f.rpm.empty() ? std::round(op.rpm) : std::round(f.rpm.high);
    const double rough = f.rough.empty() ? f.finish.high : f.rough.high;
    const double finish = f.finish.empty() ? f.rough.high : f.finish.high;
    o["feed"] = f.rough.empty() && f.finish.empty() ? len(op.feed, u) : len(rough, u);
    o["finish_feed"] =
        f.rough.empty() && f.finish.empty() ? len(op.finish_feed, u) : len(finish, u);
    auto& passes = o["passes"] = nlohmann::json::array();
    for (const auto& p : op.passes) {
      nlohmann::json q;
      q["number"] = p.number;
      q["tool"] = p.tool;
      q["role"] = std::string(pass_role_word(p.role));
      q["side"] = p.side ? (*p.side == Side::Left ? "left" : "right") : "centre";
      q["x"] = len(p.x, u);
      q["taper_slope"] = p.taper_slope;
      q["z"] = len(p.z, u);
      q["radial_step"] = len(p.radial_step, u);
      q["stock_left"] = len(p.stock_left, u);
      q["feed"] = len(p.feed, u);
      q["rpm"] = std::round(p.rpm);
      q["deflection"] = len(p.deflection, u);
      q["mode"] = key_of(p.mode);
      passes.push_back(q);
    }
    ops.push_back(o);
  }
  auto& cps = j["checkpoints"] = nlohmann::json::array();
  for (const auto& c : plan.checkpoints) {
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
    cps.push_back(k);
  }
  j["notes"] = plan.notes;
  j["warnings"] = plan.warnings;
  return j.dump(2);
}

}  // namespace dovetailor
