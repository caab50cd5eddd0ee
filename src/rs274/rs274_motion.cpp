#include <array>
#include <cmath>
#include <string>

#include <dovetailor/base/error.hpp>

#include "rs274_arc.hpp"
#include "rs274_block_executor.hpp"
#include "rs274_modal_groups.hpp"

namespace dovetailor {

void Rs274BlockExecutor::go_home() {
  const auto& given_home = *non_modal();
  const std::string code = g_code_name(given_home.number);
  const int column = given_home.column;
  if (st_.compensation != CompensationSide::Off)
    fail(column, code, code + " cannot be used with cutter compensation on; give G40 first");
  motion_column_ = column;
  Point3& position = in_.position_;
  if (axis_words()) {
    const Point3 via = end_point();
    const PathSegment path{position, via, {}};
    in_.push_motion(b_.line, MotionKind::Rapid, path, {path}, 0);
    position = via;
  }
  const bool g28 = g_of(given_home) == GCode::Home;
  const int first = g28 ? parameter::g28_home : parameter::g30_home;
  const Point3& w = st_.work_offset_mm;
  const Point3& g92 = st_.axis_offset_mm;
  Point3 to;
  if (const auto& rise = g28 ? in_.options_.g28_rise_to_mm : in_.options_.g30_rise_to_mm) {
    to = {position.x, position.y, *rise - w.z - g92.z - st_.length_offset_mm};
  } else {
    Point3 home;
    if (in_.parameters_.valid(first + 2))
      home = {stored_length(first, column, code), stored_length(first + 1, column, code),
              stored_length(first + 2, column, code)};
    to = {home.x - w.x - g92.x, home.y - w.y - g92.y, home.z - w.z - g92.z - st_.length_offset_mm};
  }
  const PathSegment path{position, to, {}};
  in_.push(b_.line, Motion{MotionKind::Rapid, path, {path}, 0, false, g28 ? 28 : 30});
  position = to;
}

bool Rs274BlockExecutor::compensating() const {
  return st_.compensation != CompensationSide::Off && st_.compensation_radius_mm > 0;
}

Point3 Rs274BlockExecutor::end_point() const {
  const bool g53 = non_modal(GCode::MachineCoordinates);
  const Point3 base = in_.programmed_ ? *in_.programmed_ : in_.position_;
  Point3 end = base;
  end.z = in_.position_.z;
  const bool incremental = st_.distance == DistanceMode::Incremental;
  const auto axis = [&](Word letter, double& value, double origin, double base_value) {
    if (!b_.has(letter)) return;
    const double v = length(letter);
    if (g53)
      value = v - origin;
    else
      value = incremental ? base_value + v : v;
  };
  const Point3& w = st_.work_offset_mm;
  const Point3& g92 = st_.axis_offset_mm;
  axis(Word::X, end.x, w.x + g92.x, base.x);
  axis(Word::Y, end.y, w.y + g92.y, base.y);
  axis(Word::Z, end.z, w.z + g92.z + st_.length_offset_mm, in_.position_.z);
  return end;
}

double Rs274BlockExecutor::feed_for(const PathSegment& path, const std::string& code) const {
  if (st_.feed_mode == FeedMode::InverseTime) {
    if (!b_.has(Word::F) || word(Word::F).value <= 0)
      fail(motion_column_, code,
           "in inverse time mode (G93) every feed move needs its own F greater than 0");
    return path_length(path) * word(Word::F).value;
  }
  if (st_.feed_mm_per_min <= 0)
    fail(motion_column_, code, code + " needs a feed rate: give F greater than 0 first");
  return st_.feed_mm_per_min;
}

void Rs274BlockExecutor::motion() {
  if (!motion_) return;
  in_.motion_mode_ = *motion_;
  if (motion_is(GCode::CycleCancel)) {
    in_.cycle_r_.reset();
    in_.cycle_z_.reset();
    in_.cycle_p_.reset();
    in_.cycle_q_.reset();
    return;
  }
  if (cycle_motion()) {
    if (axis_words()) cycle();
    return;
  }
  if (arc_motion()) {
    arc();
    return;
  }
  if (!axis_words()) return;
  if (non_modal(GCode::MachineCoordinates) && compensating())
    fail(non_modal()->column, "G53",
         "G53 cannot be used with cutter compensation on; give G40 first");
  straight(motion_is(GCode::Rapid) ? MotionKind::Rapid : MotionKind::Feed);
}

void Rs274BlockExecutor::compensation_fault(detail::CompensationFault fault) const {
  const std::string code = code_name(*motion_);
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

void Rs274BlockExecutor::straight(MotionKind kind) {
  const Point3 end = end_point();
  const std::string code = code_name(*motion_);
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
  auto moved = detail::compensate_move(position, path, st_.compensation_radius_mm, st_.compensation,
                                       kind == MotionKind::Feed);
  if (moved.fault != detail::CompensationFault::None) compensation_fault(moved.fault);
  position = moved.tool_centre.back().end;
  in_.programmed_ = end;
  in_.push_motion(b_.line, kind, path, std::move(moved.tool_centre), feed);
}

namespace {

// The in-plane axis letters, the centre-offset letters (first, second) and
// the offset letter that does not belong to the plane (NISTIR 6556 section
// 3.5.3, from memory: G17 X Y with I J, G18 Z X with K I, G19 Y Z with J K).
struct PlaneWords {
  std::array<Word, 2> axes;
  std::array<Word, 2> offsets;
  Word foreign;
  const char* name;
};

PlaneWords plane_words(Plane plane) {
  switch (plane) {
    case Plane::XY:
      return {{Word::X, Word::Y}, {Word::I, Word::J}, Word::K, "XY (G17)"};
    case Plane::ZX:
      return {{Word::Z, Word::X}, {Word::K, Word::I}, Word::J, "ZX (G18)"};
    case Plane::YZ:
      return {{Word::Y, Word::Z}, {Word::J, Word::K}, Word::I, "YZ (G19)"};
  }
  return {{Word::X, Word::Y}, {Word::I, Word::J}, Word::K, "XY (G17)"};
}

// How far the radii to an arc's start and end may differ, and R may fall
// short of half the chord: the NIST interpreter's 0.0005 in or 0.005 mm
// (from memory), in the program's units.
double arc_radius_tolerance_mm(Units units) {
  return units == Units::Inch ? to_mm(0.0005, Units::Inch) : 0.005;
}

}  // namespace

void Rs274BlockExecutor::check_arc_words(const std::string& code) const {
  const PlaneWords p = plane_words(st_.plane);
  const std::string plane_name = p.name;
  const std::string first = word_name(p.offsets[0]), second = word_name(p.offsets[1]);
  if (!b_.has(p.axes[0]) && !b_.has(p.axes[1]))
    fail(motion_column_, code,
         code + " needs an end point in the " + plane_name + " plane: give " +
             word_name(p.axes[0]) + " or " + word_name(p.axes[1]) +
             " (the start point again for a full circle)");
  if (b_.has(p.foreign))
    fail(word(p.foreign).column, word_name(p.foreign),
         word_name(p.foreign) + " is not a centre offset for an arc in the " + plane_name +
             " plane");
  const bool radius_format = b_.has(Word::R);
  const bool centre_format = b_.has(p.offsets[0]) || b_.has(p.offsets[1]);
  if (radius_format && centre_format)
    fail(word(Word::R).column, "R",
         "give either R or the centre offsets " + first + " " + second + ", not both");
  if (!radius_format && !centre_format)
    fail(motion_column_, code,
         code + " needs R (radius) or the centre offsets " + first + " and " + second);
  if (compensating() && in_.compensation_entry_pending_)
    fail(motion_column_, code,
         "an arc cannot be the first move after G41/G42; program a straight entry move first");
}

detail::FoundCentre Rs274BlockExecutor::arc_centre(const Point3& start, const Point3& end,
                                                   ArcDirection direction) const {
  const Plane pl = st_.plane;
  const PlaneWords p = plane_words(pl);
  const double tolerance = arc_radius_tolerance_mm(st_.program_units);
  if (b_.has(Word::R))
    return detail::centre_from_radius(start, end, length(Word::R), direction, pl, tolerance);
  return detail::centre_from_offsets(start, end, length_or(p.offsets[0], 0.0),
                                     length_or(p.offsets[1], 0.0), pl, tolerance);
}

void Rs274BlockExecutor::arc_fault(detail::ArcFault fault, const std::string& code) const {
  const PlaneWords p = plane_words(st_.plane);
  switch (fault) {
    case detail::ArcFault::SameEndPoints:
      fail(word(Word::R).column, "R",
           "a full circle cannot be given with R; use the centre offsets " +
               word_name(p.offsets[0]) + " " + word_name(p.offsets[1]));
    case detail::ArcFault::RadiusTooSmall:
      fail(word(Word::R).column, "R", "R is smaller than half the distance to the end point");
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
}

void Rs274BlockExecutor::arc() {
  const std::string code = code_name(*motion_);
  check_arc_words(code);
  const Point3 end = end_point();
  Point3 start = in_.programmed_ ? *in_.programmed_ : in_.position_;
  start.z = in_.position_.z;
  const auto direction =
      motion_is(GCode::ArcClockwise) ? ArcDirection::Clockwise : ArcDirection::Counterclockwise;
  const auto found = arc_centre(start, end, direction);
  arc_fault(found.fault, code);
  const PathSegment path{start, end, ArcShape{found.centre, st_.plane, direction, 1}};
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

void Rs274BlockExecutor::check_cycle_modes(const std::string& code) const {
  if (st_.plane != Plane::XY)
    fail(motion_column_, code, "canned cycles outside the XY plane (G17) are not supported");
  if (st_.compensation != CompensationSide::Off)
    fail(motion_column_, code, "a canned cycle cannot run with cutter compensation on");
  if (st_.feed_mode == FeedMode::InverseTime)
    fail(motion_column_, code, "a canned cycle cannot run in inverse time feed (G93)");
}

// P and Q are kept like R and Z while the same cycle continues (common
// practice on controls; NIST V3 asks for them on every line, from memory).
void Rs274BlockExecutor::cycle_dwell_and_peck(Rs274Interpreter::Cycle& c, bool retained,
                                              const std::string& code) {
  if (motion_is(GCode::DrillDwell) || motion_is(GCode::BoreDwell)) {
    if (b_.has(Word::P)) {
      if (word(Word::P).value < 0)
        fail(word(Word::P).column, "P", "dwell time must not be negative");
      in_.cycle_p_ = word(Word::P).value;
    } else if (!retained || !in_.cycle_p_) {
      fail(motion_column_, code, code + " needs P, the dwell at the bottom");
    }
    c.dwell = *in_.cycle_p_;
  }
  if (motion_is(GCode::PeckDrill)) {
    if (b_.has(Word::Q)) {
      if (length(Word::Q) <= 0)
        fail(word(Word::Q).column, "Q", "the peck depth Q must be greater than 0");
      in_.cycle_q_ = length(Word::Q);
    } else if (!retained || !in_.cycle_q_) {
      fail(motion_column_, code, "G83 needs Q, the depth of each peck");
    }
    c.peck = *in_.cycle_q_;
    if ((c.r - c.bottom) / c.peck > 1000)
      fail(motion_column_, code, "Q is so small that a hole needs more than 1000 pecks");
  }
}

void Rs274BlockExecutor::cycle() {
  const std::string code = code_name(*motion_);
  check_cycle_modes(code);
  const bool retained = previous_motion_ == *motion_;
  const auto level = [&](Word letter, std::optional<double>& kept, const std::string& what) {
    if (b_.has(letter))
      kept = length(letter);
    else if (!retained || !kept)
      fail(motion_column_, code, code + " needs " + word_name(letter) + ", " + what);
    return *kept;
  };
  const double r_word = level(Word::R, in_.cycle_r_, "the retract (R) plane");
  const double z_word = level(Word::Z, in_.cycle_z_, "the bottom of the hole");
  int repeats = 1;
  if (b_.has(Word::L)) repeats = whole(Word::L, 1, 10000, "L needs a repeat count from 1 to 10000");
  Rs274Interpreter::Cycle c;
  c.code = *motion_;
  c.line = b_.line;
  c.holes_left = repeats;
  const Point3 here = in_.position_;
  if (st_.distance == DistanceMode::Incremental) {
    c.dx = length_or(Word::X, 0.0);
    c.dy = length_or(Word::Y, 0.0);
    c.x = here.x + c.dx;
    c.y = here.y + c.dy;
    c.r = here.z + r_word;
    c.bottom = c.r + z_word;
  } else {
    c.x = length_or(Word::X, here.x);
    c.y = length_or(Word::Y, here.y);
    c.r = r_word;
    c.bottom = z_word;
  }
  if (c.bottom > c.r) fail(motion_column_, code, "the hole bottom Z is above the retract plane R");
  cycle_dwell_and_peck(c, retained, code);
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

}  // namespace dovetailor
