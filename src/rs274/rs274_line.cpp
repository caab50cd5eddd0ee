#include "rs274_line.hpp"

#include <dovetailor/base/error.hpp>

namespace dovetailor::detail {

namespace {

bool printable(char c) { return c >= 0x20 && c < 0x7f; }

std::string shown(char c) {
  if (printable(c)) return std::string("'") + c + "'";
  static const char* digits = "0123456789abcdef";
  const auto byte = static_cast<unsigned char>(c);
  return std::string("byte 0x") + digits[byte >> 4] + digits[byte & 15];
}

}  // namespace

Rs274Line::Rs274Line(std::string_view raw, const std::string& file, int line)
    : file_(file), line_(line) {
  text_.reserve(raw.size());
  columns_.reserve(raw.size());
  std::size_t comment_start = std::string_view::npos;
  for (std::size_t i = 0; i < raw.size(); ++i) {
    const char c = raw[i];
    const int col = static_cast<int>(i) + 1;
    if (comment_start != std::string_view::npos) {
      if (c == ')')
        comment_start = std::string_view::npos;
      else if (c == '(')
        throw InputError("a comment may not contain '(' (comments do not nest); close it with ')'",
                         {file_, line_, col}, "comment");
      continue;
    }
    if (c == '(') {
      comment_start = i;
    } else if (c == ';') {
      break;
    } else if (c == ' ' || c == '\t') {
      continue;
    } else if (!printable(c)) {
      throw InputError(shown(c) + " cannot appear in a program outside a comment",
                       {file_, line_, col}, "character");
    } else {
      text_ += (c >= 'A' && c <= 'Z') ? static_cast<char>(c - 'A' + 'a') : c;
      columns_.push_back(col);
    }
  }
  if (comment_start != std::string_view::npos)
    throw InputError("comment is not closed; end it with ')' on the same line",
                     {file_, line_, static_cast<int>(comment_start) + 1}, "comment");
  end_column_ = static_cast<int>(raw.size()) + 1;
}

bool Rs274Line::accept(std::string_view token) {
  if (text_.compare(position_, token.size(), token) != 0) return false;
  position_ += token.size();
  return true;
}

int Rs274Line::column(std::size_t position) const {
  return position < columns_.size() ? columns_[position] : end_column_;
}

void Rs274Line::fail(const std::string& message, const std::string& field,
                     std::size_t position) const {
  throw InputError(message, {file_, line_, column(position)}, field);
}

}  // namespace dovetailor::detail
