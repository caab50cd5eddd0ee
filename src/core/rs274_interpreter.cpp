#include <algorithm>
#include <array>
#include <cmath>

#include <dovetailor/error.hpp>
#include <dovetailor/rs274_interpreter.hpp>

#include "cutter_compensation.hpp"
#include "rs274_arc.hpp"

namespace dovetailor {

namespace {

// Modal groups of G codes (NISTIR 6556 table 4 "Modal groups", from
// memory). Codes are times ten. -1: not an RS-274/NGC code; -2: an
// RS-274/NGC code the checker does not simulate.
int g_group(int code) {
  switch (code) {
    case 0:
    case 10:
    case 20:
    case 30:
    case 800:
    case 810:
    case 820:
    case 830:
    case 850:
    case 890:
      return 1;
    case 170:
    case 180:
    case 190:
      return 2;
    case 900:
    case 910:
      return 3;
    case 930:
    case 940:
      return 5;
    case 200:
    case 210:
      return 6;
    case 400:
    case 410:
    case 420:
      return 7;
    case 430:
    case 490:
      return 8;
    case 980:
    case 990:
      return 10;
    case 540:
    case 550:
    case 560:
    case 570:
    case 580:
    case 590:
    case 591:
    case 592:
    case 593:
      return 12;
    case 610:
    case 611:
    case 640:
      return 13;
    case 40:
    case 280:
    case 300:
    case 530:
      return 0;
    case 100:
    case 382:
    case 840:
    case 860:
    case 870:
    case 880:
    case 920:
    case 921:
    case 922:
    case 923:
      return -2;
    default:
      return -1;
  }
}

// M code groups (same table): 4 stopping, 6 tool change, 7 spindle,
// 8 coolant, 9 override switches.
int m_group(int code) {
  switch (code) {
    case 0:
    case 1:
    case 2:
    case 30:
    case 60:
      return 4;
    case 6:
      return 6;
    case 3:
    case 4:
    case 5:
      return 7;
    case 7:
    case 8:
    case 9:
      return 8;
    case 48:
    case 49:
      return 9;
    default:
      return -1;
  }
}

std::string g_name(int code) {
  return "G" + std::to_string(code / 10) + (code % 10 ? "." + std::to_string(code % 10) : "");
}

std::string m_name(int code) { return "M" + std::to_string(code); }

bool is_cycle(int motion) { return motion >= 810 && motion <= 890; }

}  // namespace

class Rs274BlockExecutor {
 public:
  Rs274BlockExecutor(Rs274Interpreter& interpreter, const Rs274Block& block)
      : in_(interpreter), b_(block), st_(interpreter.state_) {}

  void run() {
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
    motion();
    stops();
  }

 private:
  // --- reading the block ---
  void classify() {
    for (const auto& code : b_.g_codes) {
      const int group = g_group(code.number);
      if (group == -1)
        fail(code.column, g_name(code.number),
             g_name(code.number) + " is not an RS-274/NGC G code");
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
      const bool mist_and_flood = group == 8 && slot && slot->number != 9 && code.number != 9 &&
                                  slot->number != code.number;
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

  bool homing() const { return g_[0] && (g_[0]->number == 280 || g_[0]->number == 300); }

  // G28 / G30 (NISTIR 6556 section 3.5.9, from memory): rapid to the
  // intermediate point given by the axis words, if any, then rapid with all
  // three axes to the home position held in machine coordinates in
  // #5161-#5163 (G28) or #5181-#5183 (G30).
  void go_home() {
    const std::string code = g_name(g_[0]->number);
    if (st_.compensation != CompensationSide::Off)
      fail(g_[0]->column, code,
           code + " cannot be used with cutter compensation on; give G40 first");
    motion_column_ = g_[0]->column;
    Point3& position = in_.position_;
    if (axis_words()) {
      const Point3 via = end_point();
      const PathSegment path{position, via, {}};
      in_.push_motion(b_.line, MotionKind::Rapid, path, {path}, 0);
      position = via;
    }
    const int first = g_[0]->number == 280 ? 5161 : 5181;
    Point3 home;
    if (in_.parameters_.valid(first + 2))
      home = {stored_length(first, g_[0]->column, code),
              stored_length(first + 1, g_[0]->column, code),
              stored_length(first + 2, g_[0]->column, code)};
    const Point3 to{home.x - st_.work_offset_mm.x, home.y - st_.work_offset_mm.y,
                    home.z - st_.work_offset_mm.z - st_.length_offset_mm};
    const PathSegment path{position, to, {}};
    in_.push_motion(b_.line, MotionKind::Rapid, path, {path}, 0);
    position = to;
  }

  bool axis_words() const { return b_.has('x') || b_.has('y') || b_.has('z'); }

  void decide_motion() {
    const bool g53 = g_[0] && g_[0]->number == 530;
    previous_motion_ = in_.motion_mode_;
    if (homing()) {
      // The axis words belong to G28/G30 (the intermediate point).
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
    const bool incremental =
        g_[3] ? g_[3]->number == 910 : st_.distance == DistanceMode::Incremental;
    if (g53 && incremental)
      fail(g_[0]->column, "G53", "G53 cannot be used in incremental mode (G91)");
  }

  int first_axis_column() const {
    int column = 0;
    for (char letter : {'x', 'y', 'z'})
      if (b_.has(letter) && (column == 0 || b_.word(letter)->column < column))
        column = b_.word(letter)->column;
    return column;
  }

  void unused(char letter, const std::string& uses) const {
    if (b_.has(letter))
      fail(b_.word(letter)->column, std::string(1, static_cast<char>(letter - 32)),
           std::string(1, static_cast<char>(letter - 32)) + " word on a line without " + uses +
               " to use it");
  }

  void check_letters() const {
    const bool arc = motion_ == 20 || motion_ == 30;
    const bool cycle = is_cycle(motion_);
    if (!arc) {
      unused('i', "G2 or G3");
      unused('j', "G2 or G3");
      unused('k', "G2 or G3");
    }
    if (!arc && !cycle) unused('r', "G2, G3 or a canned cycle");
    if (!(g_[0] && g_[0]->number == 40) && motion_ != 820 && motion_ != 890)
      unused('p', "G4, G82 or G89");
    if (motion_ != 830) unused('q', "G83");
    if (!cycle) unused('l', "a canned cycle");
    if (!(g_[7] && g_[7]->number != 400)) unused('d', "G41 or G42");
    if (!(g_[8] && g_[8]->number == 430)) unused('h', "G43");
  }

  double mm(double value) const { return to_mm(value, st_.program_units); }

  // A position kept in a parameter (an origin, a home position), in mm.
  double stored_length(int number, int column, const std::string& code) const {
    const double v = mm(in_.parameters_.get(number));
    if (std::fabs(v) > 1e7)
      fail(column, code,
           "parameter #" + std::to_string(number) + " is out of range (more than 10 km)");
    return v;
  }

  // A length word in mm. Anything beyond 10 km is a typing error, and
  // refusing it keeps every coordinate the simulation sees finite.
  double length(char letter) const {
    const double v = mm(word(letter).value);
    if (std::fabs(v) > 1e7)
      fail(word(letter).column, upper(letter), "value is out of range (more than 10 km)");
    return v;
  }

  const Rs274Word& word(char letter) const { return *b_.word(letter); }
  std::string upper(char letter) const { return std::string(1, static_cast<char>(letter - 32)); }

  int whole(char letter, int min, int max, const std::string& what) const {
    const auto& w = word(letter);
    const double rounded = std::floor(w.value + 0.5);
    if (std::fabs(w.value - rounded) > 0.0001 || rounded < min || rounded > max)
      fail(w.column, upper(letter), what);
    return static_cast<int>(rounded);
  }

  // --- the steps of a block, in order ---
  void feed_and_speed() {
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

  void tool_and_spindle() {
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

  void dwell() {
    if (!b_.has('p')) fail(g_[0]->column, "G4", "G4 needs P, the dwell time in seconds");
    const auto& p = word('p');
    if (p.value < 0) fail(p.column, "P", "dwell time must not be negative");
    in_.push(b_.line, Dwell{p.value});
  }

  void plane() {
    const int code = g_[2]->number;
    const Plane chosen = code == 170 ? Plane::XY : code == 180 ? Plane::ZX : Plane::YZ;
    if (chosen != Plane::XY && st_.compensation != CompensationSide::Off)
      fail(g_[2]->column, g_name(code),
           "the plane cannot change while cutter compensation is on; give G40 first");
    st_.plane = chosen;
  }

  const ToolTableEntry* find_tool(int number) const {
    for (const auto& tool : in_.options_.tools)
      if (tool.number == number) return &tool;
    return nullptr;
  }

  ToolTableEntry tool_for(char letter, int number, const std::string& code) const {
    if (number == 0) return {};
    const auto* tool = find_tool(number);
    if (tool == nullptr)
      fail(b_.has(letter) ? word(letter).column : g_[7]->column,
           b_.has(letter) ? upper(letter) : code,
           "tool " + std::to_string(number) + " is not in the tool table; add it or use another");
    return *tool;
  }

  void compensation() {
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

  void length_offset() {
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

  void coordinate_system(int code) {
    const int index = code <= 590 ? (code - 540) / 10 + 1 : code - 591 + 7;
    const int first = 5221 + 20 * (index - 1);
    Point3 origin;
    const std::string name = g_name(code);
    if (in_.parameters_.valid(first + 2))
      origin = {stored_length(first, g_[12]->column, name),
                stored_length(first + 1, g_[12]->column, name),
                stored_length(first + 2, g_[12]->column, name)};
    const Point3 old = st_.work_offset_mm;
    const Point3 shift{old.x - origin.x, old.y - origin.y, old.z - origin.z};
    for (Point3* p : {&in_.position_, in_.programmed_ ? &*in_.programmed_ : nullptr}) {
      if (p == nullptr) continue;
      p->x += shift.x;
      p->y += shift.y;
      p->z += shift.z;
    }
    st_.coordinate_system = index;
    st_.work_offset_mm = origin;
  }

  // --- motion ---
  bool compensating() const {
    return st_.compensation != CompensationSide::Off && st_.compensation_radius_mm > 0;
  }

  Point3 end_point() const {
    const bool g53 = g_[0] && g_[0]->number == 530;
    const Point3 base = in_.programmed_ ? *in_.programmed_ : in_.position_;
    Point3 end = base;
    end.z = in_.position_.z;
    const bool incremental = st_.distance == DistanceMode::Incremental;
    const auto axis = [&](char letter, double& value, double origin, double base_value) {
      if (!b_.has(letter)) return;
      const double v = length(letter);
      if (g53)
        value = v - origin;
      else
        value = incremental ? base_value + v : v;
    };
    axis('x', end.x, st_.work_offset_mm.x, base.x);
    axis('y', end.y, st_.work_offset_mm.y, base.y);
    axis('z', end.z, st_.work_offset_mm.z + st_.length_offset_mm, in_.position_.z);
    return end;
  }

  double feed_for(const PathSegment& path, const std::string& code) const {
    if (st_.feed_mode == FeedMode::InverseTime) {
      if (!b_.has('f') || word('f').value <= 0)
        fail(motion_column_, code,
             "in inverse time mode (G93) every feed move needs its own F greater than 0");
      return detail::path_length(path) * word('f').value;
    }
    if (st_.feed_mm_per_min <= 0)
      fail(motion_column_, code, code + " needs a feed rate: give F greater than 0 first");
    return st_.feed_mm_per_min;
  }

  void motion() {
    if (motion_ < 0) return;
    in_.motion_mode_ = motion_;
    if (motion_ == 800) {
      in_.cycle_r_.reset();
      in_.cycle_z_.reset();
      in_.cycle_p_.reset();
      in_.cycle_q_.reset();
      return;
    }
    if (is_cycle(motion_)) {
      if (axis_words()) cycle();
      return;
    }
    if (motion_ == 20 || motion_ == 30) {
      arc();
      return;
    }
    if (!axis_words()) return;
    if ((g_[0] && g_[0]->number == 530) && compensating())
      fail(g_[0]->column, "G53", "G53 cannot be used with cutter compensation on; give G40 first");
    straight(motion_ == 0 ? MotionKind::Rapid : MotionKind::Feed);
  }

  [[noreturn]] void compensation_fault(detail::CompensationFault fault) const {
    const std::string code = g_name(motion_);
    switch (fault) {
      case detail::CompensationFault::EntryInsideRadius:
        fail(motion_column_, code,
             "cutter compensation entry move starts within the cutter radius of its end point; "
             "start the entry farther from the contour");
      case detail::CompensationFault::ConcaveCorner:
        fail(motion_column_, code,
             "inside corner with cutter compensation: the cutter would gouge it (the NIST "
             "interpreter looks at one move at a time); round the corner with an arc larger "
             "than the cutter radius");
      case detail::CompensationFault::ArcRadiusNotGreater:
        fail(motion_column_, code,
             "the cutter radius is not smaller than the radius of this inside arc; use a smaller "
             "cutter or a larger arc");
      case detail::CompensationFault::None:
        break;
    }
    fail(motion_column_, code, "cutter compensation failed");
  }

  void straight(MotionKind kind) {
    const Point3 end = end_point();
    const std::string code = g_name(motion_);
    Point3& position = in_.position_;
    if (!compensating()) {
      const PathSegment path{position, end, {}};
      const double feed = kind == MotionKind::Feed ? feed_for(path, code) : 0;
      in_.push_motion(b_.line, kind, path, {path}, feed);
      position = end;
      return;
    }
    if (in_.compensation_entry_pending_) {
      const PathSegment path{position, end, {}};
      const double feed = kind == MotionKind::Feed ? feed_for(path, code) : 0;
      if (end.x == position.x && end.y == position.y) {
        in_.push_motion(b_.line, kind, path, {path}, feed);
        position = end;
        return;
      }
      auto moved =
          detail::compensate_entry(position, end, st_.compensation_radius_mm, st_.compensation);
      if (moved.fault != detail::CompensationFault::None) compensation_fault(moved.fault);
      position = moved.tool_centre.back().end;
      in_.programmed_ = end;
      in_.compensation_entry_pending_ = false;
      in_.push_motion(b_.line, kind, path, std::move(moved.tool_centre), feed);
      return;
    }
    Point3 start = *in_.programmed_;
    start.z = position.z;
    const PathSegment path{start, end, {}};
    const double feed = kind == MotionKind::Feed ? feed_for(path, code) : 0;
    auto moved = detail::compensate_move(position, path, st_.compensation_radius_mm,
                                         st_.compensation, kind == MotionKind::Feed);
    if (moved.fault != detail::CompensationFault::None) compensation_fault(moved.fault);
    position = moved.tool_centre.back().end;
    in_.programmed_ = end;
    in_.push_motion(b_.line, kind, path, std::move(moved.tool_centre), feed);
  }

  void arc() {
    const std::string code = g_name(motion_);
    const Plane pl = st_.plane;
    // In-plane axis letters and centre-offset letters, (first, second).
    const std::array<char, 2> axes = pl == Plane::XY   ? std::array{'x', 'y'}
                                     : pl == Plane::ZX ? std::array{'z', 'x'}
                                                       : std::array{'y', 'z'};
    const std::array<char, 2> offsets = pl == Plane::XY   ? std::array{'i', 'j'}
                                        : pl == Plane::ZX ? std::array{'k', 'i'}
                                                          : std::array{'j', 'k'};
    const char foreign = pl == Plane::XY ? 'k' : pl == Plane::ZX ? 'j' : 'i';
    const std::string plane_name = pl == Plane::XY   ? "XY (G17)"
                                   : pl == Plane::ZX ? "ZX (G18)"
                                                     : "YZ (G19)";
    if (!b_.has(axes[0]) && !b_.has(axes[1]))
      fail(motion_column_, code,
           code + " needs an end point in the " + plane_name + " plane: give " + upper(axes[0]) +
               " or " + upper(axes[1]) + " (the start point again for a full circle)");
    if (b_.has(foreign))
      fail(word(foreign).column, upper(foreign),
           upper(foreign) + " is not a centre offset for an arc in the " + plane_name + " plane");
    const bool radius_format = b_.has('r');
    const bool centre_format = b_.has(offsets[0]) || b_.has(offsets[1]);
    if (radius_format && centre_format)
      fail(word('r').column, "R",
           "give either R or the centre offsets " + upper(offsets[0]) + " " + upper(offsets[1]) +
               ", not both");
    if (!radius_format && !centre_format)
      fail(motion_column_, code,
           code + " needs R (radius) or the centre offsets " + upper(offsets[0]) + " and " +
               upper(offsets[1]));
    if (compensating() && in_.compensation_entry_pending_)
      fail(motion_column_, code,
           "an arc cannot be the first move after G41/G42; program a straight entry move first");

    const Point3 end = end_point();
    Point3 start = in_.programmed_ ? *in_.programmed_ : in_.position_;
    start.z = in_.position_.z;
    const auto direction = motion_ == 20 ? ArcDirection::Clockwise : ArcDirection::Counterclockwise;
    // Radius tolerance of the NIST interpreter: 0.0005 in or 0.005 mm (from memory).
    const double tolerance = st_.program_units == Units::Inch ? to_mm(0.0005, Units::Inch) : 0.005;
    const auto found =
        radius_format
            ? detail::centre_from_radius(start, end, length('r'), direction, pl, tolerance)
            : detail::centre_from_offsets(start, end, b_.has(offsets[0]) ? length(offsets[0]) : 0.0,
                                          b_.has(offsets[1]) ? length(offsets[1]) : 0.0, pl,
                                          tolerance);
    switch (found.fault) {
      case detail::ArcFault::SameEndPoints:
        fail(word('r').column, "R",
             "a full circle cannot be given with R; use the centre offsets " + upper(offsets[0]) +
                 " " + upper(offsets[1]));
      case detail::ArcFault::RadiusTooSmall:
        fail(word('r').column, "R", "R is smaller than half the distance to the end point");
      case detail::ArcFault::ZeroRadius:
        fail(motion_column_, code, "the arc has zero radius");
      case detail::ArcFault::RadiiDiffer:
        fail(motion_column_, code,
             "the end point is not on the circle: its distance from the centre differs from the "
             "start's by more than " +
                 std::string(st_.program_units == Units::Inch ? "0.0005 in" : "0.005 mm"));
      case detail::ArcFault::None:
        break;
    }
    const PathSegment path{start, end, ArcShape{found.centre, pl, direction, 1}};
    const double feed = feed_for(path, code);
    if (!compensating()) {
      in_.push_motion(b_.line, MotionKind::Arc, path, {path}, feed);
      in_.position_ = end;
      return;
    }
    auto moved = detail::compensate_move(in_.position_, path, st_.compensation_radius_mm,
                                         st_.compensation, true);
    if (moved.fault != detail::CompensationFault::None) compensation_fault(moved.fault);
    in_.position_ = moved.tool_centre.back().end;
    in_.programmed_ = end;
    in_.push_motion(b_.line, MotionKind::Arc, path, std::move(moved.tool_centre), feed);
  }

  void cycle() {
    const std::string code = g_name(motion_);
    if (st_.plane != Plane::XY)
      fail(motion_column_, code, "canned cycles outside the XY plane (G17) are not supported");
    if (st_.compensation != CompensationSide::Off)
      fail(motion_column_, code, "a canned cycle cannot run with cutter compensation on");
    if (st_.feed_mode == FeedMode::InverseTime)
      fail(motion_column_, code, "a canned cycle cannot run in inverse time feed (G93)");
    const bool retained = previous_motion_ == motion_;
    const auto level = [&](char letter, std::optional<double>& kept, const std::string& what) {
      if (b_.has(letter))
        kept = length(letter);
      else if (!retained || !kept)
        fail(motion_column_, code, code + " needs " + upper(letter) + ", " + what);
      return *kept;
    };
    const double r_word = level('r', in_.cycle_r_, "the retract (R) plane");
    const double z_word = level('z', in_.cycle_z_, "the bottom of the hole");
    int repeats = 1;
    if (b_.has('l')) repeats = whole('l', 1, 10000, "L needs a repeat count from 1 to 10000");
    Rs274Interpreter::Cycle c;
    c.code = motion_;
    c.line = b_.line;
    c.holes_left = repeats;
    const Point3 here = in_.position_;
    if (st_.distance == DistanceMode::Incremental) {
      c.dx = b_.has('x') ? length('x') : 0.0;
      c.dy = b_.has('y') ? length('y') : 0.0;
      c.x = here.x + c.dx;
      c.y = here.y + c.dy;
      c.r = here.z + r_word;
      c.bottom = c.r + z_word;
    } else {
      c.x = b_.has('x') ? length('x') : here.x;
      c.y = b_.has('y') ? length('y') : here.y;
      c.r = r_word;
      c.bottom = z_word;
    }
    if (c.bottom > c.r)
      fail(motion_column_, code, "the hole bottom Z is above the retract plane R");
    // P and Q are kept like R and Z while the same cycle continues (common
    // practice on controls; NIST V3 asks for them on every line, from memory).
    if (motion_ == 820 || motion_ == 890) {
      if (b_.has('p')) {
        if (word('p').value < 0) fail(word('p').column, "P", "dwell time must not be negative");
        in_.cycle_p_ = word('p').value;
      } else if (!retained || !in_.cycle_p_) {
        fail(motion_column_, code, code + " needs P, the dwell at the bottom");
      }
      c.dwell = *in_.cycle_p_;
    }
    if (motion_ == 830) {
      if (b_.has('q')) {
        if (length('q') <= 0)
          fail(word('q').column, "Q", "the peck depth Q must be greater than 0");
        in_.cycle_q_ = length('q');
      } else if (!retained || !in_.cycle_q_) {
        fail(motion_column_, code, "G83 needs Q, the depth of each peck");
      }
      c.peck = *in_.cycle_q_;
      if ((c.r - c.bottom) / c.peck > 1000)
        fail(motion_column_, code, "Q is so small that a hole needs more than 1000 pecks");
    }
    if (st_.feed_mm_per_min <= 0)
      fail(motion_column_, code, code + " needs a feed rate: give F greater than 0 first");
    double old_z = here.z;
    if (old_z < c.r) {
      const PathSegment up{here, {here.x, here.y, c.r}, {}};
      in_.push_motion(b_.line, MotionKind::Rapid, up, {up}, 0, true);
      in_.position_ = up.end;
      old_z = c.r;
    }
    c.clear = retract_to_r_ ? c.r : old_z;
    in_.cycle_ = c;
    in_.next_hole();
  }

  void stops() {
    if (!m_[4]) return;
    const int code = m_[4]->number;
    if (code == 2 || code == 30)
      emit(ProgramEnd{code == 2 ? EndKind::M2 : EndKind::M30});
    else
      emit(Stop{code == 1 ? StopKind::Optional : StopKind::Program});
  }

  // A canned cycle with repeats hands out its holes later; a stop follows them.
  template <typename Body>
  void emit(Body body) {
    if (in_.cycle_)
      in_.after_cycle_.emplace_back(b_.line, body);
    else
      in_.push(b_.line, body);
  }

  [[noreturn]] void fail(int column, const std::string& field, const std::string& message) const {
    in_.fail(b_, column, field, message);
  }

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

Rs274Interpreter::Rs274Interpreter(ProgramSource& source, InterpreterOptions options)
    : source_(source), options_(std::move(options)), parameters_(options_.highest_parameter) {
  for (const auto& [number, value] : options_.parameters)
    if (parameters_.valid(number)) parameters_.set(number, value);
  state_.program_units = options_.initial_units;
  if (parameters_.valid(5223)) {
    const auto units = options_.initial_units;
    state_.work_offset_mm = {to_mm(parameters_.get(5221), units),
                             to_mm(parameters_.get(5222), units),
                             to_mm(parameters_.get(5223), units)};
  }
  position_ = options_.start_mm;
}

void Rs274Interpreter::fail(const Rs274Block& block, int column, const std::string& field,
                            const std::string& message) const {
  throw InputError(message, {source_.name(), block.line, column}, field);
}

void Rs274Interpreter::push(int line, EventBody body) {
  queue_.push_back(Event{line, state_, std::move(body)});
}

void Rs274Interpreter::push_motion(int line, MotionKind kind, PathSegment programmed,
                                   std::vector<PathSegment> tool_centre, double feed, bool canned) {
  push(line, Motion{kind, std::move(programmed), std::move(tool_centre), feed, canned});
}

bool Rs274Interpreter::read_block() {
  if (!source_.next_line(text_)) return false;
  ++line_;
  if (options_.block_delete) {
    const auto first = text_.find_first_not_of(" \t");
    if (first != std::string::npos && text_[first] == '/') return true;
  }
  const Rs274Block block =
      read_rs274_block(text_, line_, source_.name(), parameters_, options_.limits);
  if (block.percent_line) {
    if (content_seen_) push(line_, ProgramEnd{EndKind::Percent});
    content_seen_ = true;
    return true;
  }
  if (block.empty()) return true;
  content_seen_ = true;
  for (const auto& setting : block.settings) parameters_.set(setting.number, setting.value);
  execute(block);
  return true;
}

void Rs274Interpreter::execute(const Rs274Block& block) { Rs274BlockExecutor(*this, block).run(); }

std::optional<Event> Rs274Interpreter::next() {
  for (;;) {
    if (!queue_.empty()) {
      Event event = std::move(queue_.front());
      queue_.pop_front();
      if (std::holds_alternative<ProgramEnd>(event.body)) {
        ended_ = true;
        queue_.clear();
        cycle_.reset();
        after_cycle_.clear();
      }
      return event;
    }
    if (ended_) return std::nullopt;
    if (cycle_) {
      next_hole();
      continue;
    }
    if (!after_cycle_.empty()) {
      for (auto& [line, body] : after_cycle_) push(line, std::move(body));
      after_cycle_.clear();
      continue;
    }
    if (!read_block()) push(line_, ProgramEnd{EndKind::EndOfInput});
  }
}

}  // namespace dovetailor
