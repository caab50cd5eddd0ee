#pragma once

#include <string>

#include <dovetailor/job/job.hpp>

namespace dovetailor::cli {

// A length (mm inside) shown in `units` with its symbol: "0.5170 in".
std::string length(double mm, Units units);
// The number alone, at the usual decimals for the units: "0.5170".
std::string number(double mm, Units units);
// A signed length: "+0.0010 in".
std::string signed_length(double mm, Units units);
// A length at the usual decimals, as a JSON number in `units`.
double json_length(double mm, Units units);

std::string type_name(DovetailType type);
// "both", "left", "right".
std::string sides_name(AngledSides sides);

}  // namespace dovetailor::cli
