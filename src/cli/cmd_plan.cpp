// dovetailor plan: the cutting plan with its pin-measurement checkpoints.

#include <fmt/format.h>

#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/plan/planner.hpp>
#include <dovetailor/report/plan_report.hpp>

#include "commands.hpp"
#include "file_io.hpp"

namespace dovetailor::cli {
namespace {

struct PlanOptions {
  std::string job_file;
  bool json = false;
};

void run_plan(const PlanOptions& o) {
  const Job job = read_job(read_text_file(o.job_file), o.job_file);
  const Plan p = plan(job);
  fmt::print("{}", o.json ? plan_json(p) + "\n" : format_plan(p));
}

}  // namespace

void setup_plan(CLI::App& app) {
  auto o = std::make_shared<PlanOptions>();
  auto* cmd = app.add_subcommand(
      "plan", "Roughing and finishing passes for a job, with pin-measurement checkpoints.");
  cmd->add_option("job", o->job_file, "Job file (TOML)")->required();
  cmd->add_flag("--json", o->json, "Print the plan as JSON");
  cmd->callback([o] { run_plan(*o); });
}

}  // namespace dovetailor::cli
