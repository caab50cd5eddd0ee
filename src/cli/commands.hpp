#pragma once

#include <CLI/CLI.hpp>

namespace dovetailor::cli {

// Each subcommand lives in its own file: an options struct, a setup_...()
// that binds the options to a CLI11 subcommand and registers run_... as its
// callback. Errors for the user are thrown as InputError and caught in main.
void setup_new(CLI::App& app);
void setup_pins(CLI::App& app);
void setup_fit(CLI::App& app);
void setup_plan(CLI::App& app);
void setup_gcode(CLI::App& app);
void setup_trim(CLI::App& app);
void setup_sheet(CLI::App& app);
void setup_draw(CLI::App& app);
void setup_check(CLI::App& app);
void setup_materials(CLI::App& app);

// Thrown by a command that has written its output and must end the program
// with this exit code (check: 1 when it found errors); caught in main.
struct ExitCode {
  int code = 0;
};

}  // namespace dovetailor::cli
