// The checker's drawing: the simulated section at a station over the target,
// its gouges and leftover stock, and the station chosen for a look.

#include <cmath>
#include <string>

#include <gtest/gtest.h>

#include <dovetailor/base/length.hpp>
#include <dovetailor/check/checker.hpp>
#include <dovetailor/drawing/check_drawing.hpp>
#include <dovetailor/drawing/drawing_scene.hpp>
#include <dovetailor/input/job_reader.hpp>

#include "test_support.hpp"

namespace dovetailor {
namespace {

using testing::read_source_file;

// samples/stop-block-male.toml: stock 90 x 25 mm, a tongue 6 mm deep, 40 mm
// across the top, 45 deg flanks, 4 mm pins.
Job male_job() { return read_job(read_source_file("samples/stop-block-male.toml"), "male.toml"); }

CheckReport check_file(const std::string& program, const Job& job) {
  StringProgramSource source(read_source_file(program), program);
  return check(source, job, {.stations = 3});
}

double area(const std::vector<Ring>& rings) {
  double a = 0;
  for (const auto& ring : rings) a += ring_area(ring);
  return a;
}

const Region* region(const Drawing& d, RegionFill fill) {
  for (const Region& r : d.regions)
    if (r.fill == fill) return &r;
  return nullptr;
}

TEST(check_drawing, clean_program_draws_the_part_it_cuts_and_no_defects) {
  const Job job = male_job();
  const CheckReport report = check_file("tests/programs/stop-block-male.ngc", job);
  ASSERT_EQ(report.stations.size(), 3u);
  const Drawing d = build_check_drawing(report, job, 1);
  const Region* simulated = region(d, RegionFill::Simulated);
  ASSERT_NE(simulated, nullptr);
  EXPECT_EQ(region(d, RegionFill::Gouge), nullptr);
  EXPECT_EQ(region(d, RegionFill::Leftover), nullptr);
  // Area of the part: the stock below the shelf plus the tongue, a
  // trapezoid of area depth * (top + bottom) / 2 (handbook formula); bottom
  // = top - 2 * depth * cot 45 = 28 mm. 90 * 19 + 6 * (40 + 28) / 2 = 1914
  // mm^2. The program cuts to the middle of the -0.02..0 mm band and leaves
  // the 0.2 mm corner radius' fillets: well under 0.5 mm^2 together.
  EXPECT_NEAR(area(simulated->polygons), 1914.0, 0.5);
  // The target is the middle of the band: the tongue 0.01 mm narrower over
  // its 6 mm depth, 0.06 mm^2 less.
  EXPECT_NEAR(area(report.stations[1].target_part), 1914.0 - 6 * 0.01, 1e-6);
  // Two virtual pins on the shelf, 4 mm, their reading dimensioned.
  ASSERT_EQ(d.pins.size(), 2u);
  for (const PinMark& p : d.pins) {
    EXPECT_DOUBLE_EQ(p.diameter, 4.0);
    EXPECT_NEAR(p.center.z, -6.0 + 2.0, 0.01);  // resting on the shelf, 6 mm down
  }
  const double reading = report.stations[1].measured.reading->value;
  bool dimensioned = false;
  for (const Dimension& dim : d.dimensions)
    dimensioned = dimensioned || (dim.kind == DimensionKind::Horizontal &&
                                  dim.text == fmt::format("{}", shown(reading, Units::Millimetre)));
  EXPECT_TRUE(dimensioned);
  EXPECT_NE(d.pin_label.find("in tolerance"), std::string::npos) << d.pin_label;
  EXPECT_NE(d.subtitle.find("station 2 of 3"), std::string::npos) << d.subtitle;
}

TEST(check_drawing, gouge_is_drawn_where_the_end_mill_cut_into_the_tongue) {
  // tests/programs/gouge-male.ngc runs the 12 mm end mill along the middle
  // of the tongue 3 mm below its top: a slot 12 x 3 = 36 mm^2 cut from the
  // part, less the tolerance band's half (0.01 mm) on its three sides.
  const Job job = male_job();
  const CheckReport report = check_file("tests/programs/gouge-male.ngc", job);
  const std::size_t station = station_to_draw(report);
  ASSERT_FALSE(report.stations[station].gouged.empty());
  const Drawing d = build_check_drawing(report, job, station);
  const Region* gouge = region(d, RegionFill::Gouge);
  ASSERT_NE(gouge, nullptr);
  EXPECT_NEAR(area(gouge->polygons), 36.0, 0.5);
  const Scene scene = layout_drawing(d, 270, 170);
  bool legend = false;
  for (const SceneText& t : scene.texts) legend = legend || t.text.starts_with("Gouge");
  EXPECT_TRUE(legend);
  EXPECT_NE(drawing_svg(scene).find("Gouge"), std::string::npos);
}

TEST(check_drawing, unfinished_program_draws_the_stock_left_and_no_pins) {
  // A program that ends at once leaves the whole stock: everything outside
  // the part is leftover, 90 * 25 - 1914 = 336 mm^2 (as above).
  const Job job = male_job();
  StringProgramSource source("G21 G90\nM30\n", "empty.ngc");
  const CheckReport report = check(source, job, {.stations = 3});
  const std::size_t station = station_to_draw(report);
  const Drawing d = build_check_drawing(report, job, station);
  const Region* leftover = region(d, RegionFill::Leftover);
  ASSERT_NE(leftover, nullptr);
  EXPECT_NEAR(area(leftover->polygons), 336.0, 1.0);
  EXPECT_NE(d.pin_label.find("no reading"), std::string::npos) << d.pin_label;
}

StationResult station(double y, double reading, double target, bool in_tolerance) {
  StationResult s;
  s.y = y;
  s.measured.reading = PinReading{.value = reading};
  s.target_reading.value = target;
  s.reading_in_tolerance = in_tolerance;
  return s;
}

TEST(check_drawing, station_to_draw_prefers_gouges_then_leftover_then_the_worst_reading) {
  CheckReport r;
  r.stations = {station(1, 50.00, 50, true), station(2, 50.05, 50, false),
                station(3, 49.90, 50, false), station(4, 50.00, 50, true)};
  EXPECT_EQ(station_to_draw(r), 2u);  // misses by 0.10, more than station 2's 0.05
  r.stations[3].measured.reading.reset();
  r.stations[3].reading_in_tolerance = false;
  EXPECT_EQ(station_to_draw(r), 3u);  // unread: the worst miss
  r.stations[1].leftover = {{{0, 0}, {1, 0}, {1, 1}}};
  EXPECT_EQ(station_to_draw(r), 1u);
  r.stations[2].gouged = {{{0, 0}, {1, 0}, {1, 1}}};
  EXPECT_EQ(station_to_draw(r), 2u);
  CheckReport clean;
  clean.stations = {station(1, 50, 50, true), station(2, 50, 50, true)};
  EXPECT_EQ(station_to_draw(clean), 0u);
  EXPECT_THROW((void)build_check_drawing(clean, male_job(), 2), std::out_of_range);
}

}  // namespace
}  // namespace dovetailor
