#pragma once

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include <dovetailor/base/units.hpp>

namespace dovetailor {

// A post definition: what the control that runs the program accepts and how
// it wants its blocks written. Read from a TOML file in post/ (every key is
// documented in post/README.md). The G-code writer consults it before it
// writes anything a control may not understand; the block formatter
// (gcode_block.hpp) refuses words the post does not allow.
//
// The reference for words and their meaning is the NIST RS274NGC Interpreter,
// Version 3 (NISTIR 6556, 2000); ISO 6983-1 for the program format (N words,
// the % program start/end character).

// Which length units the control accepts (G20 inch, G21 mm).
enum class PostUnits { Inch, Millimetre, Both };

// "(comment)" is RS274NGC; "; comment" to the end of the line is a later
// extension that some controls accept instead.
enum class CommentStyle { Parentheses, Semicolon };

// How arcs are written: centre offsets I J K from the start point, or the
// radius R (RS274NGC allows both for G2/G3).
enum class ArcFormat { Centre, Radius };

struct LineNumbers {
  bool enabled = false;
  long start = 10;  // the first numbered line's N value
  long step = 10;   // added for each following line

  bool operator==(const LineNumbers&) const = default;
};

// Decimal places written after the point. Lengths follow the program's units:
// 4 for inch (0.0001 in) and 3 for mm (0.001 mm) by default, the resolution
// of most controls' least input increment (common practice). Feeds (per
// minute) share one setting for both units.
struct Decimals {
  int inch = 4;
  int mm = 3;
  int feed = 1;

  bool operator==(const Decimals&) const = default;
};

// M codes that switch coolant; std::nullopt where the control has no such
// output. RS274NGC: M7 mist, M8 flood, M9 off.
struct CoolantCodes {
  std::optional<int> flood = 8;
  std::optional<int> mist = 7;
  std::optional<int> off = 9;

  bool operator==(const CoolantCodes&) const = default;
};

struct Post {
  std::string name;         // short name, for messages and program headers
  std::string description;  // one line for people choosing a post
  PostUnits units = PostUnits::Both;
  LineNumbers line_numbers;
  CommentStyle comments = CommentStyle::Parentheses;
  Decimals decimals;
  bool tool_changer = true;         // else: M0 with a comment asking for the tool change
  bool tool_length_offset = true;   // G43 Hn / G49
  bool cutter_compensation = true;  // G41/G42 Dn, G40
  bool parameters = true;           // numbered parameters #n and [expressions]
  bool optional_stop = true;        // M1
  bool canned_cycles = true;        // G80 and the canned cycles G81-G89
  bool two_digit_codes = false;     // G01, M03 instead of G1, M3 (common on ISO 6983 controls)
  ArcFormat arc_format = ArcFormat::Centre;
  CoolantCodes coolant;
  // Lines written verbatim before and after the program's blocks, e.g. "%"
  // (ISO 6983 program start/end character) or "M2". A line that is exactly
  // "%" never gets a line number; every other line counts as a block.
  std::vector<std::string> start_lines;
  std::vector<std::string> end_lines = {"M2"};
  // Longest line the control reads, counting the N word and the comment.
  // RS274NGC allows 256 characters (NISTIR 6556, from memory: section 3.3).
  int max_line_length = 256;

  bool operator==(const Post&) const = default;
};

// Whether the control accepts a program in these units.
constexpr bool accepts(const Post& post, Units units) {
  if (post.units == PostUnits::Both) return true;
  return (post.units == PostUnits::Inch) == (units == Units::Inch);
}

// The units a program for this post is written in: the job's own units when
// the control accepts them, else the only units it accepts.
constexpr Units program_units(const Post& post, Units job_units) {
  if (accepts(post, job_units)) return job_units;
  return post.units == PostUnits::Inch ? Units::Inch : Units::Millimetre;
}

// Reads a post file's text (TOML). `file` is the name used in messages.
// Throws InputError naming the file, line, column and key for unknown keys,
// wrong types, out-of-range numbers and start/end lines a control could not
// read (empty, too long, characters outside printable ASCII), and says what
// would be valid.
Post read_post(std::string_view text, const std::string& file);

}  // namespace dovetailor
