#pragma once

#include <dovetailor/job/job.hpp>
#include <dovetailor/plan/plan.hpp>

namespace dovetailor {

// Builds the cutting plan for a job:
//  1. roughing with the end mill (female: the central slot, narrower than the
//     mouth by the rough allowance per side and short of the floor by the
//     floor allowance; male: both shoulders, clear of the tongue's top edge by
//     the rough allowance, to the shelf);
//  2. the undercut with the dovetail cutter: passes along Y stepping from the
//     roughed space toward each flank, radial steps sized so the predicted
//     cutter deflection stays under the roughing limit, in axial levels from
//     the top down when the depth exceeds the flute length; the floor (female)
//     is finished by the cutter's bottom face. Where a female's roughed slot
//     is narrower than the cutter, its first pass down the slot cuts both
//     walls alike (CNC) or one wall only (manual), within the same step;
//     passes toward a tapered gib's flank turn from the straight wall to
//     the taper a share at a time, so no pass cuts more than the step;
//  3. finishing per flank: an optional semi-finish pass to a light last cut,
//     the finishing pass, and a spring pass;
//  4. checkpoints (after roughing, before finishing, after finishing) with the
//     pin reading to expect and the correction rule.
// Every cut along the slide mills the job's way (climb by default on a CNC,
// always conventional on a manual machine; the spindle runs M3). On a manual
// machine the one cut that takes both sides is the end mill's first pass into
// solid stock down a female's slot, a full-width slot; a CNC's dovetail
// cutter may also take both walls of a narrow slot on its first pass.
// Throws InputError, naming the job key, for a job that cannot be cut with
// the listed tools (cutter angle differs by more than cutter_angle_tolerance,
// cutter too large or too small for the space, a first pass down the slot or
// a finishing cut over the step, neck or shank would touch the overhang, end
// mill wider than the slot, pin cannot bridge the cutter's corner radius,
// tolerance finer than the machine can hold, ends closed at both ends,
// unknown material). Plans the dovetail as cut (dovetail_as_cut).
Plan plan(const Job& job);

// The most the dovetail cutter's angle may differ from the dovetail's, either
// way, in degrees.
inline constexpr double cutter_angle_tolerance = 0.1;

// The dovetail the job's dovetail cutter cuts (the one [strategy]
// dovetail_cutter names, else the first): within cutter_angle_tolerance of the
// dovetail's angle, the job's dovetail with its flanks at the cutter's own
// angle and its base-plane width held. The cutter's tip corner sets the
// base-plane width whatever its angle, and the pins rest on that plane; the
// angle only tilts the flank above it, so the top-plane width moves by
// H (cot a_cutter - cot a) per angled flank and every pin reading and contact
// height is that of the flank actually cut. The job's dovetail unchanged when
// the angles agree, when the job has no dovetail cutter, or when they differ
// by more (plan() refuses that job). The planner and the checker both take
// their target from here.
DovetailSpec dovetail_as_cut(const Job& job);

}  // namespace dovetailor
