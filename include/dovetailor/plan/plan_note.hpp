#pragma once

#include <optional>
#include <string>
#include <variant>

#include <dovetailor/job/job.hpp>
#include <dovetailor/shop/cutting_data.hpp>

namespace dovetailor {

// What the planner tells the machinist beside the passes, as data: one
// struct per kind of note or warning, with its figures (lengths in mm,
// angles in degrees, like the rest of the plan). The writers put them into
// words (report/plan_note_text.hpp) in the units they print in.

// Notes: derivations and choices.

// The width of this part was derived from its measured mate (fit.hpp).
struct MateNote {
  Mate mate;
  MateDerivation derivation;

  bool operator==(const MateNote&) const = default;
};

// The dovetail cutter's angle differs from the dovetail's, within
// cutter_angle_tolerance: the flanks are planned at the cutter's angle, the
// base-plane width held.
struct CutterAngleNote {
  int tool = 0;
  double cutter_angle = 0;       // degrees
  double dovetail_angle = 0;     // degrees, as the job gives it
  double tolerance = 0;          // degrees either way
  double width_bottom = 0;       // held, at the base plane
  bool gib = false;              // the gib's allowance is taken at the cutter's angle
  double width_top = 0;          // as cut, at the cutter's angle
  double nominal_width_top = 0;  // at the dovetail's angle

  bool operator==(const CutterAngleNote&) const = default;
};

// The width is aimed at the middle of its tolerance band.
struct AimedWidthNote {
  double width_bottom = 0;          // aimed, at the base plane
  double offset = 0;                // aimed less nominal: > 0 over, < 0 under
  double nominal_width_bottom = 0;  // at the base plane

  bool operator==(const AimedWidthNote&) const = default;
};

// The work material and the milling direction on the flanks.
struct MillingNote {
  std::string material;  // its name in the material table
  MillingMode mode = MillingMode::Climb;
  bool manual = false;  // a manual machine: always conventional

  bool operator==(const MillingNote&) const = default;
};

// What each tool leaves for the next.
struct AllowanceNote {
  double rough = 0;             // per side, by the end mill
  std::optional<double> floor;  // on a female's floor, by the end mill; none for a male
  double finish = 0;            // per flank, by the dovetail cutter's roughing
  double last_cut = 0;          // per flank, by the semi-finish pass; 0 without one

  bool operator==(const AllowanceNote&) const = default;
};

// The bend limits the radial steps are sized to.
struct BendLimitNote {
  double rough = 0;   // the dovetail cutter's roughing passes
  double finish = 0;  // its finishing pass: a quarter of the tolerance band

  bool operator==(const BendLimitNote&) const = default;
};

using PlanNote = std::variant<MateNote, CutterAngleNote, AimedWidthNote, MillingNote, AllowanceNote,
                              BendLimitNote>;

// Warnings: what deserves a look before cutting.

// A cap on one tool's speed or feed (cutting_data.hpp).
struct CuttingDataWarning {
  int tool = 0;
  CuttingWarning warning;

  bool operator==(const CuttingDataWarning&) const = default;
};

// strategy.direction = "climb" on a manual machine: every pass is conventional.
struct ClimbOnManualWarning {
  bool operator==(const ClimbOnManualWarning&) const = default;
};

// The finish allowance is far larger than the rough allowance.
struct LargeFinishAllowanceWarning {
  double finish = 0;
  double rough = 0;

  bool operator==(const LargeFinishAllowanceWarning&) const = default;
};

// A finishing pass is predicted to bend the cutter more than its limit (the
// first such pass).
struct FinishBendWarning {
  int pass = 0;
  double deflection = 0;
  double limit = 0;

  bool operator==(const FinishBendWarning&) const = default;
};

// The job gives no gauge pins: the checkpoints give widths but no readings.
struct NoGaugeWarning {
  bool operator==(const NoGaugeWarning&) const = default;
};

using PlanWarning = std::variant<CuttingDataWarning, ClimbOnManualWarning,
                                 LargeFinishAllowanceWarning, FinishBendWarning, NoGaugeWarning>;

}  // namespace dovetailor
