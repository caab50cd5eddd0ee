#pragma once

// One RS-274 line made ready for reading: comments removed, spaces and tabs
// removed, letters lower-cased (NISTIR 6556 section 3.3 "Format of a line":
// spaces and tabs are allowed anywhere and do not change the meaning, case
// is not significant; from memory). Keeps the original column of every
// character for error messages. Internal to the core library.

#include <cstddef>
#include <string>
#include <string_view>
#include <vector>

namespace dovetailor::detail {

class Rs274Line {
 public:
  // Throws InputError for an unclosed or nested comment or a character that
  // can never appear in a program outside a comment.
  Rs274Line(std::string_view raw, const std::string& file, int line);

  bool at_end() const { return position_ >= text_.size(); }
  // The character `ahead` places on, or '\0' past the end.
  char peek(std::size_t ahead = 0) const {
    return position_ + ahead < text_.size() ? text_[position_ + ahead] : '\0';
  }
  void advance(std::size_t count = 1) { position_ += count; }
  bool accept(std::string_view token);  // consumes `token` when it comes next
  std::size_t position() const { return position_; }
  // 1-based column in the raw line of the character at `position`.
  int column(std::size_t position) const;
  int column() const { return column(position_); }
  const std::string& text() const { return text_; }

  [[noreturn]] void fail(const std::string& message, const std::string& field,
                         std::size_t position) const;
  [[noreturn]] void fail(const std::string& message, const std::string& field) const {
    fail(message, field, position_);
  }

 private:
  std::string text_;
  std::vector<int> columns_;
  std::size_t position_ = 0;
  int end_column_ = 1;
  const std::string& file_;
  int line_;
};

}  // namespace dovetailor::detail
