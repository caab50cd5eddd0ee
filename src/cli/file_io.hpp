#pragma once

#include <string>

namespace dovetailor::cli {

// The whole file as text. Throws InputError naming the file when it cannot
// be read or is larger than `max_bytes`.
std::string read_text_file(const std::string& path, std::size_t max_bytes = 16u << 20);

// Writes `content` to a temporary file in the same folder, then renames it
// into place, so a reader never sees half a file and a failed write leaves
// the old file as it was. Refuses to replace an existing file unless `force`.
// The output file's extension in lower case (".pdf"), which picks the format.
std::string output_extension(const std::string& path);

void write_file_atomically(const std::string& path, const std::string& content, bool force);

}  // namespace dovetailor::cli
