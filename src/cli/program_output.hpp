#pragma once

// Shared by the subcommands that write programs and sheets (gcode, trim, sheet).

#include <string>

#include <dovetailor/gcode/gcode_writer.hpp>
#include <dovetailor/plan/plan.hpp>

namespace dovetailor::cli {

// Today's local date as YYYY-MM-DD, for program headers.
std::string today();

// The plan's warnings on stderr, one "dovetailor: warning: ..." paragraph
// each within 80 columns, so they reach the screen when the output goes to
// a file or a pipe.
void print_plan_warnings(const Plan& plan);

// Refuses an output path that is the job file itself.
void refuse_job_file(const std::string& output, const std::string& job_file);

}  // namespace dovetailor::cli
