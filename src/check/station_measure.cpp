#include <algorithm>
#include <cmath>

#include "station_simulator.hpp"

namespace dovetailor::detail {
namespace {

// The simulation's own error on a reading: each flank within about 0.2 um of
// the exact swept area (swept_region.hpp), the pin's centre exact to the grid.
// Readings this close to a limit count as within it.
constexpr double reading_slack = 0.0005;

double corner_radius(const Job& job) {
  double r = 0;
  for (const Tool& t : job.tools) r = std::max(r, t.corner_radius);
  return r;
}

double pin_for(const Job& job, const DovetailSection& section) {
  if (job.gauge) return job.gauge->pin_diameter;
  const auto advice = advise_pins(section, corner_radius(job), job.units, stock_faces(job));
  for (const PinAdvice& a : advice)
    if (a.middle_third) return a.diameter;
  if (!advice.empty()) return advice.front().diameter;
  return 0.8 * largest_pin(section.depth, section.chamfer, section.angle);
}

// Where material may stay: the finished part grown by the allowance, and the
// fillet a cutter's corner radius leaves in each base corner (it lies within
// r / tan(a/2) of the sharp corner; the pins bridge it, pin_gauge.hpp).
SectionRegion allowed_material(const Job& job, const StationTarget& target) {
  SectionRegion allowed = offset(target.part, target.allowance);
  const double r = corner_radius(job);
  if (r > 0) {
    const double reach = r / std::tan(radians(target.section.angle) / 2) + target.allowance;
    for (const Flank* f : {&target.section.left, &target.section.right})
      allowed = unite(allowed, disc(f->base, reach));
  }
  return allowed;
}

}  // namespace

void measure_stations(const Job& job, const StationSimulator& sim, FindingSink& sink, int end_line,
                      CheckReport& report) {
  const Tolerance& tol = job.dovetail.tolerance;
  for (std::size_t s = 0; s < sim.ys().size(); ++s) {
    const double y = sim.ys()[s];
    const StationTarget& target = sim.target(s);
    const SectionRegion& material = sim.material(s);
    const double pin = pin_for(job, target.section);

    const SectionRegion excess = subtract(material, allowed_material(job, target));
    const bool stock_left = excess.area() > least_area;
    if (stock_left) {
      sink.add({.kind = FindingKind::StockLeft,
                .severity = Severity::Error,
                .line = end_line,
                .station_y = y,
                .amount = thickness_of(excess) + target.allowance,
                .limit = target.allowance,
                .extent = excess.bounds()},
               true);
    }

    StationResult r;
    r.y = y;
    r.section = material.rings();
    r.target_part = target.part.rings();
    const SectionRegion gouged = subtract(target.forbidden, material);
    if (gouged.area() > least_area) r.gouged = gouged.rings();
    if (stock_left) r.leftover = excess.rings();
    r.measured = measure_section(material, target.section, {.pin_diameter = pin});
    r.target_depth = target.section.depth;
    r.target_width_bottom = target.section.width_bottom();
    r.target_width_top = target.section.width_top();
    r.target_reading = reading_of(target.section, pin);
    // The target is the middle of the band; the band lies on the nominal.
    const double want = r.target_reading.value;
    const double nominal = want - band_middle(tol);
    if (r.measured.reading) {
      const double error = r.measured.reading->value - nominal;
      r.reading_in_tolerance =
          error >= tol.lower - reading_slack && error <= tol.upper + reading_slack;
    }
    if (!r.reading_in_tolerance) {
      Finding f{.kind = FindingKind::ReadingOutOfTolerance,
                .severity = Severity::Error,
                .line = end_line,
                .station_y = y,
                .amount = r.measured.reading ? r.measured.reading->value : 0,
                .limit = want,
                .band_low = nominal + tol.lower,
                .band_high = nominal + tol.upper,
                .pin_diameter = pin};
      // measure_section gives a problem whenever it gives no reading.
      if (!r.measured.reading)
        f.problem = r.measured.problems.empty()
                        ? MeasureProblem{.kind = MeasureProblemKind::NoFlank}
                        : r.measured.problems.front();
      sink.add(std::move(f), true);
    }
    report.stations.push_back(std::move(r));
  }
  const StationResult* first = nullptr;
  const StationResult* last = nullptr;
  double low = HUGE_VAL, high = -HUGE_VAL;
  for (const StationResult& r : report.stations) {
    if (!r.measured.reading) continue;
    if (!first) first = &r;
    last = &r;
    low = std::min(low, r.measured.reading->value);
    high = std::max(high, r.measured.reading->value);
  }
  if (first && last != first) {
    report.reading_taper =
        (last->measured.reading->value - first->measured.reading->value) / (last->y - first->y);
    report.reading_spread = high - low;
  }
}

}  // namespace dovetailor::detail
