// The job file `dovetailor new` writes: for each type and unit it reads back
// through the strict job reader, plans, and its program checks clean through
// every shipped post; every key carries a comment; the pair fits.

#include <sstream>
#include <string>
#include <utility>

#include <gtest/gtest.h>

#include <dovetailor/check/checker.hpp>
#include <dovetailor/gcode/gcode_writer.hpp>
#include <dovetailor/geometry/dovetail_section.hpp>
#include <dovetailor/geometry/fit.hpp>
#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/input/job_template.hpp>
#include <dovetailor/plan/planner.hpp>
#include <dovetailor/report/check_report.hpp>
#include <dovetailor/report/plan_note_text.hpp>

#include "test_support.hpp"

namespace dovetailor {
namespace {

using testing::read_source_file;

// Reads the template back and plans it without a warning; the program
// written through each shipped post must check clean (the project's rule for
// whatever it writes), at the post's own decimals: the plan aims at the
// middle of the tolerance band, so the post's rounding stays inside it.
void expect_reads_back_and_plans(DovetailType type, Units units) {
  const std::string text = job_template(type, units);
  const Job job = read_job(text, "new.toml");
  EXPECT_EQ(job.dovetail.type, type);
  EXPECT_EQ(job.units, units);
  const Plan p = plan(job);
  EXPECT_FALSE(p.checkpoints.empty());
  // A start free of warnings: the example's cutter bends less than a quarter
  // of the tolerance on the finishing pass.
  EXPECT_TRUE(p.warnings.empty()) << warning_texts(p).front();
  for (const char* name : {"rs274ngc-full", "small-control", "iso6983-numbered"}) {
    const std::string path = std::string("post/") + name + ".toml";
    const Post post = read_post(read_source_file(path), path);
    StringProgramSource source(write_program(p, post, {.date = "2000-01-01"}), "new.ngc");
    const CheckReport r = check(source, job, {.stations = 3});
    EXPECT_FALSE(r.has_errors()) << name << ":\n" << format_check_report(r);
  }
}

TEST(job_template, female_inch_reads_back_and_plans) {
  expect_reads_back_and_plans(DovetailType::Female, Units::Inch);
}
TEST(job_template, female_mm_reads_back_and_plans) {
  expect_reads_back_and_plans(DovetailType::Female, Units::Millimetre);
}
TEST(job_template, male_inch_reads_back_and_plans) {
  expect_reads_back_and_plans(DovetailType::Male, Units::Inch);
}
TEST(job_template, male_mm_reads_back_and_plans) {
  expect_reads_back_and_plans(DovetailType::Male, Units::Millimetre);
}

// Every line fits 80 columns, and every key has its comment on the line or
// on the comment line just above it (a long setting).
TEST(job_template, every_key_is_commented_and_lines_fit_80_columns) {
  for (auto type : {DovetailType::Female, DovetailType::Male})
    for (auto units : {Units::Inch, Units::Millimetre}) {
      std::istringstream in(job_template(type, units));
      std::string line, previous;
      int keys = 0;
      while (std::getline(in, line)) {
        EXPECT_LE(line.size(), 80u) << line;
        const bool is_key = !line.empty() && line[0] != '#' && line[0] != '[' &&
                            line.find(" = ") != std::string::npos;
        if (is_key) {
          ++keys;
          EXPECT_TRUE(line.find(" # ") != std::string::npos || previous.starts_with("#"))
              << "no comment for: " << line;
        }
        previous = line;
      }
      EXPECT_GE(keys, 25);
    }
}

// The two templates in one unit make a sliding pair: by the README's fit
// convention, lateral clearance = W_top(female) - W_bottom(male), here the
// files' own 1.2500 - 1.2485 in and 32.00 - 31.96 mm at the nominal. Each
// plan aims at the middle of its band, which adds the female's band middle
// and takes away the male's.
TEST(job_template, the_male_and_female_templates_fit_with_clearance) {
  for (auto [units, clearance] :
       {std::pair{Units::Inch, 0.0015 * 25.4}, {Units::Millimetre, 0.04}}) {
    const Plan female = plan(read_job(job_template(DovetailType::Female, units), "f.toml"));
    const Plan male = plan(read_job(job_template(DovetailType::Male, units), "m.toml"));
    const double aimed = clearance + band_middle(female.job.dovetail.tolerance) -
                         band_middle(male.job.dovetail.tolerance);
    EXPECT_GT(aimed, 0);
    EXPECT_NEAR(fit_of(female.target, male.target).lateral_clearance, aimed, 1e-9);
  }
}

TEST(job_template, female_inch_matches_its_golden_file) {
  testing::expect_golden("tests/golden/new/female-inch.toml",
                         job_template(DovetailType::Female, Units::Inch));
}

}  // namespace
}  // namespace dovetailor
