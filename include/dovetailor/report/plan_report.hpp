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
// `remaining_per_flank`, `pin_diameter`), `notes` and `warnings`.
std::string plan_json(const Plan& plan);

// The cautions every printed output carries, wrapped to 80 columns.
const std::string& safety_cautions();

// One line per checkpoint rule, in words: what a reading above or below the
// expected one means for each flank, and when to stop (over-cut).
std::string correction_rule(const Plan& plan, const Checkpoint& checkpoint);

}  // namespace dovetailor
