#pragma once

#include <string>
#include <string_view>
#include <vector>

#include <dovetailor/base/units.hpp>
#include <dovetailor/plan/plan.hpp>
#include <dovetailor/plan/plan_note.hpp>

namespace dovetailor {

// The plan's notes and warnings (plan/plan_note.hpp) in words, lengths in
// `units`: one sentence or paragraph each, as the text plan, the pass sheet,
// the program header and the terminal give them. No "WARNING:" prefix.
std::string note_text(const PlanNote& note, Units units);
std::string warning_text(const PlanWarning& warning, Units units);

// An operation's title ("Rough the slot", "Undercut and finish the flanks",
// "Trim the flanks to size", ...) and how its tool enters the work, in words.
std::string operation_title(const Operation& op);
std::string entry_words(const Operation& op, Ends ends);

// All of the plan's notes, and all of its warnings, in words in the job's units.
std::vector<std::string> note_texts(const Plan& plan);
std::vector<std::string> warning_texts(const Plan& plan);

// The kind as one word for JSON: "mate", "cutter_angle", "aimed_width",
// "milling", "allowances", "bend_limits"; for warnings "cutting_data",
// "climb_on_manual", "large_finish_allowance", "finish_bend", "no_gauge".
std::string_view note_kind(const PlanNote& note);
std::string_view warning_kind(const PlanWarning& warning);

}  // namespace dovetailor
