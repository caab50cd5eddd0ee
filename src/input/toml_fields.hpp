#pragma once

// Strict reading of one TOML table: every key read is checked for type,
// finiteness and range, and keys nobody asked for are reported as unknown.
// Shared by the job reader and the post reader. Internal to the core library.

#include <initializer_list>
#include <optional>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include <toml++/toml.h>

#include <dovetailor/base/error.hpp>
#include <dovetailor/base/words.hpp>

namespace dovetailor::detail {

SourcePlace place_of(const toml::node& node, const std::string& file);

// Parses TOML text; a syntax error becomes an InputError at its line and column.
toml::table parse_toml(std::string_view text, const std::string& file);

class TableReader {
 public:
  // `path` is the dotted name used in messages ("dovetail", "tool[2]").
  TableReader(const toml::table& table, std::string path, std::string file);

  bool has(std::string_view key) const;
  SourcePlace place(std::string_view key) const;  // the key's value, or the table
  std::string field(std::string_view key) const;  // "path.key"
  [[noreturn]] void fail(std::string_view key, const std::string& message) const;

  // A finite number (integer or float) within [min, max].
  std::optional<double> number(std::string_view key, double min, double max);
  double required_number(std::string_view key, double min, double max);
  std::optional<long long> integer(std::string_view key, long long min, long long max);
  std::optional<std::string> text(std::string_view key);
  std::optional<bool> flag(std::string_view key);
  // An array of strings (possibly empty).
  std::optional<std::vector<std::string>> texts(std::string_view key);
  // An array of exactly `count` finite numbers each within [min, max].
  std::optional<std::vector<double>> numbers(std::string_view key, std::size_t count, double min,
                                             double max);
  const toml::table* table(std::string_view key);
  // An array of any items (the caller checks them, with place_of for messages).
  const toml::array* array(std::string_view key);
  // An array of tables, written [[key]] in the file; empty when absent.
  std::vector<const toml::table*> tables(std::string_view key);

  // The value of an enum key, by the enum's word table (base/words.hpp);
  // the message lists the keys.
  template <class E>
  std::optional<E> choice(std::string_view key) {
    auto word = text(key);
    if (!word) return std::nullopt;
    if (auto value = from_key<E>(*word)) return value;
    fail(key, "\"" + *word + "\" is not one of " + key_list<E>());
  }

  // One of a fixed set of words; the message lists them.
  template <typename E>
  std::optional<E> choice(std::string_view key,
                          std::initializer_list<std::pair<std::string_view, E>> words) {
    auto word = text(key);
    if (!word) return std::nullopt;
    std::string valid;
    for (const auto& [name, value] : words) {
      if (*word == name) return value;
      valid += (valid.empty() ? "\"" : ", \"") + std::string(name) + "\"";
    }
    fail(key, "\"" + *word + "\" is not one of " + valid);
  }

  // Marks a key as valid that the caller reads by hand.
  void allow(std::string_view key) { known_.emplace_back(key); }

  // Throws for the first key that was never read.
  void reject_unknown() const;

 private:
  const toml::node* node(std::string_view key);

  const toml::table& table_;
  std::string path_;
  std::string file_;
  std::vector<std::string> known_;
};

}  // namespace dovetailor::detail
