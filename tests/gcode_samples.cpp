// Writes a few programs through the block formatter, one per shipped post,
// for the independent read-back test (tests/node/check_program.js). For each
// post NAME it writes NAME.ngc and NAME.points.json into the directory given
// on the command line: the program and the end point (program units) that
// every line with X, Y or Z words must reach, null where an axis word is an
// expression the reader cannot evaluate.
//
// It also writes the program of every sample job for every shipped post
// (SAMPLE.POST.ngc) with its expected end points (SAMPLE.POST.points.json),
// derived here from the plan's moves and the path rules documented in
// gcode_writer.hpp (lead-in and lead-out of compensated passes, the length
// offset move, the park move), not from the writer's output; and the
// compensation data the read-back checks the RS274NGC entry/exit rules with
// (SAMPLE.POST.comp.json). One more program, fixture-slide-female with the
// full post less cutter compensation, exercises the #parameter style.
//
// Usage: gcode_samples OUTPUT_DIR

#include <algorithm>
#include <cmath>
#include <filesystem>
#include <fstream>
#include <iostream>
#include <map>
#include <sstream>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include <dovetailor/gcode/gcode_writer.hpp>
#include <dovetailor/gcode/program_text.hpp>
#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/plan/planner.hpp>

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

// The end points a program for `plan` must reach, in program units, in the
// order of its motion lines; null for a line whose X is an expression.
struct Expected {
  const Post& post;
  Units units;
  json points = json::array();
  Point3 at{};
  std::map<char, std::string> last;

  std::string text(double mm) const { return format_length(mm, post, units); }
  void point() {
    points.push_back(
        json::array({from_mm(at.x, units), from_mm(at.y, units), from_mm(at.z, units)}));
  }
  void move(Point3 to, bool x_expression = false) {
    bool moved = x_expression;
    const auto axis = [&](char letter, double value) {
      const std::string t = text(value);
      if (last[letter] != t) moved = true;
      last[letter] = t;
    };
    if (!x_expression) axis('X', to.x);
    axis('Y', to.y);
    axis('Z', to.z);
    if (x_expression) last['X'] = "expression";
    if (!moved) return;
    at = to;
    if (x_expression)
      points.push_back(json());
    else
      point();
  }
};

void write_job_program(const std::string& out_dir, const std::string& file_name, const Job& job,
                       const Post& post) {
  const Plan plan = dovetailor::plan(job);
  const std::string program = write_program(plan, post, {.date = "2000-01-01"});
  const Units units = program_units(post, job.units);
  Expected e{.post = post, .units = units, .last = {}};
  const bool female = plan.target.type == DovetailType::Female;
  const bool comp = post.cutter_compensation && job.dovetail.ends == Ends::Open;
  const bool params = !comp && post.parameters;
  double cutter_radius = 0;
  json radius = json::object();
  int tool = -1;
  for (const auto& op : plan.operations) {
    const Tool* t = find_tool(job, op.tool);
    if (op.kind == OperationKind::Undercut) {
      cutter_radius = t->diameter / 2;
      radius[std::to_string(t->number)] = from_mm(cutter_radius, units);
    }
    if (op.tool != tool) {  // the length-offset move to the safe height
      e.last = {{'Z', e.text(plan.safe_z)}};
      e.at.z = plan.safe_z;
      e.point();
    }
    tool = op.tool;
    for (const auto& pass : op.passes) {
      const bool sized =
          op.kind == OperationKind::Undercut && pass.side && pass.role != PassRole::Rough;
      if (sized && comp) {
        // The programmed path is the flank line: the axis moved toward the
        // flank by R (R sqrt(1 + m^2) across X on a taper).
        const bool right = *pass.side == Side::Right;
        const double toward = (female == right) ? 1.0 : -1.0;
        const double off =
            toward * cutter_radius * std::sqrt(1 + pass.taper_slope * pass.taper_slope);
        const double y0 = pass.cut_start().y, y1 = pass.cut.back().to.y;
        const double dir = y1 > y0 ? 1.0 : -1.0;
        const double lead = cutter_radius + plan.clearance;
        const auto line = [&](double y, double z) { return Point3{pass.x_at(y) + off, y, z}; };
        for (const auto& m : pass.entry) e.move(line(y0 - dir * lead, m.to.z));
        e.move(line(y0, pass.z));
        e.move(line(y1, pass.z));
        e.move(line(y1 + dir * lead, pass.z));
        for (const auto& m : pass.exit) e.move(line(y1 + dir * lead, m.to.z));
        continue;
      }
      for (const auto& m : pass.moves()) e.move(m.to, sized && params);
    }
  }
  double park = 0;
  for (const auto& t : job.tools) park = std::max(park, t.diameter / 2);
  e.move({e.at.x, e.at.y, plan.safe_z});
  e.move({0, -(park + plan.clearance), plan.safe_z});
  std::ofstream(out_dir + "/" + file_name + ".ngc") << program;
  std::ofstream(out_dir + "/" + file_name + ".points.json") << e.points.dump(1) << "\n";
  std::ofstream(out_dir + "/" + file_name + ".comp.json")
      << json{{"radius", radius}, {"stock_y", {0, from_mm(job.stock.length, units)}}}.dump(1)
      << "\n";
}

void write_job_programs(const std::string& source, const std::string& out_dir) {
  const char* samples[] = {"fixture-slide-female", "fixture-slide-male", "stop-block-male",
                           "height-stop-half-female", "spindle-slide-tapered-female"};
  const char* posts[] = {"rs274ngc-full", "small-control", "iso6983-numbered"};
  for (const char* sample : samples) {
    const std::string job_file = source + "/samples/" + sample + ".toml";
    const Job job = read_job(read(job_file), job_file);
    for (const char* name : posts) {
      const Post post = read_post(read(source + "/post/" + name + ".toml"), name);
      write_job_program(out_dir, std::string(sample) + "." + name, job, post);
    }
  }
  const std::string job_file = source + "/samples/fixture-slide-female.toml";
  Post post = read_post(read(source + "/post/rs274ngc-full.toml"), "rs274ngc-full");
  post.cutter_compensation = false;
  write_job_program(out_dir, "fixture-slide-female.parameters", read_job(read(job_file), job_file),
                    post);
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
    write_job_programs(DOVETAILOR_SOURCE_DIR, argv[1]);
  } catch (const std::exception& e) {
    std::cerr << "gcode_samples: " << e.what() << "\n";
    return 1;
  }
  return 0;
}
