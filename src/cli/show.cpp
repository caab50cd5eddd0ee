#include "show.hpp"

namespace dovetailor::cli {

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
