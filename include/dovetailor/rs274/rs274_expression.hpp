#pragma once

#include <string>
#include <string_view>

#include <dovetailor/rs274/rs274_parameters.hpp>

namespace dovetailor {

// RS-274/NGC real values and expressions (NISTIR 6556 section 3.5
// "Expressions and parameters"; from memory for sub-section numbers).
//
// A real value is one of
//   - a number: digits with at most one decimal point ("12", "-.5", "3.")
//     and no exponent;
//   - a parameter "#n" where n is itself a real value that is an integer
//     ("#12", "#[#1+1]", "##3");
//   - an expression in square brackets "[1 + 2 * #3]";
//   - a unary function "ABS[x]", "ACOS[x]", "ASIN[x]", "COS[x]", "EXP[x]",
//     "FIX[x]" (round down), "FUP[x]" (round up), "LN[x]", "ROUND[x]",
//     "SIN[x]", "SQRT[x]", "TAN[x]", or "ATAN[y]/[x]" (the angle of the point
//     (x, y), -180 .. 180);
//   - any of these after a unary minus or plus.
// Angles are in degrees, arguments and results (section 3.5.2, from memory).
//
// Binary operators come in three groups, evaluated left to right within a
// group (section 3.5.1, from memory):
//   1. "**" (power), highest;
//   2. "*", "/", "MOD";
//   3. "+", "-", "AND", "XOR", "OR", lowest.
// So [2 + 3 * 2 ** 2] is 14 and [1 + 1 AND 0] is 0. The logical operators
// treat any non-zero value as true and give 1 or 0. "a MOD b" has the sign
// of b's magnitude: the remainder is moved into 0 .. |b| when negative, as
// the NIST interpreter does (from memory).
//
// Errors (InputError with line and column): division or MOD by zero, a
// negative number to a non-integer power, SQRT of a negative, LN of zero or
// less, ACOS/ASIN outside -1 .. 1, a result that is not finite, an unknown
// function, unbalanced brackets, a parameter number outside 1 .. highest,
// and nesting (brackets, functions, unary signs, '#') deeper than
// `max_nesting`, which also bounds the reader's stack use.

inline constexpr int default_max_nesting = 64;

// Evaluates `text`, which must hold exactly one real value, e.g.
// evaluate_rs274_value("[1 + 2 * 3]", parameters) == 7. `file` names the
// source in error messages (line 1, columns within `text`).
double evaluate_rs274_value(std::string_view text, const Rs274Parameters& parameters,
                            int max_nesting = default_max_nesting,
                            const std::string& file = "expression");

}  // namespace dovetailor
