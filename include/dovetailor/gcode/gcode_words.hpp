#pragma once

// The words of the G-code writer's enums (see base/words.hpp).

#include <array>

#include <dovetailor/base/words.hpp>
#include <dovetailor/gcode/gcode_writer.hpp>

namespace dovetailor {

// Keys of --coolant and the words of the program header.
constexpr std::array<EnumWord<CoolantChoice>, 3> word_table(CoolantChoice) {
  return {{{CoolantChoice::Flood, "flood"},
           {CoolantChoice::Mist, "mist"},
           {CoolantChoice::Off, "off", "none"}}};
}

}  // namespace dovetailor
