#include "help_format.hpp"

#include <sstream>

#include <dovetailor/base/text_wrap.hpp>

namespace dovetailor::cli {
namespace {

constexpr std::size_t screen = 80;

// Each paragraph of `text` wrapped to `width`, lines joined by '\n' (CLI11
// indents what follows a '\n' to the description column).
std::string wrapped(const std::string& text, std::size_t width) {
  std::string out;
  std::istringstream paragraphs(text);
  std::string paragraph;
  while (std::getline(paragraphs, paragraph)) {
    for (const std::string& line : wrap_words(paragraph, width))
      out += (out.empty() ? "" : "\n") + line;
  }
  return out;
}

}  // namespace

HelpFormatter::HelpFormatter() { column_width(28); }

std::string HelpFormatter::make_option_desc(const CLI::Option* option) const {
  return wrapped(CLI::Formatter::make_option_desc(option), screen - 1 - get_column_width());
}

std::string HelpFormatter::make_subcommand(const CLI::App* sub) const {
  std::stringstream out;
  CLI::detail::format_help(out, sub->get_display_name(true),
                           wrapped(sub->get_description(), screen - 1 - get_column_width()),
                           get_column_width());
  return out.str();
}

std::string HelpFormatter::make_description(const CLI::App* app) const {
  const std::string text = CLI::Formatter::make_description(app);
  return text.empty() ? text : wrapped(text, screen - 1) + "\n";
}

}  // namespace dovetailor::cli
