#include <cmath>

#include <gtest/gtest.h>

#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/shop/cutting_data.hpp>

#include "test_support.hpp"

namespace dovetailor {
namespace {

using testing::expect_input_error;

constexpr double in = 25.4;  // mm per inch, exact

Tool end_mill_half_inch() {
  Tool tool;
  tool.number = 1;
  tool.kind = ToolKind::EndMill;
  tool.diameter = 0.5 * in;
  tool.flutes = 4;
  tool.flute_length = 1.0 * in;
  tool.material = ToolMaterial::Hss;
  return tool;
}

Tool dovetail_one_inch() {
  Tool tool;
  tool.number = 2;
  tool.kind = ToolKind::Dovetail;
  tool.diameter = 1.0 * in;
  tool.flutes = 6;
  tool.flute_length = 0.4375 * in;
  tool.material = ToolMaterial::Hss;
  tool.angle = 60;
  tool.neck_diameter = 0.375 * in;
  return tool;
}

const Material& material(const char* name) { return find_material(builtin_materials(), name); }

TEST(cutting_data, spindle_speed_metric_textbook_formula) {
  // n = 1000 Vc / (pi D) (textbook formula; domain brief): Vc 100 m/min on a
  // 10 mm cutter: 100000 / (10 pi) = 3183.0989 rev/min (hand-computed).
  EXPECT_NEAR(spindle_speed(100, 10), 3183.0989, 1e-4);
  // Vc 30 m/min, 6 mm: 30000 / (6 pi) = 1591.5494.
  EXPECT_NEAR(spindle_speed(30, 6), 1591.5494, 1e-4);
  EXPECT_NEAR(surface_speed(3183.0989, 10), 100.0, 1e-5);
}

TEST(cutting_data, spindle_speed_inch_textbook_formula) {
  // n = 12 V / (pi D) (textbook formula; domain brief): 100 ft/min on a 1/2 in
  // cutter: 2400 / pi = 763.9437 rev/min; 80 ft/min on 1 in: 960 / pi = 305.5775.
  EXPECT_NEAR(spindle_speed_inch(100, 0.5), 763.9437, 1e-4);
  EXPECT_NEAR(spindle_speed_inch(80, 1.0), 305.5775, 1e-4);
  // Both forms agree: 100 ft/min = 30.48 m/min, 0.5 in = 12.7 mm.
  EXPECT_NEAR(spindle_speed(30.48, 12.7), spindle_speed_inch(100, 0.5), 1e-9);
}

TEST(cutting_data, feed_is_chip_load_times_flutes_times_rpm) {
  // 0.05 mm x 4 flutes x 2000 rev/min = 400 mm/min (textbook relation).
  EXPECT_DOUBLE_EQ(feed_rate(0.05, 4, 2000), 400);
}

TEST(cutting_data, chip_thinning_from_engagement_angle) {
  // ae = D/10: cos(phi) = 1 - 2/10 = 0.8, phi = 36.87 deg, sin(phi) = 0.6,
  // factor 1/0.6 = 1.6667 = D / (2 sqrt(0.1 D * 0.9 D)) (geometry of the tooth path).
  EXPECT_NEAR(degrees(engagement_angle(1, 10)), 36.8699, 1e-4);
  EXPECT_NEAR(chip_thinning_factor(1, 10, 3), 1 / 0.6, 1e-12);
  EXPECT_DOUBLE_EQ(chip_thinning_factor(5, 10, 3), 1.0);  // half the diameter: none
  EXPECT_DOUBLE_EQ(chip_thinning_factor(8, 10, 3), 1.0);
  EXPECT_DOUBLE_EQ(chip_thinning_factor(0.1, 10, 2), 2.0);  // 5.03 capped at the limit
  EXPECT_DOUBLE_EQ(engagement_angle(10, 10), pi);           // full slot
  EXPECT_DOUBLE_EQ(engagement_angle(5, 10), pi / 2);
}

TEST(cutting_data, end_mill_in_mild_steel_hand_worked) {
  // HSS in low-carbon steel: middle of 80-120 ft/min = 100 ft/min; on 1/2 in:
  // 763.94 rev/min. Chip load 0.002 in at 1/2 in (table), full slot, so
  // feed = 0.002 x 4 x 763.94 = 6.1115 in/min = 155.233 mm/min.
  const auto data = cutting_data(end_mill_half_inch(), material("1018"), Machine{});
  EXPECT_NEAR(data.rpm, 763.9437, 1e-4);
  EXPECT_NEAR(data.surface_speed, 30.48, 1e-9);
  EXPECT_NEAR(data.chip_load, 0.002 * in, 1e-12);
  EXPECT_NEAR(data.feed, 155.2334, 1e-4);
  EXPECT_DOUBLE_EQ(data.chip_thinning, 1.0);
  EXPECT_EQ(data.rpm_from, FigureSource::Material);
  EXPECT_TRUE(data.warnings.empty());
}

TEST(cutting_data, dovetail_cutter_runs_slower_and_lighter) {
  // Grey iron, HSS 60-80 ft/min: middle 70, x 0.6 for a dovetail cutter = 42
  // ft/min on the 1 in large diameter: 12 x 42 / pi = 160.428 rev/min. Chip load
  // 0.004 in at 1 in, x 0.5 = 0.002 in; a 0.05 in radial step thins the chip by
  // 1 / (2 sqrt(0.05 x 0.95)) = 2.294, capped at 2: 0.004 in per tooth, feed
  // 0.004 x 6 x 160.428 = 3.8503 in/min.
  const auto data = cutting_data(dovetail_one_inch(), material("cast iron"), Machine{},
                                 {.radial_step = 0.05 * in});
  EXPECT_NEAR(data.rpm, 160.4282, 1e-4);
  EXPECT_DOUBLE_EQ(data.chip_thinning, 2.0);
  EXPECT_NEAR(data.chip_load / in, 0.004, 1e-12);
  EXPECT_NEAR(data.feed / in, 3.8503, 1e-4);
  // Carbide runs faster in the same material.
  auto carbide = dovetail_one_inch();
  carbide.material = ToolMaterial::Carbide;
  EXPECT_GT(cutting_data(carbide, material("cast iron"), Machine{}).rpm, 2 * data.rpm);
}

TEST(cutting_data, machine_limits_cap_speed_and_feed) {
  // Aluminium, carbide: middle of 300-900 ft/min = 600 on 1/2 in = 4583.66
  // rev/min, above a 2500 rev/min machine.
  auto tool = end_mill_half_inch();
  tool.material = ToolMaterial::Carbide;
  const Machine slow{.kind = MachineKind::Manual, .max_rpm = 2500};
  const auto data = cutting_data(tool, material("6061"), slow);
  ASSERT_EQ(data.warnings.size(), 1u);
  EXPECT_EQ(data.warnings[0].kind, CuttingWarningKind::RpmCapped);
  EXPECT_NEAR(data.warnings[0].wanted, 4583.662, 1e-3);
  EXPECT_EQ(data.rpm, 2500);
  // The feed follows the capped speed: 0.004 in x 4 x 2500 = 40 in/min = 1016
  // mm/min, above 300 mm/min: capped, and the chip load reported is what 300 gives.
  const Machine slower{.max_rpm = 2500, .max_feed = 300};
  const auto capped = cutting_data(tool, material("6061"), slower);
  ASSERT_EQ(capped.warnings.size(), 2u);
  EXPECT_EQ(capped.warnings[1].kind, CuttingWarningKind::FeedCapped);
  EXPECT_NEAR(capped.warnings[1].wanted, 1016, 1e-9);
  EXPECT_EQ(capped.feed, 300);
  EXPECT_NEAR(capped.chip_load, 300.0 / (4 * 2500), 1e-12);
  EXPECT_EQ(warning_text(capped.warnings[0], Units::Inch),
            "spindle speed 4584 rev/min is above the machine's 2500 rev/min; using 2500");
  EXPECT_EQ(warning_text(capped.warnings[1], Units::Millimetre),
            "feed 1016 mm/min is above the machine's 300 mm/min; using 300");
  EXPECT_EQ(warning_text(capped.warnings[1], Units::Inch),
            "feed 40.0 in/min is above the machine's 11.8 in/min; using 11.8");
}

TEST(cutting_data, tool_overrides_win) {
  auto tool = end_mill_half_inch();
  tool.rpm = 600;
  tool.chip_load = 0.05;
  auto data = cutting_data(tool, material("1018"), Machine{}, {.radial_step = 1});
  EXPECT_EQ(data.rpm, 600);
  EXPECT_EQ(data.rpm_from, FigureSource::ToolOverride);
  EXPECT_DOUBLE_EQ(data.chip_load, 0.05);  // as given: no chip-thinning increase
  EXPECT_DOUBLE_EQ(data.feed, 0.05 * 4 * 600);
  EXPECT_EQ(data.feed_from, FigureSource::ToolOverride);
  tool.chip_load.reset();
  tool.feed = 100;
  data = cutting_data(tool, material("1018"), Machine{.max_rpm = 500});
  EXPECT_EQ(data.rpm, 500);
  EXPECT_EQ(data.feed, 100);
  EXPECT_DOUBLE_EQ(data.chip_load, 100.0 / (4 * 500));
}

// The job keys for the overrides and the machine limits.
const char* const job_text = R"(units = "inch"
[stock]
size = [3.0, 6.0, 1.25]
[dovetail]
type = "female"
angle = 60
depth = 0.375
width = 1.5
width_at = "top"
[[tool]]
number = 1
kind = "end-mill"
diameter = 0.5
flutes = 4
flute_length = 1.0
material = "hss"
rpm = 800
feed = 10
[machine]
kind = "manual"
max_rpm = 2500
max_feed = 30
)";

std::string replaced(std::string text, const std::string& from, const std::string& to) {
  const auto at = text.find(from);
  EXPECT_NE(at, std::string::npos) << from;
  return text.replace(at, from.size(), to);
}

TEST(cutting_data, job_keys_are_read_in_job_units) {
  const auto job = read_job(job_text, "job.toml");
  EXPECT_EQ(job.tools[0].rpm, 800);
  EXPECT_NEAR(*job.tools[0].feed, 254, 1e-12);  // 10 in/min
  EXPECT_FALSE(job.tools[0].chip_load);
  EXPECT_EQ(job.machine.max_rpm, 2500);
  EXPECT_NEAR(*job.machine.max_feed, 762, 1e-12);  // 30 in/min
  const auto with_load = read_job(replaced(job_text, "feed = 10", "chip_load = 0.002"), "job.toml");
  EXPECT_NEAR(*with_load.tools[0].chip_load, 0.0508, 1e-12);
}

TEST(cutting_data, job_key_errors_name_key_and_line) {
  expect_input_error(
      [] { read_job(replaced(job_text, "feed = 10", "feed = 10\nchip_load = 0.002"), "job.toml"); },
      {"job.toml:19", "tool[1].chip_load", "not both"});
  expect_input_error([] { read_job(replaced(job_text, "rpm = 800", "rpm = 0"), "job.toml"); },
                     {"job.toml:17", "tool[1].rpm", "greater than zero"});
  expect_input_error(
      [] { read_job(replaced(job_text, "max_rpm = 2500", "max_rpm = -5"), "job.toml"); },
      {"job.toml:21", "machine.max_rpm", "out of range"});
  expect_input_error(
      [] { read_job(replaced(job_text, "max_feed = 30", "max_feed = \"fast\""), "job.toml"); },
      {"job.toml:22", "machine.max_feed", "expected a number"});
}

}  // namespace
}  // namespace dovetailor
