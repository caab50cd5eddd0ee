#include "app.hpp"

#include <cstdio>
#include <exception>

#include <fmt/format.h>

#include <dovetailor/base/error.hpp>

#include "commands.hpp"
#include "help_format.hpp"

namespace dovetailor::cli {

int run_cli(int argc, const char* const* argv) {
  CLI::App app{
      "dovetailor: plans, programs and checks dovetail slides cut on milling machines, with "
      "pin-measurement checkpoints.",
      "dovetailor"};
  app.formatter(std::make_shared<HelpFormatter>());
  app.require_subcommand(1);
  app.set_version_flag("--version", "dovetailor 0.1.0");
  setup_new(app);
  setup_pins(app);
  setup_fit(app);
  setup_plan(app);
  setup_gcode(app);
  setup_trim(app);
  setup_sheet(app);
  setup_draw(app);
  setup_check(app);
  setup_materials(app);
  std::string names;
  bool known = false;
  for (const auto* sub : app.get_subcommands({})) {
    names += (names.empty() ? "" : ", ") + sub->get_name();
    known = known || (argc > 1 && sub->get_name() == argv[1]);
  }
  if (argc > 1 && argv[1][0] != '-' && !known) {
    fmt::print(stderr, "dovetailor: unknown command \"{}\"; the commands are: {}\n", argv[1],
               names);
    return 2;
  }
  try {
    app.parse(argc, argv);
  } catch (const CLI::Success& e) {
    return app.exit(e);
  } catch (const CLI::ParseError& e) {
    app.exit(e);
    return 2;
  } catch (const ExitCode& e) {
    return e.code;
  } catch (const InputError& e) {
    fmt::print(stderr, "dovetailor: {}\n", e.what());
    return 2;
  } catch (const std::exception& e) {
    fmt::print(stderr, "dovetailor: internal error: {}\n", e.what());
    return 3;
  }
  return 0;
}

}  // namespace dovetailor::cli
