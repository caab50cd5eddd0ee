#include "rs274_block_executor.hpp"

#include <cmath>
#include <string>

#include <dovetailor/base/error.hpp>

#include "rs274_arc.hpp"
#include "rs274_modal_groups.hpp"

namespace dovetailor {

using detail::GGroup;
using detail::MGroup;

namespace {

// Anything beyond 10 km is a typing error; refusing it keeps every
// coordinate the simulation sees finite.
constexpr double longest_length_mm = 1e7;
// T, D and H take tool numbers from 0 up to this.
constexpr int highest_tool_number = 1 << 30;

}  // namespace

void Rs274BlockExecutor::run() {
  classify();
  decide_motion();
  check_letters();
  if (const auto& feed_mode = given(GGroup::FeedMode))
    st_.feed_mode =
        g_of(*feed_mode) == GCode::InverseTime ? FeedMode::InverseTime : FeedMode::UnitsPerMinute;
  if (const auto& units = given(GGroup::Units))
    st_.program_units = g_of(*units) == GCode::Inch ? Units::Inch : Units::Millimetre;
  feed_and_speed();
  tool_and_spindle();
  if (non_modal(GCode::Dwell)) dwell();
  if (given(GGroup::Plane)) plane();
  if (given(GGroup::CutterCompensation)) compensation();
  if (given(GGroup::LengthOffset)) length_offset();
  if (const auto& system = given(GGroup::CoordinateSystem)) coordinate_system(g_of(*system));
  if (const auto& distance = given(GGroup::Distance))
    st_.distance =
        g_of(*distance) == GCode::Absolute ? DistanceMode::Absolute : DistanceMode::Incremental;
  if (const auto& mode = given(GGroup::ReturnMode)) retract_to_r_ = g_of(*mode) == GCode::ReturnToR;
  in_.retract_to_r_mode_ = retract_to_r_;
  if (homing()) go_home();
  if (non_modal(GCode::SetCoordinateData)) coordinate_data();
  if (non_modal(GCode::AxisOffset) || non_modal(GCode::AxisOffsetClear) ||
      non_modal(GCode::AxisOffsetSuspend) || non_modal(GCode::AxisOffsetRestore))
    axis_offsets();
  motion();
  stops();
}

void Rs274BlockExecutor::classify() {
  for (const auto& c : b_.g_codes) {
    const std::string name = g_code_name(c.number);
    const auto known = detail::classify_g_code(c.number);
    if (!known) fail(c.column, name, name + " is not an RS-274/NGC G code");
    if (!known->simulated)
      fail(c.column, name,
           name +
               " is not supported by the checker; remove it or check this "
               "part of the program another way");
    auto& slot = g_[detail::group_index(known->group)];
    if (slot)
      fail(c.column, name,
           g_code_name(slot->number) + " and " + name +
               " are in the same modal group; give only one of them per line");
    slot = c;
  }
  classify_m_codes();
  for (Word letter : {Word::A, Word::B, Word::C})
    if (b_.has(letter))
      fail(b_.word(letter)->column, word_name(letter),
           "rotary axis words are not supported by the checker (three linear axes only)");
}

void Rs274BlockExecutor::classify_m_codes() {
  for (const auto& c : b_.m_codes) {
    const std::string name = m_code_name(c.number);
    const auto known = detail::classify_m_code(c.number);
    if (!known) fail(c.column, name, name + " is not an RS-274/NGC M code the checker knows");
    auto& slot = m_[detail::group_index(known->group)];
    // M7 and M8 may share a line (NISTIR 6556 section 3.6.4, from memory).
    const bool coolant = known->group == MGroup::Coolant;
    const bool mist_and_flood = coolant && slot && m_of(*slot) != MCode::CoolantOff &&
                                known->code != MCode::CoolantOff && slot->number != c.number;
    if (slot && !mist_and_flood)
      fail(c.column, name,
           m_code_name(slot->number) + " and " + name +
               " are in the same modal group; give only one of them per line");
    if (mist_and_flood) both_coolants_ = true;
    slot = c;
  }
}

void Rs274BlockExecutor::decide_motion() {
  previous_motion_ = in_.motion_mode_;
  const auto& motion = given(GGroup::Motion);
  if (takes_axis_words()) {
    // The axis words belong to G28/G30 (the intermediate point), G10 (the
    // origin) or G92 (the coordinates the current point is to have).
    if (motion && g_of(*motion) != GCode::CycleCancel && axis_words())
      fail(motion->column, g_code_name(motion->number),
           g_code_name(non_modal()->number) + " and " + g_code_name(motion->number) +
               " both use the axis words; put them on separate lines");
    if (motion) {
      motion_ = g_of(*motion);
      motion_column_ = motion->column;
    }
    return;
  }
  if (motion) {
    motion_ = g_of(*motion);
    motion_column_ = motion->column;
  } else if (axis_words()) {
    motion_ = in_.motion_mode_;
    motion_column_ = first_axis_column();
  }
  if (motion_is(GCode::CycleCancel) && axis_words())
    fail(first_axis_column(), code_name(GCode::CycleCancel),
         "axis words with G80 (motion cancelled) in effect; give G0, G1, G2 or G3 first");
  check_g53();
}

void Rs274BlockExecutor::check_g53() const {
  if (!non_modal(GCode::MachineCoordinates)) return;
  const int column = non_modal()->column;
  const std::string name = code_name(GCode::MachineCoordinates);
  if (!motion_is(GCode::Rapid) && !motion_is(GCode::Linear))
    fail(column, name, "G53 needs G0 or G1 on the line or in effect");
  const auto& distance = given(GGroup::Distance);
  const bool incremental =
      distance ? g_of(*distance) == GCode::Incremental : st_.distance == DistanceMode::Incremental;
  if (incremental) fail(column, name, "G53 cannot be used in incremental mode (G91)");
}

int Rs274BlockExecutor::first_axis_column() const {
  int column = 0;
  for (Word letter : {Word::X, Word::Y, Word::Z})
    if (b_.has(letter) && (column == 0 || b_.word(letter)->column < column))
      column = b_.word(letter)->column;
  return column;
}

void Rs274BlockExecutor::unused(Word letter, const std::string& uses) const {
  if (b_.has(letter))
    fail(b_.word(letter)->column, word_name(letter),
         word_name(letter) + " word on a line without " + uses + " to use it");
}

void Rs274BlockExecutor::check_letters() const {
  const bool arc = arc_motion();
  const bool cycle = cycle_motion();
  const bool g10 = non_modal(GCode::SetCoordinateData);
  if (!arc) {
    unused(Word::I, "G2 or G3");
    unused(Word::J, "G2 or G3");
    unused(Word::K, "G2 or G3");
  }
  if (!arc && !cycle) unused(Word::R, "G2, G3 or a canned cycle");
  if (!non_modal(GCode::Dwell) && !motion_is(GCode::DrillDwell) && !motion_is(GCode::BoreDwell) &&
      !g10)
    unused(Word::P, "G4, G10, G82 or G89");
  if (!motion_is(GCode::PeckDrill)) unused(Word::Q, "G83");
  if (!cycle && !g10) unused(Word::L, "G10 or a canned cycle");
  const auto& compensation = given(GGroup::CutterCompensation);
  if (!(compensation && g_of(*compensation) != GCode::CompensationOff))
    unused(Word::D, "G41 or G42");
  if (!gives(GGroup::LengthOffset, GCode::LengthOffset)) unused(Word::H, "G43");
}

double Rs274BlockExecutor::stored_length(int number, int column, const std::string& code) const {
  const double v = mm(in_.parameters_.get(number));
  if (std::fabs(v) > longest_length_mm)
    fail(column, code,
         "parameter #" + std::to_string(number) + " is out of range (more than 10 km)");
  return v;
}

double Rs274BlockExecutor::length(Word letter) const {
  const double v = mm(word(letter).value);
  if (std::fabs(v) > longest_length_mm)
    fail(word(letter).column, word_name(letter), "value is out of range (more than 10 km)");
  return v;
}

int Rs274BlockExecutor::whole(Word letter, int min, int max, const std::string& what) const {
  const auto& w = word(letter);
  const double rounded = std::floor(w.value + 0.5);
  if (std::fabs(w.value - rounded) > 0.0001 || rounded < min || rounded > max)
    fail(w.column, word_name(letter), what);
  return static_cast<int>(rounded);
}

void Rs274BlockExecutor::feed_and_speed() {
  if (b_.has(Word::F)) {
    const auto& f = word(Word::F);
    if (f.value < 0) fail(f.column, "F", "feed rate must not be negative");
    if (st_.feed_mode == FeedMode::UnitsPerMinute) st_.feed_mm_per_min = mm(f.value);
  }
  if (b_.has(Word::S)) {
    const auto& s = word(Word::S);
    if (s.value < 0) fail(s.column, "S", "spindle speed must not be negative");
    speed_changed_ = s.value != st_.spindle_rpm;
    st_.spindle_rpm = s.value;
  }
}

void Rs274BlockExecutor::tool_and_spindle() {
  if (b_.has(Word::T))
    st_.selected_tool = whole(Word::T, 0, highest_tool_number, "T needs a tool number, 0 or more");
  if (given(MGroup::ToolChange)) {
    st_.tool = st_.selected_tool;
    in_.push(b_.line, ToolChange{st_.tool});
  }
  const auto& spindle = given(MGroup::Spindle);
  if (spindle) {
    const MCode c = m_of(*spindle);
    st_.spindle = c == MCode::SpindleClockwise          ? SpindleDirection::Clockwise
                  : c == MCode::SpindleCounterclockwise ? SpindleDirection::Counterclockwise
                                                        : SpindleDirection::Stopped;
  }
  if (spindle || (speed_changed_ && st_.spindle != SpindleDirection::Stopped))
    in_.push(b_.line, SpindleChange{st_.spindle, st_.spindle_rpm});
  if (const auto& coolant = given(MGroup::Coolant)) {
    const MCode c = m_of(*coolant);
    if (c == MCode::CoolantOff) st_.coolant = {};
    if (c == MCode::Mist || both_coolants_) st_.coolant.mist = true;
    if (c == MCode::Flood || both_coolants_) st_.coolant.flood = true;
    in_.push(b_.line, CoolantChange{st_.coolant});
  }
}

void Rs274BlockExecutor::dwell() {
  if (!b_.has(Word::P)) fail(non_modal()->column, "G4", "G4 needs P, the dwell time in seconds");
  const auto& p = word(Word::P);
  if (p.value < 0) fail(p.column, "P", "dwell time must not be negative");
  in_.push(b_.line, Dwell{p.value});
}

void Rs274BlockExecutor::plane() {
  const auto& given_plane = *given(GGroup::Plane);
  const GCode c = g_of(given_plane);
  const Plane chosen = c == GCode::PlaneXY   ? Plane::XY
                       : c == GCode::PlaneZX ? Plane::ZX
                                             : Plane::YZ;
  if (chosen != Plane::XY && st_.compensation != CompensationSide::Off)
    fail(given_plane.column, code_name(c),
         "the plane cannot change while cutter compensation is on; give G40 first");
  st_.plane = chosen;
}

const ToolTableEntry* Rs274BlockExecutor::find_tool(int number) const {
  for (const auto& tool : in_.options_.tools)
    if (tool.number == number) return &tool;
  return nullptr;
}

ToolTableEntry Rs274BlockExecutor::tool_for(Word letter, int number,
                                            const std::string& code) const {
  if (number == 0) return {};
  const auto* tool = find_tool(number);
  if (tool == nullptr) {
    const char shown = letter == Word::D ? 'D' : 'H';
    if (in_.options_.missing_tools_are_zero) {
      in_.push(b_.line, MissingTool{number, shown});
      return {number, 0, 0};
    }
    fail(b_.has(letter) ? word(letter).column : given(GGroup::CutterCompensation)->column,
         b_.has(letter) ? word_name(letter) : code,
         "tool " + std::to_string(number) + " is not in the tool table; add it or use another");
  }
  return *tool;
}

void Rs274BlockExecutor::compensation() {
  const auto& given_side = *given(GGroup::CutterCompensation);
  const GCode c = g_of(given_side);
  const int column = given_side.column;
  if (c == GCode::CompensationOff) {
    st_.compensation = CompensationSide::Off;
    st_.compensation_radius_mm = 0;
    in_.programmed_.reset();
    in_.compensation_entry_pending_ = false;
    return;
  }
  const std::string name = code_name(c);
  if (st_.compensation != CompensationSide::Off)
    fail(column, name, "cutter compensation is already on; give G40 before " + name);
  if (st_.plane != Plane::XY)
    fail(column, name, "cutter compensation works only in the XY plane (G17)");
  int number = st_.tool;
  if (b_.has(Word::D)) {
    number = whole(Word::D, 0, highest_tool_number, "D needs a tool number, 0 or more");
  } else if (number == 0) {
    fail(column, name,
         name +
             " needs D, the tool whose radius to use (no tool is in the "
             "spindle)");
  }
  const auto tool = tool_for(Word::D, number, name);
  st_.compensation =
      c == GCode::CompensationLeft ? CompensationSide::Left : CompensationSide::Right;
  st_.compensation_radius_mm = tool.radius_mm;
  in_.compensation_entry_pending_ = tool.radius_mm > 0;
}

void Rs274BlockExecutor::length_offset() {
  double length = 0;
  const bool on = gives(GGroup::LengthOffset, GCode::LengthOffset);
  if (on) {
    if (!b_.has(Word::H))
      fail(given(GGroup::LengthOffset)->column, "G43", "G43 needs H, the tool whose length to use");
    const int number = whole(Word::H, 0, highest_tool_number, "H needs a tool number, 0 or more");
    length = tool_for(Word::H, number, "G43").length_mm;
  }
  const double shift = st_.length_offset_mm - length;
  in_.position_.z += shift;
  if (in_.programmed_) in_.programmed_->z += shift;
  st_.length_offset_active = on;
  st_.length_offset_mm = length;
}

void Rs274BlockExecutor::coordinate_system(GCode c) {
  // G54..G59 are systems 1..6, G59.1..G59.3 systems 7..9.
  const int n = code_number(c);
  const int index = c <= GCode::System6 ? (n - code_number(GCode::System1)) / 10 + 1
                                        : n - code_number(GCode::System7) + 7;
  select_system(index, given(GGroup::CoordinateSystem)->column, code_name(c));
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
  const int first = parameter::system_origin(index);
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
  if (in_.parameters_.valid(parameter::selected_system))
    in_.parameters_.set(parameter::selected_system, index);
}

void Rs274BlockExecutor::coordinate_data() {
  const int column = non_modal()->column;
  if (!b_.has(Word::L))
    fail(column, "G10",
         "G10 needs L2 (set a coordinate system's origin) or L20 (set it so the current point "
         "has the given coordinates)");
  const int l = whole(Word::L, 0, 1000, "L needs a whole number: L2 or L20 with G10");
  if (l == 1)
    fail(word(Word::L).column, "L",
         "G10 L1 (tool table data) is not supported by the checker; the tools come from the "
         "job's [[tool]] tables");
  if (l != 2 && l != 20) fail(word(Word::L).column, "L", "G10 takes L2 or L20");
  if (!b_.has(Word::P))
    fail(column, "G10", "G10 needs P, the coordinate system: 1 (G54) to 9 (G59.3)");
  const int n = whole(Word::P, 1, 9, "P needs a coordinate system from 1 (G54) to 9 (G59.3)");
  const int first = parameter::system_origin(n);
  if (!in_.parameters_.valid(first + 2))
    fail(word(Word::P).column, "P",
         "parameter #" + std::to_string(first) + " is beyond this control's parameters");
  const Point3 here = current_point();
  const Point3& origin = st_.work_offset_mm;
  const std::array<Word, 3> letters{Word::X, Word::Y, Word::Z};
  const std::array<double, 3> at{here.x + origin.x, here.y + origin.y, here.z + origin.z};
  for (std::size_t i = 0; i < 3; ++i) {
    const Word letter = letters[i];
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
  const GCode c = g_of(*non_modal());
  const int column = non_modal()->column;
  const Point3 old = st_.axis_offset_mm;
  Point3 offset = old;
  const int first = parameter::axis_offset;
  if (c == GCode::AxisOffset) {
    if (!axis_words())
      fail(column, "G92", "G92 needs X, Y or Z: the coordinates the current point is to have");
    const Point3 here = current_point();
    const auto set = [&](Word letter, double& value, double now, int number) {
      if (!b_.has(letter)) return;
      value = now - length(letter);
      if (in_.parameters_.valid(number))
        in_.parameters_.set(number, from_mm(value, st_.program_units));
    };
    set(Word::X, offset.x, here.x + old.x, first);
    set(Word::Y, offset.y, here.y + old.y, first + 1);
    set(Word::Z, offset.z, here.z + old.z, first + 2);
  } else if (c == GCode::AxisOffsetClear || c == GCode::AxisOffsetSuspend) {
    offset = {};
    if (c == GCode::AxisOffsetClear)
      for (int number = first; number <= parameter::axis_offset_last; ++number)
        if (in_.parameters_.valid(number)) in_.parameters_.set(number, 0);
  } else {
    const std::string name = code_name(c);
    if (in_.parameters_.valid(first + 2))
      offset = {stored_length(first, column, name), stored_length(first + 1, column, name),
                stored_length(first + 2, column, name)};
  }
  const Point3& w = st_.work_offset_mm;
  shift_origin({w.x + old.x, w.y + old.y, w.z + old.z},
               {w.x + offset.x, w.y + offset.y, w.z + offset.z});
  st_.axis_offset_mm = offset;
}

void Rs274BlockExecutor::stops() {
  const auto& stop = given(MGroup::Stopping);
  if (!stop) return;
  const MCode c = m_of(*stop);
  if (c == MCode::ProgramEnd || c == MCode::ProgramEndRewind)
    emit(ProgramEnd{c == MCode::ProgramEnd ? EndKind::M2 : EndKind::M30});
  else
    emit(Stop{c == MCode::OptionalStop ? StopKind::Optional : StopKind::Program});
}

void Rs274BlockExecutor::fail(int column, const std::string& field,
                              const std::string& message) const {
  in_.fail(b_, column, field, message);
}

}  // namespace dovetailor
