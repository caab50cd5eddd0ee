// dovetailor draw: the cross-section to scale, as SVG, PNG or PDF.

#include <dovetailor/drawing/drawing.hpp>
#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/plan/planner.hpp>

#include "commands.hpp"
#include "drawing_output.hpp"
#include "file_io.hpp"

namespace dovetailor::cli {
namespace {

struct DrawOptions {
  std::string job_file;
  std::string output;
  PngSize png;
  bool force = false;
};

void run_draw(const DrawOptions& o) {
  require_drawing_format(o.output, "-o");
  const Job job = read_job(read_text_file(o.job_file), o.job_file);
  write_file_atomically(o.output, drawing_file_bytes(build_drawing(plan(job)), o.output, o.png),
                        o.force);
}

}  // namespace

void setup_draw(CLI::App& app) {
  auto o = std::make_shared<DrawOptions>();
  auto* cmd = app.add_subcommand(
      "draw", "The cross-section to scale: stock, part, each operation's cut, tools, pins.");
  cmd->add_option("job", o->job_file, "Job file (TOML)")->required();
  cmd->add_option("-o,--output", o->output, "Output file: .svg, .png or .pdf")->required();
  add_png_size_options(*cmd, o->png);
  cmd->add_flag("--force", o->force, "Replace an existing output file");
  cmd->callback([o] { run_draw(*o); });
}

}  // namespace dovetailor::cli
