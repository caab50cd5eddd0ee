#pragma once

// Shared by the G-code writer's source files. Internal to the core library.

#include <string>
#include <vector>

#include <dovetailor/base/text_wrap.hpp>
#include <dovetailor/gcode/gcode_writer.hpp>

namespace dovetailor::detail {

using dovetailor::wrap_words;

// The header comment lines (not yet wrapped).
std::vector<std::string> header_lines(const Plan& plan, const Post& post,
                                      const ProgramOptions& options, Units units,
                                      SizingStyle style);

// The comment lines written before a checkpoint's stop.
std::vector<std::string> checkpoint_lines(const Plan& plan, const Checkpoint& checkpoint,
                                          char letter, Units units, SizingStyle style);

}  // namespace dovetailor::detail
