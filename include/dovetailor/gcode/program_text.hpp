#pragma once

#include <string>
#include <string_view>

#include <dovetailor/base/units.hpp>
#include <dovetailor/gcode/gcode_block.hpp>
#include <dovetailor/shop/post.hpp>

namespace dovetailor {

// Builds the text of one program for one post: the post's start lines, the
// blocks in the order added, the post's end lines, each line ended by '\n'.
// It keeps the line-number state: when the post numbers lines, every line
// except a lone "%" gets the next N value (Post::line_numbers). Pure: no I/O.
//
//   ProgramText program(post, Units::Inch);
//   program.add_comment("Female dovetail, fixture slide");
//   program.add({.words = {{'G', 0}, {'X', 12.7}, {'Y', -6.35}}});
//   std::string text = program.finish();
class ProgramText {
 public:
  // Writes the start lines. Throws InputError (key "units") when the control
  // does not accept `units`.
  ProgramText(Post post, Units units);

  // Throws what format_block throws.
  void add(const Block& block);
  void add_comment(std::string_view text);

  // Writes the end lines and returns the whole program; the builder is empty
  // afterwards (start a new ProgramText for another program).
  std::string finish();

  Units units() const { return units_; }
  const Post& post() const { return post_; }

 private:
  void add_verbatim(const std::string& line, std::string_view key);
  void append(const std::string& lines);

  Post post_;
  Units units_;
  long next_number_;
  std::string text_;
};

}  // namespace dovetailor
