#pragma once

// Helpers shared by the test files.

#include <string>

#include <gtest/gtest.h>

#include <dovetailor/error.hpp>

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

// A path under the source tree, from CMake (never the current directory).
inline std::string source_path(const std::string& relative) {
  return std::string(DOVETAILOR_SOURCE_DIR) + "/" + relative;
}

}  // namespace dovetailor::testing
