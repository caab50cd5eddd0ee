#pragma once

#include <string>
#include <string_view>

namespace dovetailor::cli {

// The whole file as text. Throws InputError naming the file when it cannot
// be read or is larger than `max_bytes`.
std::string read_text_file(const std::string& path, std::size_t max_bytes = 16u << 20);

// An output file that appears whole or not at all. The text goes to a
// temporary file in the same folder (".NAME.tmpNNNNNN"), which commit()
// flushes to disk (fsync) and renames over the target; rename within a folder
// is atomic on POSIX file systems, so a reader never sees half a file and a
// failure or a killed process leaves the old file as it was. Without commit()
// the destructor removes the temporary file. An existing target is refused
// unless `force`; the inputs are never opened for writing.
class AtomicFile {
 public:
  AtomicFile(std::string path, bool force);
  AtomicFile(const AtomicFile&) = delete;
  AtomicFile& operator=(const AtomicFile&) = delete;
  ~AtomicFile();

  void write(std::string_view text);
  void commit();

 private:
  std::string path_;
  std::string temp_;
  int fd_ = -1;
  bool committed_ = false;
};

// The output file's extension in lower case (".pdf"), which picks the format.
std::string output_extension(const std::string& path);

// AtomicFile for a whole text at once.
void write_file_atomically(const std::string& path, const std::string& content, bool force);

// True for the output name "-": standard output instead of a file.
inline bool is_standard_output(const std::string& path) { return path == "-"; }

// `content` to standard output when `path` is "-", else to the file through
// AtomicFile. A failed write to standard output (a closed pipe, a full disk)
// is an InputError, so the exit code tells the shell.
void write_output(const std::string& path, const std::string& content, bool force);

}  // namespace dovetailor::cli
