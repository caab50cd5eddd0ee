// The bad-input catalogue: malformed and hostile inputs fed to the real
// command line. For each: exit code 2, a message on stderr naming the file,
// line and key (or the flag), no stack trace or internal error, nothing on
// stdout for commands that would write a file, no output file created, and
// the input files left as they were.

#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <map>
#include <sstream>
#include <string>
#include <sys/wait.h>
#include <vector>

#include <gtest/gtest.h>

#include "test_support.hpp"

namespace dovetailor {
namespace {

namespace fs = std::filesystem;

struct RunResult {
  int exit_code = -1;
  std::string out;
  std::string err;
};

std::string quote(const std::string& arg) {
  std::string q = "'";
  for (char c : arg) q += c == '\'' ? std::string("'\\''") : std::string(1, c);
  return q + "'";
}

std::string slurp(const fs::path& p) {
  std::ifstream in(p, std::ios::binary);
  std::stringstream s;
  s << in.rdbuf();
  return s.str();
}

// Runs the binary in `dir` with `args`; stdout and stderr go to files beside it.
RunResult run(const fs::path& dir, const std::vector<std::string>& args) {
  const fs::path logs = dir.parent_path() / (dir.filename().string() + ".logs");
  fs::create_directories(logs);
  std::string command = "cd " + quote(dir.string()) + " && " + quote(DOVETAILOR_BINARY);
  for (const auto& a : args) {
    command += ' ';
    command += quote(a);
  }
  command += " > " + quote((logs / "out").string()) + " 2> " + quote((logs / "err").string());
  const int status = std::system(command.c_str());
  RunResult r;
  r.exit_code = WIFEXITED(status) ? WEXITSTATUS(status) : -1;
  r.out = slurp(logs / "out");
  r.err = slurp(logs / "err");
  return r;
}

// A file's bytes, or `size` copies of `fill` made only when the case runs:
// every case runs in its own test process, and each would otherwise build
// (and copy) the 100 MiB input just to list the tests.
struct Content {
  Content(std::string t) : text(std::move(t)) {}  // NOLINT: implicit by design
  Content(const char* t) : text(t) {}             // NOLINT: implicit by design
  Content(std::size_t n, char c) : size(n), fill(c) {}
  std::string bytes() const { return size ? std::string(size, fill) : text; }

  std::string text;
  std::size_t size = 0;
  char fill = 0;
};

struct Case {
  std::string name;
  std::map<std::string, Content> files;  // written into the work folder first
  std::vector<std::string> args;
  std::vector<std::string> expect;  // parts of stderr
  int exit_code = 2;
};

// Test names show the case name, not its bytes.
void PrintTo(const Case& c, std::ostream* os) { *os << c.name; }

std::string sample() { return testing::read_source_file("samples/fixture-slide-female.toml"); }

// The sample with the first occurrence of `from` replaced.
std::string with(const std::string& from, const std::string& to) {
  std::string text = sample();
  const auto at = text.find(from);
  if (at == std::string::npos) throw std::logic_error("catalogue: no '" + from + "' in the sample");
  return text.replace(at, from.size(), to);
}

Case job_case(std::string name, std::string text, std::vector<std::string> expect,
              std::string command = "pins") {
  return {
      std::move(name), {{"job.toml", std::move(text)}}, {command, "job.toml"}, std::move(expect)};
}

// A string of the bytes of a literal, embedded NULs included (not the final one).
template <std::size_t N>
std::string bytes(const char (&literal)[N]) {
  return std::string(literal, N - 1);
}

std::vector<Case> catalogue() {
  std::vector<Case> c;
  // ---- job files: types, keys, units ----
  c.push_back(job_case("angle_as_text", with("angle = 60\ndepth", "angle = \"60\"\ndepth"),
                       {"job.toml:14:", "dovetail.angle", "expected a number"}));
  c.push_back(
      job_case("units_missing", with("units = \"inch\"\n", ""), {"job.toml:", "units", "missing"}));
  c.push_back(job_case("units_unknown", with("units = \"inch\"", "units = \"cm\""),
                       {"job.toml:3:", "units", "\"inch\", \"mm\""}));
  c.push_back(job_case("units_mixed_in_a_value", with("depth = 0.375", "depth = \"9.5 mm\""),
                       {"job.toml:15:", "dovetail.depth", "expected a number"}));
  c.push_back(job_case("units_twice", with("units = \"inch\"", "units = \"inch\"\nunits = \"mm\""),
                       {"job.toml:4:", "not valid TOML"}));
  c.push_back(job_case("negative_depth", with("depth = 0.375", "depth = -0.375"),
                       {"job.toml:15:", "dovetail.depth", "out of range"}));
  c.push_back(job_case("zero_width", with("width = 1.500", "width = 0"),
                       {"job.toml:16:", "dovetail.width", "greater than zero"}));
  c.push_back(job_case("negative_stock",
                       with("size = [3.000, 6.000, 1.250]", "size = [3.0, -6.0, 1.25]"),
                       {"job.toml:10:", "stock.size", "out of range"}));
  c.push_back(job_case("zero_stock", with("size = [3.000, 6.000, 1.250]", "size = [3.0, 0, 1.25]"),
                       {"job.toml:10:", "stock.size", "greater than zero"}));
  for (const char* spelling : {"nan", "+nan", "-nan", "inf", "+inf", "-inf"})
    c.push_back(job_case(std::string("depth_") +
                             (spelling[0] == '+'   ? "plus_"
                              : spelling[0] == '-' ? "minus_"
                                                   : "") +
                             (spelling[0] == '+' || spelling[0] == '-' ? spelling + 1 : spelling),
                         with("depth = 0.375", std::string("depth = ") + spelling),
                         {"job.toml:15:", "dovetail.depth", "finite"}));
  c.push_back(job_case("nan_in_stock",
                       with("size = [3.000, 6.000, 1.250]", "size = [nan, 6.0, 1.25]"),
                       {"job.toml:10:", "stock.size", "out of range"}));
  c.push_back(job_case("absurd_depth", with("depth = 0.375", "depth = 1e300"),
                       {"job.toml:15:", "dovetail.depth", "out of range"}));
  c.push_back(job_case("absurd_integer", with("flutes = 4", "flutes = 9223372036854775807"),
                       {"tool[1].flutes", "out of range"}));
  c.push_back(job_case("integer_overflow", with("flutes = 4", "flutes = 99999999999999999999"),
                       {"job.toml:", "not valid TOML"}));
  for (const char* angle : {"0", "90", "180"})
    c.push_back(job_case(std::string("angle_") + angle,
                         with("angle = 60\ndepth", std::string("angle = ") + angle + "\ndepth"),
                         {"job.toml:14:", "dovetail.angle", "from 30 to 75"}));
  c.push_back(job_case("cutter_angle_mismatch", with("angle = 60\nneck", "angle = 55\nneck"),
                       {"job.toml", "tool.angle", "55 deg but the dovetail is 60 deg"}, "plan"));
  c.push_back(job_case("pin_cannot_touch_the_flank",
                       with("pin_diameter = 0.2500", "pin_diameter = 0.6"),
                       {"job.toml:46:", "gauge.pin_diameter", "flank ends"}));
  c.push_back(job_case("pin_on_the_fillet", with("corner_radius = 0.010", "corner_radius = 0.2"),
                       {"job.toml", "gauge.pin_diameter", "fillet"}, "plan"));
  c.push_back(job_case("empty_file", "", {"job.toml:", "units", "missing"}));
  c.push_back(job_case("only_whitespace", "\n\n   \n", {"job.toml:", "units", "missing"}));
  c.push_back(job_case("binary_garbage",
                       bytes("\x7f"
                             "ELF\x02\x01\x01\0\0\0\xff\xfe\x80"),
                       {"job.toml:1:", "not valid TOML"}));
  c.push_back(
      job_case("invalid_utf8", "units = \"\xc3\x28\"\n", {"job.toml:1:", "not valid TOML"}));
  c.push_back(job_case("unknown_key", with("depth = 0.375", "depth = 0.375\ndepht = 1"),
                       {"job.toml:16:", "dovetail.depht", "unknown key"}));
  c.push_back(job_case("unknown_table", sample() + "\n[spindle]\nrpm = 3\n",
                       {"job.toml:", "spindle", "unknown key"}));
  c.push_back(job_case("duplicate_key", with("depth = 0.375", "depth = 0.375\ndepth = 0.4"),
                       {"job.toml:16:", "not valid TOML"}));
  c.push_back(job_case("tool_kind_unknown", with("kind = \"end-mill\"", "kind = \"router\""),
                       {"tool[1].kind", "\"end-mill\", \"dovetail\""}));
  c.push_back(job_case("tool_number_twice", with("number = 2", "number = 1"),
                       {"tool[2].number", "used twice"}));
  c.push_back(job_case("tool_number_negative", with("number = 1", "number = -1"),
                       {"tool[1].number", "out of range"}));
  c.push_back(job_case("flutes_zero", with("flutes = 4", "flutes = 0"),
                       {"tool[1].flutes", "out of range"}));
  c.push_back(job_case("flutes_fraction", with("flutes = 4", "flutes = 2.5"),
                       {"tool[1].flutes", "whole number"}));
  c.push_back(job_case("neck_too_thick", with("neck_diameter = 0.375", "neck_diameter = 0.8"),
                       {"tool[2].neck_diameter", "small diameter"}));
  c.push_back(job_case("tool_not_a_table",
                       with("[[tool]]\nnumber = 1", "tool = 1\n[[toolx]]\nnumber = 1"),
                       {"job.toml:", "tool"}));
  c.push_back(job_case("gib_on_square_side", with("sides = \"both\"", "sides = \"left\""),
                       {"dovetail.gib.side", "square"}));
  c.push_back(job_case("tolerance_reversed",
                       with("tolerance = [0.0, 0.001]", "tolerance = [0.001, 0.0]"),
                       {"job.toml:", "dovetail.tolerance", "lower limit"}));
  c.push_back(job_case("tolerance_too_fine",
                       with("tolerance = [0.0, 0.001]", "tolerance = [0.0, 0.0001]"),
                       {"dovetail.tolerance", "finer than the machine"}, "plan"));
  c.push_back(job_case("chamfer_deeper_than_dovetail", with("chamfer = 0.015", "chamfer = 0.5"),
                       {"dovetail.chamfer", "smaller than the depth"}));
  c.push_back(job_case("stock_too_narrow",
                       with("size = [3.000, 6.000, 1.250]", "size = [1.5, 6.0, 1.25]"),
                       {"job.toml:10:", "stock.size", "stock spans"}));
  c.push_back(job_case("stock_too_shallow",
                       with("size = [3.000, 6.000, 1.250]", "size = [3.0, 6.0, 0.25]"),
                       {"dovetail.depth", "stock is only"}));
  {
    std::string text = with("width = 1.500", "width = 0.2");
    const std::string top = "width_at = \"top\"";
    text.replace(text.find(top), top.size(), "width_at = \"bottom\"");
    c.push_back(job_case("mouth_closes", text, {"dovetail.width", "flanks cross"}));
  }
  c.push_back(job_case("closed_ends", with("ends = \"open\"", "ends = \"closed\""),
                       {"dovetail.ends", "cannot plunge"}, "plan"));
  c.push_back(job_case("unknown_material",
                       with("material = \"cast iron\"", "material = \"cheese\""),
                       {"part.material", "cheese"}, "plan"));
  c.push_back(job_case("no_dovetail_table", "units = \"mm\"\n[stock]\nsize = [10, 10, 10]\n",
                       {"job.toml:", "dovetail", "missing table"}));
  c.push_back(
      job_case("width_and_mate",
               with("width = 1.500",
                    "width = 1.5\nmate = { type = \"male\", reading = 2.0, pin_diameter = 0.25 }"),
               {"dovetail.width", "either width or mate"}));
  c.push_back(job_case("bad_checkpoint_word",
                       sample() + "\n[strategy]\ncheckpoints = [\"sometimes\"]\n",
                       {"strategy.checkpoints", "after-roughing"}));
  c.push_back(job_case("bad_direction", sample() + "\n[strategy]\ndirection = \"sideways\"\n",
                       {"strategy.direction", "\"conventional\", \"climb\""}));
  c.push_back(job_case("bad_machine_kind", with("kind = \"cnc\"", "kind = \"lathe\""),
                       {"machine.kind", "\"cnc\", \"manual\""}));
  c.push_back(
      job_case("deep_nesting",
               "units = \"mm\"\nx = " + std::string(5000, '[') + std::string(5000, ']') + "\n",
               {"job.toml:2:", "not valid TOML"}));
  c.push_back(job_case("million_character_line",
                       "units = \"mm\"\n" + std::string(1000000, 'x') + "\n",
                       {"job.toml:2:", "not valid TOML"}));
  c.push_back(job_case("file_over_16_mib", "units = \"mm\"\n#" + std::string(17u << 20, 'c') + "\n",
                       {"job.toml", "larger than 16 MiB"}));
  c.push_back({"job_is_a_folder", {{"dir/keep", "x"}}, {"pins", "dir"}, {"dir", "is a folder"}});
  c.push_back({"job_missing", {}, {"plan", "nothing.toml"}, {"nothing.toml", "cannot open"}});
  // ---- post files (through gcode --post PATH -o FILE: no file may appear) ----
  const std::string post = testing::read_source_file("post/rs274ngc-full.toml");
  const auto post_case = [&](std::string name, std::string text, std::vector<std::string> expect) {
    return Case{std::move(name),
                {{"job.toml", sample()}, {"bad-post.toml", std::move(text)}},
                {"gcode", "job.toml", "--post", "bad-post.toml", "-o", "out.ngc"},
                std::move(expect)};
  };
  const auto post_with = [&](const std::string& from, const std::string& to) {
    std::string text = post;
    const auto at = text.find(from);
    if (at == std::string::npos) throw std::logic_error("catalogue: no '" + from + "' in the post");
    return text.replace(at, from.size(), to);
  };
  c.push_back(post_case("post_empty", "", {"bad-post.toml", "name"}));
  c.push_back(post_case("post_unknown_key", post + "\nspeed_limit = 3\n",
                        {"bad-post.toml:", "speed_limit", "unknown key"}));
  c.push_back(post_case("post_decimals_nan", post_with("inch = 4", "inch = nan"),
                        {"bad-post.toml:", "decimals.inch"}));
  c.push_back(post_case("post_decimals_huge", post_with("inch = 4", "inch = 99"),
                        {"bad-post.toml:", "decimals.inch", "out of range"}));
  c.push_back(post_case("post_units_wrong", post_with("units = \"both\"", "units = \"furlongs\""),
                        {"bad-post.toml:", "units"}));
  c.push_back(post_case("post_flag_as_text",
                        post_with("tool_changer = true", "tool_changer = \"yes\""),
                        {"bad-post.toml:", "tool_changer", "true or false"}));
  c.push_back(post_case("post_coolant_code_taken", post_with("flood = 8", "flood = 6"),
                        {"bad-post.toml:", "coolant.flood"}));
  c.push_back(post_case("post_line_length_tiny",
                        post_with("max_line_length = 256", "max_line_length = 3"),
                        {"bad-post.toml:", "max_line_length", "out of range"}));
  c.push_back(post_case("post_binary", bytes("\x00\x01\x02PK\x03\x04"),
                        {"bad-post.toml", "not valid TOML"}));
  c.push_back({"post_missing",
               {{"job.toml", sample()}},
               {"gcode", "job.toml", "--post", "nowhere.toml", "-o", "out.ngc"},
               {"nowhere.toml", "cannot open"}});
  c.push_back({"gcode_output_over_the_job",
               {{"job.toml", sample()}},
               {"gcode", "job.toml", "-o", "job.toml", "--force"},
               {"job.toml"}});
  // ---- programs (through check --job) ----
  const std::string male = testing::read_source_file("samples/stop-block-male.toml");
  const auto program_case = [&](std::string name, Content text, std::vector<std::string> expect) {
    return Case{std::move(name),
                {{"job.toml", male}, {"part.ngc", std::move(text)}},
                {"check", "part.ngc", "--job", "job.toml"},
                std::move(expect)};
  };
  c.push_back(
      program_case("program_unknown_word", "G21 G90\nG1 X1 Q5 F100\n", {"part.ngc:2", "Q"}));
  c.push_back(program_case("program_two_motion_codes", "G21\nG0 G1 X1 F100\n", {"part.ngc:2"}));
  c.push_back(program_case("program_bad_number", "G21\nG1 X1.2.3 F100\n", {"part.ngc:2"}));
  c.push_back(
      program_case("program_division_by_zero", "G21\n#1 = [1 / 0]\n", {"part.ngc:2", "zero"}));
  c.push_back(program_case("program_deep_nesting",
                           "G21\nG0 X" + std::string(200, '[') + "1" + std::string(200, ']') + "\n",
                           {"part.ngc:2", "nest"}));
  c.push_back(program_case("program_million_character_line",
                           "G21\n(" + std::string(1000000, 'x') + ")\n", {"part.ngc:2"}));
  c.push_back(program_case("program_100_mib_without_newline", Content(std::size_t{100} << 20, 'G'),
                           {"part.ngc:1"}));
  c.push_back(program_case("program_binary_garbage",
                           bytes("\x7f"
                                 "ELF\x02\x01\x01\0\0\0\xff\xfe\x80"),
                           {"part.ngc:1"}));
  c.push_back(
      program_case("program_arc_without_centre", "G21 G17\nG2 X10 Y0 F100\n", {"part.ngc:2"}));
  c.push_back(program_case("program_feed_without_f", "G21 G94\nG1 X10\n", {"part.ngc:2", "F"}));
  c.push_back(
      {"program_without_job", {{"part.ngc", "G21\nM2\n"}}, {"check", "part.ngc"}, {"--job"}});
  // ---- command lines ----
  c.push_back({"pins_without_anything", {}, {"pins"}, {"--type", "missing"}});
  c.push_back(
      {"pins_angle_not_a_number", {}, {"pins", "--type", "male", "--angle", "abc"}, {"--angle"}});
  c.push_back(
      {"pins_angle_90",
       {},
       {"pins", "--type", "male", "--angle", "90", "--depth", "1", "--pin", "1", "--width", "5"},
       {"--angle", "out of range"}});
  c.push_back(
      {"pins_negative_depth",
       {},
       {"pins", "--type", "male", "--angle", "60", "--depth", "-1", "--pin", "1", "--width", "5"},
       {"--depth", "out of range"}});
  c.push_back(
      {"pins_zero_pin",
       {},
       {"pins", "--type", "female", "--angle", "60", "--depth", "1", "--pin", "0", "--width", "5"},
       {"--pin", "out of range"}});
  c.push_back({"pins_nan_reading",
               {},
               {"pins", "--type", "female", "--angle", "60", "--depth", "1", "--pin", "1",
                "--reading", "nan"},
               {"--reading"}});
  c.push_back({"pins_infinite_width",
               {},
               {"pins", "--type", "female", "--angle", "60", "--depth", "1", "--pin", "1",
                "--width", "inf"},
               {"--width", "out of range"}});
  c.push_back({"fit_one_job", {{"job.toml", sample()}}, {"fit", "job.toml"}, {"two job files"}});
  c.push_back({"fit_two_females",
               {{"a.toml", sample()}, {"b.toml", sample()}},
               {"fit", "a.toml", "b.toml"},
               {"both jobs are female"}});
  c.push_back({"fit_only_angle", {}, {"fit", "--angle", "60"}, {"--female-pin", "missing"}});
  c.push_back(
      {"fit_negative_male_depth",
       {},
       {"fit", "--angle", "60", "--female-reading", "1", "--female-pin", "0.25", "--female-depth",
        "0.375", "--male-reading", "1.9", "--male-pin", "0.25", "--male-depth", "-0.3"},
       {"--male-depth", "out of range"}});
  c.push_back(
      {"fit_nan_male_depth",
       {},
       {"fit", "--angle", "60", "--female-reading", "1", "--female-pin", "0.25", "--female-depth",
        "0.375", "--male-reading", "1.9", "--male-pin", "0.25", "--male-depth", "nan"},
       {"--male-depth"}});
  c.push_back({"pins_overlapping_female_pins",
               {},
               {"pins", "--type", "female", "--units", "mm", "--angle", "60", "--depth", "4",
                "--width", "10", "--pin", "3.7"},
               {"--pin", "overlap"}});
  c.push_back({"materials_unknown_name",
               {},
               {"materials", "unobtainium"},
               {"unknown material", "nearest names"}});
  c.push_back({"materials_bad_units", {}, {"materials", "--units", "furlong"}, {"--units"}});
  c.push_back({"unknown_subcommand", {}, {"carve"}, {"carve", "pins, fit, plan"}});
  c.push_back({"unknown_flag", {}, {"pins", "--colour", "red"}, {"--colour"}});
  c.push_back({"plan_two_jobs", {{"a.toml", sample()}}, {"plan", "a.toml", "a.toml"}, {"a.toml"}});
  return c;
}

class bad_input : public ::testing::TestWithParam<Case> {};

TEST_P(bad_input, is_refused_clearly_and_leaves_no_file) {
  const Case& c = GetParam();
  const fs::path dir = fs::temp_directory_path() / ("dovetailor-bad-" + c.name);
  fs::remove_all(dir);
  fs::remove_all(dir.string() + ".logs");
  fs::create_directories(dir);
  for (const auto& [name, content] : c.files) {
    fs::create_directories((dir / name).parent_path());
    std::ofstream(dir / name, std::ios::binary) << content.bytes();
  }
  const RunResult r = run(dir, c.args);
  EXPECT_EQ(r.exit_code, c.exit_code) << r.err;
  for (const auto& part : c.expect)
    EXPECT_NE(r.err.find(part), std::string::npos) << "stderr: " << r.err << "\nmissing: " << part;
  for (const char* bad : {"terminate called", "internal error", "Aborted",
                          "what():", "AddressSanitizer", "runtime error"})
    EXPECT_EQ(r.err.find(bad), std::string::npos) << r.err;
  EXPECT_LT(r.err.size(), 2000u) << "a message, not a dump";
  // Nothing created, nothing changed.
  std::size_t count = 0;
  for (const auto& entry : fs::recursive_directory_iterator(dir))
    count += entry.is_regular_file() ? 1 : 0;
  EXPECT_EQ(count, c.files.size());
  for (const auto& [name, content] : c.files)
    EXPECT_TRUE(slurp(dir / name) == content.bytes()) << name << " was changed";
  fs::remove_all(dir);
  fs::remove_all(dir.string() + ".logs");
}

INSTANTIATE_TEST_SUITE_P(catalogue, bad_input, ::testing::ValuesIn(catalogue()),
                         [](const auto& param_info) { return param_info.param.name; });

// Unusual but valid encodings are read, not refused.
TEST(bad_input, crlf_bom_and_non_ascii_comments_are_accepted) {
  std::string text = sample();
  std::string crlf;
  for (char ch : text) crlf += ch == '\n' ? std::string("\r\n") : std::string(1, ch);
  crlf = "\xef\xbb\xbf# Schwalbenschwanz, queue d'aronde \xe2\x80\x94 \xc2\xb0\r\n" + crlf;
  const fs::path dir = fs::temp_directory_path() / "dovetailor-good-crlf";
  fs::remove_all(dir);
  fs::create_directories(dir);
  std::ofstream(dir / "job.toml", std::ios::binary) << crlf;
  const RunResult r = run(dir, {"pins", "job.toml"});
  EXPECT_EQ(r.exit_code, 0) << r.err;
  EXPECT_NE(r.out.find("1.3583 in"), std::string::npos);
  fs::remove_all(dir);
  fs::remove_all(dir.string() + ".logs");
}

}  // namespace
}  // namespace dovetailor
