#pragma once

#include <string>
#include <string_view>
#include <vector>

#include <dovetailor/base/units.hpp>
#include <dovetailor/shop/post.hpp>

namespace dovetailor {

// One word of a block: a letter and its value. Values are in the core's
// units and are converted on writing:
//   X Y Z I J K R  lengths in mm, written in the program's units at the post's
//                  decimal places (Post::decimals.inch / .mm);
//   F              feed in mm per minute, written per minute in the program's
//                  units at Post::decimals.feed places;
//   S              spindle speed in rpm, written as a whole number;
//   G M            codes such as 1, 43 or 64.1 (one decimal at most);
//   T H D          tool, length-offset and radius-offset numbers (whole);
//   P              dwell time in seconds for G4 (two decimals at most).
// A word with a non-empty `expression` writes that text instead of the value,
// e.g. {.letter = 'X', .expression = "[-12.7 + #101]"}; it is written as
// given (already in the program's units) and needs Post::parameters. The N
// word is never part of a block: the line-number state supplies it.
struct Word {
  char letter = 'G';
  double value = 0;
  std::string expression{};

  bool operator==(const Word&) const = default;
};

// "#101=0.005": sets a numbered parameter (RS274NGC: #1 to #5399; the value
// takes effect after the whole line is read). `length` is in mm and written in
// the program's units; a non-empty `expression` is written instead.
struct ParameterSetting {
  int number = 0;
  double length = 0;
  std::string expression{};

  bool operator==(const ParameterSetting&) const = default;
};

// One block (one line of the program, or several when a long comment must be
// split). Words are written in the fixed order N, G, X Y Z, I J K, R, P, F,
// S, T, H, D, M whatever order they are given in; several G words and several
// M words keep the order given. Parameter settings follow the words, the
// comment comes last.
struct Block {
  std::vector<Word> words{};
  std::vector<ParameterSetting> settings{};
  std::string comment{};

  bool operator==(const Block&) const = default;
};

// `value` rounded to `decimals` places, trailing zeros dropped, the decimal
// point always kept: 1.25, 1., 0., -0.5, 12.346. A value that rounds to zero
// is written "0.", never "-0." or "-0". The point is kept on whole numbers
// because controls that read a number without a point in least input
// increments would take "X1" as 0.0001 in (common practice, no source);
// RS274NGC accepts a number ending in a point (NISTIR 6556, from memory:
// section 3.3.2.1).
std::string format_number(double value, int decimals);

// An internal length (mm) as written in `units` for this post.
std::string format_length(double mm, const Post& post, Units units);

// Writes one block for `post` in program units `units`. When the post numbers
// lines, the first line gets N`line_number` and every further line (a split
// comment) the next number up by Post::line_numbers.step; the number of lines
// written is the number of '\n' in the result plus one. Lines are separated by
// '\n' with none at the end.
//
// Comments are written in the post's style; characters that would end or
// nest a parenthesised comment, '%' (ISO 6983 end of program on tape
// controls) and anything outside printable ASCII are replaced. When the block
// does not fit Post::max_line_length, its comment goes on comment-only lines
// before the words, split at spaces.
//
// Throws InputError naming the post key when the post does not allow what the
// block asks for (G41/G42/G40/D without cutter_compensation, G43/G49/H without
// tool_length_offset, M6 without tool_changer, M1 without optional_stop,
// G80 to G89 without canned_cycles, expressions or settings without
// parameters, I J K or R against arc_format,
// units the control does not accept, a words line longer than
// max_line_length, line numbers past 99999). A malformed block (unknown
// letter, a letter twice, a negative feed, an N word) is a programming mistake
// and throws std::logic_error.
std::string format_block(const Block& block, const Post& post, Units units, long line_number = 0);

// The blocks that get tool `tool` into the spindle. With a tool changer:
// "T<n> M6" with `description` as comment. Without: the spindle is stopped
// (M5) and the program stops (M0) with a comment asking the operator to
// change to tool <n>, then press cycle start.
std::vector<Block> tool_change_blocks(const Post& post, int tool, std::string_view description);

}  // namespace dovetailor
