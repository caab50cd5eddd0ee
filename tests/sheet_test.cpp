#include <cmath>
#include <random>
#include <sstream>

#include <gtest/gtest.h>

#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/job/handwheel.hpp>
#include <dovetailor/plan/planner.hpp>
#include <dovetailor/report/sheet.hpp>
#include <dovetailor/report/sheet_text.hpp>

#include "feed_text.hpp"
#include "random_jobs.hpp"
#include "test_support.hpp"

namespace dovetailor {
namespace {

using testing::read_source_file;

const char* const manual_sample = "samples/height-stop-half-female.toml";

Plan plan_of(const std::string& sample) { return plan(read_job(read_source_file(sample), sample)); }

// The row of pass `number` in the sheet, with the columns it has.
struct Row {
  std::vector<SheetColumn> columns;
  std::vector<std::string> cells;

  std::string at(const std::string& heading) const {
    for (std::size_t c = 0; c < columns.size(); ++c)
      if (columns[c].heading == heading) return cells.at(c);
    ADD_FAILURE() << "no column " << heading;
    return "";
  }
};

Row pass_row(const Sheet& sheet, int number) {
  for (const auto& op : sheet.operations)
    for (const auto& row : op.rows)
      if (!row.checkpoint && row.cells.at(0) == std::to_string(number))
        return {op.columns, row.cells};
  ADD_FAILURE() << "no row for pass " << number;
  return {};
}

std::string fixed(double mm, int decimals = 4) {
  std::ostringstream s;
  s.setf(std::ios::fixed);
  s.precision(decimals);
  s << mm / 25.4;
  return s.str();
}

TEST(sheet, manual_sample_text_matches_golden) {
  const Sheet sheet = build_sheet(plan_of(manual_sample), {.date = "2024-05-01"});
  testing::expect_golden("tests/golden/sheet/height-stop-half-female.txt", sheet_text(sheet));
}

TEST(sheet, every_sample_fits_80_columns_in_ascii) {
  for (const char* sample :
       {"samples/height-stop-half-female.toml", "samples/fixture-slide-female.toml",
        "samples/fixture-slide-male.toml", "samples/stop-block-male.toml",
        "samples/spindle-slide-tapered-female.toml"}) {
    const std::string text = sheet_text(build_sheet(plan_of(sample), {.date = "today"}));
    std::istringstream lines(text);
    int number = 0;
    for (std::string line; std::getline(lines, line);) {
      ++number;
      EXPECT_LE(line.size(), 80u) << sample << " line " << number << ": " << line;
      for (char ch : line)
        EXPECT_TRUE(ch >= 32 && ch < 127) << sample << " line " << number << ": " << line;
    }
  }
}

// Hand-worked from the sample's [machine] block. X zero: the 0.200 in edge
// finder on the left face of 2.000 in stock centred on x = -0.125 in, so the
// axis stands at -1.125 - 0.100 = -1.225 in. Pass 3 runs at x = -0.0334 in
// (the slot's wall 0.00025 in further out than for the nominal width: the
// plan aims at the middle of the 0 to +0.001 in band): 1.1916 in from the
// zero = 1191.6 graduations of 0.001 in -> 1192 = 5 turns of 200 + 192. Pass 1's tip at z = -0.2450
// in, zeroed over a 0.002 in paper: 0.2470 in down = 247 graduations of 0.001 in (0.100 in / 100) =
// 2 turns + 47.
TEST(sheet, dial_settings_are_the_hand_worked_ones) {
  const Plan p = plan_of(manual_sample);
  ASSERT_TRUE(p.job.machine.manual.has_value());
  EXPECT_NEAR(x_dial_zero(p, *p.job.machine.manual), -1.225 * 25.4, 1e-9);
  const Sheet sheet = build_sheet(p, {});
  ASSERT_TRUE(sheet.has_dials);
  const Row third = pass_row(sheet, 3);
  EXPECT_EQ(third.at("X"), "-0.0334");
  // Pass 2 was at 0.1775 in (7+3): pass 3 lies behind it, so it is marked.
  EXPECT_EQ(third.at("X dial"), "5+192*");
  const Row first = pass_row(sheet, 1);
  EXPECT_EQ(first.at("Z"), "-0.2450");
  EXPECT_EQ(first.at("Z dial"), "2+47");
}

// The same cases straight through handwheel.hpp, so the sheet and the dial
// module agree: a 0.200 in / 200 dial (common practice) and a 5 mm / 250 dial.
TEST(sheet, dial_module_hand_worked_cases) {
  const Handwheel inch = common_dial(CommonDial::Inch200);
  EXPECT_EQ(dial_setting(inch, 1.1918 * 25.4).reading, (DialReading{5, 192}));
  EXPECT_EQ(dial_text(dial_setting(inch, 1.1918 * 25.4).reading), "5+192");
  // One graduation back past zero: turns -1, collar 199.
  EXPECT_EQ(dial_text(dial_setting(inch, -0.001 * 25.4).reading), "-1+199");
  // 12.34 mm on 0.02 mm graduations = 617 = 2 turns of 250 + 117.
  const Handwheel metric = common_dial(CommonDial::Metric5mm);
  EXPECT_EQ(dial_setting(metric, 12.34).reading, (DialReading{2, 117}));
  // Going back from 617 to 600 graduations with the approach rising: turn
  // back past 600 by 2 graduations of backlash (0.03 mm rounds up) plus a
  // quarter turn (63), then forward 65.
  Handwheel worn = metric;
  worn.backlash = 0.03;
  const DialMove back = dial_move(worn, 12.34, 12.0);
  ASSERT_TRUE(back.back_off.has_value());
  EXPECT_EQ(back.back_off->stop, (DialReading{2, 35}));
  EXPECT_EQ(back.approach.divisions, 65);
  EXPECT_EQ(back.approach.stop, (DialReading{2, 100}));
}

TEST(sheet, every_pass_setting_and_reading_of_the_plan_is_on_the_sheet) {
  for (const char* sample :
       {"samples/height-stop-half-female.toml", "samples/fixture-slide-female.toml"}) {
    const Plan p = plan_of(sample);
    const Sheet sheet = build_sheet(p, {});
    for (const Pass* pass : all_passes(p)) {
      const Row row = pass_row(sheet, pass->number);
      EXPECT_EQ(row.at("X").substr(0, fixed(pass->x).size()), fixed(pass->x)) << sample;
      EXPECT_EQ(row.at("Z"), fixed(pass->z)) << sample;
      EXPECT_EQ(row.at("Left"), fixed(pass->stock_left)) << sample;
    }
    std::size_t boxes = 0;
    for (const auto& op : sheet.operations)
      for (const auto& row : op.rows)
        if (row.checkpoint) {
          const auto& c = p.checkpoints.at(boxes++);
          std::string lines;
          for (const auto& l : row.checkpoint->lines) lines += l + "\n";
          EXPECT_NE(lines.find("expect " + fixed(c.expected.value) + " in"), std::string::npos)
              << lines;
          // The middle row of the correction table is the expected reading.
          EXPECT_EQ(row.checkpoint->corrections.rows.at(3).at(0), fixed(c.expected.value));
        }
    EXPECT_EQ(boxes, p.checkpoints.size()) << sample;
  }
}

// Issue 12, item 11: every feed on the sheet is a feed of the plan's
// passes. Each pass row gives its pass's feed; the set-up step of a tool
// and each operation's introduction state the lowest and highest roughing
// and finishing feeds of the passes they describe (the height-stop sample's
// set-up gave T1's slot feed only, though its square-wall pass runs faster).
void expect_sheet_feeds_of_the_plan(const Plan& p) {
  const Sheet sheet = build_sheet(p, {});
  for (const Pass* pass : all_passes(p)) {
    const Row row = pass_row(sheet, pass->number);
    const std::string feed = row.at("Feed");
    EXPECT_EQ(feed.substr(feed.find(' ') + 1), testing::feed_figure(pass->feed, p.job.units))
        << "pass " << pass->number;
  }
  for (const auto& tool : p.job.tools) {
    const auto passes = testing::tool_passes(p, tool.number);
    if (passes.empty()) continue;
    std::string step;
    for (const auto& item : sheet.setup.items)
      if (item.starts_with(fmt::format("T{} ", tool.number))) step = item;
    EXPECT_EQ(testing::stated_feeds(step), testing::expected_feeds(passes, p.job.units)) << step;
  }
  ASSERT_EQ(sheet.operations.size(), p.operations.size());
  for (std::size_t i = 0; i < p.operations.size(); ++i) {
    std::vector<const Pass*> passes;
    for (const auto& pass : p.operations[i].passes) passes.push_back(&pass);
    const std::string intro = sheet.operations[i].intro.front();
    EXPECT_EQ(testing::stated_feeds(intro), testing::expected_feeds(passes, p.job.units)) << intro;
  }
}

TEST(sheet, every_feed_on_the_sheet_is_the_plan_feed) {
  for (const char* sample :
       {"samples/height-stop-half-female.toml", "samples/fixture-slide-female.toml",
        "samples/fixture-slide-male.toml", "samples/stop-block-male.toml",
        "samples/spindle-slide-tapered-female.toml"}) {
    SCOPED_TRACE(sample);
    expect_sheet_feeds_of_the_plan(plan_of(sample));
  }
}

TEST(sheet, every_feed_on_the_sheet_is_the_plan_feed_for_random_jobs) {
  std::mt19937_64 rng(20261203);
  for (int i = 0; i < testing::random_cases(300); ++i) {
    const Job job = testing::random_job(rng);
    const std::optional<Plan> accepted = testing::plan_if_accepted(job);
    if (!accepted) continue;
    const Plan& p = *accepted;
    SCOPED_TRACE(i);
    expect_sheet_feeds_of_the_plan(p);
  }
}

// A tapered gib's checkpoint box says where its readings (and the table of
// corrections) hold and how the reading runs along the slide: 1:100 on a
// 60 deg flank, 1 / (100 sin 60) = 0.011547 mm per mm (see planner_test).
TEST(sheet, tapered_gib_checkpoint_box_says_where_the_reading_holds) {
  const Plan p = plan_of("samples/spindle-slide-tapered-female.toml");
  const Sheet sheet = build_sheet(p, {});
  std::size_t boxes = 0;
  for (const auto& op : sheet.operations)
    for (const auto& row : op.rows)
      if (row.checkpoint) {
        ++boxes;
        std::string lines;
        for (const auto& l : row.checkpoint->lines) lines += l + "\n";
        EXPECT_NE(lines.find("hold at the front end, y = 0.000"), std::string::npos) << lines;
        EXPECT_NE(lines.find("grows 0.011547 mm per mm of y"), std::string::npos) << lines;
        EXPECT_NE(lines.find("The table below is for the front end."), std::string::npos);
      }
  EXPECT_EQ(boxes, p.checkpoints.size());
}

// The correction rule of the plan (remaining = remaining + error * rate):
// one pin from the square side moves one for one with the flank, so a reading
// 0.002 in under the expected one at checkpoint A leaves 0.002 in more.
TEST(sheet, correction_table_follows_the_plan_rule) {
  const Plan p = plan_of(manual_sample);
  const Sheet sheet = build_sheet(p, {});
  const CheckpointBox* a = nullptr;
  for (const auto& op : sheet.operations)
    for (const auto& row : op.rows)
      if (row.checkpoint && !a) a = &*row.checkpoint;
  ASSERT_NE(a, nullptr);
  const auto& c = p.checkpoints.front();
  EXPECT_DOUBLE_EQ(std::abs(c.correction_per_reading), 1.0);
  const auto& row = a->corrections.rows.at(1);  // two steps under
  EXPECT_EQ(row.at(0), fixed(c.expected.value - 0.002 * 25.4));
  EXPECT_EQ(row.at(1), fixed(c.remaining_per_flank + 0.002 * 25.4));
  EXPECT_EQ(row.at(2), "move 0.0020 in into the flank");
  // Into the left flank of a female is -X; the X reading grows with +X.
  EXPECT_EQ(row.at(3), "L -2");
}

TEST(sheet, cnc_plan_prints_without_dials) {
  const Sheet sheet = build_sheet(plan_of("samples/fixture-slide-female.toml"), {});
  EXPECT_FALSE(sheet.has_dials);
  for (const auto& op : sheet.operations)
    for (const auto& c : op.columns) EXPECT_EQ(c.heading.find("dial"), std::string::npos);
  std::string cautions;
  for (const auto& item : sheet.cautions.items) cautions += item;
  EXPECT_NE(cautions.find("dry run"), std::string::npos);
}

TEST(sheet, wrap_words_keeps_every_word_within_width) {
  const auto lines = wrap_words("one two three four five six seven", 9);
  EXPECT_EQ(lines, (std::vector<std::string>{"one two", "three", "four five", "six seven"}));
  EXPECT_TRUE(wrap_words("", 10).empty());  // no words, no lines
  EXPECT_EQ(wrap_words("averyveryverylongword x", 5),
            (std::vector<std::string>{"averyveryverylongword", "x"}));
}

}  // namespace
}  // namespace dovetailor
