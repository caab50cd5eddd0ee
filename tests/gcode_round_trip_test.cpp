// The round trip of issue 5 (and 12): every program the G-code writer makes,
// for every shipped post at its own decimals, is read back by the RS-274
// reader and simulated by the checker; it must check clean (no findings) and
// its virtual pin reading must lie in the tolerance band and equal the
// planned final reading (the middle of the band) within the post's rounding
// and 0.00005 in / 0.001 mm.

#include <cmath>
#include <random>
#include <string>

#include <gtest/gtest.h>

#include <dovetailor/check/checker.hpp>
#include <dovetailor/gcode/gcode_writer.hpp>
#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/plan/planner.hpp>
#include <dovetailor/report/check_report.hpp>

#include "random_jobs.hpp"
#include "tapered_flank.hpp"
#include "test_support.hpp"

namespace dovetailor {
namespace {

using testing::read_source_file;

const char* const posts[] = {"rs274ngc-full", "small-control", "iso6983-numbered"};

Post load_post(const std::string& name) {
  const std::string path = "post/" + name + ".toml";
  return read_post(read_source_file(path), path);
}

// The posts write 4 decimals in inch and 3 in mm, the step of most controls:
// each wall the pins read between (two flanks, or a flank and the square
// wall) can land up to half a step off, and the reading moves with each.
double rounding_bound(const Job& job, const Post& post) {
  const int decimals = job.units == Units::Inch ? post.decimals.inch : post.decimals.mm;
  return 2 * to_mm(0.5 * std::pow(10.0, -decimals), job.units);
}

// The program from `gcode` for `post`, at the post's own decimals, checked:
// no findings at all (an error or a warning on the tool's own program is the
// tool's fault), at every station a reading inside the tolerance band, and
// that reading the one the plan aims at (the middle of the band, moved by a
// tapered gib's slanted pass as tapered_flank.hpp works out) within the
// post's rounding plus the simulation's own 0.00005 in / 0.001 mm.
::testing::AssertionResult round_trip(const Job& job, const Post& post, int stations) {
  const Plan p = plan(job);
  const std::string program = write_program(p, post, {.date = "2000-01-01"});
  StringProgramSource source(program, "round-trip.ngc");
  const CheckReport r = check(source, job, {.stations = stations});
  if (!r.findings.empty())
    return ::testing::AssertionFailure() << "findings:\n" << format_check_report(r);
  const double tolerance =
      (job.units == Units::Inch ? to_mm(0.00005, Units::Inch) : 0.001) + rounding_bound(job, post);
  for (const auto& s : r.stations) {
    if (!s.measured.reading) return ::testing::AssertionFailure() << "no reading at y = " << s.y;
    if (!s.reading_in_tolerance)
      return ::testing::AssertionFailure() << "reading out of the band at y = " << s.y << "\n"
                                           << format_check_report(r);
    const double shift = testing::tapered_flank_shift(job, s.target_reading.pin_diameter);
    const double error = s.measured.reading->value - (s.target_reading.value + shift);
    if (std::abs(error) > tolerance)
      return ::testing::AssertionFailure()
             << "reading off by " << error << " mm at y = " << s.y << "\n"
             << format_check_report(r);
  }
  return ::testing::AssertionSuccess();
}

// Two more decimals than the post's: the rounding falls far below the
// round-trip tolerance, so the simulation itself is held to it.
Post finer(Post post) {
  post.decimals.inch += 2;
  post.decimals.mm += 2;
  return post;
}

const char* const samples[] = {"fixture-slide-female", "fixture-slide-male", "stop-block-male",
                               "height-stop-half-female", "spindle-slide-tapered-female"};

Job sample_job(const char* sample) {
  const std::string path = std::string("samples/") + sample + ".toml";
  return read_job(read_source_file(path), path);
}

TEST(gcode_round_trip, every_sample_for_every_post_reads_the_plan_to_the_tolerance) {
  for (const char* sample : samples)
    for (const char* post : posts)
      EXPECT_TRUE(round_trip(sample_job(sample), finer(load_post(post)), 5))
          << sample << " / " << post;
}

// Issue 12, item 12: the checker's target at each station is the plan's
// final checkpoint reading moved along the slide as the checkpoint states
// (reading_per_length from reading_at_y), so the station table and the
// checkpoints agree on a tapered gib.
TEST(gcode_round_trip, checker_targets_follow_the_checkpoint_reading_along_a_tapered_gib) {
  const Job job = sample_job("spindle-slide-tapered-female");
  const Plan p = plan(job);
  const Checkpoint& c = p.checkpoints.back();
  ASSERT_NE(c.reading_per_length, 0);
  StringProgramSource source(write_program(p, finer(load_post("rs274ngc-full")), {}), "t.ngc");
  const CheckReport r = check(source, job, {.stations = 5});
  ASSERT_EQ(r.stations.size(), 5u);
  for (const auto& s : r.stations)
    EXPECT_NEAR(s.target_reading.value,
                c.expected.value + c.reading_per_length * (s.y - c.reading_at_y), 1e-9)
        << "y = " << s.y;
  // The measured taper of the reading is the planned one, less the hair a
  // slanted pass cuts wider (tests/tapered_flank.hpp: the same at every y).
  EXPECT_NEAR(r.reading_taper, c.reading_per_length, 1e-5);
}

TEST(gcode_round_trip, every_sample_checks_clean_at_the_shipped_posts_decimals) {
  for (const char* sample : samples) {
    const Job job = sample_job(sample);
    for (const char* post : posts)
      EXPECT_TRUE(round_trip(job, load_post(post), 3)) << sample << " / " << post;
  }
}

// Random valid jobs (tests/random_jobs.hpp: levels, bands off the nominal,
// body data left out) through every post at its own decimals: 1,200 jobs
// (about 6 ms per job and post), seed fixed; more with DOVETAILOR_CASE_SCALE
// (test_support.hpp).
TEST(gcode_round_trip, random_jobs_check_clean_at_the_shipped_posts_decimals) {
  std::mt19937_64 rng(20261202);
  int tried = 0;
  const int cases = testing::random_cases(1200);
  for (int i = 0; i < cases; ++i) {
    const Job job = testing::random_job(rng);
    if (!testing::plan_if_accepted(job)) continue;
    ++tried;
    for (const char* post : posts)
      EXPECT_TRUE(round_trip(job, load_post(post), 3)) << "job " << i << " / " << post;
  }
  EXPECT_GT(tried, cases * 2 / 3);
  RecordProperty("jobs_planned", tried);
}

// A deep female slot (12 mm, 60 deg) for a cutter with 5 mm of flutes, cut in
// three levels, whose [[tool]] gives no shank, stickout or holder: the
// planner and the checker must assume the same body (tool_body.hpp) and the
// levels must meet without the flutes "cutting" at their top. Example job.
constexpr const char* deep_slot_job = R"(units = "mm"
[part]
name = "Deep cross-slide base"
material = "cast iron"
[stock]
size = [110, 120, 30]
[dovetail]
type = "female"
angle = 60
depth = 12
width = 70
width_at = "bottom"
[[tool]]
number = 1
kind = "end-mill"
diameter = 20
flutes = 4
flute_length = 30
material = "carbide"
[[tool]]
number = 2
kind = "dovetail"
diameter = 40
flutes = 8
flute_length = 5
material = "hss"
angle = 60
neck_diameter = 20
[gauge]
pin_diameter = 8
)";

TEST(gcode_round_trip, a_deep_slot_cut_in_levels_by_a_cutter_without_body_data_checks_clean) {
  const Job job = read_job(deep_slot_job, "deep-slot.toml");
  const Plan p = plan(job);
  int levels = 0;
  for (const Pass* pass : all_passes(p))
    if (pass->role == PassRole::Finish && pass->side == Side::Right) ++levels;
  EXPECT_EQ(levels, 3);
  for (const char* post : posts) EXPECT_TRUE(round_trip(job, load_post(post), 3)) << post;
}

// Females whose roughed slot is narrower than the dovetail cutter, on CNC and
// manual machines: the first pass down the slot cuts its walls (both alike,
// or one on a manual mill).
TEST(gcode_round_trip, random_narrow_slot_jobs_for_every_post_check_clean) {
  std::mt19937_64 rng(20261206);
  int tried = 0;
  const int cases = testing::random_cases(100);
  for (int i = 0; i < cases; ++i) {
    const Job job =
        testing::random_job(rng, {.type = DovetailType::Female,
                                  .machine = i % 2 ? MachineKind::Manual : MachineKind::Cnc,
                                  .narrow_slot = true});
    if (!testing::plan_if_accepted(job)) continue;
    ++tried;
    for (const char* post : posts)
      EXPECT_TRUE(round_trip(job, finer(load_post(post)), 3)) << "job " << i << " / " << post;
  }
  EXPECT_GT(tried, cases / 4);
}

}  // namespace
}  // namespace dovetailor
