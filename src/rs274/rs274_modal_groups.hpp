#pragma once

// Modal groups of G and M codes (NISTIR 6556 table "Modal groups", from
// memory). G codes are times ten (G59.1 is 591). Internal to the core
// library.

#include <string>

namespace dovetailor::detail {

// The group of a G code: 0 non-modal, 1 motion, 2 plane, 3 distance,
// 5 feed mode, 6 units, 7 cutter compensation, 8 length offset, 10 return
// mode, 12 coordinate system, 13 path control; -1 not an RS-274/NGC code;
// -2 an RS-274/NGC code the checker does not simulate.
int g_group(int code);

// 4 stopping, 6 tool change, 7 spindle, 8 coolant, 9 override switches;
// -1 unknown.
int m_group(int code);

std::string g_name(int code);  // 591 -> "G59.1"
std::string m_name(int code);  // 3 -> "M3"
inline bool is_cycle(int motion) { return motion >= 810 && motion <= 890; }

}  // namespace dovetailor::detail
