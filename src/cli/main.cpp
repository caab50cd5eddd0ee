#include <cstdio>
#include <exception>

#include <fmt/format.h>

#include <dovetailor/error.hpp>

#include "commands.hpp"

// Exit codes: 0 success, 1 a check found errors (check command), 2 bad input.
int main(int argc, char** argv) {
  CLI::App app{
      "dovetailor: plans, programs and checks dovetail slides cut on milling machines, with "
      "pin-measurement checkpoints.",
      "dovetailor"};
  app.require_subcommand(1);
  app.set_version_flag("--version", "dovetailor 0.1.0");
  dovetailor::cli::setup_pins(app);
  dovetailor::cli::setup_fit(app);
  dovetailor::cli::setup_plan(app);
  dovetailor::cli::setup_check(app);
  try {
    app.parse(argc, argv);
  } catch (const CLI::Success& e) {
    return app.exit(e);
  } catch (const CLI::ParseError& e) {
    app.exit(e);
    return 2;
  } catch (const dovetailor::cli::ExitCode& e) {
    return e.code;
  } catch (const dovetailor::InputError& e) {
    fmt::print(stderr, "dovetailor: {}\n", e.what());
    return 2;
  } catch (const std::exception& e) {
    fmt::print(stderr, "dovetailor: internal error: {}\n", e.what());
    return 3;
  }
  return 0;
}
