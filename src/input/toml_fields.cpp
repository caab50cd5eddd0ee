#include "toml_fields.hpp"

#include <algorithm>
#include <cmath>

#include <fmt/format.h>

namespace dovetailor::detail {
namespace {

std::string type_name(const toml::node& node) {
  switch (node.type()) {
    case toml::node_type::string:
      return "a string";
    case toml::node_type::integer:
      return "an integer";
    case toml::node_type::floating_point:
      return "a number";
    case toml::node_type::boolean:
      return "true/false";
    case toml::node_type::table:
      return "a table";
    case toml::node_type::array:
      return "an array";
    case toml::node_type::date:
      return "a date";
    case toml::node_type::time:
      return "a time";
    case toml::node_type::date_time:
      return "a date-time";
    default:
      return "nothing";
  }
}

std::string range_text(double min, double max) {
  if (max == HUGE_VAL) return fmt::format("at least {:g}", min);
  return fmt::format("from {:g} to {:g}", min, max);
}

}  // namespace

SourcePlace place_of(const toml::node& node, const std::string& file) {
  const auto& source = node.source();
  return {file, static_cast<int>(source.begin.line), static_cast<int>(source.begin.column)};
}

toml::table parse_toml(std::string_view text, const std::string& file) {
  try {
    return toml::parse(text, std::string_view(file));
  } catch (const toml::parse_error& error) {
    const auto& begin = error.source().begin;
    throw InputError(std::string("not valid TOML: ") + std::string(error.description()),
                     {file, static_cast<int>(begin.line), static_cast<int>(begin.column)});
  }
}

TableReader::TableReader(const toml::table& table, std::string path, std::string file)
    : table_(table), path_(std::move(path)), file_(std::move(file)) {}

bool TableReader::has(std::string_view key) const { return table_.contains(key); }

SourcePlace TableReader::place(std::string_view key) const {
  if (const auto* found = table_.get(key)) return place_of(*found, file_);
  return place_of(table_, file_);
}

std::string TableReader::field(std::string_view key) const {
  return path_.empty() ? std::string(key) : path_ + "." + std::string(key);
}

void TableReader::fail(std::string_view key, const std::string& message) const {
  throw InputError(message, place(key), field(key));
}

const toml::node* TableReader::node(std::string_view key) {
  known_.emplace_back(key);
  return table_.get(key);
}

std::optional<double> TableReader::number(std::string_view key, double min, double max) {
  const auto* value = node(key);
  if (!value) return std::nullopt;
  double x = 0;
  if (auto i = value->value_exact<int64_t>()) {
    x = static_cast<double>(*i);
  } else if (const auto* f = value->as_floating_point()) {
    x = f->get();
  } else {
    fail(key, "expected a number, found " + type_name(*value));
  }
  if (!std::isfinite(x)) fail(key, "must be a finite number, " + range_text(min, max));
  if (x < min || x > max)
    fail(key, fmt::format("{:g} is out of range: must be {}", x, range_text(min, max)));
  return x;
}

double TableReader::required_number(std::string_view key, double min, double max) {
  auto x = number(key, min, max);
  if (!x) fail(key, "missing; give a number " + range_text(min, max));
  return *x;
}

std::optional<long long> TableReader::integer(std::string_view key, long long min, long long max) {
  const auto* value = node(key);
  if (!value) return std::nullopt;
  auto i = value->value_exact<int64_t>();
  if (!i) fail(key, "expected a whole number, found " + type_name(*value));
  if (*i < min || *i > max)
    fail(key, fmt::format("{} is out of range: must be from {} to {}", *i, min, max));
  return *i;
}

std::optional<std::string> TableReader::text(std::string_view key) {
  const auto* value = node(key);
  if (!value) return std::nullopt;
  const auto* s = value->as_string();
  if (!s) fail(key, "expected a string in quotes, found " + type_name(*value));
  return s->get();
}

std::optional<bool> TableReader::flag(std::string_view key) {
  const auto* value = node(key);
  if (!value) return std::nullopt;
  const auto* b = value->as_boolean();
  if (!b) fail(key, "expected true or false, found " + type_name(*value));
  return b->get();
}

std::optional<std::vector<std::string>> TableReader::texts(std::string_view key) {
  const auto* value = node(key);
  if (!value) return std::nullopt;
  const auto* array = value->as_array();
  if (!array) fail(key, "expected an array of strings in quotes, found " + type_name(*value));
  std::vector<std::string> out;
  for (const auto& item : *array) {
    const auto* s = item.as_string();
    if (!s)
      throw InputError("expected a string in quotes, found " + type_name(item),
                       place_of(item, file_), field(key));
    out.push_back(s->get());
  }
  return out;
}

std::optional<std::vector<double>> TableReader::numbers(std::string_view key, std::size_t count,
                                                        double min, double max) {
  const auto* value = node(key);
  if (!value) return std::nullopt;
  const auto* array = value->as_array();
  if (!array || array->size() != count)
    fail(key, fmt::format("expected an array of {} numbers, found {}", count,
                          array ? fmt::format("{} items", array->size()) : type_name(*value)));
  std::vector<double> out;
  for (const auto& item : *array) {
    double x = 0;
    if (auto i = item.value_exact<int64_t>()) {
      x = static_cast<double>(*i);
    } else if (const auto* f = item.as_floating_point()) {
      x = f->get();
    } else {
      throw InputError("expected a number, found " + type_name(item), place_of(item, file_),
                       field(key));
    }
    if (!std::isfinite(x) || x < min || x > max)
      throw InputError(
          fmt::format("{:g} is out of range: each must be {}", x, range_text(min, max)),
          place_of(item, file_), field(key));
    out.push_back(x);
  }
  return out;
}

const toml::table* TableReader::table(std::string_view key) {
  const auto* value = node(key);
  if (!value) return nullptr;
  const auto* t = value->as_table();
  if (!t) fail(key, "expected a table, found " + type_name(*value));
  return t;
}

const toml::array* TableReader::array(std::string_view key) {
  const auto* value = node(key);
  if (!value) return nullptr;
  const auto* a = value->as_array();
  if (!a) fail(key, "expected an array [ ... ], found " + type_name(*value));
  return a;
}

std::vector<const toml::table*> TableReader::tables(std::string_view key) {
  const auto* value = node(key);
  std::vector<const toml::table*> out;
  if (!value) return out;
  const auto* array = value->as_array();
  if (!array)
    fail(key, fmt::format("expected one or more [[{}]] tables, found {}", key, type_name(*value)));
  for (const auto& item : *array) {
    const auto* t = item.as_table();
    if (!t)
      throw InputError(fmt::format("expected a [[{}]] table, found {}", key, type_name(item)),
                       place_of(item, file_), field(key));
    out.push_back(t);
  }
  return out;
}

void TableReader::reject_unknown() const {
  for (const auto& [key, value] : table_) {
    if (std::find(known_.begin(), known_.end(), key.str()) != known_.end()) continue;
    std::string valid;
    for (const auto& k : known_) valid += (valid.empty() ? "" : ", ") + k;
    throw InputError("unknown key" + (path_.empty() ? std::string() : " in [" + path_ + "]") +
                         (valid.empty() ? std::string() : "; valid keys here are: " + valid),
                     place_of(value, file_), field(key.str()));
  }
}

}  // namespace dovetailor::detail
