#pragma once

#include <cstdio>
#include <string>
#include <vector>

#include <dovetailor/rs274/program_source.hpp>

namespace dovetailor::cli {

// A program read from a file (or standard input for "-") one line at a time,
// so a long program never sits in memory whole. A line longer than
// `line_cap` characters is handed over cut at the cap (the RS-274 reader then
// refuses it as too long), so a file without line ends is not read whole.
class FileProgramSource : public ProgramSource {
 public:
  static constexpr std::size_t default_line_cap = std::size_t{4} * 4096;

  // Throws InputError naming the file when it cannot be opened.
  explicit FileProgramSource(const std::string& path, std::size_t line_cap = default_line_cap);
  ~FileProgramSource() override;
  FileProgramSource(const FileProgramSource&) = delete;
  FileProgramSource& operator=(const FileProgramSource&) = delete;

  bool next_line(std::string& line) override;
  const std::string& name() const override { return name_; }

 private:
  bool fill();

  std::FILE* file_ = nullptr;
  bool owned_ = false;
  std::string name_;
  std::size_t line_cap_;
  std::vector<char> buffer_;
  std::size_t begin_ = 0, end_ = 0;
  bool eof_ = false;
  bool skip_newline_ = false;  // the last line ended with '\r': a '\n' may follow
};

}  // namespace dovetailor::cli
