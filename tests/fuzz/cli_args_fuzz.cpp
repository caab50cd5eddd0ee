// libFuzzer target for the command-line parsing of `pins` and `fit` (flags
// only: no file is read). The input is split at newlines into arguments; the
// first byte chooses the subcommand. Any input must end in an exit code,
// never a crash or an escaped exception. Built only with -DDOVETAILOR_FUZZ=ON.

#include <cstddef>
#include <cstdint>
#include <cstdio>
#include <string>
#include <vector>

#include "../../src/cli/app.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  if (size == 0) return 0;
  std::vector<std::string> args = {"dovetailor", data[0] % 2 ? "pins" : "fit"};
  std::string current;
  for (std::size_t i = 1; i < size; ++i) {
    const char c = static_cast<char>(data[i]);
    if (c == '\n') {
      args.push_back(current);
      current.clear();
    } else {
      current += c;
    }
  }
  if (!current.empty()) args.push_back(current);
  // Flags only: a bare word would name a job file to read.
  for (const auto& a : args)
    if (a.find('/') != std::string::npos || a.find('.') == 0) return 0;
  for (std::size_t i = 2; i < args.size(); ++i)
    if (!args[i].starts_with("-") && (i == 2 || !args[i - 1].starts_with("--"))) return 0;
  std::vector<const char*> argv;
  for (const auto& a : args) argv.push_back(a.c_str());
  std::FILE* quiet = std::freopen("/dev/null", "w", stdout);
  (void)quiet;
  const int code = dovetailor::cli::run_cli(static_cast<int>(argv.size()), argv.data());
  if (code == 3) __builtin_trap();  // an internal error is a bug
  return 0;
}
