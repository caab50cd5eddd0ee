#pragma once

#include <array>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include <dovetailor/base/point.hpp>
#include <dovetailor/base/words.hpp>
#include <dovetailor/geometry/dovetail_section.hpp>
#include <dovetailor/geometry/pin_gauge.hpp>
#include <dovetailor/job/job.hpp>
#include <dovetailor/plan/plan_note.hpp>

namespace dovetailor {

// The cutting plan: one plain data structure, built once by plan() and read by
// every writer (text plan, JSON, G-code, pass sheet, drawing) and by the
// checker's round-trip tests. Lengths in mm, work coordinates (see job.hpp),
// feeds in mm/min, speeds in rev/min.

enum class MoveKind {
  Rapid,  // G0: only at or above the safe height, or outside the stock
  Feed,   // G1 at the pass's feed
};

// One straight move of the tool tip (the centre of the tool's bottom face).
struct Move {
  MoveKind kind = MoveKind::Feed;
  Point3 to;
  double feed = 0;  // mm/min, 0 for rapids

  bool operator==(const Move&) const = default;
};

enum class PassRole {
  Rough,       // end mill clearing, or dovetail cutter stepping toward a flank
  SemiFinish,  // takes the flank to the last, light cut
  Finish,      // lands the flank on size
  Spring,      // same position again, no added stock: takes out the spring of the cutter
};

// The role's words: the key is the word the JSON plan, the program comments
// and the trim report give ("rough", "semi-finish", "finish", "spring"); the
// text is the short word of the pass tables ("semi").
constexpr std::array<EnumWord<PassRole>, 4> word_table(PassRole) {
  return {{{PassRole::Rough, "rough"},
           {PassRole::SemiFinish, "semi-finish", "semi"},
           {PassRole::Finish, "finish"},
           {PassRole::Spring, "spring"}}};
}

// One cut along the slide (Y). `x` is the tool axis at y = 0 (for a tapered
// gib flank the axis runs at the taper: x_at(y) = x + taper_slope * y); `z` is
// the tip. A pass toward a flank knows how much lateral stock it leaves there.
struct Pass {
  int number = 0;  // 1-based through the whole plan
  int tool = 0;    // T number
  PassRole role = PassRole::Rough;
  std::optional<Side> side;  // the flank the pass works toward; none for centre passes
  double x = 0;
  double taper_slope = 0;  // dx/dy of the axis (tapered gib flank), 0 otherwise
  double z = 0;
  double radial_step = 0;  // new lateral engagement of this pass (ae), mm
  double axial_depth = 0;  // engaged height, mm
  double stock_left = 0;   // lateral stock left on `side`'s flank (or wall) after the pass
  double feed = 0;         // mm/min
  double rpm = 0;
  double deflection = 0;  // predicted tool deflection at the flutes, mm
  MillingMode mode = MillingMode::Both;
  // The path of the pass in three parts, each move starting where the one
  // before it ended (the first where the tool was, at the safe height):
  //  entry: from the safe height outside the stock down to cutting depth and
  //         on to the start of the cut; every move outside the stock, or in
  //         space this level has already cleared (with a front-open dovetail
  //         a pass that cuts on its way out runs in on the line cleared
  //         before it and steps over to its own line at the closed end);
  //  cut:   the feeds at `z` on the pass's own line (x_at), along the slide;
  //  exit:  from the end of the cut back up to the safe height, past the far
  //         end, up from the closed end (end mill), or back along the line
  //         out of the open front end (dovetail cutter).
  std::vector<Move> entry;
  std::vector<Move> cut;
  std::vector<Move> exit;

  bool operator==(const Pass&) const = default;
  double x_at(double y) const { return x + taper_slope * y; }
  // The whole path: entry, cut and exit in order.
  std::vector<Move> moves() const;
  // Where the cut starts: the end of the entry.
  Point3 cut_start() const { return entry.back().to; }
  // The cut's travel along the slide, mm: > 0 toward the back end (+Y).
  double cut_travel() const { return cut.back().to.y - cut_start().y; }
};

enum class OperationKind { RoughSlot, RoughShoulders, FinishSquareWall, Undercut };

struct Operation {
  OperationKind kind = OperationKind::RoughSlot;
  int tool = 0;
  // The trim's corrective passes (trim.hpp): an undercut operation that
  // takes the flanks from what was measured to size.
  bool corrective = false;
  double rpm = 0;
  double feed = 0;         // roughing feed, mm/min
  double finish_feed = 0;  // mm/min
  std::vector<Pass> passes;

  bool operator==(const Operation&) const = default;
};

// A stop to measure. `expected` is the pin reading to expect now, from the
// plan; the correction rule turns a measured reading into a lateral move per
// flank: error = measured - expected; each angled flank then has
// stock_per_flank - error * correction_per_reading left to cut.
struct Checkpoint {
  int after_pass = 0;  // the stop comes after this pass number
  std::string name;    // "after roughing", "before finishing", "after finishing"
  PinReading expected;
  PinReading final_reading;
  double remaining_per_flank = 0;  // lateral, mm
  double remaining_normal = 0;     // normal to the flank, mm
  // d(remaining per flank) / d(reading error): -1/2 for a two-pin female
  // (a larger reading means wider, so less stock), +1/2 for a two-pin male,
  // -1 / +1 with one pin.
  double correction_per_reading = 0;
  double expected_depth = 0;  // floor/shelf below the top plane, mm
  // With one pin from the stock face opposite the angled flank (male only).
  std::optional<double> reference_reading;
  // Where along the slide the readings hold: y from the front end, mm. A
  // tapered gib's flank runs at a slope to Y, so the reading changes along
  // the slide: at y it is expected + reading_per_length * (y - reading_at_y)
  // (mm per mm toward the back end; 0 without a tapered gib), and the
  // reference reading changes by reference_per_length.
  double reading_at_y = 0;
  double reading_per_length = 0;
  double reference_per_length = 0;

  bool operator==(const Checkpoint&) const = default;
};

struct Plan {
  Job job;  // as planned (a mate is already resolved into the width)
  // The finished section, aimed at the middle of the width tolerance band
  // (section_of(aimed_spec(job.dovetail))), and its reading.
  DovetailSection target;
  PinReading final_reading;
  double safe_z = 0;     // rapids at or above this height
  double clearance = 0;  // how far outside the stock the tools enter and leave
  std::vector<Operation> operations;
  std::vector<Checkpoint> checkpoints;
  std::vector<PlanNote> notes;  // derivations and choices, as data (plan_note.hpp)
  std::vector<PlanWarning> warnings;

  bool operator==(const Plan&) const = default;
};

// Where the final reading is good: the job's width tolerance around the
// nominal width (the reading moves one for one with the width at the base
// plane, pin_gauge.hpp). The final reading lies in its middle.
struct ReadingBand {
  double low = 0;
  double high = 0;
};
ReadingBand final_reading_band(const Plan& plan);

// All passes of the plan in order.
std::vector<const Pass*> all_passes(const Plan& plan);

}  // namespace dovetailor
