#pragma once

// Modal groups of G and M codes (NISTIR 6556 section 3.4, table 4 "Modal
// groups", from memory): of each group at most one code per line, and one
// of each modal group is always in force. Internal to the rs274 stage.

#include <cstddef>
#include <optional>

#include <dovetailor/rs274/rs274_codes.hpp>

namespace dovetailor::detail {

// Numbered as NISTIR 6556 numbers them (4, 9 and 11 are unused for G).
enum class GGroup {
  NonModal = 0,            // G4 G10 G28 G30 G53 G92 G92.1 G92.2 G92.3
  Motion = 1,              // G0 G1 G2 G3 G38.2 G80 G81..G89
  Plane = 2,               // G17 G18 G19
  Distance = 3,            // G90 G91
  FeedMode = 5,            // G93 G94
  Units = 6,               // G20 G21
  CutterCompensation = 7,  // G40 G41 G42
  LengthOffset = 8,        // G43 G49
  ReturnMode = 10,         // G98 G99 (canned cycles)
  CoordinateSystem = 12,   // G54..G59 G59.1..G59.3
  PathControl = 13,        // G61 G61.1 G64
};
inline constexpr std::size_t g_group_count = 14;

enum class MGroup {
  Stopping = 4,    // M0 M1 M2 M30 M60
  ToolChange = 6,  // M6
  Spindle = 7,     // M3 M4 M5
  Coolant = 8,     // M7 M8 M9 (M7 and M8 may share a line)
  Overrides = 9,   // M48 M49
};
inline constexpr std::size_t m_group_count = 10;

constexpr std::size_t group_index(GGroup group) { return static_cast<std::size_t>(group); }
constexpr std::size_t group_index(MGroup group) { return static_cast<std::size_t>(group); }

// What the interpreter knows of a G code number (times ten).
struct GCodeClass {
  GCode code = GCode::Rapid;
  GGroup group = GGroup::NonModal;
  bool simulated = true;  // false: an RS-274/NGC code the checker does not simulate
};
// Nothing for a number that is not an RS-274/NGC G code.
std::optional<GCodeClass> classify_g_code(int number);

struct MCodeClass {
  MCode code = MCode::ProgramStop;
  MGroup group = MGroup::Stopping;
};
// Nothing for an M code the checker does not know.
std::optional<MCodeClass> classify_m_code(int number);

}  // namespace dovetailor::detail
