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

namespace dovetailor {

class Rs274BlockExecutor {
 public:
  Rs274BlockExecutor(Rs274Interpreter& interpreter, const Rs274Block& block)
      : in_(interpreter), b_(block), st_(interpreter.state_) {}

  void run();

 private:
  // --- reading the block ---
  void classify();

  bool homing() const { return g_[0] && (g_[0]->number == 280 || g_[0]->number == 300); }
  bool non_modal(int code) const { return g_[0] && g_[0]->number == code; }
  // G28, G30, G10 and G92 take the axis words for themselves.
  bool takes_axis_words() const { return homing() || non_modal(100) || non_modal(920); }

  // G28 / G30 (NISTIR 6556 section 3.5.9, from memory): rapid to the
  // intermediate point given by the axis words, if any, then rapid with all
  // three axes to the home position held in machine coordinates in
  // #5161-#5163 (G28) or #5181-#5183 (G30).
  void go_home();

  bool axis_words() const { return b_.has('x') || b_.has('y') || b_.has('z'); }

  void decide_motion();
  int first_axis_column() const;
  void unused(char letter, const std::string& uses) const;
  void check_letters() const;

  double mm(double value) const { return to_mm(value, st_.program_units); }

  // A position kept in a parameter (an origin, a home position), in mm.
  double stored_length(int number, int column, const std::string& code) const;

  // A length word in mm. Anything beyond 10 km is a typing error, and
  // refusing it keeps every coordinate the simulation sees finite.
  double length(char letter) const;

  const Rs274Word& word(char letter) const { return *b_.word(letter); }
  std::string upper(char letter) const { return std::string(1, static_cast<char>(letter - 32)); }

  int whole(char letter, int min, int max, const std::string& what) const;

  // --- the steps of a block, in order ---
  void feed_and_speed();
  void tool_and_spindle();
  void dwell();
  void plane();
  const ToolTableEntry* find_tool(int number) const;
  ToolTableEntry tool_for(char letter, int number, const std::string& code) const;
  void compensation();
  void length_offset();
  void coordinate_system(int code);
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
  void cycle();
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
  std::array<std::optional<Rs274Code>, 14> g_;
  std::array<std::optional<Rs274Code>, 10> m_;
  bool both_coolants_ = false;
  bool speed_changed_ = false;
  bool retract_to_r_ = in_.retract_to_r_mode_;
  int motion_ = -1;
  int motion_column_ = 0;
  int previous_motion_ = 800;
};

}  // namespace dovetailor
