#pragma once

// Reading real values and expressions from a prepared line; shared by the
// block reader and evaluate_rs274_value. Internal to the core library.

#include <string>

#include <dovetailor/rs274/rs274_parameters.hpp>

#include "rs274_line.hpp"

namespace dovetailor::detail {

// Reads one real value at the line's position (see rs274_expression.hpp).
// `field` names the word being read, for messages ("X", "#12").
double read_real_value(Rs274Line& line, const Rs274Parameters& parameters, int max_nesting,
                       const std::string& field);

// A real value that must be within 0.0001 of an integer (the NIST
// interpreter's tolerance for integer words, from memory) and within
// -2^31 .. 2^31-1.
int read_integer_value(Rs274Line& line, const Rs274Parameters& parameters, int max_nesting,
                       const std::string& field);

}  // namespace dovetailor::detail
