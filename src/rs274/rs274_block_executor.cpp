#include "rs274_block_executor.hpp"

#include <cmath>
#include <string>

#include <dovetailor/base/error.hpp>

#include "rs274_arc.hpp"
#include "rs274_modal_groups.hpp"

namespace dovetailor {

using detail::g_group;
using detail::g_name;
using detail::is_cycle;
using detail::m_group;
using detail::m_name;

void Rs274BlockExecutor::run() {
  classify();
  decide_motion();
  check_letters();
  if (g_[5])
    st_.feed_mode = g_[5]->number == 930 ? FeedMode::InverseTime : FeedMode::UnitsPerMinute;
  if (g_[6]) st_.program_units = g_[6]->number == 200 ? Units::Inch : Units::Millimetre;
  feed_and_speed();
  tool_and_spindle();
  if (g_[0] && g_[0]->number == 40) dwell();
  if (g_[2]) plane();
  if (g_[7]) compensation();
  if (g_[8]) length_offset();
  if (g_[12]) coordinate_system(g_[12]->number);
  if (g_[3])
    st_.distance = g_[3]->number == 900 ? DistanceMode::Absolute : DistanceMode::Incremental;
  if (g_[10]) retract_to_r_ = g_[10]->number == 990;
  in_.retract_to_r_mode_ = retract_to_r_;
  if (homing()) go_home();
  if (non_modal(100)) coordinate_data();
  if (g_[0] && g_[0]->number >= 920 && g_[0]->number <= 923) axis_offsets();
  motion();
  stops();
}

void Rs274BlockExecutor::classify() {
  for (const auto& code : b_.g_codes) {
    const int group = g_group(code.number);
    if (group == -1)
      fail(code.column, g_name(code.number), g_name(code.number) + " is not an RS-274/NGC G code");
    if (group == -2)
      fail(code.column, g_name(code.number),
           g_name(code.number) +
               " is not supported by the checker; remove it or check this "
               "part of the program another way");
    auto& slot = g_[static_cast<std::size_t>(group)];
    if (slot)
      fail(code.column, g_name(code.number),
           g_name(slot->number) + " and " + g_name(code.number) +
               " are in the same modal group; give only one of them per line");
    slot = code;
  }
  for (const auto& code : b_.m_codes) {
    const int group = m_group(code.number);
    if (group < 0)
      fail(code.column, m_name(code.number),
           m_name(code.number) + " is not an RS-274/NGC M code the checker knows");
    auto& slot = m_[static_cast<std::size_t>(group)];
    const bool mist_and_flood =
        group == 8 && slot && slot->number != 9 && code.number != 9 && slot->number != code.number;
    if (slot && !mist_and_flood)
      fail(code.column, m_name(code.number),
           m_name(slot->number) + " and " + m_name(code.number) +
               " are in the same modal group; give only one of them per line");
    if (group == 8 && mist_and_flood) both_coolants_ = true;
    slot = code;
  }
  for (char letter : {'a', 'b', 'c'})
    if (b_.has(letter))
      fail(b_.word(letter)->column, std::string(1, static_cast<char>(letter - 32)),
           "rotary axis words are not supported by the checker (three linear axes only)");
}

void Rs274BlockExecutor::decide_motion() {
  const bool g53 = g_[0] && g_[0]->number == 530;
  previous_motion_ = in_.motion_mode_;
  if (takes_axis_words()) {
    // The axis words belong to G28/G30 (the intermediate point), G10 (the
    // origin) or G92 (the coordinates the current point is to have).
    if (g_[1] && g_[1]->number != 800 && axis_words())
      fail(g_[1]->column, g_name(g_[1]->number),
           g_name(g_[0]->number) + " and " + g_name(g_[1]->number) +
               " both use the axis words; put them on separate lines");
    if (g_[1]) {
      motion_ = g_[1]->number;
      motion_column_ = g_[1]->column;
    }
    return;
  }
  if (g_[1]) {
    motion_ = g_[1]->number;
    motion_column_ = g_[1]->column;
  } else if (axis_words()) {
    motion_ = in_.motion_mode_;
    motion_column_ = first_axis_column();
  }
  if (motion_ == 800 && axis_words())
    fail(first_axis_column(), "G80",
         "axis words with G80 (motion cancelled) in effect; give G0, G1, G2 or G3 first");
  if (g53 && motion_ != 0 && motion_ != 10)
    fail(g_[0]->column, "G53", "G53 needs G0 or G1 on the line or in effect");
  const bool incremental = g_[3] ? g_[3]->number == 910 : st_.distance == DistanceMode::Incremental;
  if (g53 && incremental)
    fail(g_[0]->column, "G53", "G53 cannot be used in incremental mode (G91)");
}

int Rs274BlockExecutor::first_axis_column() const {
  int column = 0;
  for (char letter : {'x', 'y', 'z'})
    if (b_.has(letter) && (column == 0 || b_.word(letter)->column < column))
      column = b_.word(letter)->column;
  return column;
}

void Rs274BlockExecutor::unused(char letter, const std::string& uses) const {
  if (b_.has(letter))
    fail(b_.word(letter)->column, std::string(1, static_cast<char>(letter - 32)),
         std::string(1, static_cast<char>(letter - 32)) + " word on a line without " + uses +
             " to use it");
}

void Rs274BlockExecutor::check_letters() const {
  const bool arc = motion_ == 20 || motion_ == 30;
  const bool cycle = is_cycle(motion_);
  if (!arc) {
    unused('i', "G2 or G3");
    unused('j', "G2 or G3");
    unused('k', "G2 or G3");
  }
  if (!arc && !cycle) unused('r', "G2, G3 or a canned cycle");
  if (!(g_[0] && g_[0]->number == 40) && motion_ != 820 && motion_ != 890 && !non_modal(100))
    unused('p', "G4, G10, G82 or G89");
  if (motion_ != 830) unused('q', "G83");
  if (!cycle && !non_modal(100)) unused('l', "G10 or a canned cycle");
  if (!(g_[7] && g_[7]->number != 400)) unused('d', "G41 or G42");
  if (!(g_[8] && g_[8]->number == 430)) unused('h', "G43");
}

double Rs274BlockExecutor::stored_length(int number, int column, const std::string& code) const {
  const double v = mm(in_.parameters_.get(number));
  if (std::fabs(v) > 1e7)
    fail(column, code,
         "parameter #" + std::to_string(number) + " is out of range (more than 10 km)");
  return v;
}

double Rs274BlockExecutor::length(char letter) const {
  const double v = mm(word(letter).value);
  if (std::fabs(v) > 1e7)
    fail(word(letter).column, upper(letter), "value is out of range (more than 10 km)");
  return v;
}

int Rs274BlockExecutor::whole(char letter, int min, int max, const std::string& what) const {
  const auto& w = word(letter);
  const double rounded = std::floor(w.value + 0.5);
  if (std::fabs(w.value - rounded) > 0.0001 || rounded < min || rounded > max)
    fail(w.column, upper(letter), what);
  return static_cast<int>(rounded);
}

void Rs274BlockExecutor::feed_and_speed() {
  if (b_.has('f')) {
    const auto& f = word('f');
    if (f.value < 0) fail(f.column, "F", "feed rate must not be negative");
    if (st_.feed_mode == FeedMode::UnitsPerMinute) st_.feed_mm_per_min = mm(f.value);
  }
  if (b_.has('s')) {
    const auto& s = word('s');
    if (s.value < 0) fail(s.column, "S", "spindle speed must not be negative");
    speed_changed_ = s.value != st_.spindle_rpm;
    st_.spindle_rpm = s.value;
  }
}

void Rs274BlockExecutor::tool_and_spindle() {
  if (b_.has('t')) st_.selected_tool = whole('t', 0, 1 << 30, "T needs a tool number, 0 or more");
  if (m_[6]) {
    st_.tool = st_.selected_tool;
    in_.push(b_.line, ToolChange{st_.tool});
  }
  if (m_[7]) {
    const int code = m_[7]->number;
    st_.spindle = code == 3   ? SpindleDirection::Clockwise
                  : code == 4 ? SpindleDirection::Counterclockwise
                              : SpindleDirection::Stopped;
  }
  if (m_[7] || (speed_changed_ && st_.spindle != SpindleDirection::Stopped))
    in_.push(b_.line, SpindleChange{st_.spindle, st_.spindle_rpm});
  if (m_[8]) {
    const int code = m_[8]->number;
    if (code == 9) st_.coolant = {};
    if (code == 7 || both_coolants_) st_.coolant.mist = true;
    if (code == 8 || both_coolants_) st_.coolant.flood = true;
    in_.push(b_.line, CoolantChange{st_.coolant});
  }
}

void Rs274BlockExecutor::dwell() {
  if (!b_.has('p')) fail(g_[0]->column, "G4", "G4 needs P, the dwell time in seconds");
  const auto& p = word('p');
  if (p.value < 0) fail(p.column, "P", "dwell time must not be negative");
  in_.push(b_.line, Dwell{p.value});
}

void Rs274BlockExecutor::plane() {
  const int code = g_[2]->number;
  const Plane chosen = code == 170 ? Plane::XY : code == 180 ? Plane::ZX : Plane::YZ;
  if (chosen != Plane::XY && st_.compensation != CompensationSide::Off)
    fail(g_[2]->column, g_name(code),
         "the plane cannot change while cutter compensation is on; give G40 first");
  st_.plane = chosen;
}

const ToolTableEntry* Rs274BlockExecutor::find_tool(int number) const {
  for (const auto& tool : in_.options_.tools)
    if (tool.number == number) return &tool;
  return nullptr;
}

ToolTableEntry Rs274BlockExecutor::tool_for(char letter, int number,
                                            const std::string& code) const {
  if (number == 0) return {};
  const auto* tool = find_tool(number);
  if (tool == nullptr) {
    const char shown = letter == 'd' ? 'D' : 'H';
    if (in_.options_.missing_tools_are_zero) {
      in_.push(b_.line, MissingTool{number, shown});
      return {number, 0, 0};
    }
    fail(b_.has(letter) ? word(letter).column : g_[7]->column,
         b_.has(letter) ? upper(letter) : code,
         "tool " + std::to_string(number) + " is not in the tool table; add it or use another");
  }
  return *tool;
}

void Rs274BlockExecutor::compensation() {
  const int code = g_[7]->number;
  if (code == 400) {
    st_.compensation = CompensationSide::Off;
    st_.compensation_radius_mm = 0;
    in_.programmed_.reset();
    in_.compensation_entry_pending_ = false;
    return;
  }
  const std::string name = g_name(code);
  if (st_.compensation != CompensationSide::Off)
    fail(g_[7]->column, name, "cutter compensation is already on; give G40 before " + name);
  if (st_.plane != Plane::XY)
    fail(g_[7]->column, name, "cutter compensation works only in the XY plane (G17)");
  int number = st_.tool;
  if (b_.has('d')) {
    number = whole('d', 0, 1 << 30, "D needs a tool number, 0 or more");
  } else if (number == 0) {
    fail(g_[7]->column, name,
         name +
             " needs D, the tool whose radius to use (no tool is in the "
             "spindle)");
  }
  const auto tool = tool_for('d', number, name);
  st_.compensation = code == 410 ? CompensationSide::Left : CompensationSide::Right;
  st_.compensation_radius_mm = tool.radius_mm;
  in_.compensation_entry_pending_ = tool.radius_mm > 0;
}

void Rs274BlockExecutor::length_offset() {
  double length = 0;
  if (g_[8]->number == 430) {
    if (!b_.has('h')) fail(g_[8]->column, "G43", "G43 needs H, the tool whose length to use");
    const int number = whole('h', 0, 1 << 30, "H needs a tool number, 0 or more");
    length = tool_for('h', number, "G43").length_mm;
  }
  const double shift = st_.length_offset_mm - length;
  in_.position_.z += shift;
  if (in_.programmed_) in_.programmed_->z += shift;
  st_.length_offset_active = g_[8]->number == 430;
  st_.length_offset_mm = length;
}

void Rs274BlockExecutor::coordinate_system(int code) {
  const int index = code <= 590 ? (code - 540) / 10 + 1 : code - 591 + 7;
  select_system(index, g_[12]->column, g_name(code));
}

void Rs274BlockExecutor::shift_origin(const Point3& old_total, const Point3& new_total) {
  const Point3 shift{old_total.x - new_total.x, old_total.y - new_total.y,
                     old_total.z - new_total.z};
  for (Point3* p : {&in_.position_, in_.programmed_ ? &*in_.programmed_ : nullptr}) {
    if (p == nullptr) continue;
    p->x += shift.x;
    p->y += shift.y;
    p->z += shift.z;
  }
}

void Rs274BlockExecutor::select_system(int index, int column, const std::string& code) {
  const int first = 5221 + 20 * (index - 1);
  Point3 origin;
  if (in_.parameters_.valid(first + 2))
    origin = {stored_length(first, column, code), stored_length(first + 1, column, code),
              stored_length(first + 2, column, code)};
  const Point3& g92 = st_.axis_offset_mm;
  const Point3& old = st_.work_offset_mm;
  shift_origin({old.x + g92.x, old.y + g92.y, old.z + g92.z},
               {origin.x + g92.x, origin.y + g92.y, origin.z + g92.z});
  st_.coordinate_system = index;
  st_.work_offset_mm = origin;
  if (in_.parameters_.valid(5220)) in_.parameters_.set(5220, index);
}

void Rs274BlockExecutor::coordinate_data() {
  const int column = g_[0]->column;
  if (!b_.has('l'))
    fail(column, "G10",
         "G10 needs L2 (set a coordinate system's origin) or L20 (set it so the current point "
         "has the given coordinates)");
  const int l = whole('l', 0, 1000, "L needs a whole number: L2 or L20 with G10");
  if (l == 1)
    fail(word('l').column, "L",
         "G10 L1 (tool table data) is not supported by the checker; the tools come from the "
         "job's [[tool]] tables");
  if (l != 2 && l != 20) fail(word('l').column, "L", "G10 takes L2 or L20");
  if (!b_.has('p')) fail(column, "G10", "G10 needs P, the coordinate system: 1 (G54) to 9 (G59.3)");
  const int n = whole('p', 1, 9, "P needs a coordinate system from 1 (G54) to 9 (G59.3)");
  const int first = 5221 + 20 * (n - 1);
  if (!in_.parameters_.valid(first + 2))
    fail(word('p').column, "P",
         "parameter #" + std::to_string(first) + " is beyond this control's parameters");
  const Point3 here = current_point();
  const Point3& origin = st_.work_offset_mm;
  const std::array<char, 3> letters{'x', 'y', 'z'};
  const std::array<double, 3> at{here.x + origin.x, here.y + origin.y, here.z + origin.z};
  for (std::size_t i = 0; i < 3; ++i) {
    const char letter = letters[i];
    if (!b_.has(letter)) continue;
    const double value = length(letter);  // checks the range
    const int number = first + static_cast<int>(i);
    if (l == 2)
      in_.parameters_.set(number, word(letter).value);
    else
      in_.parameters_.set(number, from_mm(at[i] - value, st_.program_units));
  }
  if (n == st_.coordinate_system) select_system(n, column, "G10");
}

void Rs274BlockExecutor::axis_offsets() {
  const int code = g_[0]->number;
  const int column = g_[0]->column;
  const Point3 old = st_.axis_offset_mm;
  Point3 offset = old;
  if (code == 920) {
    if (!axis_words())
      fail(column, "G92", "G92 needs X, Y or Z: the coordinates the current point is to have");
    const Point3 here = current_point();
    const auto set = [&](char letter, double& value, double now, int number) {
      if (!b_.has(letter)) return;
      value = now - length(letter);
      if (in_.parameters_.valid(number))
        in_.parameters_.set(number, from_mm(value, st_.program_units));
    };
    set('x', offset.x, here.x + old.x, 5211);
    set('y', offset.y, here.y + old.y, 5212);
    set('z', offset.z, here.z + old.z, 5213);
  } else if (code == 921 || code == 922) {
    offset = {};
    if (code == 921)
      for (int number = 5211; number <= 5216; ++number)
        if (in_.parameters_.valid(number)) in_.parameters_.set(number, 0);
  } else {
    const std::string name = g_name(code);
    if (in_.parameters_.valid(5213))
      offset = {stored_length(5211, column, name), stored_length(5212, column, name),
                stored_length(5213, column, name)};
  }
  const Point3& w = st_.work_offset_mm;
  shift_origin({w.x + old.x, w.y + old.y, w.z + old.z},
               {w.x + offset.x, w.y + offset.y, w.z + offset.z});
  st_.axis_offset_mm = offset;
}

void Rs274BlockExecutor::stops() {
  if (!m_[4]) return;
  const int code = m_[4]->number;
  if (code == 2 || code == 30)
    emit(ProgramEnd{code == 2 ? EndKind::M2 : EndKind::M30});
  else
    emit(Stop{code == 1 ? StopKind::Optional : StopKind::Program});
}

void Rs274BlockExecutor::fail(int column, const std::string& field,
                              const std::string& message) const {
  in_.fail(b_, column, field, message);
}

}  // namespace dovetailor
