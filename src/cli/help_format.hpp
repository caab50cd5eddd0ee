#pragma once

#include <string>

#include <CLI/CLI.hpp>

namespace dovetailor::cli {

// CLI11's help layout with every description wrapped to fit an 80-column
// terminal: names in a 28-column left column, words beside them.
class HelpFormatter : public CLI::Formatter {
 public:
  HelpFormatter();
  std::string make_option_desc(const CLI::Option* option) const override;
  std::string make_subcommand(const CLI::App* sub) const override;
  std::string make_description(const CLI::App* app) const override;
};

}  // namespace dovetailor::cli
