#include <algorithm>
#include <utility>

#include <fmt/format.h>

#include <dovetailor/base/error.hpp>
#include <dovetailor/gcode/program_text.hpp>

namespace dovetailor {

ProgramText::ProgramText(Post post, Units units)
    : post_(std::move(post)), units_(units), next_number_(post_.line_numbers.start) {
  if (!accepts(post_, units_))
    throw InputError(fmt::format("the control accepts {} programs only",
                                 post_.units == PostUnits::Inch ? "inch" : "mm"),
                     {}, "post " + post_.name + ": units");
  for (const auto& line : post_.start_lines) add_verbatim(line, "start");
}

void ProgramText::append(const std::string& lines) {
  text_ += lines;
  text_ += '\n';
  if (post_.line_numbers.enabled)
    next_number_ += post_.line_numbers.step *
                    (1 + static_cast<long>(std::count(lines.begin(), lines.end(), '\n')));
}

void ProgramText::add(const Block& block) {
  append(format_block(block, post_, units_, next_number_));
}

void ProgramText::add_comment(std::string_view text) { add(Block{.comment = std::string(text)}); }

void ProgramText::add_verbatim(const std::string& line, std::string_view key) {
  if (line == "%" || !post_.line_numbers.enabled) {
    text_ += line + '\n';
    return;
  }
  std::string numbered = fmt::format("N{} {}", next_number_, line);
  if (next_number_ > 99999 || numbered.size() > static_cast<std::size_t>(post_.max_line_length))
    throw InputError(fmt::format("\"{}\" does not fit max_line_length {} or N99999 with its line "
                                 "number",
                                 numbered, post_.max_line_length),
                     {}, "post " + post_.name + ": " + std::string(key));
  text_ += numbered + '\n';
  next_number_ += post_.line_numbers.step;
}

std::string ProgramText::finish() {
  for (const auto& line : post_.end_lines) add_verbatim(line, "end");
  next_number_ = post_.line_numbers.start;
  return std::exchange(text_, {});
}

}  // namespace dovetailor
