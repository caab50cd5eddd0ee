#pragma once

#include <string>

#include <dovetailor/base/length.hpp>
#include <dovetailor/job/job.hpp>

namespace dovetailor::cli {

std::string type_name(DovetailType type);
// "both", "left", "right".
std::string sides_name(AngledSides sides);

}  // namespace dovetailor::cli
