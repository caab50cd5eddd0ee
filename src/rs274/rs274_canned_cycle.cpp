#include <algorithm>

#include <dovetailor/rs274/rs274_interpreter.hpp>

namespace dovetailor {

// One hole of a canned cycle, as the moves the NIST interpreter makes
// (NISTIR 6556 section 3.5.16, from memory): rapid over the hole at the
// current height, rapid down to R, the cycle's own moves, back to the
// clear level (R for G99, the higher of R and the Z before the cycle for
// G98).
void Rs274Interpreter::next_hole() {
  Cycle& c = *cycle_;
  const double feed = state_.feed_mm_per_min;
  const auto move = [&](MotionKind kind, Point3 to) {
    if (to == position_) return;
    const PathSegment path{position_, to, {}};
    push_motion(c.line, kind, path, {path}, kind == MotionKind::Rapid ? 0 : feed, true);
    position_ = to;
  };
  const auto at = [&](double z) { return Point3{c.x, c.y, z}; };
  move(MotionKind::Rapid, at(position_.z));
  if (position_.z != c.r) move(MotionKind::Rapid, at(c.r));
  switch (c.code) {
    case GCode::Drill:
      move(MotionKind::Feed, at(c.bottom));
      break;
    case GCode::DrillDwell:
      move(MotionKind::Feed, at(c.bottom));
      push(c.line, Dwell{c.dwell});
      break;
    case GCode::PeckDrill: {
      // Back to R after each peck, then rapid to just above the last depth
      // (0.010 in in the NIST interpreter, from memory).
      const double clearance = std::min(0.254, c.peck / 2);
      double depth = c.r;
      while (depth - c.peck > c.bottom + 1e-9) {
        depth -= c.peck;
        move(MotionKind::Feed, at(depth));
        move(MotionKind::Rapid, at(c.r));
        move(MotionKind::Rapid, at(depth + clearance));
      }
      move(MotionKind::Feed, at(c.bottom));
      break;
    }
    case GCode::Bore:
      move(MotionKind::Feed, at(c.bottom));
      move(MotionKind::Feed, at(c.r));
      break;
    case GCode::BoreDwell:
      move(MotionKind::Feed, at(c.bottom));
      push(c.line, Dwell{c.dwell});
      move(MotionKind::Feed, at(c.r));
      break;
    default:
      break;
  }
  if (position_.z != c.clear) move(MotionKind::Rapid, at(c.clear));
  c.x += c.dx;
  c.y += c.dy;
  if (--c.holes_left == 0) cycle_.reset();
}

}  // namespace dovetailor
