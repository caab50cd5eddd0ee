#include "show.hpp"

#include <fmt/format.h>

#include <dovetailor/base/length_text.hpp>

namespace dovetailor::cli {

std::string number(double mm, Units units) { return length_number(mm, units); }

std::string length(double mm, Units units) { return length_text(mm, units); }

std::string signed_length(double mm, Units units) { return signed_length_text(mm, units); }

double json_length(double mm, Units units) { return length_value(mm, units); }

std::string type_name(DovetailType type) { return type == DovetailType::Male ? "male" : "female"; }

std::string sides_name(AngledSides sides) {
  switch (sides) {
    case AngledSides::Both:
      return "both";
    case AngledSides::Left:
      return "left";
    case AngledSides::Right:
      return "right";
  }
  return "both";
}

}  // namespace dovetailor::cli
