#pragma once

// Cutter radius compensation in the XY plane, after the rules of the NIST
// RS274NGC Interpreter Version 3 (NISTIR 6556, section 2.1.2.4 and the
// G41/G42 section 3.5.11 and chapter on cutter radius compensation; section
// numbers from memory). The interpreter looks at one move at a time (no look
// ahead):
//
// - Entry move (the first XY move after G41/G42, straight only): the tool
//   centre goes from where it is to the point at distance r from the
//   programmed end such that its straight path touches the circle of radius
//   r round that end. The start must be farther than r from the end.
// - Later moves: the tool centre follows the programmed line or arc offset
//   by r to the left (G41) or right (G42) of the direction of travel. At an
//   outside (convex) corner a feed move first goes round the programmed
//   corner point on an arc of radius r; a rapid goes straight. An inside
//   (concave) corner sharper than 0.01 rad is refused, because without
//   look-ahead the tool would gouge the corner (the NIST rule). An arc on the
//   inside must have a radius greater than r.
// - Exit (after G40): the next move runs straight from the offset point to
//   the programmed point; nothing special is needed here.
// Internal to the core library.

#include <vector>

#include <dovetailor/rs274/rs274_events.hpp>

namespace dovetailor::detail {

enum class CompensationFault { None, EntryInsideRadius, ConcaveCorner, ArcRadiusNotGreater };

struct CompensatedMove {
  CompensationFault fault = CompensationFault::None;
  std::vector<PathSegment> tool_centre;  // one or two segments when no fault
};

// Both sides Left or Right; `radius` > 0.
CompensatedMove compensate_entry(const Point3& tool, const Point3& programmed_end, double radius,
                                 CompensationSide side);

// `programmed` is a line or an XY arc starting at the previous programmed
// point; `tool` is the tool centre now. `corner_arc` is false for rapids.
CompensatedMove compensate_move(const Point3& tool, const PathSegment& programmed, double radius,
                                CompensationSide side, bool corner_arc);

}  // namespace dovetailor::detail
