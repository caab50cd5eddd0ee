#pragma once

#include <dovetailor/plan/plan.hpp>
#include <dovetailor/shop/post.hpp>

namespace dovetailor {

// How the operator sneaks up on size without editing coordinates.
enum class SizingStyle {
  // The finishing passes of the dovetail cutter (semi-finish, finish,
  // spring) are programmed along the flank contact line (where the
  // cutter's large diameter touches the flank) with G41/G42 D<tool>: a
  // wear offset on D moves both flanks. Needs Post::cutter_compensation and
  // open ends (the compensated path must begin and end outside the stock).
  CutterCompensation,
  // The finishing passes' X words are written `[base - #n]` or
  // `[base + #n]`, with one parameter per flank (flank_parameter), set to 0
  // at the top. Needs Post::parameters.
  Parameters,
  // Plain coordinates of the cutter's axis: resize with `dovetailor trim`.
  Plain,
};

// The style for this plan and post: compensation where the post has it and
// the dovetail runs out at both ends; else parameters where the post has
// them; else plain.
SizingStyle sizing_style(const Plan& plan, const Post& post);

// The parameter that offsets one flank's finishing passes: #101 left, #102
// right. A positive value leaves that much more lateral stock on the flank
// (moves the cut away from the material), as a positive wear offset on D
// does; a negative value cuts deeper.
int flank_parameter(Side side);

}  // namespace dovetailor
