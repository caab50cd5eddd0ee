#pragma once

#include <string>

#include <dovetailor/plan/sizing.hpp>
#include <dovetailor/plan/trim.hpp>

namespace dovetailor {

// The trim as text for an 80-column terminal, in the job's units: the
// checkpoint and reading, the stock per flank, the verdict (an over-cut says
// by how much the part is already over or under size and to stop), the depth
// check, the corrective passes with the reading to expect after them, and the
// offset change for the full program in `style` (D wear or #n).
std::string format_trim(const Plan& plan, const Trim& trim, SizingStyle style);

// Lines for a manual machine: per pass the cross-slide setting and the move
// from the current setting per flank, in the job's units, approached from the
// same direction as before; then the reading to expect.
std::string trim_sheet(const Plan& plan, const Trim& trim);

}  // namespace dovetailor
