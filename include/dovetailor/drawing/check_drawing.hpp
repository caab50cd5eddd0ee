#pragma once

#include <cstddef>

#include <dovetailor/check/check_result.hpp>
#include <dovetailor/drawing/drawing.hpp>
#include <dovetailor/job/job.hpp>

namespace dovetailor {

// The checker's result drawn as a section (drawing.hpp): at one station, the
// material the simulated program leaves, the finished part wanted there as
// an outline over it, material cut from the part beyond the tolerance
// (gouges) and stock left outside it beyond the tolerance, the stock as
// supplied, and the virtual pins where they came to rest with the reading
// they give. Lengths in mm inside, texts in the job's units.

// The station most worth a look: the first with a gouge, else the first
// with stock left, else the one whose reading misses the target by most (a
// station that could not be read counts as missing by most). 0 when every
// station is clean and on size, or when there are no stations.
std::size_t station_to_draw(const CheckReport& report);

// The drawing of station `station` (0-based) of a check of `job`. Throws
// std::out_of_range when the report has no such station.
Drawing build_check_drawing(const CheckReport& report, const Job& job, std::size_t station);

}  // namespace dovetailor
