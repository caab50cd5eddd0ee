#pragma once

// Helpers shared by the test files.

#include <cstdlib>
#include <string>

#include <gtest/gtest.h>

#include <dovetailor/base/error.hpp>

namespace dovetailor::testing {

// Runs `action`, which must throw InputError whose full text (what()) contains
// every one of `parts` (for instance the key and the line "job.toml:7").
template <typename Action>
void expect_input_error(Action&& action, std::initializer_list<std::string> parts) {
  try {
    action();
  } catch (const InputError& e) {
    const std::string what = e.what();
    for (const auto& part : parts)
      EXPECT_NE(what.find(part), std::string::npos) << "message: " << what << "\nmissing: " << part;
    return;
  }
  ADD_FAILURE() << "no InputError was thrown";
}

// How many random cases a property test runs: all of them normally, a tenth
// (at least one) in the sanitizer build, where every case costs ten times
// more and the point is memory and UB errors, not coverage of the space.
// DOVETAILOR_CASE_SCALE=K in the environment runs K times as many (a long
// run before a release; the seeds stay fixed, so the first cases are the
// usual ones).
inline int random_cases(int count) {
#ifdef DOVETAILOR_SANITIZED
  int cases = count / 10 > 0 ? count / 10 : 1;
#else
  int cases = count;
#endif
  if (const char* scale = std::getenv("DOVETAILOR_CASE_SCALE")) {
    const int k = std::atoi(scale);
    if (k > 1) cases *= k;
  }
  return cases;
}

// A path under the source tree, from CMake (never the current directory).
inline std::string source_path(const std::string& relative) {
  return std::string(DOVETAILOR_SOURCE_DIR) + "/" + relative;
}

}  // namespace dovetailor::testing

#include <fstream>
#include <sstream>

namespace dovetailor::testing {

// The text of a file under the source tree.
inline std::string read_source_file(const std::string& relative) {
  std::ifstream in(source_path(relative), std::ios::binary);
  std::stringstream text;
  text << in.rdbuf();
  return text.str();
}

// Compares `actual` with the golden file (reviewed by eye). With
// DOVETAILOR_UPDATE_GOLDEN=1 in the environment the file is rewritten
// instead, so a deliberate change is one command and one diff to review.
inline void expect_golden(const std::string& relative, const std::string& actual) {
  if (std::getenv("DOVETAILOR_UPDATE_GOLDEN")) {
    std::ofstream(source_path(relative), std::ios::binary) << actual;
    return;
  }
  const std::string expected = read_source_file(relative);
  EXPECT_EQ(actual, expected) << "golden file " << relative
                              << " differs; review, then rerun with DOVETAILOR_UPDATE_GOLDEN=1";
}

}  // namespace dovetailor::testing
