#include <algorithm>
#include <cassert>

#include <dovetailor/rs274/rs274_parameters.hpp>

namespace dovetailor {

Rs274Parameters::Rs274Parameters(int highest)
    : values_(static_cast<std::size_t>(std::clamp(highest, 1, highest_number)) + 1, 0.0) {}

double Rs274Parameters::get(int number) const {
  assert(valid(number));
  return values_[static_cast<std::size_t>(number)];
}

void Rs274Parameters::set(int number, double value) {
  assert(valid(number));
  values_[static_cast<std::size_t>(number)] = value;
}

}  // namespace dovetailor
