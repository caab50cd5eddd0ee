#pragma once

#include <dovetailor/job.hpp>
#include <dovetailor/plan.hpp>

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
//     is finished by the cutter's bottom face;
//  3. finishing per flank: an optional semi-finish pass to a light last cut,
//     the finishing pass, and a spring pass;
//  4. checkpoints (after roughing, before finishing, after finishing) with the
//     pin reading to expect and the correction rule.
// Throws InputError, naming the job key, for a job that cannot be cut with
// the listed tools (cutter angle differs, cutter too large or too small for
// the space, neck or shank would touch the overhang, end mill wider than the
// slot, pin cannot bridge the cutter's corner radius, tolerance finer than the
// machine can hold, ends closed at both ends, unknown material).
Plan plan(const Job& job);

}  // namespace dovetailor
