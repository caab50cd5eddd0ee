#include <fstream>
#include <sstream>
#include <stdexcept>

#include <gtest/gtest.h>

#include <dovetailor/gcode/gcode_block.hpp>
#include <dovetailor/shop/post.hpp>

#include "test_support.hpp"

// Expected text is written out by hand. The rule each case follows is named
// beside it: NIST RS274NGC Interpreter, Version 3 (Kramer, Proctor, Messina,
// NISTIR 6556, 2000), section numbers from memory; ISO 6983-1 (from memory).

namespace dovetailor {
namespace {

using testing::expect_input_error;
using testing::source_path;

Post load(const std::string& name) {
  std::ifstream in(source_path("post/" + name));
  std::stringstream text;
  text << in.rdbuf();
  return read_post(text.str(), name);
}

const Post& full() {
  static const Post post = load("rs274ngc-full.toml");
  return post;
}
const Post& small() {
  static const Post post = load("small-control.toml");
  return post;
}
const Post& iso() {
  static const Post post = load("iso6983-numbered.toml");
  return post;
}

constexpr double inch = 25.4;

TEST(gcode_block, numbers_keep_the_point_and_drop_trailing_zeros) {
  // A number may end in a decimal point; leading and trailing zeros are
  // allowed (NISTIR 6556 3.3.2.1). The point on whole numbers is common
  // practice (no source): without it some controls read least increments.
  EXPECT_EQ(format_number(1.25, 4), "1.25");
  EXPECT_EQ(format_number(1.0, 4), "1.");
  EXPECT_EQ(format_number(0.0, 4), "0.");
  EXPECT_EQ(format_number(0.0001, 4), "0.0001");
  EXPECT_EQ(format_number(-0.5, 3), "-0.5");
  EXPECT_EQ(format_number(12.3456, 3), "12.346");
  EXPECT_EQ(format_number(-12.3454, 3), "-12.345");
  EXPECT_EQ(format_number(7.0, 0), "7.");
}

TEST(gcode_block, negative_zero_is_written_as_zero) {
  EXPECT_EQ(format_number(-0.0, 4), "0.");
  EXPECT_EQ(format_number(-0.00004, 4), "0.");
  EXPECT_EQ(format_number(-0.0004, 3), "0.");
  // A Z a hair below zero in mm, written in inch.
  EXPECT_EQ(format_block({.words = {{'Z', -0.0001}}}, full(), Units::Inch), "Z0.");
}

TEST(gcode_block, words_follow_the_fixed_order_whatever_order_they_come_in) {
  // Words may come in any order in RS274NGC (NISTIR 6556 3.3); the writer
  // keeps N G X Y Z I J K R F S T M for the reader (common practice).
  const Block block{
      .words = {
          {'F', 10 * inch}, {'Z', -0.1 * inch}, {'X', 0.5 * inch}, {'G', 1}, {'Y', -0.25 * inch}}};
  EXPECT_EQ(format_block(block, full(), Units::Inch), "G1 X0.5 Y-0.25 Z-0.1 F10.");
}

TEST(gcode_block, several_g_and_m_words_keep_the_order_given) {
  // Several G words from different modal groups and up to four M words may
  // share a line (NISTIR 6556 3.4, from memory).
  const Block block{.words = {{'M', 8}, {'G', 90}, {'S', 1200}, {'M', 3}, {'G', 17}, {'T', 2}}};
  EXPECT_EQ(format_block(block, full(), Units::Inch), "G90 G17 S1200 T2 M8 M3");
}

TEST(gcode_block, lengths_use_the_post_decimals_for_the_units) {
  // Default resolution 0.0001 in and 0.001 mm (common practice).
  const Block block{.words = {{'G', 0}, {'X', 12.34567}, {'Y', 100.0}}};
  EXPECT_EQ(format_block(block, full(), Units::Millimetre), "G0 X12.346 Y100.");
  EXPECT_EQ(format_block(block, full(), Units::Inch), "G0 X0.4861 Y3.937");
}

TEST(gcode_block, feeds_and_speeds) {
  // F is units per minute in G94 (NISTIR 6556 3.5.19, from memory); S rpm.
  const Block block{.words = {{'G', 1}, {'X', 1}, {'F', 300.04}, {'S', 1199.6}}};
  EXPECT_EQ(format_block(block, full(), Units::Millimetre), "G1 X1. F300. S1200");
  const Block slow{.words = {{'G', 1}, {'Z', -inch}, {'F', 3.5 * inch}}};
  EXPECT_EQ(format_block(slow, full(), Units::Inch), "G1 Z-1. F3.5");
}

TEST(gcode_block, iso_post_numbers_lines_and_writes_two_digit_codes) {
  // ISO 6983-1: N sequence number first in the block (from memory).
  const Block block{.words = {{'G', 1}, {'X', 12.7}, {'F', 300}, {'M', 3}}};
  EXPECT_EQ(format_block(block, iso(), Units::Millimetre, 10), "N10 G01 X12.7 F300. M03");
  EXPECT_EQ(format_block({.words = {{'G', 43}, {'H', 2}, {'Z', 25}}}, iso(), Units::Millimetre, 20),
            "N20 G43 Z25. H2");
}

TEST(gcode_block, comments_in_the_post_style) {
  // Parenthesised comments (NISTIR 6556 3.3.4); ";" to end of line is a
  // later extension (domain brief).
  const Block block{.words = {{'G', 0}, {'Z', 5}}, .comment = "clear the mouth"};
  EXPECT_EQ(format_block(block, full(), Units::Millimetre), "G0 Z5. (clear the mouth)");
  Post semicolon = full();
  semicolon.comments = CommentStyle::Semicolon;
  EXPECT_EQ(format_block(block, semicolon, Units::Millimetre), "G0 Z5. ; clear the mouth");
  EXPECT_EQ(format_block({.comment = "rough left flank"}, semicolon, Units::Millimetre),
            "; rough left flank");
}

TEST(gcode_block, comment_characters_that_would_end_it_early_are_replaced) {
  // A comment may not contain "(" and ends at ")" (NISTIR 6556 3.3.4);
  // "%" ends a program on tape-format controls (ISO 6983-1, from memory).
  const Block block{.comment = "left flank (60\u00b0) 100% done\tnext"};
  EXPECT_EQ(format_block(block, full(), Units::Inch), "(left flank [60 deg] 100pct done next)");
  EXPECT_EQ(format_block({.comment = "\u00d8 6 pin, caf\u00e9"}, full(), Units::Inch),
            "(dia 6 pin, caf?)");
}

TEST(gcode_block, long_comment_goes_on_its_own_lines_before_the_words) {
  // Line length limit (NISTIR 6556 3.3: 256 characters; here a post's 32).
  Post narrow = full();
  narrow.max_line_length = 32;
  const Block block{.words = {{'G', 1}, {'X', 10}, {'F', 100}},
                    .comment = "finish pass on the left flank, measure over pins after it"};
  EXPECT_EQ(format_block(block, narrow, Units::Millimetre),
            "(finish pass on the left flank,)\n"
            "(measure over pins after it)\n"
            "G1 X10. F100.");
  std::istringstream lines(format_block(block, narrow, Units::Millimetre));
  for (std::string line; std::getline(lines, line);) EXPECT_LE(line.size(), 32u) << line;
}

TEST(gcode_block, split_lines_each_get_a_line_number) {
  Post narrow = iso();
  narrow.max_line_length = 32;
  const Block block{.words = {{'G', 0}, {'Z', 5}},
                    .comment = "retract clear of the overhang before moving out"};
  EXPECT_EQ(format_block(block, narrow, Units::Millimetre, 100),
            "N100 (retract clear of the)\n"
            "N110 (overhang before moving)\n"
            "N120 (out)\n"
            "N130 G00 Z5.");
}

TEST(gcode_block, words_that_cannot_fit_name_the_post_key) {
  Post narrow = full();
  narrow.max_line_length = 32;
  const Block block{
      .words = {{'G', 2}, {'X', 123.456}, {'Y', -123.456}, {'I', 50}, {'J', -50}, {'F', 250}}};
  expect_input_error([&] { format_block(block, narrow, Units::Millimetre); },
                     {"max_line_length", "is 38 characters long", "at most 32"});
}

TEST(gcode_block, line_numbers_stop_at_five_digits) {
  // N is at most five digits, 0 to 99999 (NISTIR 6556 3.3, from memory).
  EXPECT_EQ(format_block({.words = {{'M', 5}}}, iso(), Units::Inch, 99999), "N99999 M05");
  expect_input_error(
      [&] {
        format_block({.words = {{'M', 5}}}, iso(), Units::Inch, 100000);
      },
      {"line_numbers.step", "N100000"});
}

TEST(gcode_block, parameters_and_expressions_on_a_post_that_has_them) {
  // Parameter setting #n=value and bracketed expressions (NISTIR 6556 3.3.2.2,
  // 3.3.2.3, from memory); #1 to #5399 (3.2.1).
  const Block set{.settings = {{.number = 101, .length = 0.005 * inch}},
                  .comment = "finish allowance"};
  EXPECT_EQ(format_block(set, full(), Units::Inch), "#101=0.005 (finish allowance)");
  const Block move{.words = {{'G', 1}, {.letter = 'X', .expression = "[-0.5 + #101]"}}};
  EXPECT_EQ(format_block(move, full(), Units::Inch), "G1 X[-0.5 + #101]");
  expect_input_error([&] { format_block(move, small(), Units::Inch); },
                     {"post small-control", "parameters"});
  expect_input_error([&] { format_block(set, small(), Units::Inch); }, {"parameters"});
}

TEST(gcode_block, words_the_control_lacks_are_refused_naming_the_post_key) {
  // Cutter radius compensation G40/G41/G42 with D (NISTIR 6556 3.5.16), tool
  // length offset G43 H / G49 (3.5.15), M6 (3.6.3), M1 (3.6.1), arcs by
  // centre or radius (3.5.3), from memory.
  expect_input_error(
      [] {
        format_block({.words = {{'G', 41}, {'D', 2}}}, small(), Units::Inch);
      },
      {"cutter_compensation"});
  expect_input_error(
      [] {
        format_block({.words = {{'G', 40}}}, small(), Units::Inch);
      },
      {"cutter_compensation"});
  expect_input_error(
      [] {
        format_block({.words = {{'G', 43}, {'H', 2}}}, small(), Units::Inch);
      },
      {"tool_length_offset"});
  expect_input_error(
      [] {
        format_block({.words = {{'T', 2}, {'M', 6}}}, small(), Units::Inch);
      },
      {"tool_changer"});
  expect_input_error(
      [] {
        format_block({.words = {{'M', 1}}}, small(), Units::Inch);
      },
      {"optional_stop"});
  expect_input_error(
      [] {
        format_block({.words = {{'G', 2}, {'X', 1}, {'I', 1}}}, small(), Units::Inch);
      },
      {"arc_format"});
  expect_input_error(
      [] {
        format_block({.words = {{'G', 2}, {'X', 1}, {'R', 1}}}, full(), Units::Inch);
      },
      {"arc_format"});
  EXPECT_EQ(format_block({.words = {{'G', 3}, {'X', 2 * inch}, {'R', inch}}}, small(), Units::Inch),
            "G3 X2. R1.");
}

TEST(gcode_block, units_the_control_refuses_name_the_units_key) {
  Post metric = full();
  metric.units = PostUnits::Millimetre;
  expect_input_error(
      [&] {
        format_block({.words = {{'G', 0}}}, metric, Units::Inch);
      },
      {"units", "mm programs only"});
  expect_input_error(
      [&] {
        format_block({.words = {{'G', 20}}}, metric, Units::Millimetre);
      },
      {"units", "G20"});
}

TEST(gcode_block, malformed_blocks_are_programming_mistakes) {
  EXPECT_THROW(format_block({.words = {{'N', 10}}}, full(), Units::Inch), std::logic_error);
  EXPECT_THROW(format_block({.words = {{'X', 1}, {'X', 2}}}, full(), Units::Inch),
               std::logic_error);
  EXPECT_THROW(format_block({.words = {{'G', 1}, {'F', 0}}}, full(), Units::Inch),
               std::logic_error);
  EXPECT_THROW(format_block({.words = {{'G', 1.25}}}, full(), Units::Inch), std::logic_error);
  EXPECT_THROW(
      format_block({.words = {{.letter = 'X', .expression = "[1 + (2)]"}}}, full(), Units::Inch),
      std::logic_error);
  EXPECT_THROW(format_block(Block{}, full(), Units::Inch), std::logic_error);
}

TEST(gcode_block, tool_change_follows_the_post) {
  const auto changer = tool_change_blocks(full(), 2, "3/4 in 60\u00b0 dovetail cutter");
  ASSERT_EQ(changer.size(), 1u);
  EXPECT_EQ(format_block(changer[0], full(), Units::Inch),
            "T2 M6 (tool 2: 3/4 in 60 deg dovetail cutter)");
  // Without a changer: stop the spindle, then a program stop M0 (NISTIR 6556
  // 3.6.1) with the instruction in a comment; T selects the tool without a
  // change (NISTIR 6556, T word, from memory), so a reader knows which it is.
  const auto manual = tool_change_blocks(small(), 2, "3/4 in dovetail cutter");
  ASSERT_EQ(manual.size(), 2u);
  EXPECT_EQ(format_block(manual[0], small(), Units::Inch), "M5");
  EXPECT_EQ(format_block(manual[1], small(), Units::Inch),
            "T2 M0 (change to tool 2: 3/4 in dovetail cutter, then cycle start)");
}

}  // namespace
}  // namespace dovetailor
