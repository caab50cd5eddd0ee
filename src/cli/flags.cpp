#include "flags.hpp"

#include <cmath>

#include <fmt/format.h>

namespace dovetailor::cli {

double require_flag(double value, const std::string& flag, double min, double max) {
  if (std::isnan(value)) throw InputError("missing", {"flags"}, flag);
  if (!std::isfinite(value) || value <= min || value > max)
    throw InputError(
        fmt::format("{:g} is out of range: must be above {:g} and at most {:g}", value, min, max),
        {"flags"}, flag);
  return value;
}

}  // namespace dovetailor::cli
