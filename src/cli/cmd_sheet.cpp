// dovetailor sheet: the printed pass sheet for the machine, as text or PDF.

#include <filesystem>

#include <fmt/format.h>

#include <dovetailor/base/error.hpp>
#include <dovetailor/drawing/drawing.hpp>
#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/plan/planner.hpp>
#include <dovetailor/render/cairo_render.hpp>
#include <dovetailor/report/sheet.hpp>
#include <dovetailor/report/sheet_text.hpp>

#include "commands.hpp"
#include "file_io.hpp"
#include "program_output.hpp"

namespace dovetailor::cli {
namespace {

struct SheetCommandOptions {
  std::string job_file;
  std::string output;
  std::string date;
  std::string paper = "letter";
  bool force = false;
};

void run_sheet(const SheetCommandOptions& o) {
  // "-" is the text sheet on standard output; a PDF needs a file (binary
  // data on a terminal is garbage, and a pipe can take the text).
  const std::string ext = is_standard_output(o.output) ? ".txt" : output_extension(o.output);
  if (ext != ".txt" && ext != ".pdf")
    throw InputError(
        "give an output file ending in .txt (plain text) or .pdf, or - for the text "
        "on standard output",
        {o.output}, "-o");
  const Job job = read_job(read_text_file(o.job_file), o.job_file);
  const Plan p = plan(job);
  const Sheet sheet = build_sheet(p, {.date = o.date.empty() ? today() : o.date});
  if (ext == ".txt") {
    write_output(o.output, sheet_text(sheet), o.force);
  } else {
    const Drawing drawing = build_drawing(p);
    write_file_atomically(
        o.output, sheet_pdf(sheet, &drawing, o.paper == "a4" ? Paper::A4 : Paper::Letter), o.force);
  }
  print_plan_warnings(p);
}

}  // namespace

void setup_sheet(CLI::App& app) {
  auto o = std::make_shared<SheetCommandOptions>();
  auto* cmd = app.add_subcommand(
      "sheet", "The pass sheet for the machine: settings, dials, checkpoints (.txt or .pdf).");
  cmd->add_option("job", o->job_file, "Job file (TOML)")->required();
  cmd->add_option("-o,--output", o->output,
                  "Output file: .txt or .pdf by the extension; - for the text on stdout")
      ->required();
  cmd->add_option("--date", o->date, "Date printed in the title block (default: today)");
  cmd->add_option("--paper", o->paper, "Paper for a PDF: letter (default) or a4")
      ->check(CLI::IsMember({"letter", "a4"}));
  cmd->add_flag("--force", o->force, "Replace an existing output file");
  cmd->callback([o] { run_sheet(*o); });
}

}  // namespace dovetailor::cli
