#pragma once

#include <string>

#include <dovetailor/plan/plan.hpp>

namespace dovetailor {

// The plan as text for an 80-column terminal or paper, every number in the
// job's units: title and target, the safety cautions, the tools with their
// speeds and feeds, one pass table per operation, the checkpoints with the
// reading to expect and the correction rule, then notes and warnings.
std::string format_plan(const Plan& plan);

// The plan as a JSON text (2-space indent), lengths in the job's units, feeds
// in units per minute. Keys include `units`, `final_reading`, `operations`
// (each with `passes`), `checkpoints` (each with `expected_reading`,
// `remaining_per_flank`, `pin_diameter`), `notes` and `warnings` (in words,
// plan_note_text.hpp), and `note_data` and `warning_data`: the same notes
// and warnings in the same order as objects, each with its `kind`
// (note_kind, warning_kind) and its figures in the job's units:
//   mate: mate_type, mate_reading, mate_pin_diameter, mate_depth,
//     clearance, mate_width, mate_mouth, depth_loss, depth_difference, width;
//   cutter_angle: tool, cutter_angle, dovetail_angle, angle_tolerance (deg),
//     width_bottom, width_top, nominal_width_top, gib (bool);
//   aimed_width: width_bottom, offset (aimed less nominal), nominal_width_bottom;
//   milling: material, mode ("climb", "conventional"), manual (bool);
//   allowances: rough_allowance, floor_allowance (female only),
//     finish_allowance, last_cut;
//   bend_limits: rough_limit, finish_limit;
//   cutting_data: tool, capped ("rpm" or "feed"), wanted, used (rev/min or
//     units/min);
//   large_finish_allowance: finish_allowance, rough_allowance;
//   finish_bend: pass, deflection, limit;
//   climb_on_manual, no_gauge: the kind alone.
std::string plan_json(const Plan& plan);

// The cautions every printed output carries, wrapped to 80 columns.
const std::string& safety_cautions();

// One line per checkpoint rule, in words: what a reading above or below the
// expected one means for each flank, and when to stop (over-cut).
std::string correction_rule(const Plan& plan, const Checkpoint& checkpoint);

}  // namespace dovetailor
