#include "flags.hpp"

#include <cmath>

#include <fmt/format.h>

namespace dovetailor::cli {

Units parse_units(const std::string& word) {
  return word == "mm" ? Units::Millimetre : Units::Inch;
}

DovetailType parse_type(const std::string& word, const std::string& flag) {
  if (word == "male") return DovetailType::Male;
  if (word == "female") return DovetailType::Female;
  throw InputError("missing; give male or female", {"flags"}, flag);
}

AngledSides parse_sides(const std::string& word) {
  if (word == "left") return AngledSides::Left;
  if (word == "right") return AngledSides::Right;
  return AngledSides::Both;
}

double require_flag(double value, const std::string& flag, double min, double max) {
  if (std::isnan(value)) throw InputError("missing", {"flags"}, flag);
  if (!std::isfinite(value) || value <= min || value > max)
    throw InputError(
        fmt::format("{:g} is out of range: must be above {:g} and at most {:g}", value, min, max),
        {"flags"}, flag);
  return value;
}

}  // namespace dovetailor::cli
