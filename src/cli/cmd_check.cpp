// dovetailor check: simulates a program against the job's stock and measures
// the result with virtual pins.

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdio>
#include <optional>
#include <string>
#include <unistd.h>
#include <vector>

#include <fmt/format.h>

#include <dovetailor/check/checker.hpp>
#include <dovetailor/drawing/check_drawing.hpp>
#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/report/check_report.hpp>

#include "commands.hpp"
#include "drawing_output.hpp"
#include "file_io.hpp"
#include "file_program_source.hpp"

namespace dovetailor::cli {
namespace {

struct CheckCommandOptions {
  std::string program;
  std::string job_file;
  int stations = 5;
  bool json = false;
  std::string draw;      // drawing output file, empty for none
  int draw_station = 0;  // 1-based; 0 picks the station most worth a look
  PngSize png;
  bool force = false;
  // The program's frame, over the job's [program] table (job's units).
  std::string zero;
  std::string slide;
  std::vector<std::string> offsets;  // "G54=X..,Y..,Z.."
  std::vector<std::string> homes;    // "G28=X..,Y..,Z.."
};

double flag_number(const std::string& text, const std::string& flag, const std::string& value) {
  std::size_t used = 0;
  double v = 0;
  try {
    v = std::stod(text, &used);
  } catch (const std::exception&) {
    used = 0;
  }
  if (used == 0 || used != text.size() || !std::isfinite(v) || std::fabs(v) > 1e6)
    throw InputError(fmt::format("\"{}\" is not a number in \"{}\"", text, value), {}, flag);
  return v;
}

std::vector<std::string> split(const std::string& text, char by) {
  std::vector<std::string> parts;
  std::size_t start = 0;
  for (;;) {
    const auto at = text.find(by, start);
    parts.push_back(text.substr(start, at - start));
    if (at == std::string::npos) return parts;
    start = at + 1;
  }
}

// "X1.5,Y-2,Z0" (axes left out are 0), in the job's units.
Point3 axis_point(const std::string& text, const std::string& flag, const std::string& value,
                  Units units) {
  Point3 p;
  std::string seen;
  for (const std::string& part : split(text, ',')) {
    const char axis =
        part.empty() ? ' ' : static_cast<char>(std::toupper(static_cast<unsigned char>(part[0])));
    if ((axis != 'X' && axis != 'Y' && axis != 'Z') || seen.find(axis) != std::string::npos)
      throw InputError(
          fmt::format("\"{}\": give the axes as X..,Y..,Z.., each at most once, "
                      "e.g. {}",
                      value, flag == "--home" ? "G28=X0,Y0,Z-10" : "G54=X-300,Y-150,Z-250"),
          {}, flag);
    seen += axis;
    const double v = to_mm(flag_number(part.substr(1), flag, value), units);
    (axis == 'X' ? p.x : axis == 'Y' ? p.y : p.z) = v;
  }
  return p;
}

// The flags' frame over the job's [program] table.
void apply_frame_flags(const CheckCommandOptions& o, Job& job) {
  ProgramSetup& p = job.program;
  if (!o.zero.empty()) {
    const auto parts = split(o.zero, ',');
    if (parts.size() != 3)
      throw InputError(fmt::format("\"{}\": give the program zero as X,Y,Z in the job's frame, "
                                   "e.g. -45,0,0",
                                   o.zero),
                       {}, "--zero");
    p.zero = {to_mm(flag_number(parts[0], "--zero", o.zero), job.units),
              to_mm(flag_number(parts[1], "--zero", o.zero), job.units),
              to_mm(flag_number(parts[2], "--zero", o.zero), job.units)};
  }
  if (!o.slide.empty()) {
    const std::string& w = o.slide;
    if (w == "+x" || w == "+X")
      p.slide = SlideAxis::PlusX;
    else if (w == "-x" || w == "-X")
      p.slide = SlideAxis::MinusX;
    else if (w == "+y" || w == "+Y")
      p.slide = SlideAxis::PlusY;
    else if (w == "-y" || w == "-Y")
      p.slide = SlideAxis::MinusY;
    else
      throw InputError(fmt::format("\"{}\" is not one of +x, -x, +y, -y", w), {}, "--slide");
  }
  static const std::vector<std::string> systems{"G54", "G55",   "G56",   "G57",  "G58",
                                                "G59", "G59.1", "G59.2", "G59.3"};
  for (const std::string& value : o.offsets) {
    const auto eq = value.find('=');
    std::string name = value.substr(0, eq);
    for (char& c : name) c = static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
    const auto it = std::find(systems.begin(), systems.end(), name);
    if (eq == std::string::npos || it == systems.end())
      throw InputError(fmt::format("\"{}\": give a system G54 to G59.3 and its origin in machine "
                                   "coordinates, e.g. G54=X-300,Y-150,Z-250",
                                   value),
                       {}, "--offset");
    p.offsets[static_cast<std::size_t>(it - systems.begin())] =
        axis_point(value.substr(eq + 1), "--offset", value, job.units);
  }
  for (const std::string& value : o.homes) {
    const auto eq = value.find('=');
    std::string name = value.substr(0, eq);
    for (char& c : name) c = static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
    if (eq == std::string::npos || (name != "G28" && name != "G30"))
      throw InputError(fmt::format("\"{}\": give G28 or G30 and the home position in machine "
                                   "coordinates, e.g. G28=X0,Y0,Z0",
                                   value),
                       {}, "--home");
    (name == "G28" ? p.g28_home : p.g30_home) =
        axis_point(value.substr(eq + 1), "--home", value, job.units);
  }
}

void run_check(const CheckCommandOptions& o) {
  if (o.job_file.empty())
    throw InputError(
        "--job is missing: the checker needs the job file (TOML) for the stock, the finished "
        "section, the tools and the pins; give --job JOB.toml",
        {o.program}, "--job");
  if (!o.draw.empty()) require_drawing_format(o.draw, "--draw");
  if (o.draw_station > o.stations)
    throw InputError(fmt::format("--draw-station {} is beyond the {} stations checked (--stations)",
                                 o.draw_station, o.stations),
                     {o.program}, "--draw-station");
  Job job = read_job(read_text_file(o.job_file), o.job_file);
  apply_frame_flags(o, job);
  FileProgramSource source(o.program);
  // Opened before the long work, so a refused output (it exists, no --force)
  // is said at once; the file appears only when the drawing is whole.
  std::optional<AtomicFile> drawing_file;
  if (!o.draw.empty()) drawing_file.emplace(o.draw, o.force);
  CheckOptions options{.stations = o.stations};
  const bool terminal = isatty(fileno(stderr)) != 0;
  if (terminal)
    options.progress = [](long lines) { fmt::print(stderr, "\rchecking: line {}", lines); };
  const CheckReport report = check(source, job, options);
  if (terminal) fmt::print(stderr, "\r{:40}\r", "");
  if (drawing_file) {
    const std::size_t station =
        o.draw_station > 0 ? static_cast<std::size_t>(o.draw_station - 1) : station_to_draw(report);
    drawing_file->write(
        drawing_file_bytes(build_check_drawing(report, job, station), o.draw, o.png));
    drawing_file->commit();
  }
  fmt::print("{}", o.json ? check_json(report) + "\n" : format_check_report(report));
  std::fflush(stdout);
  if (report.has_errors()) throw ExitCode{1};
}

}  // namespace

void setup_check(CLI::App& app) {
  auto o = std::make_shared<CheckCommandOptions>();
  auto* cmd = app.add_subcommand(
      "check",
      "Simulate an RS-274 program against the job's stock and measure the result with virtual "
      "pins. Exit code 0 clean, 1 errors found, 2 bad input.");
  cmd->add_option("program", o->program, "Program file (RS-274/NGC); - for standard input")
      ->required();
  cmd->add_option("--job", o->job_file, "Job file (TOML): stock, dovetail, tools, pins");
  cmd->add_option("--stations", o->stations,
                  "Section planes along the slide (both ends and evenly between)")
      ->check(CLI::Range(1, 1000));
  cmd->add_flag("--json", o->json, "Print the report as JSON");
  cmd->add_option("--draw", o->draw,
                  "Also draw the simulated section over the target: .svg, .png or .pdf");
  cmd->add_option("--draw-station", o->draw_station,
                  "Station to draw, 1 = front end (default: the one most worth a look)")
      ->check(CLI::Range(1, 1000));
  cmd->add_option("--zero", o->zero,
                  "Program zero in the job's frame, X,Y,Z in the job's units (over [program] "
                  "zero)");
  cmd->add_option("--slide", o->slide,
                  "The program's axis along the slide, front to back: +x, -x, +y or -y");
  cmd->add_option("--offset", o->offsets,
                  "A work offset in machine coordinates, e.g. G54=X-300,Y-150,Z-250 (repeat "
                  "for more)")
      ->expected(1)
      ->multi_option_policy(CLI::MultiOptionPolicy::TakeAll);
  cmd->add_option("--home", o->homes,
                  "A home position in machine coordinates: G28=X..,Y..,Z.. or G30=...")
      ->expected(1)
      ->multi_option_policy(CLI::MultiOptionPolicy::TakeAll);
  add_png_size_options(*cmd, o->png);
  cmd->add_flag("--force", o->force, "Replace an existing drawing file");
  cmd->callback([o] { run_check(*o); });
}

}  // namespace dovetailor::cli
