#pragma once

#include <array>
#include <cstddef>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include <dovetailor/rs274/rs274_codes.hpp>
#include <dovetailor/rs274/rs274_expression.hpp>
#include <dovetailor/rs274/rs274_parameters.hpp>

namespace dovetailor {

// Reading one RS-274/NGC line (a "block") into words, with every value
// evaluated. Format per NISTIR 6556 section 3.3 (from memory):
//
//   [/] [N<digits>] { word | #n=value | (comment) } [; comment]
//
// - '/' first: block delete; the interpreter skips the line when its block
//   delete switch is on.
// - N: line number, digits only, first after '/'. The spec allows five
//   digits; up to nine are accepted because long generated programs exceed
//   99999.
// - A word is a letter and a real value (see rs274_expression.hpp). Letters
//   A B C D F G H I J K L M P Q R S T X Y Z are words; E O U V W are not.
// - "#n=value" sets parameter n. Settings take effect after the whole line
//   has been read (section 3.5.3, from memory): "#1=2 X#1" moves to the old
//   value of #1. The reader returns the settings; the interpreter applies
//   them.
// - Comments: "( ... )" (they do not nest and must close on the line) and
//   ";" to the end of the line (a later extension, accepted).
// - A line holding only '%' marks the start or end of a program file (ISO
//   6983-1 program start/end character).
// - Case does not matter; spaces and tabs outside comments are ignored, also
//   inside numbers ("X 1 2. 5" is X12.5).
//
// Errors are InputError with the file, line, 1-based column and the word as
// field: an unknown letter, two words of one letter (G and M excepted), a
// G or M code that is not a number of the right form, N out of place, a
// line over the length limit.

// Limits that keep a hostile or broken program from exhausting memory or
// stack. The spec allows 256 characters per line; 4096 are accepted.
struct Rs274Limits {
  std::size_t max_line_length = 4096;
  int max_nesting = default_max_nesting;

  bool operator==(const Rs274Limits&) const = default;
};

struct Rs274Word {
  double value = 0;
  int column = 0;  // where the letter is, 1-based

  bool operator==(const Rs274Word&) const = default;
};

// A G or M code. G codes are kept times ten so G59.1 is 591 and G1 is 10;
// M codes are kept as they are (M3 is 3).
struct Rs274Code {
  int number = 0;
  int column = 0;

  bool operator==(const Rs274Code&) const = default;
};

struct Rs274ParameterSetting {
  int number = 0;
  double value = 0;
  int column = 0;

  bool operator==(const Rs274ParameterSetting&) const = default;
};

struct Rs274Block {
  int line = 0;               // 1-based line in the source
  bool percent_line = false;  // a line holding only '%'
  bool block_delete = false;  // the line started with '/'
  std::optional<long> line_number;
  std::vector<Rs274Code> g_codes;
  std::vector<Rs274Code> m_codes;
  std::array<std::optional<Rs274Word>, 26> words;  // by letter, 'a' .. 'z'; never G, M, N
  std::vector<Rs274ParameterSetting> settings;

  const std::optional<Rs274Word>& word(char letter) const;  // letter in 'a' .. 'z'
  bool has(char letter) const { return word(letter).has_value(); }
  const std::optional<Rs274Word>& word(Word w) const { return word(static_cast<char>(w)); }
  bool has(Word w) const { return word(w).has_value(); }
  bool empty() const;  // no codes, words or settings (a blank or comment line)

  bool operator==(const Rs274Block&) const = default;
};

// Reads one line. `parameters` gives the values of "#n" in it (they are not
// changed). Throws InputError naming `file` and `line`.
Rs274Block read_rs274_block(std::string_view text, int line, const std::string& file,
                            const Rs274Parameters& parameters, const Rs274Limits& limits = {});

}  // namespace dovetailor
