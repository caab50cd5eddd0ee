#pragma once

// Carries out one RS-274 block on the interpreter's state, in the order of
// execution of NISTIR 6556 section 3.8 (from memory). Split over
// rs274_block_executor.cpp (codes, words and modes) and rs274_motion.cpp
// (moves, arcs, canned cycle set-up, G28/G30). Internal to the core library.

#include <array>
#include <optional>
#include <string>

#include <dovetailor/rs274/rs274_block.hpp>
#include <dovetailor/rs274/rs274_interpreter.hpp>

#include "cutter_compensation.hpp"
#include "rs274_arc.hpp"
#include "rs274_modal_groups.hpp"

namespace dovetailor {

class Rs274BlockExecutor {
 public:
  Rs274BlockExecutor(Rs274Interpreter& interpreter, const Rs274Block& block)
      : in_(interpreter), b_(block), st_(interpreter.state_) {}

  void run();

 private:
  // --- reading the block ---
  void classify();
  void classify_m_codes();

  // The code the line gives in `group`, if any.
  const std::optional<Rs274Code>& given(detail::GGroup group) const {
    return g_[detail::group_index(group)];
  }
  const std::optional<Rs274Code>& given(detail::MGroup group) const {
    return m_[detail::group_index(group)];
  }
  // The line gives `code` (in its group).
  bool gives(detail::GGroup group, GCode code) const {
    const auto& slot = given(group);
    return slot && slot->number == code_number(code);
  }
  static GCode g_of(const Rs274Code& c) { return static_cast<GCode>(c.number); }
  static MCode m_of(const Rs274Code& c) { return static_cast<MCode>(c.number); }
  // The non-modal code of the line, if any.
  const std::optional<Rs274Code>& non_modal() const { return given(detail::GGroup::NonModal); }
  bool non_modal(GCode c) const { return gives(detail::GGroup::NonModal, c); }

  bool homing() const { return non_modal(GCode::Home) || non_modal(GCode::SecondHome); }
  // G28, G30, G10 and G92 take the axis words for themselves.
  bool takes_axis_words() const {
    return homing() || non_modal(GCode::SetCoordinateData) || non_modal(GCode::AxisOffset);
  }

  // G28 / G30 (NISTIR 6556 section 3.5.9, from memory): rapid to the
  // intermediate point given by the axis words, if any, then rapid with all
  // three axes to the home position held in machine coordinates in
  // #5161-#5163 (G28) or #5181-#5183 (G30).
  void go_home();

  bool axis_words() const { return b_.has(Word::X) || b_.has(Word::Y) || b_.has(Word::Z); }

  void decide_motion();
  void check_g53() const;
  int first_axis_column() const;
  void unused(Word letter, const std::string& uses) const;
  void check_letters() const;
  bool arc_motion() const { return motion_ && is_arc(*motion_); }
  bool cycle_motion() const { return motion_ && is_canned_cycle(*motion_); }
  bool motion_is(GCode c) const { return motion_ == c; }

  double mm(double value) const { return to_mm(value, st_.program_units); }

  // A position kept in a parameter (an origin, a home position), in mm.
  double stored_length(int number, int column, const std::string& code) const;

  // A length word in mm. Anything beyond 10 km is a typing error, and
  // refusing it keeps every coordinate the simulation sees finite.
  double length(Word letter) const;
  // The length word in mm, or `otherwise` when the line has none.
  double length_or(Word letter, double otherwise) const {
    return b_.has(letter) ? length(letter) : otherwise;
  }

  const Rs274Word& word(Word letter) const { return *b_.word(letter); }

  int whole(Word letter, int min, int max, const std::string& what) const;

  // --- the steps of a block, in order ---
  void feed_and_speed();
  void tool_and_spindle();
  void dwell();
  void plane();
  const ToolTableEntry* find_tool(int number) const;
  ToolTableEntry tool_for(Word letter, int number, const std::string& code) const;
  void compensation();
  void length_offset();
  void coordinate_system(GCode code);
  // Makes system `index` (1..9) the selected one, its origin read from the
  // parameters now; the current point keeps its machine position.
  void select_system(int index, int column, const std::string& code);
  // The current point gets new work coordinates for a changed origin or
  // G92 offset (both machine coordinates).
  void shift_origin(const Point3& old_total, const Point3& new_total);
  // The point G10 L20 and G92 refer to: the programmed point while
  // compensating, else the tool's.
  Point3 current_point() const { return in_.programmed_ ? *in_.programmed_ : in_.position_; }
  // G10 L2 / L20 (NISTIR 6556, section on G10, from memory).
  void coordinate_data();
  // G92, G92.1, G92.2, G92.3 (NISTIR 6556, section on G92, from memory).
  void axis_offsets();

  // --- motion ---
  bool compensating() const;
  Point3 end_point() const;
  double feed_for(const PathSegment& path, const std::string& code) const;
  void motion();
  [[noreturn]] void compensation_fault(detail::CompensationFault fault) const;
  void straight(MotionKind kind);
  void arc();
  void check_arc_words(const std::string& code) const;
  detail::FoundCentre arc_centre(const Point3& start, const Point3& end,
                                 ArcDirection direction) const;
  void arc_fault(detail::ArcFault fault, const std::string& code) const;
  void cycle();
  void check_cycle_modes(const std::string& code) const;
  void cycle_dwell_and_peck(Rs274Interpreter::Cycle& c, bool retained, const std::string& code);
  void stops();

  // A canned cycle with repeats hands out its holes later; a stop follows them.
  template <typename Body>
  void emit(Body body) {
    if (in_.cycle_)
      in_.after_cycle_.emplace_back(b_.line, body);
    else
      in_.push(b_.line, body);
  }
  [[noreturn]] void fail(int column, const std::string& field, const std::string& message) const;
  Rs274Interpreter& in_;
  const Rs274Block& b_;
  MachineState& st_;
  std::array<std::optional<Rs274Code>, detail::g_group_count> g_;
  std::array<std::optional<Rs274Code>, detail::m_group_count> m_;
  bool both_coolants_ = false;
  bool speed_changed_ = false;
  bool retract_to_r_ = in_.retract_to_r_mode_;
  std::optional<GCode> motion_;  // the motion this line makes, if any
  int motion_column_ = 0;
  GCode previous_motion_ = GCode::CycleCancel;
};

}  // namespace dovetailor
