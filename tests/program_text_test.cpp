#include <fstream>
#include <sstream>

#include <gtest/gtest.h>

#include <dovetailor/gcode/program_text.hpp>

#include "test_support.hpp"

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

TEST(program_text, iso_program_is_framed_by_percent_and_numbered_in_steps) {
  // ISO 6983-1: "%" starts and ends the program, N numbers each block (from memory).
  ProgramText program(load("iso6983-numbered.toml"), Units::Millimetre);
  program.add_comment("stop rail, male dovetail");
  program.add({.words = {{'G', 21}, {'G', 90}}});
  program.add({.words = {{'G', 0}, {'X', -20}, {'Y', -5}}});
  EXPECT_EQ(program.finish(),
            "%\n"
            "N10 (stop rail, male dovetail)\n"
            "N20 G21 G90\n"
            "N30 G00 X-20. Y-5.\n"
            "N40 M30\n"
            "%\n");
}

TEST(program_text, numbering_counts_split_comment_lines) {
  Post post = load("iso6983-numbered.toml");
  post.max_line_length = 32;
  ProgramText program(post, Units::Inch);
  program.add({.words = {{'M', 0}}, .comment = "measure over the pins with the spindle stopped"});
  program.add({.words = {{'M', 5}}});
  EXPECT_EQ(program.finish(),
            "%\n"
            "N10 (measure over the pins with)\n"
            "N20 (the spindle stopped)\n"
            "N30 M00\n"
            "N40 M05\n"
            "N50 M30\n"
            "%\n");
}

TEST(program_text, full_post_writes_no_numbers_and_ends_with_m2) {
  // M2 program end (NISTIR 6556 3.6.1, from memory).
  ProgramText program(load("rs274ngc-full.toml"), Units::Inch);
  program.add({.words = {{'G', 20}}});
  EXPECT_EQ(program.finish(), "G20\nM2\n");
}

TEST(program_text, refuses_units_the_control_does_not_accept) {
  Post post = load("rs274ngc-full.toml");
  post.units = PostUnits::Inch;
  expect_input_error([&] { ProgramText program(post, Units::Millimetre); },
                     {"units", "inch programs only"});
}

TEST(program_text, numbered_start_line_must_still_fit) {
  Post post = load("iso6983-numbered.toml");
  post.max_line_length = 32;
  post.start_lines = {"%", "(a start line of 29 characters)"};
  expect_input_error([&] { ProgramText program(post, Units::Inch); },
                     {"start", "max_line_length 32"});
}

}  // namespace
}  // namespace dovetailor
