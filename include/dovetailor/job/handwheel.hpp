#pragma once

#include <optional>

namespace dovetailor {

// Dial arithmetic for a manual machine's handwheel: what the graduated
// collar reads at a position, and how to turn the wheel from one setting to
// the next so the screw's backlash is always taken up on the same side.
// Lengths in mm along the axis, as everywhere in the core.
//
// The convention (common practice on manual mills): the dial is zeroed at the
// datum after moving onto it in the approach direction, and every later
// setting is reached moving the same way. A setting that lies the other way
// is reached by turning back past it by more than the backlash and coming
// forward onto it again, never by turning straight back.

enum class AxisDirection { Plus, Minus };

struct Handwheel {
  double travel_per_turn = 0;  // axis travel for one turn of the wheel, mm (> 0)
  int divisions = 0;           // graduations round the dial (> 0)
  // Which way the axis moves while the reading grows (depends on the screw's
  // hand and the dial's engraving).
  AxisDirection reading_grows = AxisDirection::Plus;
  double backlash = 0;  // lost motion when the wheel reverses, mm (>= 0)
  // The direction every setting is finally reached in.
  AxisDirection approach = AxisDirection::Plus;

  // Axis travel for one graduation, mm.
  double division() const { return travel_per_turn / divisions; }

  bool operator==(const Handwheel&) const = default;
};

// Dials commonly fitted to knee mills and small mills (common practice, from
// memory): inch 0.200 in per turn with 200 divisions (0.001 in each), inch
// 0.100 in per turn with 100 divisions (0.001 in; a 10 threads-per-inch
// screw), metric 5 mm per turn with 250 divisions (0.02 mm) and metric 2 mm
// per turn with 100 divisions (0.02 mm). Backlash is the machine's own: set it.
enum class CommonDial { Inch200, Inch100, Metric5mm, Metric2mm };
Handwheel common_dial(CommonDial dial);

// Whether the reading grows while the axis moves `motion`.
bool reading_rises(const Handwheel& wheel, AxisDirection motion);

// A setting of the dial: whole turns from the datum and the graduation read
// on the collar. Going back past zero gives negative turns: one division on
// the minus side of zero on a 200-division dial is turns -1, division 199.
struct DialReading {
  long turns = 0;
  int division = 0;  // 0 .. divisions - 1

  // Graduations from the datum, counted the way the reading grows.
  long count(const Handwheel& wheel) const { return turns * wheel.divisions + division; }

  bool operator==(const DialReading&) const = default;
};

// The reading `count` graduations from the datum.
DialReading reading_from_count(const Handwheel& wheel, long count);

// The position (mm from the datum, along the axis) a reading stands for.
double reading_position(const Handwheel& wheel, const DialReading& reading);

// The dial setting for a position along the axis, `position` mm from the
// datum: the nearest graduation, and what is left over.
struct DialSetting {
  DialReading reading;
  // position - reading_position(reading), mm along the axis: what a
  // machinist cannot set on the dial; at most half a division either way.
  double left_over = 0;

  bool operator==(const DialSetting&) const = default;
};
DialSetting dial_setting(const Handwheel& wheel, double position);

// Turning the wheel in one direction: how far, and the reading to stop at.
struct DialLeg {
  AxisDirection direction = AxisDirection::Plus;  // the axis motion
  bool reading_rises = true;                      // the reading grows during the leg
  long turns = 0;                                 // whole turns to turn ...
  int divisions = 0;                              // ... and graduations beyond them
  DialReading stop;                               // the reading at the end of the leg

  bool operator==(const DialLeg&) const = default;
};

// Turning the wheel from one setting to the next.
struct DialMove {
  // Present when the target lies against the approach direction: turn back
  // past the target by the backlash rounded up to whole graduations plus a
  // quarter turn (this project's margin, so the slack is certainly taken up
  // again), then come forward in `approach`.
  std::optional<DialLeg> back_off;
  DialLeg approach;      // the final leg, always in wheel.approach (empty: no move)
  double left_over = 0;  // as DialSetting::left_over, for the target

  bool operator==(const DialMove&) const = default;
};

// The move from the setting for `from` (mm from the datum, reached in the
// approach direction) to the setting for `to`. Both are rounded to the
// nearest graduation first.
DialMove dial_move(const Handwheel& wheel, double from, double to);

}  // namespace dovetailor
