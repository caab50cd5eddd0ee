// dovetailor check: simulates a program against the job's stock and measures
// the result with virtual pins.

#include <cstdio>
#include <unistd.h>

#include <fmt/format.h>

#include <dovetailor/checker.hpp>
#include <dovetailor/job_reader.hpp>

#include "commands.hpp"
#include "file_io.hpp"
#include "file_program_source.hpp"

namespace dovetailor::cli {
namespace {

struct CheckCommandOptions {
  std::string program;
  std::string job_file;
  int stations = 5;
  bool json = false;
};

void run_check(const CheckCommandOptions& o) {
  if (o.job_file.empty())
    throw InputError(
        "--job is missing: the checker needs the job file (TOML) for the stock, the finished "
        "section, the tools and the pins; give --job JOB.toml",
        {o.program}, "--job");
  const Job job = read_job(read_text_file(o.job_file), o.job_file);
  FileProgramSource source(o.program);
  CheckOptions options{.stations = o.stations};
  const bool terminal = isatty(fileno(stderr)) != 0;
  if (terminal)
    options.progress = [](long lines) { fmt::print(stderr, "\rchecking: line {}", lines); };
  const CheckReport report = check(source, job, options);
  if (terminal) fmt::print(stderr, "\r{:40}\r", "");
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
  cmd->callback([o] { run_check(*o); });
}

}  // namespace dovetailor::cli
