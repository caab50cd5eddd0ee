// dovetailor gcode: the RS-274 program for a job, through a post definition.

#include <ctime>
#include <filesystem>

#include <fmt/format.h>

#include <dovetailor/base/error.hpp>
#include <dovetailor/base/text_wrap.hpp>
#include <dovetailor/gcode/gcode_words.hpp>
#include <dovetailor/gcode/gcode_writer.hpp>
#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/plan/planner.hpp>
#include <dovetailor/report/plan_note_text.hpp>

#include "commands.hpp"
#include "file_io.hpp"
#include "flags.hpp"
#include "post_lookup.hpp"
#include "program_output.hpp"

namespace dovetailor::cli {

std::string today() {
  const std::time_t now = std::time(nullptr);
  std::tm local{};
  localtime_r(&now, &local);
  char text[16];
  std::strftime(text, sizeof text, "%Y-%m-%d", &local);
  return text;
}

void print_plan_warnings(const Plan& plan) {
  for (const auto& w : warning_texts(plan)) {
    const std::string first = "dovetailor: warning: ";
    bool start = true;
    for (const auto& line : wrap_words(w, 80 - first.size())) {
      fmt::print(stderr, "{}{}\n", start ? first : std::string(first.size(), ' '), line);
      start = false;
    }
  }
}

// Refuses to write the program over the job file it was made from.
void refuse_job_file(const std::string& output, const std::string& job_file) {
  namespace fs = std::filesystem;
  std::error_code ec;
  if (fs::exists(output, ec) && fs::equivalent(output, job_file, ec))
    throw InputError("is the job file; give another output file", {output}, "-o");
}

namespace {

struct GcodeOptions {
  std::string job_file;
  std::string post = "rs274ngc-full";
  std::string output;
  std::string coolant = "flood";
  bool force = false;
};

void run_gcode(const GcodeOptions& o) {
  const Job job = read_job(read_text_file(o.job_file), o.job_file);
  const Post post = load_post(o.post);
  const Plan p = plan(job);
  const std::string program = write_program(
      p, post, {.date = today(), .coolant = parse_word<CoolantChoice>(o.coolant, "--coolant")});
  const std::string output = o.output.empty() ? "-" : o.output;
  if (!is_standard_output(output)) refuse_job_file(output, o.job_file);
  write_output(output, program, o.force);
  print_plan_warnings(p);
}

}  // namespace

void setup_gcode(CLI::App& app) {
  auto o = std::make_shared<GcodeOptions>();
  auto* cmd = app.add_subcommand(
      "gcode", "The RS-274 program for a job, with a stop at every pin checkpoint.");
  cmd->add_option("job", o->job_file, "Job file (TOML)")->required();
  cmd->add_option("--post", o->post,
                  "Post name (in the post folder) or path of a post file; default rs274ngc-full");
  cmd->add_option("-o,--output", o->output,
                  "Write the program to this file (default, or -: stdout)");
  cmd->add_option("--coolant", o->coolant, "flood (default), mist or off");
  cmd->add_flag("--force", o->force, "Replace the output file if it exists");
  cmd->callback([o] { run_gcode(*o); });
}

}  // namespace dovetailor::cli
