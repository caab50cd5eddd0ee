// Writes a few programs through the block formatter, one per shipped post,
// for the independent read-back test (tests/node/check_program.js). For each
// post NAME it writes NAME.ngc and NAME.points.json into the directory given
// on the command line: the program and the end point (program units) that
// every line with X, Y or Z words must reach, null where an axis word is an
// expression the reader cannot evaluate.
//
// Usage: gcode_samples OUTPUT_DIR

#include <filesystem>
#include <fstream>
#include <iostream>
#include <sstream>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include <dovetailor/program_text.hpp>

namespace {

using namespace dovetailor;
using nlohmann::json;

std::string read(const std::string& path) {
  std::ifstream in(path);
  if (!in) throw std::runtime_error("cannot open " + path);
  std::stringstream text;
  text << in.rdbuf();
  return text.str();
}

struct Sample {
  ProgramText program;
  json points = json::array();
  double x = 0, y = 0, z = 0;  // mm

  void move(const Block& block) {
    program.add(block);
    bool moved = false, known = true;
    for (const auto& w : block.words) {
      if (w.letter != 'X' && w.letter != 'Y' && w.letter != 'Z') continue;
      moved = true;
      if (!w.expression.empty()) known = false;
      (w.letter == 'X' ? x : w.letter == 'Y' ? y : z) = w.value;
    }
    if (!moved) return;
    const Units u = program.units();
    points.push_back(known ? json::array({from_mm(x, u), from_mm(y, u), from_mm(z, u)}) : json());
  }
};

// The same dovetail-like path for every post: approach, down, a cut along Y,
// an arc, a retract. Lengths in mm.
void common_path(Sample& s, const Post& post) {
  const bool ijk = post.arc_format == ArcFormat::Centre;
  s.move({.words = {{'G', 0}, {'X', -18.3}, {'Y', -6}}, .comment = "approach, front end"});
  s.move({.words = {{'G', 0}, {'Z', 2}}});
  s.move({.words = {{'G', 1}, {'Z', -0.00001}, {'F', 150}}, .comment = "touch the top face"});
  s.move({.words = {{'G', 1}, {'Z', -6.35}, {'F', 120}}});
  s.move({.words = {{'G', 1}, {'Y', 160.1234}, {'F', 380}}, .comment = "left flank, conventional"});
  // Quarter circle of radius 5 about (-13.3, 160.1234), counterclockwise.
  if (ijk)
    s.move({.words = {{'G', 3}, {'X', -13.3}, {'Y', 165.1234}, {'I', 5}, {'J', 0}}});
  else
    s.move({.words = {{'G', 3}, {'X', -13.3}, {'Y', 165.1234}, {'R', 5}}});
  s.move({.words = {{'G', 1}, {'X', 0.00002}}, .comment = "to the centre line (60\u00b0 slide)"});
  s.move({.words = {{'G', 0}, {'Z', 25}}, .comment = "retract: out from under the overhang first"});
}

void write_sample(const std::string& post_dir, const std::string& out_dir, const std::string& name,
                  Units units) {
  const Post post = read_post(read(post_dir + "/" + name + ".toml"), name + ".toml");
  Sample s{.program = ProgramText(post, units)};
  s.program.add_comment("sample program for read-back: " + post.description);
  s.move({.words = {{'G', units == Units::Inch ? 20.0 : 21.0}, {'G', 90}, {'G', 17}, {'G', 94}}});
  for (const auto& block : tool_change_blocks(post, 1, "1/2 in end mill, roughing")) s.move(block);
  if (post.tool_length_offset) s.move({.words = {{'G', 43}, {'H', 1}, {'Z', 25}}});
  s.move({.words = {{'S', 1800}, {'M', 3}, {'M', 8}}});
  common_path(s, post);
  if (post.cutter_compensation) {
    s.move({.words = {{'G', 41}, {'D', 1}, {'X', -20}, {'Y', -6}}, .comment = "compensated"});
    s.move({.words = {{'G', 40}, {'X', -25}}});
  }
  if (post.parameters) {
    s.move({.settings = {{.number = 101, .length = 0.127}}, .comment = "finish allowance"});
    s.move({.words = {{'G', 1}, {.letter = 'X', .expression = "[-0.5 + #101]"}, {'F', 200}}});
    s.move({.words = {{'G', 0}, {'X', 0}, {'Y', 0}, {'Z', 25}}});
  }
  if (post.optional_stop)
    s.move({.words = {{'M', 1}}, .comment = "measure over pins"});
  else
    s.move({.words = {{'M', 0}}, .comment = "measure over pins, spindle stopped"});
  s.move({.words = {{'M', 9}, {'M', 5}}});

  std::ofstream(out_dir + "/" + name + ".ngc") << s.program.finish();
  std::ofstream(out_dir + "/" + name + ".points.json") << s.points.dump(1) << "\n";
}

}  // namespace

int main(int argc, char** argv) {
  if (argc != 2) {
    std::cerr << "usage: gcode_samples OUTPUT_DIR\n";
    return 2;
  }
  try {
    std::filesystem::create_directories(argv[1]);
    const std::string post_dir = std::string(DOVETAILOR_SOURCE_DIR) + "/post";
    write_sample(post_dir, argv[1], "rs274ngc-full", Units::Inch);
    write_sample(post_dir, argv[1], "small-control", Units::Millimetre);
    write_sample(post_dir, argv[1], "iso6983-numbered", Units::Millimetre);
  } catch (const std::exception& e) {
    std::cerr << "gcode_samples: " << e.what() << "\n";
    return 1;
  }
  return 0;
}
