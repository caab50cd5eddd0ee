#include <cmath>
#include <string>

#include <gtest/gtest.h>

#include <dovetailor/rs274/rs274_expression.hpp>

#include "test_support.hpp"

namespace dovetailor {
namespace {

using testing::expect_input_error;

double eval(const std::string& text) {
  Rs274Parameters parameters;
  return evaluate_rs274_value(text, parameters);
}

struct Case {
  const char* text;
  double value;
  const char* source;
};

TEST(rs274_expression, precedence_and_functions_match_hand_worked_values) {
  const Case cases[] = {
      // Three precedence groups, left to right within a group: NISTIR 6556
      // section 3.5.1 (from memory).
      {"[2 + 3 * 2 ** 2]", 14, "** before *, * before +"},
      {"[2.0 / 3 * 1.5 - 5.5 / 11.0]", 0.5, "NISTIR 6556 3.5.1 worked example (from memory)"},
      {"[2 ** 3 ** 2]", 64, "left to right within a group: (2**3)**2"},
      {"[10 - 4 - 3]", 3, "left to right"},
      {"[1 + 1 AND 0]", 0, "AND is in the + group: (1+1) AND 0"},
      {"[0 OR 2]", 1, "logical result is 1 or 0"},
      {"[1 XOR 1]", 0, "exclusive or"},
      {"[3 AND 0.5]", 1, "non-zero is true"},
      {"[7 MOD 3]", 1, "remainder"},
      {"[-7 MOD 3]", 2, "NIST interpreter moves a negative remainder into 0..|b| (from memory)"},
      {"-[1 + 2]", -3, "unary minus on an expression"},
      {"[2 * -3]", -6, "unary minus on an operand"},
      {"[2 ** -1]", 0.5, "negative power"},
      // Functions, degrees: section 3.5.2 (from memory); values hand-worked.
      {"SIN[30]", 0.5, "sin 30 deg = 1/2"},
      {"COS[60]", 0.5, "cos 60 deg = 1/2"},
      {"TAN[45]", 1, "tan 45 deg = 1"},
      {"ASIN[0.5]", 30, "asin 1/2 = 30 deg"},
      {"ACOS[0.5]", 60, "acos 1/2 = 60 deg"},
      {"ATAN[1]/[1]", 45, "atan2(1, 1) = 45 deg"},
      {"ATAN[1]/[-1]", 135, "atan2(1, -1) = 135 deg, second quadrant"},
      {"ATAN[-1]/[0]", -90, "atan2(-1, 0)"},
      {"SQRT[2]", 1.4142135623730951, "square root of 2"},
      {"ABS[-3.5]", 3.5, "absolute value"},
      {"FIX[-2.5]", -3, "FIX rounds down"},
      {"FUP[-2.5]", -2, "FUP rounds up"},
      {"FIX[2.7]", 2, "FIX rounds down"},
      {"ROUND[2.6]", 3, "nearest integer"},
      {"EXP[1]", 2.718281828459045, "e"},
      {"LN[EXP[2]]", 2, "ln inverts exp"},
      {"[1 + SIN[30] * 4]", 3, "function binds as an operand"},
      {"1 2 . 5", 12.5, "spaces inside numbers are ignored (NISTIR 6556 3.3, from memory)"},
      {"[ 1 m o d 2 ]", 1, "spaces inside operator words are ignored too"},
  };
  for (const auto& c : cases)
    EXPECT_NEAR(eval(c.text), c.value, 1e-12) << c.text << " (" << c.source << ")";
}

TEST(rs274_expression, case_does_not_matter) {
  EXPECT_DOUBLE_EQ(eval("sin[30]"), eval("SIN[30]"));
  EXPECT_DOUBLE_EQ(eval("[5 mod 3]"), 2);
}

TEST(rs274_expression, parameters_default_to_zero_and_can_be_indirect) {
  Rs274Parameters parameters;
  EXPECT_EQ(evaluate_rs274_value("#100", parameters), 0);
  parameters.set(2, 7);
  parameters.set(7, 1.25);
  EXPECT_EQ(evaluate_rs274_value("##2", parameters), 1.25);
  EXPECT_EQ(evaluate_rs274_value("#[#2]", parameters), 1.25);
  EXPECT_EQ(evaluate_rs274_value("[#2 * 2]", parameters), 14);
}

TEST(rs274_expression, bad_arithmetic_is_an_error_with_line_and_column) {
  SCOPED_TRACE("[1 / 0]");
  expect_input_error([] { eval("[1 / 0]"); }, {"expression:1:4", "division by zero"});
  SCOPED_TRACE("[1 MOD 0]");
  expect_input_error([] { eval("[1 MOD 0]"); }, {"MOD by zero"});
  SCOPED_TRACE("SQRT[-1]");
  expect_input_error([] { eval("SQRT[-1]"); }, {"SQRT", "0 or more"});
  SCOPED_TRACE("LN[0]");
  expect_input_error([] { eval("LN[0]"); }, {"LN", "greater than 0"});
  SCOPED_TRACE("ACOS[2]");
  expect_input_error([] { eval("ACOS[2]"); }, {"ACOS", "-1 to 1"});
  SCOPED_TRACE("ASIN[-1.5]");
  expect_input_error([] { eval("ASIN[-1.5]"); }, {"ASIN", "-1 to 1"});
  SCOPED_TRACE("[-8 ** 0.5]");
  expect_input_error([] { eval("[-8 ** 0.5]"); }, {"non-integer power"});
  SCOPED_TRACE("[10 ** 400]");
  expect_input_error([] { eval("[10 ** 400]"); }, {"too large"});
  SCOPED_TRACE("EXP[1000]");
  expect_input_error([] { eval("EXP[1000]"); }, {"too large"});
  const std::string huge(400, '9');  // 1e400 is beyond a double
  expect_input_error([&] { eval(huge); }, {"too large"});
}

TEST(rs274_expression, malformed_expressions_are_errors) {
  SCOPED_TRACE("FOO[1]");
  expect_input_error([] { eval("FOO[1]"); }, {"expression:1:1", "'FOO' is not a function"});
  SCOPED_TRACE("[1 + 2");
  expect_input_error([] { eval("[1 + 2"); }, {"missing ']'"});
  SCOPED_TRACE("[1 #2]");
  expect_input_error([] { eval("[1 #2]"); }, {"expected an operator or ']'"});
  SCOPED_TRACE("SIN 30");
  expect_input_error([] { eval("SIN 30"); }, {"square brackets"});
  SCOPED_TRACE("ATAN[1]");
  expect_input_error([] { eval("ATAN[1]"); }, {"ATAN[y]/[x]"});
  SCOPED_TRACE("[1 +]");
  expect_input_error([] { eval("[1 +]"); }, {"cannot start a value"});
  SCOPED_TRACE(".");
  expect_input_error([] { eval("."); }, {"at least one digit"});
  SCOPED_TRACE("#0");
  expect_input_error([] { eval("#0"); }, {"#0 does not exist"});
  SCOPED_TRACE("#5400");
  expect_input_error([] { eval("#5400"); }, {"#5400 does not exist", "#5399"});
  SCOPED_TRACE("#1.5");
  expect_input_error([] { eval("#1.5"); }, {"whole number"});
  SCOPED_TRACE("1.2.3");
  expect_input_error([] { eval("1.2.3"); }, {"unexpected text"});
}

TEST(rs274_expression, deep_nesting_is_refused_not_a_stack_overflow) {
  std::string deep = std::string(100000, '[') + "1" + std::string(100000, ']');
  expect_input_error([&] { eval(deep); }, {"nested more than 64 levels"});
  std::string signs = std::string(100000, '-') + "1";
  expect_input_error([&] { eval(signs); }, {"nested more than 64 levels"});
  std::string hashes = std::string(100000, '#') + "1";
  expect_input_error([&] { eval(hashes); }, {"nested more than 64 levels"});
  // 60 levels are fine.
  EXPECT_EQ(eval(std::string(60, '[') + "2" + std::string(60, ']')), 2);
}

TEST(rs274_expression, parameter_limit_can_be_lowered) {
  Rs274Parameters parameters(100);
  EXPECT_EQ(parameters.highest(), 100);
  expect_input_error([&] { evaluate_rs274_value("#101", parameters); }, {"#101", "#1 to #100"});
}

}  // namespace
}  // namespace dovetailor
