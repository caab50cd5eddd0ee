#pragma once

// Checks shared by the subcommands that describe a dovetail by flags.

#include <string>

#include <dovetailor/job/job.hpp>

namespace dovetailor::cli {

Units parse_units(const std::string& word);
DovetailType parse_type(const std::string& word, const std::string& flag);
AngledSides parse_sides(const std::string& word);
// The flag's value; an InputError naming the flag when it is missing (NaN),
// not finite, or outside (min, max].
double require_flag(double value, const std::string& flag, double min, double max);

}  // namespace dovetailor::cli
