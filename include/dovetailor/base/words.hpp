#pragma once

#include <optional>
#include <string>
#include <string_view>

namespace dovetailor {

// One row of an enum's word table: the value, its key (the word job files,
// flags and JSON use, "end-mill") and its text (the word reports and sheets
// print, "end mill"; empty when the same as the key).
template <class E>
struct EnumWord {
  E value;
  std::string_view key;
  std::string_view text = {};
};

// Every enum that users see has one table, `word_table(E)`, a constexpr
// function next to the enum (found by argument-dependent lookup) returning
// a std::array of EnumWord<E> with one row per value. These read and write it:

// The key of `value` ("end-mill").
template <class E>
constexpr std::string_view key_of(E value) {
  for (const auto& w : word_table(E{}))
    if (w.value == value) return w.key;
  return {};
}

// The printed word of `value` ("end mill").
template <class E>
constexpr std::string_view text_of(E value) {
  for (const auto& w : word_table(E{}))
    if (w.value == value) return w.text.empty() ? w.key : w.text;
  return {};
}

// The value whose key is `key`, if any.
template <class E>
constexpr std::optional<E> from_key(std::string_view key) {
  for (const auto& w : word_table(E{}))
    if (w.key == key) return w.value;
  return std::nullopt;
}

// The keys, quoted, for a message: "\"male\", \"female\"" (`last` joins the
// last two instead of a comma when given, "\"a\", \"b\" or \"c\"").
template <class E>
std::string key_list(std::string_view last = {}) {
  std::string out;
  const auto table = word_table(E{});
  for (std::size_t i = 0; i < table.size(); ++i) {
    if (i > 0 && !last.empty() && i + 1 == table.size()) {
      out += ' ';
      out += last;
      out += ' ';
    } else if (i > 0) {
      out += ", ";
    }
    out += '"';
    out += table[i].key;
    out += '"';
  }
  return out;
}

}  // namespace dovetailor
