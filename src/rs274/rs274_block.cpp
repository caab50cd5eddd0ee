#include <cassert>
#include <cmath>

#include <fmt/format.h>

#include <dovetailor/base/error.hpp>
#include <dovetailor/rs274/rs274_block.hpp>

#include "rs274_line.hpp"
#include "rs274_value_reader.hpp"

namespace dovetailor {

const std::optional<Rs274Word>& Rs274Block::word(char letter) const {
  assert(letter >= 'a' && letter <= 'z');
  return words[static_cast<std::size_t>(letter - 'a')];
}

bool Rs274Block::empty() const {
  if (!g_codes.empty() || !m_codes.empty() || !settings.empty()) return false;
  for (const auto& w : words)
    if (w) return false;
  return true;
}

namespace {

std::string upper(char letter) { return std::string(1, static_cast<char>(letter - 'a' + 'A')); }

void read_line_number(detail::Rs274Line& line, Rs274Block& block) {
  const auto at = line.position();
  line.advance();  // 'n'
  long number = 0;
  int digits = 0;
  while (line.peek() >= '0' && line.peek() <= '9') {
    if (++digits > 9) line.fail("line number has more than nine digits", "N", at);
    number = number * 10 + (line.peek() - '0');
    line.advance();
  }
  if (digits == 0) line.fail("N must be followed by digits, e.g. N10", "N", at);
  block.line_number = number;
}

void read_code(detail::Rs274Line& line, Rs274Block& block, char letter,
               const Rs274Parameters& parameters, const Rs274Limits& limits) {
  const auto at = line.position();
  const int column = line.column();
  line.advance();
  const std::string field = upper(letter);
  const double value = detail::read_real_value(line, parameters, limits.max_nesting, field);
  if (letter == 'g') {
    const double tenths = std::floor(value * 10 + 0.5);
    if (value < 0 || value > 99.95 || std::fabs(value * 10 - tenths) > 0.001)
      line.fail("G codes are numbers from 0 to 99.9 with at most one decimal place", field, at);
    block.g_codes.push_back({static_cast<int>(tenths), column});
  } else {
    const double whole = std::floor(value + 0.5);
    if (value < 0 || value > 99.5 || std::fabs(value - whole) > 0.0001)
      line.fail("M codes are whole numbers from 0 to 99", field, at);
    block.m_codes.push_back({static_cast<int>(whole), column});
  }
}

}  // namespace

Rs274Block read_rs274_block(std::string_view text, int line_index, const std::string& file,
                            const Rs274Parameters& parameters, const Rs274Limits& limits) {
  if (text.size() > limits.max_line_length)
    throw InputError("line is " + std::to_string(text.size()) + " characters long; at most " +
                         std::to_string(limits.max_line_length) +
                         " are accepted (the RS-274/NGC limit is 256)",
                     {file, line_index, static_cast<int>(limits.max_line_length) + 1}, "line");
  Rs274Block block;
  block.line = line_index;
  detail::Rs274Line line(text, file, line_index);
  if (line.text() == "%") {
    block.percent_line = true;
    return block;
  }
  if (line.peek() == '/') {
    block.block_delete = true;
    line.advance();
  }
  if (line.peek() == 'n') read_line_number(line, block);
  while (!line.at_end()) {
    const char c = line.peek();
    if (c == '#') {
      const int column = line.column();
      line.advance();
      const auto number_at = line.position();
      const std::string field = "#";
      const int number = detail::read_integer_value(line, parameters, limits.max_nesting, field);
      const std::string name = fmt::format("#{}", number);
      if (!parameters.valid(number))
        line.fail("parameter " + name + " does not exist; use #1 to #" +
                      std::to_string(parameters.highest()),
                  name, number_at);
      if (!line.accept("="))
        line.fail("a parameter setting needs '=' and a value, e.g. " + name + "=2.5", name);
      const double value = detail::read_real_value(line, parameters, limits.max_nesting, name);
      block.settings.push_back({number, value, column});
    } else if (c == 'n') {
      line.fail("the line number N must come first on the line (after any '/')", "N");
    } else if (c == 'g' || c == 'm') {
      read_code(line, block, c, parameters, limits);
    } else if (word_of(c)) {
      const auto at = line.position();
      const int column = line.column();
      line.advance();
      const std::string field = upper(c);
      auto& slot = block.words[static_cast<std::size_t>(c - 'a')];
      if (slot) line.fail("two " + field + " words on one line; give one", field, at);
      const double value = detail::read_real_value(line, parameters, limits.max_nesting, field);
      slot = Rs274Word{value, column};
    } else if (c >= 'a' && c <= 'z') {
      line.fail("'" + upper(c) + "' is not an RS-274/NGC word letter", upper(c));
    } else if (c == '%') {
      line.fail("'%' must stand alone on its line", "%");
    } else {
      line.fail(std::string("unexpected '") + c + "'; a word letter, '#' or a comment was expected",
                "line");
    }
  }
  return block;
}

}  // namespace dovetailor
