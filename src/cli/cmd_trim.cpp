// dovetailor trim: after measuring at a checkpoint, the corrective passes.

#include <cmath>

#include <fmt/format.h>

#include <dovetailor/base/error.hpp>
#include <dovetailor/gcode/gcode_words.hpp>
#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/plan/planner.hpp>
#include <dovetailor/plan/trim.hpp>
#include <dovetailor/report/trim_report.hpp>

#include "commands.hpp"
#include "file_io.hpp"
#include "flags.hpp"
#include "post_lookup.hpp"
#include "program_output.hpp"

namespace dovetailor::cli {
namespace {

struct TrimOptions {
  std::string job_file;
  std::string checkpoint;
  double reading = std::nan("");
  double depth = std::nan("");
  double at = 0;
  std::string post = "rs274ngc-full";
  std::string output;
  std::string coolant = "flood";
  bool sheet = false;
  bool force = false;
};

void run_trim(const TrimOptions& o) {
  const Job job = read_job(read_text_file(o.job_file), o.job_file);
  const Post post = load_post(o.post);
  const Plan p = plan(job);
  if (std::isnan(o.reading))
    throw InputError("give the measured reading, in the job's units", {}, "--reading");
  TrimRequest request{.checkpoint = find_checkpoint(p, o.checkpoint),
                      .reading = to_mm(o.reading, job.units)};
  if (!std::isnan(o.depth)) request.depth = to_mm(o.depth, job.units);
  request.at_y = to_mm(o.at, job.units);
  const Trim t = trim(p, request);
  fmt::print("{}", format_trim(p, t, o.sheet ? SizingStyle::Plain : sizing_style(p, post)));
  if (t.verdict == TrimVerdict::OverCut)
    throw InputError("the part is cut past size; no corrective passes written", {}, "--reading");
  if (t.verdict != TrimVerdict::Trim) return;
  if (o.sheet) {
    fmt::print("\n{}", trim_sheet(p, t));
    return;
  }
  const std::string program =
      write_program(t.passes, post,
                    {.date = today(),
                     .coolant = parse_word<CoolantChoice>(o.coolant, "--coolant"),
                     .title = fmt::format("dovetailor trim after checkpoint {} of {}", t.letter,
                                          job.part.name.empty() ? o.job_file : job.part.name)});
  if (o.output.empty()) {
    fmt::print("\nCorrective program (post {}):\n{}", post.name, program);
    return;
  }
  refuse_job_file(o.output, o.job_file);
  write_file_atomically(o.output, program, o.force);
  fmt::print("\nCorrective program written to {} (post {}).\n", o.output, post.name);
}

}  // namespace

void setup_trim(CLI::App& app) {
  auto o = std::make_shared<TrimOptions>();
  auto* cmd = app.add_subcommand(
      "trim", "After measuring at a checkpoint: stock per flank, and the passes that finish it.");
  cmd->add_option("job", o->job_file, "Job file (TOML)")->required();
  cmd->add_option("--checkpoint", o->checkpoint,
                  "Checkpoint number (1, 2, ...) or letter (A, B, ...)")
      ->required();
  cmd->add_option("--reading", o->reading, "Measured pin reading, in the job's units")->required();
  cmd->add_option("--depth", o->depth, "Measured depth from the top face, in the job's units");
  cmd->add_option("--at", o->at,
                  "Where the reading was taken: y from the front end, in the job's units "
                  "(default 0; matters on a tapered gib)");
  cmd->add_option("--post", o->post, "Post name or path for the corrective program");
  cmd->add_option("-o,--output", o->output, "Write the corrective program to this file");
  cmd->add_option("--coolant", o->coolant, "flood (default), mist or off");
  cmd->add_flag("--sheet", o->sheet, "Lines for a manual machine instead of a program");
  cmd->add_flag("--force", o->force, "Replace the output file if it exists");
  cmd->callback([o] { run_trim(*o); });
}

}  // namespace dovetailor::cli
