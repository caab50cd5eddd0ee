#pragma once

#include <cstddef>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include <dovetailor/plan/plan.hpp>

namespace dovetailor {

// The measure-and-trim loop: after measuring at one of the plan's
// checkpoints, how much stock each angled flank really has, whether it is
// safe to go on, and the finishing passes that take the part from that state
// to the final size. Pure: no I/O.
//
// A pin reading cannot tell the flanks apart, so the error is shared equally
// between the angled flanks (the checkpoint's correction_per_reading: -1/2
// for a two-pin female, +1/2 for a two-pin male, -1/+1 with one pin):
//   stock now = checkpoint stock + (measured - expected) * correction_per_reading.
// Sensitivity of the reading to one flank moved laterally by d is d (domain
// brief, "Measuring with pins").

// The checkpoint's index (0-based) in plan.checkpoints from its number
// (1-based, "2") or its letter as the text plan prints it ("B" or "b").
// Throws InputError (field "--checkpoint") naming the valid choices.
std::size_t find_checkpoint(const Plan& plan, std::string_view text);

struct TrimRequest {
  std::size_t checkpoint = 0;     // index in plan.checkpoints
  double reading = 0;             // measured pin reading (or width without a gauge), mm
  std::optional<double> depth{};  // measured depth from the top face, mm
  // Where along the slide the reading was taken: y from the front end, mm.
  // It matters on a tapered gib, whose reading changes along the slide
  // (Checkpoint::reading_per_length).
  double at_y = 0;
};

enum class TrimVerdict {
  OnSize,   // within the width tolerance: nothing to cut
  Trim,     // stock left: the corrective passes take it off
  OverCut,  // cut past size beyond the tolerance: stop
};

struct FlankStock {
  Side side = Side::Left;
  double planned = 0;  // lateral stock the plan expects here, mm
  double now = 0;      // lateral stock from the reading; negative: cut past size
  double error() const { return now - planned; }

  bool operator==(const FlankStock&) const = default;
};

// The depth reading against the checkpoint's expected depth. The tolerance
// is the width tolerance band (the job gives no depth tolerance). A shallow
// floor beyond it is corrected by programming the trim passes lower by the
// error (z_correction < 0); lowering the cutter that forms floor and flank
// does not change the pin reading (the corner stays at the large radius) but
// narrows a female mouth by 2 dz cot a toward its nominal. A deep floor cannot
// be undone: z_correction stays 0 and the report says so.
struct DepthCheck {
  double measured = 0;
  double expected = 0;
  double tolerance = 0;
  double z_correction = 0;  // added to the trim passes' Z, mm
  double error() const { return measured - expected; }
  bool beyond() const { return error() > tolerance || error() < -tolerance; }

  bool operator==(const DepthCheck&) const = default;
};

struct Trim {
  std::size_t checkpoint = 0;
  char letter = 'A';
  double reading = 0;
  double at_y = 0;                 // where it was taken, mm from the front end
  double expected = 0;             // the checkpoint's reading there
  double reading_error = 0;        // measured - expected
  std::vector<FlankStock> flanks;  // the angled flanks
  TrimVerdict verdict = TrimVerdict::OnSize;
  // Width at the base plane as cut now minus the final width: positive is
  // wider. Over size for a female and under size for a male when cut past.
  double width_error = 0;
  std::optional<DepthCheck> depth;
  // The corrective passes as a plan of their own (the job, target and final
  // reading of the original; one operation with semi-finish when the stock
  // is more than the plan's last cut, finish, and spring when the job has
  // it; one checkpoint after the last pass expecting the final reading).
  // Empty operations unless verdict == Trim. Each flank's passes take off
  // exactly its stock now, measured from where the cutter last ran: the
  // process left (stock now - planned) more than the plan expected, so the
  // positions move toward the flank by that too and the last pass runs at
  // the plan's finishing position moved by it (the same as the offset change
  // below does in the full program).
  Plan passes;
  // The change to the dovetail cutter's wear offset (D) or to each flank's
  // parameter (#101/#102) that makes the full program, continued from this
  // checkpoint, do the same: -(stock now - planned stock). Negative cuts deeper.
  double offset_change = 0;
  // The first finishing pass of the full program, to rerun from after the
  // last checkpoint.
  int first_finishing_pass = 0;

  bool operator==(const Trim&) const = default;
};

// Throws InputError (field "--reading") for a reading that is not finite or
// not positive, (field "--depth") for such a depth, and (field "--at") for a
// position off the dovetail.
Trim trim(const Plan& plan, const TrimRequest& request);

}  // namespace dovetailor
