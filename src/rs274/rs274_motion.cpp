#include <cmath>
#include <string>

#include <dovetailor/base/error.hpp>

#include "rs274_arc.hpp"
#include "rs274_block_executor.hpp"
#include "rs274_modal_groups.hpp"

namespace dovetailor {

using detail::g_name;
using detail::is_cycle;

void Rs274BlockExecutor::go_home() {
  const std::string code = g_name(g_[0]->number);
  if (st_.compensation != CompensationSide::Off)
    fail(g_[0]->column, code, code + " cannot be used with cutter compensation on; give G40 first");
  motion_column_ = g_[0]->column;
  Point3& position = in_.position_;
  if (axis_words()) {
    const Point3 via = end_point();
    const PathSegment path{position, via, {}};
    in_.push_motion(b_.line, MotionKind::Rapid, path, {path}, 0);
    position = via;
  }
  const bool g28 = g_[0]->number == 280;
  const int first = g28 ? 5161 : 5181;
  const Point3& w = st_.work_offset_mm;
  const Point3& g92 = st_.axis_offset_mm;
  Point3 to;
  if (const auto& rise = g28 ? in_.options_.g28_rise_to_mm : in_.options_.g30_rise_to_mm) {
    to = {position.x, position.y, *rise - w.z - g92.z - st_.length_offset_mm};
  } else {
    Point3 home;
    if (in_.parameters_.valid(first + 2))
      home = {stored_length(first, g_[0]->column, code),
              stored_length(first + 1, g_[0]->column, code),
              stored_length(first + 2, g_[0]->column, code)};
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
  const Point3& w = st_.work_offset_mm;
  const Point3& g92 = st_.axis_offset_mm;
  axis('x', end.x, w.x + g92.x, base.x);
  axis('y', end.y, w.y + g92.y, base.y);
  axis('z', end.z, w.z + g92.z + st_.length_offset_mm, in_.position_.z);
  return end;
}

double Rs274BlockExecutor::feed_for(const PathSegment& path, const std::string& code) const {
  if (st_.feed_mode == FeedMode::InverseTime) {
    if (!b_.has('f') || word('f').value <= 0)
      fail(motion_column_, code,
           "in inverse time mode (G93) every feed move needs its own F greater than 0");
    return path_length(path) * word('f').value;
  }
  if (st_.feed_mm_per_min <= 0)
    fail(motion_column_, code, code + " needs a feed rate: give F greater than 0 first");
  return st_.feed_mm_per_min;
}

void Rs274BlockExecutor::motion() {
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

void Rs274BlockExecutor::compensation_fault(detail::CompensationFault fault) const {
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

void Rs274BlockExecutor::straight(MotionKind kind) {
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
  auto moved = detail::compensate_move(position, path, st_.compensation_radius_mm, st_.compensation,
                                       kind == MotionKind::Feed);
  if (moved.fault != detail::CompensationFault::None) compensation_fault(moved.fault);
  position = moved.tool_centre.back().end;
  in_.programmed_ = end;
  in_.push_motion(b_.line, kind, path, std::move(moved.tool_centre), feed);
}

void Rs274BlockExecutor::arc() {
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
      radius_format ? detail::centre_from_radius(start, end, length('r'), direction, pl, tolerance)
                    : detail::centre_from_offsets(
                          start, end, b_.has(offsets[0]) ? length(offsets[0]) : 0.0,
                          b_.has(offsets[1]) ? length(offsets[1]) : 0.0, pl, tolerance);
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

void Rs274BlockExecutor::cycle() {
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
  if (c.bottom > c.r) fail(motion_column_, code, "the hole bottom Z is above the retract plane R");
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
      if (length('q') <= 0) fail(word('q').column, "Q", "the peck depth Q must be greater than 0");
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

}  // namespace dovetailor
