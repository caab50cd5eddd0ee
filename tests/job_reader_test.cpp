#include <algorithm>
#include <fstream>
#include <sstream>

#include <gtest/gtest.h>

#include <dovetailor/input/job_reader.hpp>

#include "test_support.hpp"

namespace dovetailor {
namespace {

using testing::expect_input_error;

// A valid job; tests replace one line to make each error.
const std::string valid = R"(units = "inch"
[part]
name = "test slide"
material = "1018"
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
diameter = 0.75
flutes = 4
flute_length = 1.0
material = "carbide"
[[tool]]
number = 2
kind = "dovetail"
diameter = 1.0
flutes = 6
flute_length = 0.4375
material = "hss"
angle = 60
neck_diameter = 0.375
[gauge]
pin_diameter = 0.25
)";

std::string replace(const std::string& text, const std::string& from, const std::string& to) {
  const auto at = text.find(from);
  EXPECT_NE(at, std::string::npos) << from;
  return text.substr(0, at) + to + text.substr(at + from.size());
}

TEST(job_reader, reads_a_valid_job_in_millimetres) {
  const Job job = read_job(valid, "slide.toml");
  EXPECT_EQ(job.units, Units::Inch);
  EXPECT_EQ(job.part.name, "test slide");
  EXPECT_DOUBLE_EQ(job.stock.width, 3.0 * 25.4);
  EXPECT_DOUBLE_EQ(job.dovetail.depth, 0.375 * 25.4);
  EXPECT_EQ(job.dovetail.width_at, WidthAt::Top);
  EXPECT_EQ(job.dovetail.sides, AngledSides::Both);
  EXPECT_DOUBLE_EQ(job.dovetail.length, job.stock.length);  // default: the stock length
  ASSERT_EQ(job.tools.size(), 2u);
  EXPECT_EQ(job.tools[1].kind, ToolKind::Dovetail);
  EXPECT_DOUBLE_EQ(job.tools[1].neck_diameter, 0.375 * 25.4);
  ASSERT_TRUE(job.gauge.has_value());
  EXPECT_DOUBLE_EQ(job.gauge->pin_diameter, 0.25 * 25.4);
}

TEST(job_reader, refuses_pins_that_cannot_sit_in_the_dovetail) {
  // Female 1.5 in mouth narrowed to 0.3 in: floor 0.3 + 2 (0.375) cot 60 =
  // 0.7330127 in; two pins overlap from D = 0.7330127 / 2.7320508 =
  // 0.2683 in, so 0.3125 in pins cannot (their contact, 0.2344 in up the
  // 0.375 in flank, could).
  expect_input_error(
      [] {
        read_job(replace(replace(valid, "width = 1.5", "width = 0.3"), "pin_diameter = 0.25",
                         "pin_diameter = 0.3125"),
                 "j.toml");
      },
      {"j.toml:30:", "gauge.pin_diameter", "overlap", "smaller than 0.2683 in"});
  // Male, 1.5 in top and 1.0670 in root on stock 1.54 in wide: shelves
  // (1.54 - 1.0669873) / 2 = 0.2365064 in. A 0.3125 in pin's centre lies
  // 0.15625 cot 30 = 0.2706329 in out from the root: 0.0341 in past the
  // face. The largest pin: 2 (0.2365064) / cot 30 = 0.2731 in.
  const std::string male = replace(replace(valid, "type = \"female\"", "type = \"male\""),
                                   "size = [3.0, 6.0, 1.25]", "size = [1.54, 6.0, 1.25]");
  EXPECT_NO_THROW(read_job(male, "m.toml"));
  expect_input_error(
      [&] { read_job(replace(male, "pin_diameter = 0.25", "pin_diameter = 0.3125"), "m.toml"); },
      {"m.toml:30:", "gauge.pin_diameter", "cannot rest on the shelf", "by 0.0341 in",
       "smaller than 0.2731 in"});
}

TEST(job_reader, default_tolerance_favours_a_sliding_fit) {
  const Job female = read_job(valid, "f.toml");
  EXPECT_DOUBLE_EQ(female.dovetail.tolerance.lower, 0);
  EXPECT_DOUBLE_EQ(female.dovetail.tolerance.upper, 0.001 * 25.4);
  const Job male = read_job(replace(valid, "type = \"female\"", "type = \"male\""), "m.toml");
  EXPECT_DOUBLE_EQ(male.dovetail.tolerance.lower, -0.001 * 25.4);
  EXPECT_DOUBLE_EQ(male.dovetail.tolerance.upper, 0);
}

TEST(job_reader, every_sample_job_reads) {
  for (const char* name :
       {"samples/fixture-slide-female.toml", "samples/stop-block-male.toml",
        "samples/height-stop-half-female.toml", "samples/spindle-slide-tapered-female.toml"}) {
    std::ifstream in(testing::source_path(name));
    ASSERT_TRUE(in) << name;
    std::stringstream text;
    text << in.rdbuf();
    EXPECT_NO_THROW(read_job(text.str(), name)) << name;
  }
}

// A file saved by an editor that writes a UTF-8 byte-order mark and CRLF
// line ends (TOML 1.0 allows both) is the same job, and its errors name the
// same lines.
std::string bom_crlf(const std::string& text) {
  std::string out = "\xEF\xBB\xBF";
  for (char ch : text) out += ch == '\n' ? std::string("\r\n") : std::string(1, ch);
  return out;
}

TEST(job_reader, a_byte_order_mark_and_crlf_line_ends_read_the_same_job) {
  const std::string sample = testing::read_source_file("samples/stop-block-male.toml");
  EXPECT_EQ(read_job(bom_crlf(sample), "j.toml"), read_job(sample, "j.toml"));
  expect_input_error(
      [] { read_job(bom_crlf(replace(valid, "depth = 0.375", "depth = = 0.375")), "j.toml"); },
      {"j.toml:10:", "not valid TOML"});
}

TEST(job_reader, syntax_error_names_line_and_column) {
  expect_input_error([] { read_job(replace(valid, "depth = 0.375", "depth = = 0.375"), "j.toml"); },
                     {"j.toml:10:", "not valid TOML"});
}

TEST(job_reader, unknown_key_names_key_line_and_valid_keys) {
  expect_input_error(
      [] { read_job(replace(valid, "depth = 0.375", "depth = 0.375\ndepht = 1"), "j.toml"); },
      {"j.toml:11:", "dovetail.depht", "unknown key", "valid keys here are"});
}

TEST(job_reader, wrong_type_names_key_and_line) {
  expect_input_error(
      [] { read_job(replace(valid, "angle = 60\ndepth", "angle = \"sixty\"\ndepth"), "j.toml"); },
      {"j.toml:9:", "dovetail.angle", "expected a number, found a string"});
}

TEST(job_reader, missing_required_key_names_key) {
  expect_input_error([] { read_job(replace(valid, "width_at = \"top\"\n", ""), "j.toml"); },
                     {"j.toml:", "dovetail.width_at", "missing"});
  expect_input_error([] { read_job(replace(valid, "units = \"inch\"\n", ""), "j.toml"); },
                     {"units", "missing"});
}

TEST(job_reader, non_finite_numbers_are_refused) {
  for (const char* spelling : {"nan", "+nan", "-nan", "inf", "+inf", "-inf"}) {
    expect_input_error(
        [&] {
          read_job(replace(valid, "depth = 0.375", std::string("depth = ") + spelling), "j.toml");
        },
        {"j.toml:10:", "dovetail.depth", "finite"});
  }
}

TEST(job_reader, out_of_range_numbers_say_the_range) {
  expect_input_error(
      [] { read_job(replace(valid, "angle = 60\ndepth", "angle = 90\ndepth"), "j.toml"); },
      {"j.toml:9:", "dovetail.angle", "from 30 to 75"});
  expect_input_error([] { read_job(replace(valid, "depth = 0.375", "depth = -0.375"), "j.toml"); },
                     {"j.toml:10:", "dovetail.depth", "out of range"});
  expect_input_error([] { read_job(replace(valid, "depth = 0.375", "depth = 0"), "j.toml"); },
                     {"j.toml:10:", "dovetail.depth", "greater than zero"});
  expect_input_error([] { read_job(replace(valid, "depth = 0.375", "depth = 1e300"), "j.toml"); },
                     {"j.toml:10:", "dovetail.depth", "out of range"});
}

TEST(job_reader, wrong_word_lists_the_valid_ones) {
  expect_input_error(
      [] { read_job(replace(valid, "type = \"female\"", "type = \"tongue\""), "j.toml"); },
      {"j.toml:8:", "dovetail.type", "\"male\", \"female\""});
  expect_input_error(
      [] { read_job(replace(valid, "units = \"inch\"", "units = \"cm\""), "j.toml"); },
      {"j.toml:1:", "units", "\"inch\", \"mm\""});
}

TEST(job_reader, impossible_combinations_are_explained) {
  // A female mouth that would close: 2 * 1.2 * cot 60 = 1.386 > 1.0 floor width.
  expect_input_error(
      [] {
        auto text = replace(valid, "width_at = \"top\"", "width_at = \"bottom\"");
        text = replace(text, "width = 1.5", "width = 1.0");
        text = replace(text, "depth = 0.375", "depth = 1.2");
        read_job(text, "j.toml");
      },
      {"j.toml:", "dovetail.width", "flanks cross"});
  expect_input_error(
      [] {
        read_job(replace(valid, "size = [3.0, 6.0, 1.25]", "size = [1.5, 6.0, 1.25]"), "j.toml");
      },
      {"j.toml:6:", "stock.size", "stock spans"});
  expect_input_error(
      [] {
        read_job(replace(valid, "size = [3.0, 6.0, 1.25]", "size = [3.0, 6.0, 0.3]"), "j.toml");
      },
      {"dovetail.depth", "stock is only"});
  expect_input_error(
      [] { read_job(replace(valid, "pin_diameter = 0.25", "pin_diameter = 0.6"), "j.toml"); },
      {"j.toml:30:", "gauge.pin_diameter", "flank ends"});
  expect_input_error(
      [] {
        read_job(replace(valid, "width_at = \"top\"",
                         "width_at = \"top\"\nsides = \"left\"\ngib = { side = \"right\", "
                         "thickness = 0.1 }"),
                 "j.toml");
      },
      {"dovetail.gib.side", "square"});
}

TEST(job_reader, dovetail_cutter_must_be_consistent) {
  expect_input_error(
      [] { read_job(replace(valid, "neck_diameter = 0.375", "neck_diameter = 0.6"), "j.toml"); },
      {"j.toml:28:", "tool[2].neck_diameter", "small diameter"});
  expect_input_error(
      [] {
        read_job(replace(valid, "kind = \"end-mill\"", "kind = \"end-mill\"\nangle = 60"),
                 "j.toml");
      },
      {"tool[1].angle", "only to dovetail cutters"});
  expect_input_error([] { read_job(replace(valid, "number = 2", "number = 1"), "j.toml"); },
                     {"tool[2].number", "used twice"});
}

TEST(job_reader, tables_of_the_wrong_shape_are_refused) {
  expect_input_error(
      [] {
        read_job(replace(valid, "[[tool]]\nnumber = 1", "tool = 3\n[[toolx]]\nnumber = 1"),
                 "j.toml");
      },
      {"tool"});
  expect_input_error([] { read_job("units = \"mm\"\nstock = 3\n", "j.toml"); },
                     {"j.toml:2:", "stock", "expected a table"});
}

}  // namespace
// A manual machine: the valid job with dials and a datum appended. The line of
// a key in the appended text is the number of lines before it plus one.
const std::string manual_tail = R"([machine]
kind = "manual"
[machine.x_dial]
preset = "inch-200"
backlash = 0.004
[machine.z_dial]
units = "mm"
travel_per_turn = 2.5
divisions = 125
reading_grows = "minus"
backlash = 0.05
[machine.datum]
x = "edge-finder"
face = "left"
edge_finder_diameter = 0.2
shim = 0.002
)";

std::string line_of(const std::string& text, const std::string& key) {
  const auto at = text.find(key);
  EXPECT_NE(at, std::string::npos) << key;
  return ":" +
         std::to_string(std::count(text.begin(), text.begin() + static_cast<long>(at), '\n') + 1) +
         ":";
}

TEST(job_reader, manual_dials_and_datum_read_in_mm) {
  const Job job = read_job(valid + manual_tail, "m.toml");
  ASSERT_TRUE(job.machine.manual.has_value());
  const auto& m = *job.machine.manual;
  // The preset: 0.200 in per turn, 200 graduations (handwheel.hpp, common practice).
  EXPECT_DOUBLE_EQ(m.x.travel_per_turn, 0.200 * 25.4);
  EXPECT_EQ(m.x.divisions, 200);
  EXPECT_EQ(m.x.reading_grows, AxisDirection::Plus);
  EXPECT_EQ(m.x.approach, AxisDirection::Plus);  // defaults to the way the reading grows
  EXPECT_DOUBLE_EQ(m.x.backlash, 0.004 * 25.4);
  // A metric dial on an inch job keeps its own units.
  EXPECT_DOUBLE_EQ(m.z.travel_per_turn, 2.5);
  EXPECT_EQ(m.z.divisions, 125);
  EXPECT_EQ(m.z.reading_grows, AxisDirection::Minus);
  EXPECT_EQ(m.z.approach, AxisDirection::Minus);
  EXPECT_DOUBLE_EQ(m.z.backlash, 0.05);
  EXPECT_EQ(m.datum.x_method, XDatumMethod::EdgeFinder);
  EXPECT_EQ(m.datum.x_face, Side::Left);
  EXPECT_DOUBLE_EQ(m.datum.edge_finder_diameter, 0.2 * 25.4);
  EXPECT_DOUBLE_EQ(m.datum.shim, 0.002 * 25.4);
}

TEST(job_reader, manual_keys_are_checked_with_their_lines) {
  const std::string job = valid + manual_tail;
  const std::string extra = replace(job, "backlash = 0.004", "backlash = 0.004\nlash = 1");
  expect_input_error([&] { read_job(extra, "m.toml"); },
                     {"m.toml" + line_of(extra, "lash = 1"), "machine.x_dial.lash", "unknown key",
                      "travel_per_turn, divisions"});
  expect_input_error(
      [&] { read_job(replace(job, "preset = \"inch-200\"", "preset = \"inch-300\""), "m.toml"); },
      {"m.toml" + line_of(job, "preset"), "machine.x_dial.preset", "\"inch-200\", \"inch-100\""});
  expect_input_error(
      [&] {
        read_job(replace(job, "preset = \"inch-200\"", "preset = \"inch-200\"\ndivisions = 100"),
                 "m.toml");
      },
      {"machine.x_dial.divisions", "preset"});
  expect_input_error(
      [&] { read_job(replace(job, "divisions = 125", "divisions = 0"), "m.toml"); },
      {"m.toml" + line_of(job, "divisions = 125"), "machine.z_dial.divisions", "from 10 to 2000"});
  expect_input_error([&] { read_job(replace(job, "travel_per_turn = 2.5\n", ""), "m.toml"); },
                     {"machine.z_dial.travel_per_turn", "missing", "in mm"});
  expect_input_error(
      [&] {
        read_job(replace(job, "reading_grows = \"minus\"", "reading_grows = \"up\""), "m.toml");
      },
      {"m.toml" + line_of(job, "reading_grows"), "machine.z_dial.reading_grows",
       "\"plus\", \"minus\""});
  expect_input_error([&] { read_job(replace(job, "edge_finder_diameter = 0.2\n", ""), "m.toml"); },
                     {"machine.datum.edge_finder_diameter", "missing"});
  expect_input_error(
      [&] { read_job(replace(job, "x = \"edge-finder\"", "x = \"touch-off\""), "m.toml"); },
      {"m.toml" + line_of(job, "edge_finder_diameter"), "machine.datum.edge_finder_diameter",
       "applies only to x = \"edge-finder\""});
  expect_input_error([&] { read_job(replace(job, "shim = 0.002", "shim = 0.5"), "m.toml"); },
                     {"m.toml" + line_of(job, "shim"), "machine.datum.shim", "at most 0.05 in"});
  expect_input_error(
      [&] { read_job(replace(job, "kind = \"manual\"", "kind = \"cnc\""), "m.toml"); },
      {"machine.x_dial", "kind = \"manual\""});
  expect_input_error(
      [&] {
        read_job(replace(job,
                         "[machine.z_dial]\nunits = \"mm\"\ntravel_per_turn = 2.5\n"
                         "divisions = 125\nreading_grows = \"minus\"\nbacklash = 0.05\n",
                         ""),
                 "m.toml");
      },
      {"machine.z_dial", "missing"});
}

TEST(job_reader, manual_datum_and_approach_must_agree) {
  const std::string job = valid + manual_tail;
  // Approaching X settings moving plus, the left face is the one met that way.
  expect_input_error(
      [&] { read_job(replace(job, "face = \"left\"", "face = \"right\""), "m.toml"); },
      {"m.toml" + line_of(job, "face = "), "machine.datum.face", "on the left face"});
  // The top face is touched off moving down.
  expect_input_error(
      [&] {
        read_job(replace(job, "backlash = 0.05", "backlash = 0.05\napproach = \"plus\""), "m.toml");
      },
      {"machine.z_dial.approach", "\"minus\""});
  // Approaching minus moves the default face to the right.
  const Job right =
      read_job(replace(replace(job, "backlash = 0.004", "backlash = 0.004\napproach = \"minus\""),
                       "face = \"left\"\n", ""),
               "m.toml");
  EXPECT_EQ(right.machine.manual->datum.x_face, Side::Right);
}

TEST(job_reader, manual_without_a_datum_table_touches_off) {
  const std::string job = valid + manual_tail.substr(0, manual_tail.find("[machine.datum]"));
  const Job read = read_job(job, "m.toml");
  ASSERT_TRUE(read.machine.manual.has_value());
  EXPECT_EQ(read.machine.manual->datum.x_method, XDatumMethod::TouchOff);
  EXPECT_DOUBLE_EQ(read.machine.manual->datum.shim, 0);
}

}  // namespace dovetailor

namespace dovetailor {
namespace {

// Stock 3.0 x 6.0 x 1.25 in, centred on x = 0: x from -1.5 to 1.5, y 0 to 6,
// z -1.25 to 0 (README, "Conventions").
TEST(job_reader, reads_fixture_boxes_in_work_coordinates) {
  const Job job = read_job(valid + R"(
[[fixture]]
name = "right jaw"
kind = "vise-jaw"
x = [1.5, 2.0]
y = [0, 6]
z = [-1.25, 0.25]
)",
                           "job.toml");
  ASSERT_EQ(job.fixtures.size(), 1u);
  const Fixture& f = job.fixtures.front();
  EXPECT_EQ(f.name, "right jaw");
  EXPECT_EQ(f.kind, FixtureKind::ViseJaw);
  EXPECT_DOUBLE_EQ(f.x_min, 38.1);  // 1.5 in = 38.1 mm exactly (1959 inch)
  EXPECT_DOUBLE_EQ(f.z_max, 6.35);
}

TEST(job_reader, refuses_a_fixture_inside_the_stock) {
  expect_input_error(
      [] {
        read_job(valid + "[[fixture]]\nx = [1.0, 2.0]\ny = [0, 6]\nz = [-1, 0.25]\n", "job.toml");
      },
      {"job.toml", "fixture[1].x", "reaches into the stock"});
}

TEST(job_reader, refuses_a_fixture_with_a_reversed_span_or_unknown_key) {
  expect_input_error(
      [] {
        read_job(valid + "[[fixture]]\nx = [2.0, 1.6]\ny = [0, 6]\nz = [-1, 0.25]\n", "job.toml");
      },
      {"fixture[1].x", "from below to"});
  expect_input_error(
      [] {
        read_job(valid + "[[fixture]]\nx = [1.6, 2]\ny = [0, 6]\nz = [-1, 0]\nheight = 3\n",
                 "job.toml");
      },
      {"fixture[1]", "height"});
}

// [program]: the frame of a program written elsewhere (README, the job
// file table). 1 in = 25.4 mm exactly (1959 inch).
TEST(job_reader, reads_the_program_frame_offsets_and_homes) {
  const Job job = read_job(valid + R"(
[program]
zero = [-1.5, 0, 0]
slide = "+x"
g28 = [0, 0, 0]
[program.offsets]
g54 = [-10, -5, -8]
g59_3 = [1, 2, 3]
)",
                           "job.toml");
  const ProgramSetup& p = job.program;
  EXPECT_DOUBLE_EQ(p.zero.x, -38.1);
  EXPECT_EQ(p.slide, SlideAxis::PlusX);
  ASSERT_TRUE(p.g28_home);
  EXPECT_EQ(*p.g28_home, (Point3{0, 0, 0}));
  EXPECT_FALSE(p.g30_home);
  ASSERT_TRUE(p.offsets[0]);
  EXPECT_DOUBLE_EQ(p.offsets[0]->z, -8 * 25.4);
  EXPECT_FALSE(p.offsets[1]);
  ASSERT_TRUE(p.offsets[8]);
  EXPECT_DOUBLE_EQ(p.offsets[8]->y, 2 * 25.4);
  // Without the table: the job's own frame.
  EXPECT_EQ(read_job(valid, "job.toml").program, ProgramSetup{});
}

TEST(job_reader, program_frame_keys_are_checked) {
  expect_input_error([] { read_job(valid + "[program]\nslide = \"z\"\n", "job.toml"); },
                     {"program.slide", "\"+x\", \"-x\", \"+y\", \"-y\""});
  expect_input_error([] { read_job(valid + "[program]\nzero = [0, 0]\n", "job.toml"); },
                     {"program.zero"});
  expect_input_error([] { read_job(valid + "[program.offsets]\ng60 = [0, 0, 0]\n", "job.toml"); },
                     {"program.offsets", "g60"});
  expect_input_error([] { read_job(valid + "[program]\nhome = [0, 0, 0]\n", "job.toml"); },
                     {"program", "home"});
}

TEST(job_reader, reads_drills_and_chamfer_mills) {
  const Job job = read_job(valid + R"(
[[tool]]
number = 7
kind = "drill"
diameter = 0.25
flutes = 2
flute_length = 1.5
material = "hss"
[[tool]]
number = 8
kind = "chamfer-mill"
diameter = 0.5
tip_diameter = 0.05
angle = 90
flutes = 4
flute_length = 0.5
material = "carbide"
)",
                           "job.toml");
  ASSERT_EQ(job.tools.size(), 4u);
  EXPECT_EQ(job.tools[2].kind, ToolKind::Drill);
  EXPECT_EQ(job.tools[2].point_angle, 118);  // the default, common practice
  EXPECT_EQ(job.tools[3].kind, ToolKind::ChamferMill);
  EXPECT_EQ(job.tools[3].angle, 90);
  EXPECT_DOUBLE_EQ(job.tools[3].tip_diameter, 0.05 * 25.4);
}

TEST(job_reader, drill_and_chamfer_keys_belong_to_their_kinds) {
  const std::string drill =
      "[[tool]]\nnumber = 7\nkind = \"drill\"\ndiameter = 0.25\nflutes = 2\n"
      "flute_length = 1.5\nmaterial = \"hss\"\n";
  expect_input_error([&] { read_job(valid + drill + "tip_diameter = 0.1\n", "job.toml"); },
                     {"tool[3].tip_diameter", "only to chamfer mills"});
  expect_input_error([&] { read_job(valid + drill + "point_angle = 200\n", "job.toml"); },
                     {"tool[3].point_angle"});
  expect_input_error([&] { read_job(valid + drill + "angle = 60\n", "job.toml"); },
                     {"tool[3].angle", "dovetail cutters and chamfer mills"});
  expect_input_error(
      [&] {
        read_job(replace(valid, "flute_length = 1.0", "flute_length = 1.0\npoint_angle = 118"),
                 "job.toml");
      },
      {"tool[1].point_angle", "only to drills"});
  // A 0.5 in 90 deg chamfer mill with a sharp tip has a 0.25 in cone.
  const std::string chamfer =
      "[[tool]]\nnumber = 8\nkind = \"chamfer-mill\"\ndiameter = 0.5\nangle = 90\nflutes = 4\n"
      "flute_length = 0.2\nmaterial = \"hss\"\n";
  expect_input_error([&] { read_job(valid + chamfer, "job.toml"); },
                     {"tool[3].flute_length", "shorter than the cone"});
  expect_input_error(
      [&] { read_job(replace(valid + chamfer, "angle = 90", "angle = 20"), "job.toml"); },
      {"tool[3].angle"});
}

}  // namespace
}  // namespace dovetailor
