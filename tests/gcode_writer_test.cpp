#include <algorithm>
#include <cctype>
#include <cmath>
#include <random>
#include <sstream>
#include <stdexcept>
#include <vector>

#include <fmt/format.h>
#include <gtest/gtest.h>

#include <dovetailor/gcode/gcode_block.hpp>
#include <dovetailor/gcode/gcode_writer.hpp>
#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/plan/planner.hpp>
#include <dovetailor/report/plan_note_text.hpp>

#include "feed_text.hpp"
#include "random_jobs.hpp"
#include "test_support.hpp"

namespace dovetailor {
namespace {

using testing::expect_input_error;

const char* const samples[] = {"fixture-slide-female", "fixture-slide-male", "stop-block-male",
                               "height-stop-half-female", "spindle-slide-tapered-female"};
const char* const posts[] = {"rs274ngc-full", "small-control", "iso6983-numbered"};

Job sample(const std::string& name) {
  const std::string path = "samples/" + name + ".toml";
  return read_job(testing::read_source_file(path), path);
}

Post shipped(const std::string& name) {
  return read_post(testing::read_source_file("post/" + name + ".toml"), name + ".toml");
}

std::vector<std::string> lines_of(const std::string& text) {
  std::vector<std::string> out;
  std::istringstream in(text);
  for (std::string line; std::getline(in, line);) out.push_back(line);
  return out;
}

bool has_word(const std::string& line, const std::string& word) {
  const std::string words = line.substr(0, line.find('('));
  std::istringstream in(words);
  for (std::string w; in >> w;)
    if (w == word) return true;
  return false;
}

// The header's comments, joined into one text: every comment line before
// the modal set-up, without its line number and comment marks.
std::string header_text(const std::string& program) {
  std::string out;
  for (std::string line : lines_of(program)) {
    if (line.find("modal set-up") != std::string::npos) break;
    // Without its block number "N123 ".
    if (line.starts_with("N")) {
      std::size_t digits = 1;
      while (digits < line.size() && std::isdigit(static_cast<unsigned char>(line[digits])))
        ++digits;
      if (digits > 1 && digits < line.size() && line[digits] == ' ') line = line.substr(digits + 1);
    }
    if (line.starts_with("(") && line.ends_with(")"))
      line = line.substr(1, line.size() - 2);
    else if (line.starts_with("; "))
      line = line.substr(2);
    else
      continue;
    out += (out.empty() ? "" : " ") + line;
  }
  return out;
}

// One tool's entry in the header's tool list, up to the next entry.
std::string header_tool(const std::string& header, int number) {
  const auto at = header.find(fmt::format(" T{} ", number));
  if (at == std::string::npos) return {};
  const std::string rest = header.substr(at + 1);
  // The next " T<digits> ", " coolant:" or " no tool length" ends it.
  std::size_t end = std::string::npos;
  for (const char* word : {" coolant:", " no tool length"}) end = std::min(end, rest.find(word, 1));
  for (std::size_t t = rest.find(" T", 1); t != std::string::npos && t < end;
       t = rest.find(" T", t + 1)) {
    std::size_t d = t + 2;
    while (d < rest.size() && std::isdigit(static_cast<unsigned char>(rest[d]))) ++d;
    if (d > t + 2 && d < rest.size() && rest[d] == ' ') {
      end = t;
      break;
    }
  }
  return end == std::string::npos ? rest : rest.substr(0, end);
}

// Issue 12, item 11: the program shows the plan's warnings in its header,
// as comments within the post's line length that never nest (RS274NGC
// comments end at the first ')': NISTIR 6556, 3.3.4, from memory).
TEST(gcode_writer, header_carries_the_plan_warnings) {
  Plan p = plan(sample("spindle-slide-tapered-female"));
  ASSERT_FALSE(p.warnings.empty());  // the sample's 4000 rev/min spindle caps the end mill
  // A long one, to be wrapped on every post.
  p.warnings.push_back(FinishBendWarning{.pass = 99, .deflection = 0.0123, .limit = 0.005});
  for (const char* name : posts) {
    SCOPED_TRACE(name);
    const Post post = shipped(name);
    const std::string program = write_program(p, post, {});
    const std::string header = header_text(program);
    for (const auto& w : p.warnings) {
      std::string shown = warning_text(w, p.job.units);
      std::replace(shown.begin(), shown.end(), '(', '[');
      std::replace(shown.begin(), shown.end(), ')', ']');
      EXPECT_NE(header.find("WARNING: " + shown), std::string::npos) << header;
    }
    for (const auto& line : lines_of(program)) {
      EXPECT_LE(line.size(), static_cast<std::size_t>(post.max_line_length)) << line;
      EXPECT_LE(std::count(line.begin(), line.end(), '('), 1) << line;
      EXPECT_LE(std::count(line.begin(), line.end(), ')'), 1) << line;
    }
  }
}

// Issue 12, item 11: the F words of a program are the feeds of the plan's
// moves, in order, to the post's decimals, and the header's tool list gives
// the lowest and highest roughing and finishing feed of each tool's passes
// (for the height-stop sample it gave T1's slot feed alone).
void expect_program_feeds_of_the_plan(const Plan& p, const Post& post) {
  const std::string program = write_program(p, post, {});
  const Units units = program_units(post, p.job.units);
  std::vector<double> planned;
  for (const Pass* pass : all_passes(p))
    for (const auto& m : pass->moves())
      if (m.kind == MoveKind::Feed && (planned.empty() || std::abs(m.feed - planned.back()) > 1e-9))
        planned.push_back(m.feed);
  std::vector<double> written;
  for (const auto& line : lines_of(program)) {
    std::istringstream words(line.substr(0, line.find_first_of("(;")));
    for (std::string w; words >> w;)
      if (w.size() > 1 && w[0] == 'F') written.push_back(std::stod(w.substr(1)));
  }
  ASSERT_EQ(written.size(), planned.size());
  const double half_step = 0.5 * std::pow(10.0, -post.decimals.feed) + 1e-9;
  for (std::size_t i = 0; i < written.size(); ++i)
    EXPECT_NEAR(written[i], from_mm(planned[i], units), half_step) << "F word " << i + 1;
  const std::string header = header_text(program);
  if (units != p.job.units) return;  // the tool list is checked in the job's units
  for (const auto& op : p.operations) {
    const std::string entry = header_tool(header, op.tool);
    EXPECT_EQ(testing::stated_feeds(entry),
              testing::expected_feeds(testing::tool_passes(p, op.tool), units))
        << entry;
  }
}

TEST(gcode_writer, feeds_written_are_the_plan_feeds) {
  for (const char* name : samples)
    for (const char* post : posts) {
      SCOPED_TRACE(std::string(name) + " " + post);
      expect_program_feeds_of_the_plan(plan(sample(name)), shipped(post));
    }
}

TEST(gcode_writer, feeds_written_are_the_plan_feeds_for_random_jobs) {
  std::mt19937_64 rng(20261203);
  std::vector<Post> all;
  for (const char* post : posts) all.push_back(shipped(post));
  for (int i = 0; i < testing::random_cases(200); ++i) {
    const Job job = testing::random_job(rng);
    const std::optional<Plan> accepted = testing::plan_if_accepted(job);
    if (!accepted) continue;
    const Plan& p = *accepted;
    SCOPED_TRACE(i);
    for (const auto& post : all) expect_program_feeds_of_the_plan(p, post);
  }
}

// Issue 12, item 12: on a tapered gib every checkpoint stop says where its
// reading holds and how it runs along the slide (1:100 on 60 deg: 1 / (100
// sin 60) = 0.011547 mm per mm, worked in planner_test).
TEST(gcode_writer, tapered_gib_checkpoints_say_where_the_reading_holds) {
  const Plan p = plan(sample("spindle-slide-tapered-female"));
  const std::string program = write_program(p, shipped("rs274ngc-full"), {});
  std::string comments;
  for (const auto& line : lines_of(program))
    if (line.starts_with("(")) comments += line.substr(1, line.size() - 2) + " ";
  std::size_t found = 0;
  for (auto at = comments.find("these readings hold at the front end, y = 0.000 mm.");
       at != std::string::npos; at = comments.find("these readings hold", at + 1))
    ++found;
  EXPECT_EQ(found, p.checkpoints.size()) << comments;
  EXPECT_NE(comments.find("reading grows 0.011547 mm per mm of y"), std::string::npos);
}

TEST(gcode_writer, every_sample_for_every_post_matches_its_golden_program) {
  for (const char* name : samples)
    for (const char* post : posts) {
      SCOPED_TRACE(std::string(name) + " " + post);
      const std::string program =
          write_program(plan(sample(name)), shipped(post), {.date = "2000-01-01"});
      testing::expect_golden(std::string("tests/golden/gcode/") + name + "." + post + ".ngc",
                             program);
    }
  Post no_compensation = shipped("rs274ngc-full");
  no_compensation.cutter_compensation = false;
  testing::expect_golden(
      "tests/golden/gcode/fixture-slide-female.parameters.ngc",
      write_program(plan(sample("fixture-slide-female")), no_compensation, {.date = "2000-01-01"}));
}

// G41 keeps the tool left of the programmed path seen in the direction of
// travel, G42 right (NISTIR 6556, section 3.5.14, from memory). Checked here
// with the cross product: the tool lies on the side away from the flank; it
// is left of travel t when t x (tool - path) points up (+Z).
TEST(gcode_writer, compensation_side_follows_travel_and_the_material) {
  for (DovetailType type : {DovetailType::Female, DovetailType::Male})
    for (Side side : {Side::Left, Side::Right})
      for (double travel : {1.0, -1.0}) {
        // Female: the flank is outboard of the cutter; male: inboard.
        const bool outboard = type == DovetailType::Female;
        const double flank_dx = (side == Side::Right) == outboard ? 1.0 : -1.0;
        const double tool_dx = -flank_dx;
        const double cross_z = 0.0 * 0.0 - travel * tool_dx;  // (0, travel) x (tool_dx, 0)
        EXPECT_EQ(compensation_code(type, side, travel), cross_z > 0 ? 41 : 42);
      }
  // The case spelled out: a female right flank travelling +Y has the tool on
  // its left.
  EXPECT_EQ(compensation_code(DovetailType::Female, Side::Right, 1), 41);
  EXPECT_EQ(compensation_code(DovetailType::Male, Side::Right, 1), 42);
}

// The compensated path is where the cutter's large diameter meets the finished
// flank at the tip's height: the flank line of the section (dovetail_section).
TEST(gcode_writer, compensated_path_lies_on_the_finished_flank) {
  for (const char* name : {"fixture-slide-female", "fixture-slide-male", "stop-block-male"}) {
    SCOPED_TRACE(name);
    const Plan p = plan(sample(name));
    int checked = 0;
    for (const Pass* pass : all_passes(p)) {
      if (pass->role != PassRole::Finish || !pass->side) continue;
      const double path_x = pass->x + contour_offset(p, *pass);
      EXPECT_NEAR(path_x, flank_x_at(p.target.flank(*pass->side), pass->z), 1e-9);
      ++checked;
    }
    EXPECT_GT(checked, 0);
  }
}

// The compensated pass is written from the pass's parts (gcode_writer.hpp):
// its entry moves, each on the lead-in point of the flank line, then the
// cut with G41/G42 before it and G40 after, then its exit moves on the
// lead-out point. A stop added to the entry shows in the program there.
const Pass* first_compensated_finish(const Plan& p) {
  for (const auto& op : p.operations)
    if (op.kind == OperationKind::Undercut)
      for (const auto& pass : op.passes)
        if (pass.role == PassRole::Finish && pass.side) return &pass;
  return nullptr;
}

TEST(gcode_writer, compensated_pass_writes_its_lead_in_from_the_pass_entry) {
  Plan p = plan(sample("fixture-slide-female"));
  const Post post = shipped("rs274ngc-full");
  ASSERT_EQ(sizing_style(p, post), SizingStyle::CutterCompensation);
  Pass& pass = const_cast<Pass&>(*first_compensated_finish(p));
  Move halfway = pass.entry.front();
  halfway.to.z = (p.safe_z + pass.entry[1].to.z) / 2;
  pass.entry.insert(pass.entry.begin() + 1, halfway);
  const Units units = program_units(post, p.job.units);
  const auto lines = lines_of(write_program(p, post, {}));
  const std::string pass_comment = fmt::format("(pass {}: finish", pass.number);
  std::size_t at = 0;
  while (at < lines.size() && lines[at].find(pass_comment) == std::string::npos) ++at;
  while (at < lines.size() && lines[at].find("lead-in") == std::string::npos) ++at;
  ASSERT_LT(at + 4, lines.size());
  EXPECT_TRUE(has_word(lines[at + 1], "G0")) << lines[at + 1];
  EXPECT_TRUE(has_word(lines[at + 1], "Z" + format_length(halfway.to.z, post, units)))
      << lines[at + 1];
  // Then the rest of the entry (approach height, depth), then compensation on.
  EXPECT_TRUE(has_word(lines[at + 3], "G1")) << lines[at + 3];
  EXPECT_NE(lines[at + 4].find("compensation on"), std::string::npos) << lines[at + 4];
}

TEST(gcode_writer, a_compensated_pass_that_is_not_one_straight_cut_is_a_programming_error) {
  Plan p = plan(sample("fixture-slide-female"));
  const Post post = shipped("rs274ngc-full");
  Pass& pass = const_cast<Pass&>(*first_compensated_finish(p));
  // The cut in two pieces: the lead-in and lead-out are only defined for one.
  Move half = pass.cut.front();
  half.to.y = (pass.cut_start().y + half.to.y) / 2;
  half.to.x = pass.x_at(half.to.y);
  pass.cut.insert(pass.cut.begin(), half);
  EXPECT_THROW(write_program(p, post, {}), std::logic_error);
}

TEST(gcode_writer, lead_in_is_longer_than_the_compensation_radius) {
  const Plan p = plan(sample("fixture-slide-female"));
  // NISTIR 6556, 3.5.14 (from memory): the entry move at least the radius.
  EXPECT_GT(lead_length(p), to_mm(0.5, Units::Inch));
}

TEST(gcode_writer, every_checkpoint_is_a_stop_with_its_reading_and_the_spindle_restarts) {
  for (const char* name : samples)
    for (const char* post_name : posts) {
      SCOPED_TRACE(std::string(name) + " " + post_name);
      const Plan p = plan(sample(name));
      const Post post = shipped(post_name);
      const auto lines = lines_of(write_program(p, post, {}));
      const std::string m0 = post.two_digit_codes ? "M00" : "M0";
      const std::string m3 = post.two_digit_codes ? "M03" : "M3";
      const std::string m5 = post.two_digit_codes ? "M05" : "M5";
      const std::string g1 = post.two_digit_codes ? "G01" : "G1";
      std::size_t stops = 0;
      for (std::size_t i = 0; i < lines.size(); ++i) {
        if (!has_word(lines[i], m0) || lines[i].find("checkpoint") == std::string::npos) continue;
        const Checkpoint& c = p.checkpoints.at(stops++);
        // The reading to expect is in the comments before the stop, with the
        // spindle stopped first.
        const std::string reading = fmt::format(
            "expect {:.{}f}", from_mm(c.expected.value, p.job.units), length_decimals(p.job.units));
        bool said = false, stopped = false;
        for (std::size_t j = i; j-- > 1;) {
          said = said || lines[j].find(reading) != std::string::npos;
          if (lines[j].find("CHECKPOINT") == std::string::npos) continue;
          stopped = has_word(lines[j - 1], m5);
          break;
        }
        EXPECT_TRUE(said) << "line " << i + 1;
        EXPECT_TRUE(stopped) << "line " << i + 1;
        // No feed move before the spindle runs again.
        for (std::size_t j = i + 1; j < lines.size(); ++j) {
          EXPECT_FALSE(has_word(lines[j], g1)) << "cut before M3 at line " << j + 1;
          if (has_word(lines[j], m3) || has_word(lines[j], g1)) break;
        }
      }
      EXPECT_EQ(stops, p.checkpoints.size());
    }
}

TEST(gcode_writer, optional_stops_where_the_job_asks_and_the_post_has_them) {
  Job job = sample("fixture-slide-male");
  job.strategy.optional_stops = true;
  const Plan p = plan(job);
  const std::string full = write_program(p, shipped("rs274ngc-full"), {});
  const std::string small = write_program(p, shipped("small-control"), {});
  EXPECT_NE(full.find("M1 (checkpoint A"), std::string::npos);
  EXPECT_EQ(small.find("M1 "), std::string::npos);
  EXPECT_NE(small.find("M0 (checkpoint A"), std::string::npos);
}

TEST(gcode_writer, parameter_style_sets_flank_offsets_and_writes_them_in_finishing_passes) {
  Post post = shipped("rs274ngc-full");
  post.cutter_compensation = false;
  const Plan p = plan(sample("fixture-slide-female"));
  EXPECT_EQ(sizing_style(p, post), SizingStyle::Parameters);
  const std::string program = write_program(p, post, {});
  EXPECT_NE(program.find("#101=0. #102=0."), std::string::npos);
  // Female right flank at +X of the cutter: raising #102 moves the cut to -X,
  // away from the flank, leaving stock.
  EXPECT_NE(program.find("X[0.575 - #102]"), std::string::npos);
  EXPECT_EQ(program.find("G41"), std::string::npos);
  EXPECT_NE(program.find("- #102]"), std::string::npos);
  EXPECT_NE(program.find("+ #101]"), std::string::npos);
}

TEST(gcode_writer, mist_on_a_post_without_mist_is_refused) {
  const Plan p = plan(sample("stop-block-male"));
  expect_input_error(
      [&] { write_program(p, shipped("small-control"), {.coolant = CoolantChoice::Mist}); },
      {"coolant", "mist"});
}

TEST(gcode_writer, writes_in_the_units_asked_for) {
  const Plan p = plan(sample("stop-block-male"));
  const std::string inch = write_program(p, shipped("rs274ngc-full"),
                                         {.units = Units::Inch, .coolant = CoolantChoice::Off});
  EXPECT_NE(inch.find("G20 G17"), std::string::npos);
  EXPECT_EQ(inch.find("M8"), std::string::npos);
  // 5 mm safe height = 0.1969 in (25.4 mm to the inch, exact).
  EXPECT_NE(inch.find("Z0.1969"), std::string::npos);
}

TEST(gcode_writer, lines_fit_80_columns_without_line_numbers) {
  for (const char* name : samples) {
    const auto lines = lines_of(write_program(plan(sample(name)), shipped("rs274ngc-full"), {}));
    for (const auto& line : lines) EXPECT_LE(line.size(), 80u) << line;
  }
}

}  // namespace
}  // namespace dovetailor
