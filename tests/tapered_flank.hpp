#pragma once

// What a pass along a tapered gib's flank does to the reading (shared by the
// checker's and the G-code round trip's tests).

#include <algorithm>
#include <cmath>

#include <dovetailor/geometry/dovetail_section.hpp>
#include <dovetailor/job/job.hpp>

namespace dovetailor::testing {

// The pass runs at a slope s to Y. At each height h above its tip the
// dovetail cutter is a disc of radius r(h) = R - h cot(a); swept along the
// line it leaves a band r(h) sqrt(1 + s^2) wide either side of the path
// across the slide (a disc swept along a line, cut by a plane at slope s to
// its normal: analytic geometry). So the flank lies k = sqrt(1 + s^2) times
// further out at every height: moved out by (R - h cot a)(k - 1) and laid
// back to cot(a') = k cot(a). A pin of radius p on the floor touches it
// with its centre at height p, p / sin(a') from the flank, so its centre
// moves by (R - p cot a)(k - 1) - p (sqrt(1 + k^2 cot^2 a) -
// sqrt(1 + cot^2 a)). The planner ignores this; the simulation does not.
// One flank moves: the reading grows (female) or shrinks (male) by that.
inline double tapered_flank_shift(const Job& job, double pin_diameter) {
  double slope = 0;
  for (Side side : {Side::Left, Side::Right})
    slope = std::max(slope, std::abs(flank_taper_slope(job.dovetail, side)));
  const Tool* cutter = first_tool(job, ToolKind::Dovetail);
  const double k = std::sqrt(1 + slope * slope);
  const double cot = cot_deg(cutter->angle);
  const double p = pin_diameter / 2;
  const double excess = (cutter->diameter / 2 - p * cot) * (k - 1) -
                        p * (std::sqrt(1 + k * k * cot * cot) - std::sqrt(1 + cot * cot));
  return job.dovetail.type == DovetailType::Female ? excess : -excess;
}

}  // namespace dovetailor::testing
