#include <array>
#include <charconv>
#include <cmath>
#include <string>

#include <dovetailor/base/units.hpp>
#include <dovetailor/rs274/rs274_expression.hpp>

#include "rs274_value_reader.hpp"

namespace dovetailor {
namespace detail {
namespace {

enum class Op { Power, Times, Divide, Mod, Plus, Minus, And, Xor, Or };

struct OpName {
  std::string_view text;
  Op op;
  int group;  // 1 binds tightest
};

// "**" before "*" so the longer token wins.
constexpr std::array<OpName, 9> operators{{{"**", Op::Power, 1},
                                           {"*", Op::Times, 2},
                                           {"/", Op::Divide, 2},
                                           {"mod", Op::Mod, 2},
                                           {"+", Op::Plus, 3},
                                           {"-", Op::Minus, 3},
                                           {"and", Op::And, 3},
                                           {"xor", Op::Xor, 3},
                                           {"or", Op::Or, 3}}};

class ValueReader {
 public:
  ValueReader(Rs274Line& line, const Rs274Parameters& parameters, int max_nesting,
              const std::string& field)
      : line_(line), parameters_(parameters), max_nesting_(max_nesting), field_(field) {}

  double value(int depth) {
    if (depth > max_nesting_)
      line_.fail("expression is nested more than " + std::to_string(max_nesting_) +
                     " levels deep (brackets, functions, signs and '#' count); simplify it",
                 field_);
    const char c = line_.peek();
    if (c == '[') return bracketed(depth + 1);
    if (c == '#') {
      const auto at = line_.position();
      line_.advance();
      const int number = integer(depth + 1);
      if (!parameters_.valid(number))
        line_.fail("parameter #" + std::to_string(number) + " does not exist; use #1 to #" +
                       std::to_string(parameters_.highest()),
                   field_, at);
      return parameters_.get(number);
    }
    if (c == '-' || c == '+') {
      line_.advance();
      const double v = value(depth + 1);
      return c == '-' ? -v : v;
    }
    if (c >= 'a' && c <= 'z') return function(depth + 1);
    if ((c >= '0' && c <= '9') || c == '.') return number();
    if (c == '\0')
      line_.fail("a value is missing at the end of the line; give a number, #n or [expression]",
                 field_);
    line_.fail(std::string("'") + c +
                   "' cannot start a value; give a number, #n, [expression] or a function",
               field_);
  }

  int integer(int depth) {
    const auto at = line_.position();
    const double v = value(depth);
    const double whole = std::floor(v + 0.5);
    if (std::fabs(v - whole) > 0.0001)
      line_.fail("needs a whole number, not " + format(v), field_, at);
    if (whole < -2147483648.0 || whole > 2147483647.0)
      line_.fail("whole number " + format(v) + " is out of range", field_, at);
    return static_cast<int>(whole);
  }

 private:
  static std::string format(double v) {
    std::array<char, 32> buffer{};
    auto [end, ec] = std::to_chars(buffer.data(), buffer.data() + buffer.size(), v);
    return ec == std::errc{} ? std::string(buffer.data(), end) : std::string("?");
  }

  double finite(double v, std::size_t at) const {
    if (!std::isfinite(v))
      line_.fail("the result is too large to be a number (overflow)", field_, at);
    return v;
  }

  double number() {
    const auto start = line_.position();
    std::size_t length = 0;
    bool point = false;
    bool digits = false;
    for (;;) {
      const char c = line_.peek(length);
      if (c >= '0' && c <= '9') {
        digits = true;
      } else if (c == '.' && !point) {
        point = true;
      } else {
        break;
      }
      ++length;
    }
    if (!digits) line_.fail("a number needs at least one digit", field_, start);
    const std::string& text = line_.text();
    double v = 0;
    const char* first = text.data() + start;
    auto [end, ec] = std::from_chars(first, first + length, v, std::chars_format::fixed);
    if (ec != std::errc{} || end != first + length || !std::isfinite(v))
      line_.fail("number is too large", field_, start);
    line_.advance(length);
    return v;
  }

  double bracketed(int depth) {
    line_.advance();  // '['
    double result = group(3, depth);
    if (!line_.accept("]")) {
      if (line_.at_end()) line_.fail("missing ']' to close the expression", field_);
      line_.fail(std::string("expected an operator or ']' here, not '") + line_.peek() + "'",
                 field_);
    }
    return result;
  }

  const OpName* peek_operator() const {
    for (const auto& candidate : operators)
      if (line_.text().compare(line_.position(), candidate.text.size(), candidate.text) == 0)
        return &candidate;
    return nullptr;
  }

  // Left-to-right evaluation of all operators of `level` and tighter.
  double group(int level, int depth) {
    double left = level == 1 ? value(depth) : group(level - 1, depth);
    for (;;) {
      const OpName* op = peek_operator();
      if (op == nullptr || op->group != level) return left;
      const auto at = line_.position();
      line_.advance(op->text.size());
      const double right = level == 1 ? value(depth) : group(level - 1, depth);
      left = apply(op->op, left, right, at);
    }
  }

  double apply(Op op, double a, double b, std::size_t at) const {
    switch (op) {
      case Op::Power:
        if (a < 0 && b != std::floor(b))
          line_.fail("a negative number cannot be raised to a non-integer power", field_, at);
        if (a == 0 && b < 0) line_.fail("zero to a negative power divides by zero", field_, at);
        return finite(std::pow(a, b), at);
      case Op::Times:
        return finite(a * b, at);
      case Op::Divide:
        if (b == 0) line_.fail("division by zero", field_, at);
        return finite(a / b, at);
      case Op::Mod: {
        if (b == 0) line_.fail("MOD by zero", field_, at);
        double r = std::fmod(a, b);
        if (r < 0) r += std::fabs(b);
        return r;
      }
      case Op::Plus:
        return finite(a + b, at);
      case Op::Minus:
        return finite(a - b, at);
      case Op::And:
        return (a != 0 && b != 0) ? 1.0 : 0.0;
      case Op::Xor:
        return ((a != 0) != (b != 0)) ? 1.0 : 0.0;
      case Op::Or:
        return (a != 0 || b != 0) ? 1.0 : 0.0;
    }
    return 0;
  }

  double argument(int depth, const std::string& name) {
    if (line_.peek() != '[')
      line_.fail(name + " needs its argument in square brackets, e.g. " + name + "[30]", field_);
    return bracketed(depth);
  }

  double function(int depth) {
    const auto at = line_.position();
    std::size_t length = 0;
    while (line_.peek(length) >= 'a' && line_.peek(length) <= 'z') ++length;
    std::string name = line_.text().substr(at, length);
    line_.advance(length);
    std::string upper = name;
    for (auto& ch : upper) ch = static_cast<char>(ch - 'a' + 'A');
    if (name == "atan") {
      const double y = argument(depth, upper);
      if (!line_.accept("/")) line_.fail("ATAN needs two arguments written ATAN[y]/[x]", field_);
      const double x = argument(depth, upper);
      return degrees(std::atan2(y, x));
    }
    using Fn = double (*)(double);
    struct Entry {
      std::string_view name;
      Fn fn;
    };
    static constexpr std::array<Entry, 12> table{{
        {"abs", [](double x) { return std::fabs(x); }},
        {"acos", [](double x) { return degrees(std::acos(x)); }},
        {"asin", [](double x) { return degrees(std::asin(x)); }},
        {"cos", [](double x) { return std::cos(radians(x)); }},
        {"exp", [](double x) { return std::exp(x); }},
        {"fix", [](double x) { return std::floor(x); }},
        {"fup", [](double x) { return std::ceil(x); }},
        {"ln", [](double x) { return std::log(x); }},
        {"round", [](double x) { return std::round(x); }},
        {"sin", [](double x) { return std::sin(radians(x)); }},
        {"sqrt", [](double x) { return std::sqrt(x); }},
        {"tan", [](double x) { return std::tan(radians(x)); }},
    }};
    for (const auto& entry : table) {
      if (entry.name != name) continue;
      const auto arg_at = line_.position();
      const double x = argument(depth, upper);
      if ((name == "acos" || name == "asin") && (x < -1 || x > 1))
        line_.fail(upper + " needs an argument from -1 to 1, not " + format(x), field_, arg_at);
      if (name == "ln" && x <= 0)
        line_.fail("LN needs an argument greater than 0, not " + format(x), field_, arg_at);
      if (name == "sqrt" && x < 0)
        line_.fail("SQRT needs an argument of 0 or more, not " + format(x), field_, arg_at);
      return finite(entry.fn(x), at);
    }
    line_.fail("'" + upper +
                   "' is not a function; use ABS ACOS ASIN ATAN COS EXP FIX FUP LN ROUND SIN "
                   "SQRT TAN",
               field_, at);
  }

  Rs274Line& line_;
  const Rs274Parameters& parameters_;
  int max_nesting_;
  const std::string& field_;
};

}  // namespace

double read_real_value(Rs274Line& line, const Rs274Parameters& parameters, int max_nesting,
                       const std::string& field) {
  return ValueReader(line, parameters, max_nesting, field).value(0);
}

int read_integer_value(Rs274Line& line, const Rs274Parameters& parameters, int max_nesting,
                       const std::string& field) {
  return ValueReader(line, parameters, max_nesting, field).integer(0);
}

}  // namespace detail

double evaluate_rs274_value(std::string_view text, const Rs274Parameters& parameters,
                            int max_nesting, const std::string& file) {
  detail::Rs274Line line(text, file, 1);
  const std::string field = "value";
  const double v = detail::read_real_value(line, parameters, max_nesting, field);
  if (!line.at_end()) line.fail("unexpected text after the value", field);
  return v;
}

}  // namespace dovetailor
