#pragma once

namespace dovetailor::cli {

// The whole command line: parses argv, runs the subcommand, reports errors on
// stderr and returns the exit code (0 success, 1 a check found errors, 2 bad
// input, 3 internal error). Kept apart from main() so tests and the fuzz
// target can drive it in-process.
int run_cli(int argc, const char* const* argv);

}  // namespace dovetailor::cli
