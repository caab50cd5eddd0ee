#include <fstream>
#include <sstream>

#include <gtest/gtest.h>

#include <dovetailor/shop/post.hpp>

#include "test_support.hpp"

namespace dovetailor {
namespace {

using testing::expect_input_error;
using testing::source_path;

Post load(const std::string& name) {
  std::ifstream in(source_path("post/" + name));
  EXPECT_TRUE(in) << "cannot open post/" << name;
  std::stringstream text;
  text << in.rdbuf();
  return read_post(text.str(), name);
}

TEST(post, full_rs274ngc_post_allows_every_feature) {
  const Post post = load("rs274ngc-full.toml");
  EXPECT_EQ(post.name, "rs274ngc-full");
  EXPECT_EQ(post.units, PostUnits::Both);
  EXPECT_FALSE(post.line_numbers.enabled);
  EXPECT_EQ(post.comments, CommentStyle::Parentheses);
  EXPECT_TRUE(post.tool_changer);
  EXPECT_TRUE(post.tool_length_offset);
  EXPECT_TRUE(post.cutter_compensation);
  EXPECT_TRUE(post.parameters);
  EXPECT_TRUE(post.optional_stop);
  EXPECT_TRUE(post.canned_cycles);
  EXPECT_EQ(post.arc_format, ArcFormat::Centre);
  // RS274NGC line limit, 256 characters (NISTIR 6556, from memory: section 3.3).
  EXPECT_EQ(post.max_line_length, 256);
  EXPECT_EQ(post.end_lines, std::vector<std::string>{"M2"});
  // RS274NGC coolant codes M7 mist, M8 flood, M9 off (NISTIR 6556, from memory: 3.6.4).
  EXPECT_EQ(post.coolant, (CoolantCodes{.flood = 8, .mist = 7, .off = 9}));
}

TEST(post, small_control_post_has_no_compensation_changer_or_parameters) {
  const Post post = load("small-control.toml");
  EXPECT_FALSE(post.tool_changer);
  EXPECT_FALSE(post.tool_length_offset);
  EXPECT_FALSE(post.cutter_compensation);
  EXPECT_FALSE(post.parameters);
  EXPECT_FALSE(post.optional_stop);
  EXPECT_FALSE(post.canned_cycles);
  EXPECT_EQ(post.arc_format, ArcFormat::Radius);
  EXPECT_EQ(post.coolant.mist, std::nullopt);
  EXPECT_EQ(post.coolant.flood, 8);
}

TEST(post, iso6983_post_numbers_lines_and_frames_with_percent) {
  const Post post = load("iso6983-numbered.toml");
  EXPECT_TRUE(post.line_numbers.enabled);
  EXPECT_EQ(post.line_numbers.start, 10);
  EXPECT_EQ(post.line_numbers.step, 10);
  EXPECT_TRUE(post.two_digit_codes);
  // ISO 6983-1: "%" program start and end character (from memory).
  EXPECT_EQ(post.start_lines, std::vector<std::string>{"%"});
  EXPECT_EQ(post.end_lines, (std::vector<std::string>{"M30", "%"}));
}

TEST(post, a_byte_order_mark_and_crlf_line_ends_read_the_same_post) {
  std::ifstream in(source_path("post/rs274ngc-full.toml"));
  std::stringstream text;
  text << in.rdbuf();
  std::string saved = "\xEF\xBB\xBF";
  for (char ch : text.str()) saved += ch == '\n' ? std::string("\r\n") : std::string(1, ch);
  EXPECT_EQ(read_post(saved, "p.toml"), read_post(text.str(), "p.toml"));
}

TEST(post, empty_file_is_refused_as_nameless) {
  expect_input_error([] { read_post("", "empty.toml"); }, {"empty.toml", "name", "missing"});
}

TEST(post, named_file_gives_documented_defaults) {
  const Post post = read_post("name = \"bare\"\n", "bare.toml");
  Post defaults;
  defaults.name = "bare";
  EXPECT_EQ(post, defaults);
  EXPECT_EQ(post.decimals, (Decimals{.inch = 4, .mm = 3, .feed = 1}));
  EXPECT_EQ(post.line_numbers, (LineNumbers{.enabled = false, .start = 10, .step = 10}));
}

TEST(post, program_units_follow_the_job_unless_the_control_refuses_them) {
  Post metric_only;
  metric_only.units = PostUnits::Millimetre;
  EXPECT_FALSE(accepts(metric_only, Units::Inch));
  EXPECT_EQ(program_units(metric_only, Units::Inch), Units::Millimetre);
  EXPECT_EQ(program_units(Post{}, Units::Inch), Units::Inch);
}

TEST(post, unknown_key_is_named_with_its_line) {
  expect_input_error([] { read_post("name = \"x\"\ntool_chnager = true\n", "p.toml"); },
                     {"p.toml:2", "tool_chnager", "unknown key", "tool_changer"});
  expect_input_error([] { read_post("[decimals]\ninch = 4\nfeeds = 1\n", "p.toml"); },
                     {"p.toml:3", "decimals.feeds", "valid keys here are: inch, mm, feed"});
}

TEST(post, wrong_type_is_named_with_its_line) {
  expect_input_error([] { read_post("name = \"x\"\ntool_changer = \"yes\"\n", "p.toml"); },
                     {"p.toml:2", "tool_changer", "expected true or false"});
  expect_input_error([] { read_post("start = \"%\"\n", "p.toml"); },
                     {"p.toml:1", "start", "expected an array"});
  expect_input_error([] { read_post("end = [\"M2\", 30]\n", "p.toml"); },
                     {"p.toml:1", "end", "string in quotes"});
}

TEST(post, out_of_range_value_says_what_is_valid) {
  expect_input_error([] { read_post("[decimals]\n\ninch = 9\n", "p.toml"); },
                     {"p.toml:3", "decimals.inch", "from 1 to 6"});
  expect_input_error([] { read_post("max_line_length = 300\n", "p.toml"); },
                     {"p.toml:1", "max_line_length", "from 32 to 256"});
  expect_input_error([] { read_post("[line_numbers]\nstep = 0\n", "p.toml"); },
                     {"p.toml:2", "line_numbers.step", "from 1 to 1000"});
  expect_input_error([] { read_post("comments = \"slashes\"\n", "p.toml"); },
                     {"p.toml:1", "comments", "\"parentheses\", \"semicolon\""});
  expect_input_error([] { read_post("units = \"metric\"\n", "p.toml"); },
                     {"p.toml:1", "units", "\"inch\", \"mm\", \"both\""});
  expect_input_error([] { read_post("arc_format = \"center\"\n", "p.toml"); },
                     {"p.toml:1", "arc_format", "\"ijk\", \"radius\""});
}

TEST(post, start_and_end_lines_must_be_readable_by_a_control) {
  expect_input_error([] { read_post("start = [\"%\", \"\"]\n", "p.toml"); },
                     {"p.toml:1", "start", "empty line"});
  expect_input_error([] { read_post("start = [\"(60\u00b0 slide)\"]\n", "p.toml"); },
                     {"p.toml:1", "start", "printable ASCII"});
  expect_input_error(
      [] {
        read_post("max_line_length = 32\nend = [\"(this end line is longer than the limit)\"]\n",
                  "p.toml");
      },
      {"p.toml:2", "end", "max_line_length is 32"});
}

TEST(post, coolant_codes_cannot_reuse_stop_or_spindle_codes) {
  // M3, M5, M6 already mean spindle and tool change (NISTIR 6556, from memory: 3.6).
  expect_input_error([] { read_post("[coolant]\nflood = 6\n", "p.toml"); },
                     {"p.toml:2", "coolant.flood", "M6 already means"});
  expect_input_error([] { read_post("[coolant]\noff = \"none\"\n", "p.toml"); },
                     {"coolant.off", "needs a code to switch it off"});
  expect_input_error([] { read_post("[coolant]\nmist = \"no\"\n", "p.toml"); },
                     {"p.toml:2", "coolant.mist", "\"none\""});
  const Post none = read_post(
      "name = \"x\"\n[coolant]\nflood = \"none\"\nmist = \"none\"\noff = \"none\"\n", "p");
  EXPECT_EQ(none.coolant, (CoolantCodes{std::nullopt, std::nullopt, std::nullopt}));
}

TEST(post, toml_syntax_error_names_line) {
  expect_input_error([] { read_post("name = \"x\"\nunits = \n", "p.toml"); },
                     {"p.toml:2", "not valid TOML"});
}

}  // namespace
}  // namespace dovetailor
