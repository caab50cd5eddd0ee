#include <algorithm>
#include <cmath>
#include <stdexcept>

#include <fmt/format.h>

#include <dovetailor/base/error.hpp>
#include <dovetailor/base/length.hpp>
#include <dovetailor/gcode/gcode_block.hpp>

namespace dovetailor {
namespace {

// RS274NGC numbers lines up to N99999 (NISTIR 6556, from memory: section 3.3).
constexpr long largest_line_number = 99999;

void require(bool condition, const std::string& what) {
  if (!condition) throw std::logic_error("G-code block: " + what);
}

// Position of a letter in the written order; -1 for letters a block may not hold.
int rank(char letter) {
  constexpr std::string_view order = "GXYZIJKRPFSTHDM";
  auto at = order.find(letter);
  return at == std::string_view::npos ? -1 : static_cast<int>(at);
}

[[noreturn]] void refuse(const Post& post, const std::string& key, const std::string& message) {
  throw InputError(
      message, {},
      "post " + (post.name.empty() ? std::string("(unnamed)") : post.name) + ": " + key);
}

bool is_code(const Word& w, char letter, double code) {
  return w.letter == letter && w.expression.empty() && std::abs(w.value - code) < 1e-9;
}

std::string format_code(const Word& w, const Post& post) {
  require(w.value >= 0 && w.value < 1000,
          fmt::format("{} code {} out of range", w.letter, w.value));
  const double tenths = std::round(w.value * 10);
  require(std::abs(tenths - w.value * 10) < 1e-6,
          fmt::format("{} code {} has more than one decimal", w.letter, w.value));
  const long whole = static_cast<long>(tenths) / 10;
  const long fraction = static_cast<long>(tenths) % 10;
  std::string out = post.two_digit_codes ? fmt::format("{:02}", whole) : fmt::format("{}", whole);
  if (fraction != 0) out += fmt::format(".{}", fraction);
  return out;
}

std::string format_whole(const Word& w) {
  require(w.value >= 0 && w.value == std::floor(w.value) && w.value <= 99999,
          fmt::format("{} needs a whole number from 0 to 99999, not {}", w.letter, w.value));
  return fmt::format("{}", static_cast<long>(w.value));
}

std::string format_value(const Word& w, const Post& post, Units units) {
  if (!w.expression.empty()) return w.expression;
  require(std::isfinite(w.value), fmt::format("{} value is not finite", w.letter));
  switch (w.letter) {
    case 'G':
    case 'M':
      return format_code(w, post);
    case 'T':
    case 'H':
    case 'D':
      return format_whole(w);
    case 'F':
      require(w.value > 0, "feed must be greater than zero");
      return format_number(from_mm(w.value, units), post.decimals.feed);
    case 'S':
      require(w.value >= 0, "spindle speed must not be negative");
      return fmt::format("{}", std::lround(w.value));
    case 'P':
      require(w.value >= 0, "dwell must not be negative");
      return format_number(w.value, 2);
    default:
      return format_length(w.value, post, units);
  }
}

void check_expression(const std::string& text) {
  int depth = 0;
  for (char c : text) {
    require(std::string_view("0123456789.#+-*/[] ABCDEFGHIJKLMNOPQRSTUVWXYZ").find(c) !=
                std::string_view::npos,
            "character '" + std::string(1, c) + "' in expression \"" + text + "\"");
    depth += c == '[' ? 1 : c == ']' ? -1 : 0;
    require(depth >= 0, "unbalanced brackets in \"" + text + "\"");
  }
  require(depth == 0, "unbalanced brackets in \"" + text + "\"");
}

void check_allowed(const Block& block, const Post& post, Units units) {
  if (!accepts(post, units))
    refuse(post, "units",
           fmt::format("the control accepts {} programs only; write the program in {}",
                       post.units == PostUnits::Inch ? "inch" : "mm",
                       post.units == PostUnits::Inch ? "inch" : "mm"));
  const bool uses_parameters =
      !block.settings.empty() || std::any_of(block.words.begin(), block.words.end(),
                                             [](const Word& w) { return !w.expression.empty(); });
  if (uses_parameters && !post.parameters)
    refuse(post, "parameters",
           "this control takes no numbered parameters or [expressions]; write plain numbers");
  for (const auto& w : block.words) {
    const auto has = [&](char letter, double code) { return is_code(w, letter, code); };
    if (!post.cutter_compensation && (w.letter == 'D' || has('G', 40) || has('G', 41) ||
                                      has('G', 42) || has('G', 41.1) || has('G', 42.1)))
      refuse(post, "cutter_compensation",
             "this control has no cutter radius compensation (G40, G41, G42, D); the program "
             "must follow the cutter's centre");
    if (!post.tool_length_offset && (w.letter == 'H' || has('G', 43) || has('G', 49)))
      refuse(post, "tool_length_offset",
             "this control has no tool length offsets (G43, G49, H); set each tool's length at "
             "the machine");
    if (!post.tool_changer && has('M', 6))
      refuse(post, "tool_changer",
             "this control has no tool changer (M6); stop with M0 for a manual tool change");
    if (!post.canned_cycles && w.letter == 'G' && w.expression.empty() && w.value >= 80 &&
        w.value < 90)
      refuse(post, "canned_cycles",
             "this control has no canned cycles (G80 to G89); leave the cancel out");
    if (!post.optional_stop && has('M', 1))
      refuse(post, "optional_stop", "this control has no optional stop (M1); use M0");
    if (post.arc_format == ArcFormat::Radius &&
        (w.letter == 'I' || w.letter == 'J' || w.letter == 'K'))
      refuse(post, "arc_format", "this post writes arcs with R; I, J and K are not used");
    if (post.arc_format == ArcFormat::Centre && w.letter == 'R')
      refuse(post, "arc_format", "this post writes arcs with I, J and K; R is not used");
    if ((post.units == PostUnits::Millimetre && has('G', 20)) ||
        (post.units == PostUnits::Inch && has('G', 21)))
      refuse(post, "units", "this control does not accept that units code (G20 inch, G21 mm)");
  }
}

// Non-ASCII symbols machinists type, spelled in ASCII.
constexpr std::pair<std::string_view, std::string_view> spelled[] = {
    {"\u00b0", " deg"}, {"\u00d8", "dia "}, {"\u00f8", "dia "}, {"\u2300", "dia "},
    {"\u00b5", "u"},    {"\u00d7", "x"},    {"\u00b1", "+/-"},  {"\u2212", "-"}};

std::string clean_comment(std::string_view text) {
  std::string out;
  for (std::size_t i = 0; i < text.size();) {
    bool replaced = false;
    for (const auto& [symbol, ascii] : spelled) {
      if (text.substr(i, symbol.size()) == symbol) {
        out += ascii;
        i += symbol.size();
        replaced = true;
        break;
      }
    }
    if (replaced) continue;
    const auto c = static_cast<unsigned char>(text[i]);
    if (c >= 0x80) {
      // Skip the rest of one UTF-8 sequence, write one '?'.
      ++i;
      while (i < text.size() && (static_cast<unsigned char>(text[i]) & 0xC0) == 0x80) ++i;
      out += '?';
      continue;
    }
    if (c == '(')
      out += '[';
    else if (c == ')')
      out += ']';
    else if (c == '%')
      out += "pct";
    else if (c < ' ' || c == 0x7f)
      out += ' ';
    else
      out += static_cast<char>(c);
    ++i;
  }
  // Collapse runs of spaces and trim.
  std::string tidy;
  for (char c : out) {
    if (c == ' ' && (tidy.empty() || tidy.back() == ' ')) continue;
    tidy += c;
  }
  while (!tidy.empty() && tidy.back() == ' ') tidy.pop_back();
  return tidy;
}

std::string comment_text(const std::string& text, const Post& post) {
  return post.comments == CommentStyle::Parentheses ? "(" + text + ")" : "; " + text;
}

// Splits `text` into pieces no longer than `width`, at spaces where possible.
std::vector<std::string> split_words(const std::string& text, std::size_t width) {
  std::vector<std::string> pieces;
  std::string current;
  std::size_t i = 0;
  while (i < text.size()) {
    auto end = text.find(' ', i);
    if (end == std::string::npos) end = text.size();
    std::string word = text.substr(i, end - i);
    i = end + 1;
    while (word.size() > width) {  // a word longer than a line is cut
      if (!current.empty()) pieces.push_back(std::move(current)), current.clear();
      pieces.push_back(word.substr(0, width));
      word.erase(0, width);
    }
    if (current.empty())
      current = word;
    else if (current.size() + 1 + word.size() <= width)
      current += " " + word;
    else
      pieces.push_back(std::move(current)), current = word;
  }
  if (!current.empty()) pieces.push_back(std::move(current));
  return pieces;
}

// The block's words in the post's order, then its parameter settings,
// checked: each letter writable, once (G and M may repeat), parameters in
// #1 to #5399.
std::string block_body(const Block& block, const Post& post, Units units) {
  std::vector<Word> words = block.words;
  for (std::size_t i = 0; i < words.size(); ++i) {
    const char letter = words[i].letter;
    require(rank(letter) >= 0, fmt::format("letter '{}' cannot be written in a block", letter));
    if (!words[i].expression.empty()) check_expression(words[i].expression);
    if (letter == 'G' || letter == 'M') continue;
    for (std::size_t j = i + 1; j < words.size(); ++j)
      require(words[j].letter != letter, fmt::format("letter '{}' twice in one block", letter));
  }
  std::stable_sort(words.begin(), words.end(),
                   [](const Word& a, const Word& b) { return rank(a.letter) < rank(b.letter); });

  std::string body;
  for (const auto& w : words) {
    if (!body.empty()) body += ' ';
    body += w.letter + format_value(w, post, units);
  }
  for (const auto& s : block.settings) {
    require(s.number >= 1 && s.number <= 5399,
            fmt::format("parameter #{} outside #1 to #5399", s.number));
    if (!s.expression.empty()) check_expression(s.expression);
    if (!body.empty()) body += ' ';
    body += fmt::format("#{}={}", s.number,
                        s.expression.empty() ? format_length(s.length, post, units) : s.expression);
  }
  return body;
}

// The "N.. " prefix of each line a block takes, from its first number by the
// post's step; none when the post numbers no lines.
class BlockNumbers {
 public:
  BlockNumbers(const Post& post, long first) : post_(post), number_(first) {}

  std::string next() {
    const auto& numbering = post_.line_numbers;
    if (!numbering.enabled) return {};
    if (number_ > largest_line_number)
      refuse(post_, "line_numbers.step",
             fmt::format("line number N{} is past N{}; give a smaller start or step, or turn "
                         "line numbers off",
                         number_, largest_line_number));
    std::string prefix = fmt::format("N{} ", number_);
    number_ += numbering.step;
    return prefix;
  }

 private:
  const Post& post_;
  long number_;
};

}  // namespace

std::string format_number(double value, int decimals) {
  require(std::isfinite(value), "number is not finite");
  // fixed_text drops the sign of a value that rounds to zero ("-0.000").
  std::string text = fixed_text(value, decimals, false);
  if (text.find('.') == std::string::npos) text += '.';
  while (text.back() == '0') text.pop_back();
  return text;
}

std::string format_length(double mm, const Post& post, Units units) {
  return format_number(from_mm(mm, units),
                       units == Units::Inch ? post.decimals.inch : post.decimals.mm);
}

std::string format_block(const Block& block, const Post& post, Units units, long line_number) {
  require(!block.words.empty() || !block.settings.empty() || !block.comment.empty(), "empty block");
  check_allowed(block, post, units);
  const std::string body = block_body(block, post, units);
  BlockNumbers numbers(post, line_number);
  const auto max = static_cast<std::size_t>(post.max_line_length);

  const std::string comment = clean_comment(block.comment);
  std::string prefix = numbers.next();
  std::string one_line = prefix + body;
  if (!comment.empty()) {
    if (!body.empty()) one_line += ' ';
    one_line += comment_text(comment, post);
  }
  if (one_line.size() <= max) return one_line;

  // Too long: the comment goes on its own lines, then the words.
  std::vector<std::string> lines;
  const std::size_t frame = comment_text("", post).size();
  for (const auto& piece : split_words(comment, max - prefix.size() - frame)) {
    if (!lines.empty()) prefix = numbers.next();
    lines.push_back(prefix + comment_text(piece, post));
  }
  if (!body.empty()) {
    std::string words_line = numbers.next() + body;
    if (words_line.size() > max)
      refuse(post, "max_line_length",
             fmt::format("the block \"{}\" is {} characters long; the control reads at most {}",
                         words_line, words_line.size(), max));
    lines.push_back(std::move(words_line));
  }
  std::string out;
  for (const auto& line : lines) out += (out.empty() ? "" : "\n") + line;
  return out;
}

std::vector<Block> tool_change_blocks(const Post& post, int tool, std::string_view description) {
  require(tool >= 0, "negative tool number");
  const std::string what = description.empty() ? std::string() : ": " + std::string(description);
  if (post.tool_changer)
    return {Block{.words = {{'T', static_cast<double>(tool)}, {'M', 6}},
                  .comment = fmt::format("tool {}{}", tool, what)}};
  // No changer: the T word names the tool (RS274NGC lets T stand alone: it
  // selects without changing) and the stop lets the operator fit it.
  return {Block{.words = {{'M', 5}}},
          Block{.words = {{'T', static_cast<double>(tool)}, {'M', 0}},
                .comment = fmt::format("change to tool {}{}, then cycle start", tool, what)}};
}

}  // namespace dovetailor
