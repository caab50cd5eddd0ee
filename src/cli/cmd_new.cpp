// dovetailor new: a commented job file to start from.

#include <dovetailor/input/job_template.hpp>

#include "commands.hpp"
#include "file_io.hpp"
#include "flags.hpp"

namespace dovetailor::cli {
namespace {

struct NewOptions {
  std::string type;
  std::string units;
  std::string output = "-";
  bool force = false;
};

void run_new(const NewOptions& o) {
  const DovetailType type = parse_word<DovetailType>(o.type, "--type");
  const Units units = parse_word<Units>(o.units, "--units");
  write_output(o.output, job_template(type, units), o.force);
}

}  // namespace

void setup_new(CLI::App& app) {
  auto o = std::make_shared<NewOptions>();
  auto* cmd = app.add_subcommand(
      "new", "A commented job file to start from: an example part to change to yours.");
  cmd->add_option("--type", o->type, "male or female")
      ->required()
      ->check(CLI::IsMember(keys_of<DovetailType>()));
  cmd->add_option("--units", o->units, "inch or mm: every length in the file")
      ->required()
      ->check(CLI::IsMember(keys_of<Units>()));
  cmd->add_option("-o,--output", o->output, "Write the job file here (default, or -: stdout)");
  cmd->add_flag("--force", o->force, "Replace the output file if it exists");
  cmd->callback([o] { run_new(*o); });
}

}  // namespace dovetailor::cli
