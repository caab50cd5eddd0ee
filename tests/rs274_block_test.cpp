#include <string>

#include <gtest/gtest.h>

#include <dovetailor/rs274/rs274_block.hpp>

#include "test_support.hpp"

namespace dovetailor {
namespace {

using testing::expect_input_error;

Rs274Block read(const std::string& text, const Rs274Parameters& parameters = Rs274Parameters()) {
  return read_rs274_block(text, 7, "part.ngc", parameters);
}

TEST(rs274_block, reads_words_codes_and_line_number) {
  const auto block = read("N0120 g1 X1.5 y-2 Z.25 F300 M3 S1200 (rough pass)");
  EXPECT_EQ(block.line, 7);
  EXPECT_EQ(block.line_number, 120);
  ASSERT_EQ(block.g_codes.size(), 1u);
  EXPECT_EQ(block.g_codes[0], (Rs274Code{10, 7}));
  ASSERT_EQ(block.m_codes.size(), 1u);
  EXPECT_EQ(block.m_codes[0].number, 3);
  EXPECT_EQ(block.word('x')->value, 1.5);
  EXPECT_EQ(block.word('x')->column, 10);
  EXPECT_EQ(block.word('y')->value, -2);
  EXPECT_EQ(block.word('z')->value, 0.25);
  EXPECT_EQ(block.word('f')->value, 300);
  EXPECT_EQ(block.word('s')->value, 1200);
}

TEST(rs274_block, decimal_g_codes_are_kept_times_ten) {
  const auto block = read("G59.1 G61.1");
  ASSERT_EQ(block.g_codes.size(), 2u);
  EXPECT_EQ(block.g_codes[0].number, 591);
  EXPECT_EQ(block.g_codes[1].number, 611);
}

TEST(rs274_block, parameter_settings_are_returned_not_applied) {
  // NISTIR 6556 section 3.5.3 (from memory): a setting takes effect after
  // the whole line has been read, so X sees the old value of #1.
  Rs274Parameters parameters;
  parameters.set(1, 4);
  const auto block = read("#1=2 X#1 #2=[#1+1]", parameters);
  EXPECT_EQ(block.word('x')->value, 4);
  ASSERT_EQ(block.settings.size(), 2u);
  EXPECT_EQ(block.settings[0], (Rs274ParameterSetting{1, 2, 1}));
  EXPECT_EQ(block.settings[1].number, 2);
  EXPECT_EQ(block.settings[1].value, 5);
  EXPECT_EQ(parameters.get(1), 4);
}

TEST(rs274_block, comments_percent_and_block_delete) {
  EXPECT_TRUE(read("(only a comment)").empty());
  EXPECT_TRUE(read("").empty());
  EXPECT_TRUE(read("   ; semicolon comment, a later extension").empty());
  EXPECT_EQ(read("G0 X1 ; to the end (of line").word('x')->value, 1);
  EXPECT_TRUE(read("%").percent_line);
  EXPECT_TRUE(read("  %  ").percent_line);
  const auto deleted = read("/N5 G0 X1");
  EXPECT_TRUE(deleted.block_delete);
  EXPECT_EQ(deleted.line_number, 5);
}

// Accepted and rejected lines, with the spec section beside each
// (NISTIR 6556, section numbers from memory).
struct Rejected {
  const char* text;
  const char* message;  // part of the message
  const char* where;    // "part.ngc:7:<column>"
  const char* section;
};

TEST(rs274_block, rejects_malformed_lines_with_place_and_word) {
  const Rejected cases[] = {
      {"G1 X1 X2", "two X words", "part.ngc:7:7", "3.4: one word per letter except G and M"},
      {"G1 E5", "'E' is not an RS-274/NGC word letter", "part.ngc:7:4", "3.3.2 table of words"},
      {"O100", "'O' is not", "part.ngc:7:1", "3.3.2: O is not an NGC word in V3"},
      {"G1 X1 N10", "must come first", "part.ngc:7:7", "3.3.1: line number first"},
      {"G1.25", "one decimal place", "part.ngc:7:1", "3.4: G codes to one decimal"},
      {"M3.5", "whole numbers", "part.ngc:7:1", "3.4: M codes are integers"},
      {"G1 X(open", "not closed", "part.ngc:7:5", "3.3.4 comments end on the line"},
      {"G1 (a (b) c)", "do not nest", "part.ngc:7:7", "3.3.4 comments do not nest"},
      {"G1 X1+2", "unexpected '+'", "part.ngc:7:6", "3.5: operators only inside [ ]"},
      {"#1 5", "needs '='", "part.ngc:7:5", "3.5.3 #n=value; spaces ignored so this is #15"},
      {"#6000=1", "#6000 does not exist", "part.ngc:7:2", "3.2.1 parameters #1-#5399"},
      {"G1 X", "value is missing", "part.ngc:7:5", "3.3.2 a word is a letter and a value"},
      {"N", "followed by digits", "part.ngc:7:1", "3.3.1 line number"},
      {"G1 X1 %", "stand alone", "part.ngc:7:7", "ISO 6983-1: % marks program start/end"},
      {"G1 X1 \x01", "byte 0x01", "part.ngc:7:7", "3.3: printable characters only"},
  };
  for (const auto& c : cases) {
    SCOPED_TRACE(std::string(c.text) + " -- " + c.section);
    expect_input_error([&] { read(c.text); }, {c.message, c.where});
  }
}

TEST(rs274_block, accepts_what_the_format_allows) {
  const char* accepted[] = {
      "g0x1y2",                  // 3.3: spaces are optional, case is free
      "G 0 1 X 1 0 . 5",         // spaces anywhere, even inside numbers
      "N99999 G1 X1",            // five-digit line number
      "N123456789 G1 X1",        // nine digits: accepted for long programs
      "G1 X[1+2] Y#1 Z-ABS[3]",  // 3.5 expressions, parameters, functions
      "#1=2 #2=#1",              // settings only
      "M3 M8 M7",                // one M code per group (M7 and M8 together)
      "(MSG, any text here)",    // comment
      "G1 X1 ; trailing",        // ; comment
  };
  for (const char* text : accepted) EXPECT_NO_THROW(read(text)) << text;
  EXPECT_EQ(read("G 0 1 X 1 0 . 5").word('x')->value, 10.5);
}

TEST(rs274_block, overlong_line_is_refused_with_the_limit_named) {
  const std::string line(5000, 'X');
  expect_input_error([&] { read(line); }, {"part.ngc:7", "5000 characters", "at most 4096"});
  const std::string long_but_fine = "G1 X1 (" + std::string(4000, 'c') + ")";
  EXPECT_NO_THROW(read(long_but_fine));
}

}  // namespace
}  // namespace dovetailor
