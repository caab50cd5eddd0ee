#pragma once

// Shared by the subcommands that write programs (gcode, trim).

#include <string>

#include <dovetailor/gcode_writer.hpp>

namespace dovetailor::cli {

// Today's local date as YYYY-MM-DD, for program headers.
std::string today();

// "flood", "mist" or "off"; an InputError naming --coolant otherwise.
CoolantChoice parse_coolant(const std::string& word);

// Refuses an output path that is the job file itself.
void refuse_job_file(const std::string& output, const std::string& job_file);

}  // namespace dovetailor::cli
