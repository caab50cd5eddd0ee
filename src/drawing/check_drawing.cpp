#include <algorithm>
#include <cmath>
#include <stdexcept>

#include <fmt/format.h>

#include <dovetailor/base/length.hpp>
#include <dovetailor/drawing/check_drawing.hpp>
#include <dovetailor/geometry/dovetail_section.hpp>
#include <dovetailor/report/check_report.hpp>

namespace dovetailor {
namespace {

// How far a station's reading is from its target; unread stations first.
double reading_miss(const StationResult& s) {
  if (!s.measured.reading) return HUGE_VAL;
  return std::abs(s.measured.reading->value - s.target_reading.value);
}

// Where the instrument touches on each side: the pin's far edge, or the
// square flank's face.
std::pair<double, double> measuring_span(const SectionMeasurement& m) {
  double from = m.left.measuring_x, to = m.right.measuring_x;
  if (from > to) std::swap(from, to);
  return {from, to};
}

}  // namespace

std::size_t station_to_draw(const CheckReport& report) {
  const auto& st = report.stations;
  for (std::size_t i = 0; i < st.size(); ++i)
    if (!st[i].gouged.empty()) return i;
  for (std::size_t i = 0; i < st.size(); ++i)
    if (!st[i].leftover.empty()) return i;
  std::size_t worst = 0;
  double miss = -1;
  for (std::size_t i = 0; i < st.size(); ++i)
    if (!st[i].reading_in_tolerance && reading_miss(st[i]) > miss) {
      worst = i;
      miss = reading_miss(st[i]);
    }
  return worst;
}

namespace {

// The material left, the gouges and leftover over it, the target's outline.
void add_regions(Drawing& d, const StationResult& s) {
  d.regions.push_back({RegionFill::Simulated, 0, s.section, "Material the program leaves"});
  if (!s.gouged.empty())
    d.regions.push_back(
        {RegionFill::Gouge, 0, s.gouged, "Gouge: finished part cut away beyond the tolerance"});
  if (!s.leftover.empty())
    d.regions.push_back(
        {RegionFill::Leftover, 0, s.leftover, "Stock left outside the part beyond the tolerance"});
  // One legend entry for the target, however many rings it has.
  for (std::size_t i = 0; i < s.target_part.size(); ++i)
    d.outlines.push_back({OutlineStyle::Target, s.target_part[i],
                          i == 0 ? "Finished part wanted (target)" : "", ""});
}

// The virtual pins where they came to rest, the reading across them and the
// label that says it.
void add_pins(Drawing& d, const StationResult& s, Units u) {
  const auto show = [u](double mm) { return fmt::format("{}", shown(mm, u)); };
  const SectionMeasurement& m = s.measured;
  const double pin = s.target_reading.pin_diameter;
  for (const FlankMeasurement* f : {&m.left, &m.right})
    if (f->pin_center) d.pins.push_back({*f->pin_center, pin});
  if (!m.reading) {
    d.pin_label = fmt::format("Virtual pins {} dia: no reading ({})", show(pin),
                              m.problems.empty() ? std::string("no flank found")
                                                 : measure_problem_text(m.problems.front()));
    return;
  }
  const auto [from, to] = measuring_span(m);
  const double z = d.pins.empty() ? -s.target_depth / 2 : d.pins.front().center.z;
  d.dimensions.push_back({DimensionKind::Horizontal,
                          {from, z},
                          {to, z},
                          0,
                          0,
                          0,
                          m.reading->value,
                          show(m.reading->value)});
  d.pin_label =
      fmt::format("Virtual pins {} dia: {} {} (target {}, {})", show(pin), show(m.reading->value),
                  reading_words(m.reading->method), show(s.target_reading.value),
                  s.reading_in_tolerance ? "in tolerance" : "OUT of tolerance");
}

}  // namespace

Drawing build_check_drawing(const CheckReport& report, const Job& job, std::size_t station) {
  if (station >= report.stations.size())
    throw std::out_of_range("build_check_drawing: no such station");
  const StationResult& s = report.stations[station];
  const Units u = job.units;
  Drawing d;
  d.title = fmt::format("{}: {} as simulated", job.part.name.empty() ? job.source : job.part.name,
                        report.program);
  d.subtitle = fmt::format("Section at y = {} (station {} of {}), looking from the front end; {}",
                           shown(s.y, u), station + 1, report.stations.size(),
                           u == Units::Inch ? "dimensions in inches" : "dimensions in mm");
  add_stock(d, job);
  const double right = d.stock_max.x, height = -d.stock_min.z;
  add_regions(d, s);
  add_pins(d, s, u);
  const SectionMeasurement& m = s.measured;
  if (m.depth > 0)
    d.dimensions.push_back({DimensionKind::Vertical,
                            {right, m.top_z},
                            {right, m.top_z - m.depth},
                            0.12 * height,
                            0,
                            0,
                            m.depth,
                            fmt::format("{}", shown(m.depth, u))});
  return d;
}

}  // namespace dovetailor
