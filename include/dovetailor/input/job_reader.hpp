#pragma once

#include <string>
#include <string_view>

#include <dovetailor/job/job.hpp>

namespace dovetailor {

// Reads a job file's text (TOML). `file` is the name used in messages.
// Lengths are converted from the file's `units` to millimetres. Throws
// InputError naming the file, line, column and key for unknown keys, wrong
// types, missing keys, non-finite or out-of-range numbers and impossible
// combinations (a mouth that closes, a dovetail wider than the stock, ...).
Job read_job(std::string_view text, const std::string& file);

}  // namespace dovetailor
