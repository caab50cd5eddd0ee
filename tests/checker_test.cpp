// The checker: a program written from the planner's own moves checks clean
// and its virtual pin reading equals the planned final reading; hand-made bad
// programs, one per finding kind, are each found at the right line.

#include <algorithm>
#include <cmath>
#include <random>
#include <stdexcept>
#include <string>

#include <fmt/format.h>
#include <gtest/gtest.h>

#include <dovetailor/check/checker.hpp>
#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/plan/planner.hpp>
#include <dovetailor/report/check_report.hpp>

#include "random_jobs.hpp"
#include "tapered_flank.hpp"
#include "test_support.hpp"

namespace dovetailor {
namespace {

using testing::read_source_file;

Job sample(const std::string& name) { return read_job(read_source_file("samples/" + name), name); }

// The plan's moves written out as plain RS-274 in mm: a direct round trip of
// the plan geometry (the G-code writer has its own round trip).
std::string program_from_plan(const Plan& p) {
  std::string text = "G21 G90 G17 G40 G49 G80\n";
  for (const Operation& op : p.operations) {
    text += fmt::format("T{} M6\nS{:.0f} M3\n", op.tool, op.rpm);
    for (const Pass* pass : all_passes(p)) {
      if (pass->tool != op.tool) continue;
      for (const Move& m : pass->moves) {
        if (m.kind == MoveKind::Rapid)
          text += fmt::format("G0 X{:.5f} Y{:.5f} Z{:.5f}\n", m.to.x, m.to.y, m.to.z);
        else
          text +=
              fmt::format("G1 X{:.5f} Y{:.5f} Z{:.5f} F{:.1f}\n", m.to.x, m.to.y, m.to.z, m.feed);
      }
    }
    text += "M5\n";
  }
  return text + "M30\n";
}

CheckReport check_text(const std::string& program, const Job& job, int stations = 5) {
  StringProgramSource source(program, "test.ngc");
  return check(source, job, {.stations = stations});
}

std::string describe(const CheckReport& r) { return format_check_report(r); }

// Reading tolerance of the round trip (issue 5): 0.00005 in or 0.001 mm.
double round_trip_tolerance(Units units) {
  return units == Units::Inch ? to_mm(0.00005, Units::Inch) : 0.001;
}

void expect_round_trip(const Job& job) {
  const Plan p = plan(job);
  const CheckReport r = check_text(program_from_plan(p), job);
  EXPECT_TRUE(r.findings.empty()) << describe(r);
  ASSERT_FALSE(r.stations.empty());
  for (const StationResult& s : r.stations) {
    ASSERT_TRUE(s.measured.reading) << describe(r);
    const double shift = testing::tapered_flank_shift(job, s.target_reading.pin_diameter);
    EXPECT_NEAR(s.measured.reading->value, s.target_reading.value + shift,
                round_trip_tolerance(job.units))
        << "at y = " << s.y << "\n"
        << describe(r);
    EXPECT_TRUE(s.reading_in_tolerance);
  }
  // Without a tapered gib the target is the plan's final reading everywhere.
  if (!job.dovetail.gib || job.dovetail.gib->taper == 0) {
    EXPECT_NEAR(r.stations.front().measured.reading->value, p.final_reading.value,
                round_trip_tolerance(job.units));
  }
}

TEST(checker, planned_male_sample_checks_clean_and_reads_the_planned_reading) {
  expect_round_trip(sample("stop-block-male.toml"));
}

// The round-trip program for the male sample is kept as a file, reviewed by
// eye, for the command-line tests (tests/CMakeLists.txt, cli.check_*).
TEST(checker, planned_male_program_file_is_current) {
  testing::expect_golden("tests/programs/stop-block-male.ngc",
                         program_from_plan(plan(sample("stop-block-male.toml"))));
}

TEST(checker, planned_female_sample_with_gib_checks_clean) {
  expect_round_trip(sample("fixture-slide-female.toml"));
}

TEST(checker, planned_half_dovetail_checks_clean) {
  expect_round_trip(sample("height-stop-half-female.toml"));
}

TEST(checker, planned_random_jobs_check_clean) {
  std::mt19937_64 rng(20240605);
  for (int i = 0; i < testing::random_cases(20); ++i) {
    SCOPED_TRACE(i);
    Job job = testing::random_job(rng);
    Plan p;
    try {
      p = plan(job);
    } catch (const InputError&) {
      continue;  // the planner refuses some random jobs; its own tests cover that
    }
    expect_round_trip(job);
  }
}

// A cutter within the planner's 0.1 deg of the dovetail's angle cuts the
// flank at its own angle; the plan is for that flank, and so is the section
// the checker holds the program to (planner.hpp, dovetail_as_cut).
TEST(checker, planned_program_of_a_cutter_a_tenth_of_a_degree_off_checks_clean) {
  for (double angle : {45.1, 44.9}) {
    SCOPED_TRACE(angle);
    Job job = sample("stop-block-male.toml");
    job.tools[1].angle = angle;
    expect_round_trip(job);
  }
}

TEST(checker, planned_random_jobs_with_a_cutter_a_little_off_angle_check_clean) {
  std::mt19937_64 rng(20261208);
  for (int i = 0; i < testing::random_cases(20); ++i) {
    SCOPED_TRACE(i);
    Job job = testing::random_job(rng, {.cutter_off_angle = true});
    if (!testing::plan_if_accepted(job)) continue;
    expect_round_trip(job);
  }
}

// Female jobs whose roughed slot is narrower than the dovetail cutter: its
// first pass down the slot cuts the walls, on one wall only on a manual mill.
TEST(checker, planned_random_narrow_slot_jobs_check_clean) {
  std::mt19937_64 rng(20261205);
  int planned = 0;
  for (int i = 0; i < testing::random_cases(20); ++i) {
    SCOPED_TRACE(i);
    Job job = testing::random_job(rng, {.type = DovetailType::Female,
                                        .machine = i % 2 ? MachineKind::Manual : MachineKind::Cnc,
                                        .narrow_slot = true});
    if (!testing::plan_if_accepted(job)) continue;
    ++planned;
    expect_round_trip(job);
  }
  EXPECT_GT(planned, 0);
}

// The male stop-block rail (samples/stop-block-male.toml: stock 90 x 160 x
// 25 mm, x from -45 to 45; tongue 40 mm across the top, 28 mm at the 6 mm
// deep shelf, 45 deg), with its end mill T3 given 10 mm flutes and a 16 mm
// shank so that depth and shank checks can be provoked, a vise jaw against
// the right face, and a 3000 rev/min machine.
Job bad_program_job() {
  Job job = sample("stop-block-male.toml");
  job.tools[0].flute_length = 10;
  job.tools[0].shank_diameter = 16;
  job.fixtures.push_back({.name = "right vise jaw",
                          .kind = FixtureKind::ViseJaw,
                          .x_min = 45,
                          .x_max = 60,
                          .y_min = 0,
                          .y_max = 160,
                          .z_min = -25,
                          .z_max = 5});
  job.machine.max_rpm = 3000;
  return job;
}

struct BadProgram {
  const char* name;
  std::string text;  // line 1 is "G21 G90 G17"
  FindingKind kind;
  Severity severity;
  int line;
};

// Each program breaks one rule at a known line (other findings may follow
// from it; only the one asked for is checked). The T3 end mill enters at
// y = -20 (outside the stock) unless the case is about entering.
std::vector<BadProgram> bad_programs() {
  const std::string head = "G21 G90 G17\n";
  const std::string mill = head + "T3 M6\nS2500 M3\n";  // lines 2, 3
  const std::string cutter = head + "T4 M6\nS800 M3\n";
  return {
      {"gouge", mill + "G0 X0 Y-20 Z5\nG1 Z-3 F500\nG1 Y180\nM30\n", FindingKind::Gouge,
       Severity::Error, 6},
      {"stock_left", head + "M30\n", FindingKind::StockLeft, Severity::Error, 2},
      {"body_collision", mill + "G0 X30 Y-20 Z5\nG1 Z-8 F500\nG1 Y180\nG1 Z-12\nG1 Y-20\nM30\n",
       FindingKind::BodyCollision, Severity::Error, 8},
      {"fixture_collision", mill + "G0 X50 Y80 Z20\nG1 Z2 F500\nM30\n",
       FindingKind::FixtureCollision, Severity::Error, 5},
      {"rapid_through_material", mill + "G0 X30 Y80 Z5\nG0 Z-2\nM30\n",
       FindingKind::RapidThroughMaterial, Severity::Error, 5},
      {"spindle_stopped", head + "T3 M6\nG0 X30 Y-20 Z5\nG1 Z-3 F500\nG1 Y180\nM30\n",
       FindingKind::SpindleStopped, Severity::Error, 5},
      {"plunge", cutter + "G0 X32 Y80 Z5\nG1 Z-3 F100\nM30\n", FindingKind::Plunge, Severity::Error,
       5},
      {"depth_of_cut", mill + "G0 X30 Y-20 Z5\nG1 Z-12 F500\nG1 Y180\nM30\n",
       FindingKind::DepthOfCut, Severity::Error, 6},
      {"cutter_overload",
       mill + "G0 X32 Y-20 Z5\nG1 Z-6 F500\nG1 Y180\nG0 Z5\nT4 M6\nS800 M3\n"
              "G0 X31 Y-20 Z5\nG1 Z-6 F100\nG1 Y180\nM30\n",
       FindingKind::CutterOverload, Severity::Error, 12},
      {"rapid_below_safe_height", mill + "G0 X0 Y80 Z1\nM30\n", FindingKind::RapidBelowSafeHeight,
       Severity::Warning, 4},
      {"spindle_speed", head + "T3 M6\nS5000 M3\nM30\n", FindingKind::SpindleSpeed,
       Severity::Warning, 3},
      {"unknown_tool", head + "T9 M6\nS800 M3\nG0 X0 Y-20 Z5\nM30\n", FindingKind::UnknownTool,
       Severity::Error, 2},
      {"no_program_end", mill + "G0 X0 Y-20 Z5\n", FindingKind::NoProgramEnd, Severity::Warning, 4},
  };
}

TEST(checker, finds_each_bad_program_at_its_line) {
  const Job job = bad_program_job();
  for (const BadProgram& bad : bad_programs()) {
    SCOPED_TRACE(bad.name);
    const CheckReport r = check_text(bad.text, job);
    bool found = false;
    for (const Finding& f : r.findings)
      found = found || (f.kind == bad.kind && f.line == bad.line && f.severity == bad.severity);
    EXPECT_TRUE(found) << describe(r);
    EXPECT_EQ(finding_kind_name(bad.kind), bad.name);
    EXPECT_EQ(r.has_errors(), bad.severity == Severity::Error || r.count(FindingKind::StockLeft));
  }
}

const Finding* first_of(const CheckReport& r, FindingKind kind) {
  for (const Finding& f : r.findings)
    if (f.kind == kind) return &f;
  return nullptr;
}

const Finding* finding_at(const CheckReport& r, FindingKind kind, int line) {
  for (const Finding& f : r.findings)
    if (f.kind == kind && f.line == line) return &f;
  return nullptr;
}

const BadProgram& bad_program(const std::string& name) {
  static const std::vector<BadProgram> all = bad_programs();
  for (const BadProgram& b : all)
    if (b.name == name) return b;
  throw std::invalid_argument(name);
}

// The finding of each bad program carries what its words say, worked by
// hand from the programs above and the job (common practice, no source):
TEST(checker, each_bad_programs_finding_carries_its_tool_part_and_place) {
  const Job job = bad_program_job();
  const auto found = [&](const char* name) {
    const BadProgram& bad = bad_program(name);
    const CheckReport r = check_text(bad.text, job);
    const Finding* f = finding_at(r, bad.kind, bad.line);
    EXPECT_NE(f, nullptr) << describe(r);
    return std::pair{r, f ? *f : Finding{}};
  };
  {
    // T3 (12 mm, flutes 10 long, shank 16 mm) first cuts x = 24..36 down to
    // z = -8, then runs with its tip at z = -12: its shank (x = 22..38 from
    // z = -2 up) meets two strips 2 x 2 mm beside the slot. Thickness 2 x
    // area / perimeter = 2 x 8 / 16 = 1 mm; their middle x = 30, z = -1.
    const auto [r, f] = found("body_collision");
    EXPECT_EQ(f.tool, 3);
    EXPECT_EQ(f.part, BodyPart::Shank);
    EXPECT_NEAR(f.amount, 1.0, 1e-3);
    ASSERT_TRUE(f.at);
    EXPECT_NEAR(f.at->x, 30, 1e-3);
    EXPECT_NEAR(f.at->z, -1, 1e-3);
  }
  {
    // The flutes (z = 2..12 at the bottom of the move) come down into the
    // jaw's box (x = 45..60, up to z = 5) at x = 50.
    const auto [r, f] = found("fixture_collision");
    EXPECT_EQ(f.tool, 3);
    EXPECT_EQ(f.part, BodyPart::Flutes);
    ASSERT_EQ(f.fixture, 0);
    EXPECT_EQ(r.fixtures, std::vector<std::string>{"right vise jaw"});
  }
  {
    // Z-2 at rapid through the station y = 80 on the tool's axis: the 12
    // mm flutes' full width, 2 mm of the stock's top: 24 mm^2, 2 mm high.
    const auto [r, f] = found("rapid_through_material");
    EXPECT_EQ(f.tool, 3);
    EXPECT_NEAR(f.area, 24, 1e-3);
    EXPECT_NEAR(f.amount, 2, 1e-3);
  }
  {
    const auto [r, f] = found("plunge");  // from the top face down to z = -3
    EXPECT_EQ(f.tool, 4);
    EXPECT_NEAR(f.amount, 3, 1e-3);
  }
  {
    // Tip at z = -12, flutes 10 long: material runs from z = -2 to the top.
    const auto [r, f] = found("depth_of_cut");
    EXPECT_EQ(f.tool, 3);
    EXPECT_NEAR(f.amount, 2, 1e-3);
    EXPECT_EQ(f.limit, 10);
  }
  {
    const auto [r, f] = found("cutter_overload");
    EXPECT_EQ(f.tool, 4);
    EXPECT_EQ(f.overload, Overload::RadialCut);
  }
  {
    const auto [r, f] = found("rapid_below_safe_height");  // Z1 under the 5 mm safe height
    EXPECT_EQ(f.tool, 3);
    EXPECT_NEAR(f.amount, 4, 1e-9);
    EXPECT_NEAR(f.limit, 5, 1e-9);
  }
  {
    const auto [r, f] = found("spindle_speed");
    EXPECT_EQ(f.amount, 5000);
    EXPECT_EQ(f.limit, 3000);
  }
  {
    const auto [r, f] = found("unknown_tool");
    EXPECT_EQ(f.tool, 9);
    EXPECT_EQ(f.named_by, ToolWord::M6);
  }
  {
    // Nothing cut: the stock (x = -45..45) stands above the shelf, which
    // lies 6 mm down; material within the allowance (half the 0.02 mm band)
    // of the part may stay: left from z = -5.99 up. No flank to read.
    const auto [r, f] = found("stock_left");
    ASSERT_TRUE(f.extent);
    EXPECT_NEAR(f.extent->x_min, -45, 1e-6);
    EXPECT_NEAR(f.extent->x_max, 45, 1e-6);
    EXPECT_NEAR(f.extent->z_min, -5.99, 1e-6);
    EXPECT_NEAR(f.extent->z_max, 0, 1e-6);
    const Finding* reading = first_of(r, FindingKind::ReadingOutOfTolerance);
    ASSERT_NE(reading, nullptr);
    EXPECT_EQ(reading->problem, (MeasureProblem{MeasureProblemKind::NoFlank, Side::Left}));
    EXPECT_EQ(reading->pin_diameter, 4);  // [gauge] pin_diameter
  }
}

// The plan with its end-mill roughing left out: the dovetail cutter's first
// pass then runs through solid stock.
Plan without_roughing(Plan p) {
  std::erase_if(p.operations, [](const Operation& op) {
    return op.kind == OperationKind::RoughSlot || op.kind == OperationKind::RoughShoulders;
  });
  return p;
}

// The line of the first cut along Y of tool `tool` in a program_from_plan
// text: "T M6", "S M3", then per pass two rapids down, the feed to depth
// and the cut.
int first_cut_line(const std::string& program, int tool) {
  const std::string change = fmt::format("T{} M6\n", tool);
  const auto at = program.find(change);
  EXPECT_NE(at, std::string::npos);
  return static_cast<int>(std::count(program.begin(), program.begin() + at, '\n')) + 1 + 5;
}

int dovetail_cutter(const Plan& p) {
  for (const Operation& op : p.operations)
    if (op.kind == OperationKind::Undercut) return op.tool;
  return 0;
}

// Issue 12, item 1: a sample's own program with the end-mill roughing taken
// out sends the dovetail cutter full width through solid stock on its first
// pass. That pass is an error at its line, for every sample. (The half
// dovetail keeps the end mill's pass along its square wall, which clears
// the cutter's axis: its first pass cuts the whole undercut from one side.)
TEST(checker, a_program_without_its_roughing_overloads_the_dovetail_cutter_at_its_first_pass) {
  for (const auto& [name, words] : std::vector<std::pair<const char*, const char*>>{
           {"stop-block-male.toml", "slots through material"},
           {"fixture-slide-female.toml", "slots through material"},
           {"fixture-slide-male.toml", "slots through material"},
           {"height-stop-half-female.toml", "takes a radial cut of 0.2569 in"}}) {
    SCOPED_TRACE(name);
    const Job job = sample(name);
    const Plan p = without_roughing(plan(job));
    const std::string program = program_from_plan(p);
    const CheckReport r = check_text(program, job);
    EXPECT_TRUE(r.has_errors());
    const Finding* f = first_of(r, FindingKind::CutterOverload);
    ASSERT_NE(f, nullptr) << describe(r);
    EXPECT_EQ(f->severity, Severity::Error);
    EXPECT_EQ(f->line, first_cut_line(program, dovetail_cutter(p))) << describe(r);
    EXPECT_NE(finding_text(*f, r).find(words), std::string::npos) << finding_text(*f, r);
  }
}

// The same program for the male rail, kept as a file for the command-line
// test (cli.check_no_roughing_fails: exit code 1, FAIL at line 7).
// A reading a hair under its target rounds to zero at the report's
// decimals: the error column shows +0.000, never -0.000 (the no-roughing
// program reads 41.647 mm, a few nanometres under the target).
TEST(checker, the_report_never_prints_a_negative_zero) {
  const std::string text = format_check_report(check_text(
      read_source_file("tests/programs/no-roughing-male.ngc"), sample("stop-block-male.toml")));
  EXPECT_EQ(text.find("-0.000"), std::string::npos) << text;
  EXPECT_NE(text.find("+0.000"), std::string::npos) << text;
}

TEST(checker, no_roughing_program_file_is_current) {
  testing::expect_golden("tests/programs/no-roughing-male.ngc",
                         program_from_plan(without_roughing(plan(sample("stop-block-male.toml")))));
}

// The male rail (tongue 40 mm across the top, 45 deg, 6 mm deep; T4 is a
// 25 mm dovetail cutter), with T4's corner radius taken off so its cone
// runs to the sharp corner: its radius at h above the tip is 12.5 - h.
Job sharp_cutter_job() {
  Job job = sample("stop-block-male.toml");
  job.tools[1].corner_radius = 0;
  return job;
}

// The planner's largest radial step for the rail's dovetail cutter: it
// steps from the end mill's shoulder wall (x = 20 + 0.25 rough allowance)
// with the cone's tip edge on it (axis 32.75) to the finishing allowance
// 0.2 mm off the finish axis 14 + 12.5 = 26.5, in 4 equal steps (plan
// table in the README): (32.75 - 26.5 - 0.2) / 4 = 1.5125 mm.
TEST(checker, the_radial_limit_is_the_planners_largest_step) {
  double largest = 0;
  const Plan p = plan(sharp_cutter_job());  // outlives the pass pointers
  for (const Pass* pass : all_passes(p))
    if (pass->tool == 4) largest = std::max(largest, pass->radial_step);
  EXPECT_NEAR(largest, 1.5125, 1e-9);
}

TEST(checker, a_dovetail_pass_three_times_the_planned_step_is_an_error_at_its_line) {
  // T3 clears the right shoulder from x = 20.25 to the stock's edge (4
  // passes, 12 mm wide, 6 mm deep); T4 then cuts at three planned steps
  // in from the wall, axis 32.75 - 3 * 1.5125 = 28.2125. Its left edge at
  // h above the tip is 28.2125 - 12.5 + h, so it takes 20.25 - 15.7125 - h
  // = 4.5375 - h from the tongue; the rows start 0.005 mm above the tip
  // (the male has no floor skin): 4.5325 mm.
  std::string text = "G21 G90 G17\nT3 M6\nS2500 M3\n";
  for (const double x : {26.25, 32.25, 38.25, 44.25})
    text += fmt::format("G0 X{} Y-20 Z5\nG1 Z-6 F500\nG1 Y180\nG0 Z5\n", x);
  text += "T4 M6\nS800 M3\nG0 X28.2125 Y-20 Z5\nG1 Z-6 F100\nG1 Y180\nG0 Z5\nM30\n";
  // Lines: 1-3 set-up, 4-19 the shoulder, 20-21 T4, 22-23 down, 24 the cut.
  const CheckReport r = check_text(text, sharp_cutter_job());
  const Finding* f = first_of(r, FindingKind::CutterOverload);
  ASSERT_NE(f, nullptr) << describe(r);
  EXPECT_EQ(f->line, 24);
  EXPECT_EQ(f->severity, Severity::Error);
  EXPECT_NEAR(f->amount, 4.5325, 1e-3);
  EXPECT_NEAR(f->limit, 1.5125, 1e-9);
  EXPECT_EQ(f->tool, 4);
  EXPECT_EQ(f->overload, Overload::RadialCut);
  EXPECT_NE(finding_text(*f, r).find("radial cut of 4.53"), std::string::npos)
      << finding_text(*f, r);
}

TEST(checker, a_dovetail_cutter_slotting_full_width_through_stock_is_an_error_at_its_line) {
  // T4 runs 3 mm deep through the uncut right shoulder, axis at x = 30:
  // solid stock on both sides of its axis, from the tip at z = -3 to the
  // top face. The skin its bottom face may take across its diameter is the
  // planner's default floor allowance, 0.12 mm, plus 2 % and 5 um: 2.8726
  // mm of material on the axis above that. The widest row, 5 um above the
  // tip (the male's own floor skin is none), is the cone's whole chord
  // there, 2 (12.5 - h): 24.99 mm.
  const std::string text =
      "G21 G90 G17\nT4 M6\nS800 M3\nG0 X30 Y-20 Z5\nG1 Z-3 F100\n"
      "G1 Y180\nG0 Z5\nM30\n";
  const CheckReport r = check_text(text, sharp_cutter_job());
  const Finding* f = first_of(r, FindingKind::CutterOverload);
  ASSERT_NE(f, nullptr) << describe(r);
  EXPECT_EQ(f->line, 6);
  EXPECT_EQ(f->severity, Severity::Error);
  EXPECT_NEAR(f->amount, 24.99, 1e-3);
  EXPECT_EQ(f->overload, Overload::Slot);
  EXPECT_NEAR(f->on_axis, 2.8726, 1e-3);
  EXPECT_NE(finding_text(*f, r).find("2.873 mm of material on its axis"), std::string::npos)
      << finding_text(*f, r);
  EXPECT_EQ(r.count(FindingKind::Plunge), 0) << describe(r);
  EXPECT_EQ(r.count(FindingKind::BodyCollision), 0) << describe(r);
}

TEST(checker, a_thin_skin_under_the_dovetail_cutter_is_no_overload) {
  // The end mill leaves 0.02 mm on the rail's shelf (z = -5.98 from x =
  // 20.25 out); the planner's first dovetail pass (axis 31.2375, its step
  // 1.5125 mm) takes that skin across its whole diameter besides its step:
  // thinner than the default floor allowance, no slot, and the step is
  // the planned one.
  std::string text = "G21 G90 G17\nT3 M6\nS2500 M3\n";
  for (const double x : {26.25, 32.25, 38.25, 44.25})
    text += fmt::format("G0 X{} Y-20 Z5\nG1 Z-5.98 F500\nG1 Y180\nG0 Z5\n", x);
  text += "T4 M6\nS800 M3\nG0 X31.2375 Y-20 Z5\nG1 Z-6 F100\nG1 Y180\nG0 Z5\nM30\n";
  const CheckReport r = check_text(text, sharp_cutter_job());
  EXPECT_EQ(r.count(FindingKind::CutterOverload), 0) << describe(r);
}

TEST(checker, a_dovetail_cutters_neck_in_material_is_an_error_at_its_line) {
  // T4's flutes are 7 mm long: with its tip 8 mm down in the uncut right
  // shoulder its neck (9 mm across) runs through the top 1 mm of stock.
  // That is a body_collision (coverage: it was found before issue 12 too),
  // besides the slotting.
  const std::string text =
      "G21 G90 G17\nT4 M6\nS800 M3\nG0 X32 Y-20 Z5\nG1 Z-8 F100\n"
      "G1 Y180\nG0 Z5\nM30\n";
  const CheckReport r = check_text(text, sharp_cutter_job());
  const Finding* neck = first_of(r, FindingKind::BodyCollision);
  ASSERT_NE(neck, nullptr) << describe(r);
  EXPECT_EQ(neck->line, 6);
  EXPECT_EQ(neck->severity, Severity::Error);
  EXPECT_EQ(neck->part, BodyPart::Neck);
  EXPECT_EQ(neck->tool, 4);
  EXPECT_NE(finding_text(*neck, r).find("the neck of T4"), std::string::npos)
      << finding_text(*neck, r);
  ASSERT_NE(first_of(r, FindingKind::CutterOverload), nullptr) << describe(r);
  EXPECT_EQ(first_of(r, FindingKind::CutterOverload)->line, 6);
}

// Issue 12, item 10: a gouge reports the largest distance of the material
// cut from the finished part, measured from the part's outline.
TEST(checker, a_gouge_reports_its_true_largest_depth_into_the_part) {
  Job job = sharp_cutter_job();
  // A band about the nominal, so the target (the band's middle) is the
  // nominal section the figures below are worked from.
  job.dovetail.tolerance = {-0.01, 0.01};
  {
    // The 12 mm end mill along the tongue's middle, tip 3 mm below its top
    // face: a slot 12 wide and 3 deep. Its floor (|x| <= 6, z = -3) lies 3 mm
    // below the top face and further from the flanks (x = +-(20 + z): at the
    // floor's corner (6, -3), |6 + 3 - 20| / sqrt 2 = 7.8 mm): 3 mm deep,
    // deepest at x = 0, z = -3.
    const CheckReport r = check_text(
        "G21 G90 G17\nT3 M6\nS2500 M3\nG0 X0 Y-20 Z5\nG1 Z-3 F500\nG1 Y180\nG0 Z5\nM30\n", job);
    const Finding* f = first_of(r, FindingKind::Gouge);
    ASSERT_NE(f, nullptr) << describe(r);
    EXPECT_EQ(f->line, 6);
    EXPECT_NEAR(f->amount, 3.0, 1e-3);
    ASSERT_TRUE(f->at);
    EXPECT_NEAR(f->at->x, 0, 1e-3);
    EXPECT_NEAR(f->at->z, -3, 1e-3);
    EXPECT_NE(finding_text(*f, r).find("3.000 mm deep into the finished part, allowed 0.010 mm; "
                                       "deepest near x = 0.000 mm, z = -3.000 mm"),
              std::string::npos)
        << finding_text(*f, r);
  }
  {
    // The shoulder cleared by T3 to x = 20.25, then T4 at its finishing
    // depth with its axis 1 mm inside the finish axis 26.5: the cone's edge
    // (x = 13 + h at h above the tip, z = -6 + h) runs 1 mm laterally inside
    // the right flank (x = 14 + h), 1 mm x sin 45 deg = 0.7071 mm square to
    // it. Deepest is the tip corner (13, -6): the flank's foot from there
    // falls below the flank, whose root corner (14, -6) is the nearest
    // point of the part's outline, 1 mm away (the other points of the edge
    // are sqrt((1 - h)^2 + h^2) < 1 from it and 0.7071 from the flank).
    std::string text = "G21 G90 G17\nT3 M6\nS2500 M3\n";
    for (const double x : {26.25, 32.25, 38.25, 44.25})
      text += fmt::format("G0 X{} Y-20 Z5\nG1 Z-6 F500\nG1 Y180\nG0 Z5\n", x);
    text += "T4 M6\nS800 M3\nG0 X25.5 Y-20 Z5\nG1 Z-6 F100\nG1 Y180\nG0 Z5\nM30\n";
    const CheckReport r = check_text(text, job);
    const Finding* f = first_of(r, FindingKind::Gouge);
    ASSERT_NE(f, nullptr) << describe(r);
    EXPECT_EQ(f->line, 24);
    EXPECT_NEAR(f->amount, 1.0, 1e-3);
    EXPECT_NE(finding_text(*f, r).find("1.000 mm deep into the finished part, allowed 0.010 mm; "
                                       "deepest near x = 13.000 mm, z = -6.000 mm"),
              std::string::npos)
        << finding_text(*f, r);
  }
}

TEST(checker, reading_out_of_tolerance_when_the_program_cuts_a_wider_tongue) {
  // The plan for a tongue 0.1 mm wider, checked against the job: each flank
  // keeps 0.05 mm of stock, the reading is 0.1 mm over (male: -0.02..0 mm).
  const Job job = sample("stop-block-male.toml");
  Job wider = job;
  wider.dovetail.width += 0.1;
  const CheckReport r = check_text(program_from_plan(plan(wider)), job);
  ASSERT_FALSE(r.stations.empty());
  for (const StationResult& s : r.stations) {
    ASSERT_TRUE(s.measured.reading);
    EXPECT_NEAR(s.measured.reading->value - s.target_reading.value, 0.1, 0.001);
    EXPECT_FALSE(s.reading_in_tolerance);
  }
  EXPECT_EQ(r.count(FindingKind::ReadingOutOfTolerance), 5) << describe(r);
  // The band is the width tolerance's, 0.02 mm, with the target at its
  // middle; the reading lies above it.
  const Finding* f = first_of(r, FindingKind::ReadingOutOfTolerance);
  ASSERT_NE(f, nullptr);
  EXPECT_FALSE(f->problem);
  EXPECT_NEAR(f->band_high - f->band_low, 0.02, 1e-9);
  EXPECT_NEAR((f->band_low + f->band_high) / 2, f->limit, 1e-9);
  EXPECT_GT(f->amount, f->band_high);
  EXPECT_EQ(r.count(FindingKind::StockLeft), 5) << describe(r);
  EXPECT_EQ(r.count(FindingKind::Gouge), 0) << describe(r);
}

TEST(checker, keeps_only_the_first_findings_of_a_kind_and_counts_the_rest) {
  const Job job = bad_program_job();
  std::string text = "G21 G90 G17\nT3 M6\nS2500 M3\n";
  for (int i = 0; i < 50; ++i) text += fmt::format("G0 X{} Y80 Z1\nG0 Z20\n", -30 + i);
  text += "M30\n";
  StringProgramSource source(text, "many.ngc");
  const CheckReport r = check(source, job, {.stations = 3, .findings_per_kind = 4});
  EXPECT_EQ(r.count(FindingKind::RapidBelowSafeHeight), 50);
  long kept = 0;
  for (const Finding& f : r.findings) kept += f.kind == FindingKind::RapidBelowSafeHeight;
  EXPECT_EQ(kept, 4);
}

TEST(checker, stations_sit_inside_the_ends_and_evenly_between) {
  const Job job = sample("stop-block-male.toml");  // 160 mm long, open ends
  const auto ys = station_positions(job, 5);
  ASSERT_EQ(ys.size(), 5u);
  EXPECT_DOUBLE_EQ(ys.front(), 1.0);
  EXPECT_DOUBLE_EQ(ys.back(), 159.0);
  EXPECT_DOUBLE_EQ(ys[2], 80.0);
  EXPECT_EQ(station_positions(job, 1), std::vector<double>{80.0});
  StringProgramSource source("M30\n", "x.ngc");
  testing::expect_input_error([&] { check(source, job, {.stations = 0}); }, {"stations"});
}

// A slanted pass of the 12 mm end mill, 3 mm deep, from (x0, -20) to
// (x1, 180), written as `pieces` straight moves end to end, with the joint
// between the first two moves `kink` mm deeper than the line.
std::string slanted_pass(double x0, double x1, int pieces, double kink = 0) {
  std::string text = "G21 G90 G17\nT3 M6\nS2500 M3\n";
  text += fmt::format("G0 X{:.5f} Y-20 Z5\nG1 Z-3 F500\n", x0);
  for (int i = 1; i <= pieces; ++i) {
    const double t = static_cast<double>(i) / pieces;
    text += fmt::format("G1 X{:.5f} Y{:.5f} Z{:.5f}\n", x0 + t * (x1 - x0), -20 + 200 * t,
                        i == 1 ? -3 - kink : -3.0);
  }
  return text + "G0 Z5\nM30\n";
}

double material_area(const StationResult& s) { return SectionRegion::from_rings(s.section).area(); }

TEST(checker, a_pass_split_into_moves_on_one_line_cuts_what_the_whole_line_cuts) {
  // The union of the sweeps of moves end to end on one line is the sweep of
  // the line (Minkowski sum of a convex body with a segment; convex
  // geometry, no source needed): the split pass leaves the same section at
  // every station, to the grid. A joint 0.2 mm below the line is a
  // different path. At y = 1 the first move's end (at y = 0, 0.2 mm deep
  // below the pass; its chord at 1 mm off the axis is 2 sqrt(36 - 1) wide)
  // and the second move (0.19 mm below it there, 12 mm wide) cut
  // 0.2 * 2 sqrt(35) + 0.19 * (12 - 2 sqrt(35)) = 2.398 mm^2 more.
  const Job job = bad_program_job();
  const CheckReport whole = check_text(slanted_pass(30, 32, 1), job);
  const CheckReport split = check_text(slanted_pass(30, 32, 10), job);
  const CheckReport kinked = check_text(slanted_pass(30, 32, 10, 0.2), job);
  ASSERT_EQ(whole.stations.size(), split.stations.size());
  for (std::size_t i = 0; i < whole.stations.size(); ++i) {
    SCOPED_TRACE(i);
    EXPECT_NEAR(material_area(split.stations[i]), material_area(whole.stations[i]), 1e-6);
  }
  const double chord = 2 * std::sqrt(35.0);
  EXPECT_NEAR(material_area(whole.stations[0]) - material_area(kinked.stations[0]),
              0.2 * chord + 0.19 * (12 - chord), 0.005);
  // The first station (y = 1) sits on the first move, 20 mm long from
  // y = -20: its sweep is 12 mm wide at z = -3, taken from the 25 mm
  // shoulder (x 20 to 45): 3 * 12 = 36 mm^2 less than the stock's 2250.
  EXPECT_NEAR(material_area(whole.stations.front()), 90 * 25 - 36, 0.01);
}

TEST(checker, a_slanted_pass_cuts_the_ellipse_width_of_its_end_mill) {
  // A plane across a cylinder of radius R whose axis runs at slope s to the
  // plane's normal cuts an ellipse with semi-axes R and R sqrt(1 + s^2)
  // (plane section of a circular cylinder, analytic geometry). The end mill
  // sweeps that cylinder's side as it moves at slope s = 14/200 = 0.07 in x
  // per y, so a flat 3 mm deep cut 12 sqrt(1 + s^2) wide = 36.088 mm^2 is
  // taken from the shoulder at every station the pass crosses (all five,
  // each more than R from its ends).
  const Job job = bad_program_job();
  const CheckReport r = check_text(slanted_pass(26, 40, 1), job);
  for (const StationResult& st : r.stations)
    EXPECT_NEAR(90 * 25 - material_area(st), 36 * std::sqrt(1 + 0.07 * 0.07), 1e-3) << st.y;
}

TEST(checker, a_gouge_by_a_split_slanted_pass_names_the_move_at_each_station) {
  // The pass runs over the middle of the tongue; its moves start on line 6,
  // each 20 mm of y, so the stations at y = 1, 40.5, 80, 119.5 and 159 lie
  // on the moves of lines 7, 9, 10 (y = 80 is its end, where line 11
  // starts: the first move to reach a station names it), 12 and 14.
  const Job job = bad_program_job();
  const CheckReport r = check_text(slanted_pass(-2, 2, 10), job);
  std::vector<int> lines;
  for (const Finding& f : r.findings)
    if (f.kind == FindingKind::Gouge) lines.push_back(f.line);
  EXPECT_EQ(lines, (std::vector<int>{7, 9, 10, 12, 14})) << describe(r);
}

// --- programs written elsewhere: frames, work offsets, G92, G10, G28, G53 ---
//
// tests/programs/frame-*.ngc are one hand-written program for the
// stop-block rail, line for line the same moves, written in six frames (the
// five others turned out of frame-job.ngc once by the rules below, outside
// the project's code, and reviewed by eye). The
// meaning of each word, read from The NIST RS274NGC Interpreter, Version 3
// (Kramer, Proctor, Messina, NISTIR 6556, 2000):
//  - G54 (section on coordinate systems): the first of nine work systems,
//    its origin in parameters #5221-#5223 (from memory), X Y Z measured from
//    it; machine = work + origin.
//  - G55, G56 (same section): systems 2 and 3, origins at #5241.. and #5261..
//    (#5221 + 20 (n - 1), from memory).
//  - G92 (section on G92): the current point gets the given coordinates by
//    an offset added to every system, kept in #5211-#5213 (from memory).
//  - G10 L2 P2 (section on G10): system 2's origin set to the axis words, in
//    machine coordinates. G10 L20 P3: a later extension to RS274NGC (from
//    memory): system 3's origin set so the current point has the given
//    coordinates.
//  - G28 (section on G28/G30): rapid to the intermediate point (G91 G28 Z0:
//    the current point), then to the home position of #5161-#5163, machine
//    coordinates, all axes.
//  - G53 (section on G53): this block only, the axis words are machine
//    coordinates.
//  - G17 G2 (section on arcs): clockwise seen from +Z; G18 G2 clockwise seen
//    from +Y, G19 G2 from +X (the plane's normal).
// The frames, and what the checker is told about each (job units, mm):
//  - job: zero at the job's own zero; nothing to say.
//  - corner, g92, g10-l2, g10-l20: G54 at the front-left top corner of the
//    stock (job x = -45), G54 origin at machine (-400, -200, -300), G28 home
//    at machine zero, which is job (355, 200, 300).
//  - slide-x: G54 at the front-right top corner (job x = 45), the slide along
//    the program's +X (program Y runs from the right face leftward), G54
//    origin at machine (-500, -250, -280), G28 home at machine (-300, -560,
//    20): the same job point (355, 200, 300).
struct FrameCase {
  const char* file;
  ProgramSetup setup;
};

std::vector<FrameCase> frame_cases() {
  ProgramSetup corner{.zero = {-45, 0, 0}};
  corner.offsets[0] = Point3{-400, -200, -300};
  corner.g28_home = Point3{0, 0, 0};
  ProgramSetup slide_x{.zero = {45, 0, 0}, .slide = SlideAxis::PlusX};
  slide_x.offsets[0] = Point3{-500, -250, -280};
  slide_x.g28_home = Point3{-300, -560, 20};
  return {{"frame-corner.ngc", corner},
          {"frame-slide-x.ngc", slide_x},
          {"frame-g92.ngc", corner},
          {"frame-g10-l2.ngc", corner},
          {"frame-g10-l20.ngc", corner}};
}

CheckReport check_frame_program(const std::string& file, const ProgramSetup& setup) {
  Job job = sample("stop-block-male.toml");
  job.program = setup;
  StringProgramSource source(read_source_file("tests/programs/" + file), file);
  return check(source, job);
}

TEST(checker, a_hand_written_program_reads_the_same_in_every_frame) {
  const CheckReport reference = check_frame_program("frame-job.ngc", {});
  // The reference itself: the G18 G2 ramp of line 40 dips 2 mm into the
  // shelf at the station y = 80 (the finding's figure is the gouge's mean
  // thickness, 2 area / perimeter, under the 2 mm at its deepest) (clockwise seen from +Y runs
  // through the low side, NISTIR 6556 section on arcs); the low rapids of lines 14, 18, 29 and 33
  // cross the stock 3 mm under the 5 mm safe height.
  bool ramp = false;
  for (const Finding& f : reference.findings)
    ramp = ramp || (f.kind == FindingKind::Gouge && f.line == 40 && f.station_y &&
                    std::fabs(*f.station_y - 80) < 1e-9 && f.amount > 1 && f.amount < 2.01);
  EXPECT_TRUE(ramp) << describe(reference);
  EXPECT_EQ(reference.count(FindingKind::RapidBelowSafeHeight), 4) << describe(reference);
  EXPECT_EQ(reference.count(FindingKind::HomeNotGiven), 0);
  ASSERT_EQ(reference.stations.size(), 5u);
  for (const FrameCase& c : frame_cases()) {
    SCOPED_TRACE(c.file);
    const CheckReport r = check_frame_program(c.file, c.setup);
    ASSERT_EQ(r.findings.size(), reference.findings.size()) << describe(r);
    for (std::size_t i = 0; i < r.findings.size(); ++i) {
      const Finding& a = r.findings[i];
      const Finding& b = reference.findings[i];
      EXPECT_EQ(a.kind, b.kind) << i;
      EXPECT_EQ(a.severity, b.severity) << i;
      EXPECT_EQ(a.line, b.line) << i;
      EXPECT_EQ(a.station_y.has_value(), b.station_y.has_value()) << i;
      if (a.station_y && b.station_y) {
        EXPECT_NEAR(*a.station_y, *b.station_y, 1e-9);
      }
      EXPECT_NEAR(a.amount, b.amount, 1e-6) << i;
      EXPECT_EQ(finding_text(a, r), finding_text(b, reference)) << i;
    }
    EXPECT_EQ(r.counts, reference.counts);
    ASSERT_EQ(r.stations.size(), reference.stations.size());
    for (std::size_t i = 0; i < r.stations.size(); ++i) {
      SCOPED_TRACE(i);
      const auto& a = r.stations[i].measured;
      const auto& b = reference.stations[i].measured;
      ASSERT_EQ(a.reading.has_value(), b.reading.has_value());
      if (a.reading) {
        EXPECT_NEAR(a.reading->value, b.reading->value, 1e-6);
      }
      EXPECT_NEAR(a.width_bottom, b.width_bottom, 1e-6);
      EXPECT_NEAR(a.depth, b.depth, 1e-6);
      EXPECT_NEAR(material_area(r.stations[i]), material_area(reference.stations[i]), 1e-4);
    }
  }
}

TEST(checker, the_job_files_program_table_sets_the_frame) {
  // The corner frame given in the job file rather than in code: the same
  // findings as the job-frame program.
  const std::string text = read_source_file("samples/stop-block-male.toml") +
                           "\n[program]\nzero = [-45, 0, 0]\ng28 = [0, 0, 0]\n"
                           "[program.offsets]\ng54 = [-400, -200, -300]\n";
  const Job job = read_job(text, "corner.toml");
  StringProgramSource source(read_source_file("tests/programs/frame-corner.ngc"), "corner.ngc");
  const CheckReport r = check(source, job);
  const CheckReport reference = check_frame_program("frame-job.ngc", {});
  EXPECT_EQ(r.counts, reference.counts) << describe(r);
  ASSERT_EQ(r.findings.size(), reference.findings.size());
  for (std::size_t i = 0; i < r.findings.size(); ++i)
    EXPECT_EQ(finding_text(r.findings[i], r), finding_text(reference.findings[i], reference));
}

TEST(checker, a_wrong_frame_shows_as_different_findings) {
  // The corner program checked as if it were in the job's frame cuts 45 mm
  // to the right: the test above would see it.
  const CheckReport reference = check_frame_program("frame-job.ngc", {});
  const CheckReport wrong = check_frame_program("frame-corner.ngc", {});
  EXPECT_NE(wrong.counts, reference.counts) << describe(wrong);
}

TEST(checker, g28_with_no_home_given_rises_straight_up_and_says_so) {
  // G91 G28 Z0 at 3 mm deep, in front of the stock: without a home position
  // the return goes straight up (a warning says so), not to work zero
  // through the front face.
  const Job job = sample("stop-block-male.toml");
  const CheckReport r = check_text(
      "G21 G90 G17\nT3 M6\nS2500 M3\nG0 X0 Y-20 Z5\nG1 Z-3 F500\nG91 G28 Z0\nG90\nM30\n", job);
  EXPECT_EQ(r.count(FindingKind::HomeNotGiven), 1) << describe(r);
  EXPECT_EQ(r.count(FindingKind::RapidThroughMaterial), 0) << describe(r);
  EXPECT_EQ(r.count(FindingKind::Gouge), 0) << describe(r);
  ASSERT_FALSE(r.findings.empty());
  bool warned = false;
  for (const Finding& f : r.findings)
    warned = warned || (f.kind == FindingKind::HomeNotGiven && f.line == 6 &&
                        f.severity == Severity::Warning && f.home_return == 28);
  EXPECT_TRUE(warned) << describe(r);
  const CheckReport g30 = check_text(
      "G21 G90 G17\nT3 M6\nS2500 M3\nG0 X0 Y-20 Z5\nG1 Z-3 F500\nG91 G30 Z0\nG90\nM30\n", job);
  const Finding* home = first_of(g30, FindingKind::HomeNotGiven);
  ASSERT_NE(home, nullptr) << describe(g30);
  EXPECT_EQ(home->home_return, 30);
}

TEST(checker, a_length_offset_for_a_tool_not_in_the_job_is_a_finding_and_the_run_goes_on) {
  // G43 H7 (NISTIR 6556, section on tool length offsets: H names the tool
  // table entry) for a T7 the job does not list: unknown_tool at its line,
  // and T3's gouge three lines later is still found.
  const Job job = sample("stop-block-male.toml");
  const CheckReport r = check_text(
      "G21 G90 G17\nT3 M6\nS2500 M3\nG43 H7\nG0 X0 Y-20 Z5\nG1 Z-3 F500\nG1 Y180\nM30\n", job);
  bool unknown = false, gouge = false;
  for (const Finding& f : r.findings) {
    unknown =
        unknown || (f.kind == FindingKind::UnknownTool && f.line == 4 &&
                    f.severity == Severity::Error && f.tool == 7 && f.named_by == ToolWord::H);
    gouge = gouge || (f.kind == FindingKind::Gouge && f.line == 7);
  }
  EXPECT_TRUE(unknown) << describe(r);
  EXPECT_TRUE(gouge) << describe(r);
}

TEST(checker, a_drill_and_a_chamfer_mill_cut_their_cones) {
  // A 10 mm drill with a 118 deg point, 4 mm into the right shoulder (x =
  // 35, clear of the tongue) at the station y = 80: it takes a 10 mm wide
  // hole of 4 - 3.0043 = 0.9957 mm at full width and the point's triangle
  // below (r / tan 59 deg = 3.0043 mm tall; right-triangle trigonometry):
  // 10 * 0.9957 + 5 * 3.0043 = 24.979 mm^2 from the section.
  Job job = sample("stop-block-male.toml");
  Tool drill;
  drill.number = 7;
  drill.kind = ToolKind::Drill;
  drill.diameter = 10;
  drill.flutes = 2;
  drill.flute_length = 40;
  job.tools.push_back(drill);
  const CheckReport r =
      check_text("G21 G90 G17\nT7 M6\nS1000 M3\nG0 X35 Y80 Z5\nG1 Z-4 F100\nG0 Z5\nM30\n", job, 5);
  const double point = 5 / std::tan(radians(59));
  EXPECT_NEAR(90 * 25 - material_area(r.stations[2]), 10 * (4 - point) + 5 * point, 0.01)
      << describe(r);
  EXPECT_EQ(r.count(FindingKind::UnknownTool), 0);
  // A 90 deg chamfer mill, 12 mm across with a 2 mm tip, 3 mm down at the
  // same place: a trapezoid 2 mm wide at the bottom, 8 mm at the top face,
  // 3 mm tall: 15 mm^2.
  Tool chamfer;
  chamfer.number = 8;
  chamfer.kind = ToolKind::ChamferMill;
  chamfer.diameter = 12;
  chamfer.flutes = 4;
  chamfer.flute_length = 8;
  chamfer.angle = 90;
  chamfer.tip_diameter = 2;
  job.tools.push_back(chamfer);
  const CheckReport c =
      check_text("G21 G90 G17\nT8 M6\nS1000 M3\nG0 X35 Y80 Z5\nG1 Z-3 F100\nG0 Z5\nM30\n", job, 5);
  EXPECT_NEAR(90 * 25 - material_area(c.stations[2]), (2 + 8) / 2.0 * 3, 0.01) << describe(c);
}

TEST(checker, the_report_lists_errors_first_and_collapses_repeated_findings) {
  const CheckReport r = check_frame_program("frame-job.ngc", {});
  const std::string text = describe(r);
  // Four low rapids, one line with their count and lines.
  EXPECT_NE(text.find("  lines 14-33 warning rapid_below_safe_height, 4 times\n"),
            std::string::npos)
      << text;
  bool grouped = false;
  for (const FindingGroup& g : group_findings(r.findings))
    grouped = grouped || (g.kind == FindingKind::RapidBelowSafeHeight && g.count == 4 &&
                          g.lines == std::vector<int>{14, 18, 29, 33});
  EXPECT_TRUE(grouped);
  const auto findings = text.find("Findings");
  const auto readings = text.find("Readings");
  const std::string block = text.substr(findings, readings - findings);
  const auto last_error = block.rfind(" error ");
  const auto first_warning = block.find(" warning ");
  ASSERT_NE(last_error, std::string::npos);
  ASSERT_NE(first_warning, std::string::npos);
  EXPECT_LT(last_error, first_warning) << block;
  std::size_t start = 0;
  while (start < text.size()) {
    const auto end = text.find('\n', start);
    EXPECT_LE(end - start, 80u) << text.substr(start, end - start);
    start = end + 1;
  }
  // The groups in JSON keep the count; every finding is still listed.
  const std::string json = check_json(r);
  EXPECT_NE(json.find("\"finding_groups\""), std::string::npos);
}

// Issue 12, item 14: a program saved with a UTF-8 byte-order mark and CRLF
// line ends (or old Mac CR ends, or a lone CR at the end) is the same
// program: the same findings at the same lines, the same readings.
std::string with_line_ends(const std::string& text, const std::string& end, bool bom) {
  std::string out = bom ? "\xEF\xBB\xBF" : "";
  for (char ch : text) out += ch == '\n' ? end : std::string(1, ch);
  return out;
}

TEST(checker, a_byte_order_mark_and_crlf_line_ends_check_the_same_program) {
  const Job job = sample("stop-block-male.toml");
  const std::string clean = read_source_file("tests/programs/stop-block-male.ngc");
  const std::string gouge = read_source_file("tests/programs/gouge-male.ngc");
  for (const std::string* program : {&clean, &gouge}) {
    const CheckReport lf = check_text(*program, job);
    for (const auto& [end, bom] : std::vector<std::pair<std::string, bool>>{
             {"\r\n", false}, {"\r\n", true}, {"\n", true}, {"\r", true}}) {
      SCOPED_TRACE(::testing::PrintToString(end) + (bom ? " with BOM" : ""));
      const CheckReport other = check_text(with_line_ends(*program, end, bom), job);
      EXPECT_EQ(other, lf) << describe(other);
    }
  }
  // The gouge stays at line 8 of gouge-male.ngc, behind the BOM too.
  const CheckReport r = check_text(with_line_ends(gouge, "\r\n", true), job);
  ASSERT_NE(first_of(r, FindingKind::Gouge), nullptr);
  EXPECT_EQ(first_of(r, FindingKind::Gouge)->line, 8);
  // A reader error on the first line counts its columns after the BOM.
  StringProgramSource source("\xEF\xBB\xBFG21 Q1\r\n", "bom.ngc");
  testing::expect_input_error([&] { check(source, job); }, {"bom.ngc:1:5"});
}

TEST(checker, reader_errors_name_the_program_and_line) {
  const Job job = sample("stop-block-male.toml");
  StringProgramSource source("G21\nG1 X1 Q\n", "broken.ngc");
  testing::expect_input_error([&] { check(source, job); }, {"broken.ngc", "2"});
}

// The planner refuses exactly the jobs whose cutter body the checker finds
// touching: over random jobs (tests/random_jobs.hpp: levels, body data
// given, in part or left out, shanks that may be too thick), a plan it
// accepts has no body_collision, and for a job it refuses for the neck,
// shank or holder, the same plan cut with a slim body (the finishing
// positions do not depend on the body) does collide when checked against
// the real one.
TEST(checker, planner_refuses_exactly_the_jobs_whose_cutter_body_the_checker_finds_touching) {
  std::mt19937_64 rng(20261203);
  int accepted = 0, refused = 0;
  const int cases = testing::random_cases(300);
  for (int i = 0; i < cases; ++i) {
    SCOPED_TRACE(i);
    Job job = testing::random_job(rng);
    // Most of those cut in levels get a short stickout and a stout shank,
    // often too stout for the slot (only there can the body reach down).
    Tool& cutter = job.tools[1];
    if (cutter.flute_length < job.dovetail.depth && i % 4 != 0) {
      cutter.stickout = cutter.flute_length + cutter.diameter * 0.03 * (i % 10);
      cutter.shank_diameter = cutter.diameter * (0.4 + 0.012 * (i % 50));
      if (i % 3 == 0) cutter.holder_diameter = 2.5 * *cutter.shank_diameter;
    }
    try {
      const Plan p = plan(job);
      ++accepted;
      const CheckReport r = check_text(program_from_plan(p), job, 3);
      EXPECT_EQ(r.count(FindingKind::BodyCollision), 0) << describe(r);
    } catch (const InputError& e) {
      const bool body =
          e.field() == "tool[T2]" && e.message().find("the cutting cone") == std::string::npos;
      if (!body) continue;
      ++refused;
      Job slim = job;
      Tool& slim_cutter = slim.tools[1];
      slim_cutter.shank_diameter = slim_cutter.neck_diameter;
      slim_cutter.holder_diameter.reset();
      const Plan p = plan(slim);
      const CheckReport r = check_text(program_from_plan(p), job, 3);
      EXPECT_GT(r.count(FindingKind::BodyCollision), 0) << e.message() << "\n" << describe(r);
    }
  }
  EXPECT_GT(accepted, 0);
  // 21 of the usual 300 are refused for the body (fewer in the sanitizer's
  // tenth of the cases).
  EXPECT_GT(refused, cases >= 300 ? 10 : -1);
}

}  // namespace
}  // namespace dovetailor

namespace dovetailor {
namespace {

TEST(checker, refuses_a_program_longer_than_the_line_limit) {
  const Job job = read_job(testing::read_source_file("samples/stop-block-male.toml"), "job.toml");
  std::string program = "G21 G90\n";
  for (int i = 0; i < 200; ++i) program += "G0 X0 Y-50 Z10\n";
  StringProgramSource source(program, "long.ngc");
  testing::expect_input_error([&] { check(source, job, {.stations = 1, .max_lines = 100}); },
                              {"long.ngc:101", "program length", "longer than 100 lines"});
}

}  // namespace
}  // namespace dovetailor
