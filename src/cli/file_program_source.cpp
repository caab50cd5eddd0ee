#include "file_program_source.hpp"

#include <cerrno>
#include <cstring>
#include <filesystem>

#include <dovetailor/base/error.hpp>

namespace dovetailor::cli {

FileProgramSource::FileProgramSource(const std::string& path, std::size_t line_cap)
    : name_(path == "-" ? "<stdin>" : path), line_cap_(line_cap), buffer_(1 << 16) {
  if (path == "-") {
    file_ = stdin;
    return;
  }
  std::error_code ec;
  if (std::filesystem::is_directory(path, ec)) throw InputError("is a folder, not a file", {path});
  file_ = std::fopen(path.c_str(), "rb");
  if (!file_) throw InputError(std::string("cannot open: ") + std::strerror(errno), {path});
  owned_ = true;
}

FileProgramSource::~FileProgramSource() {
  if (owned_) std::fclose(file_);
}

bool FileProgramSource::fill() {
  if (eof_) return false;
  begin_ = 0;
  end_ = std::fread(buffer_.data(), 1, buffer_.size(), file_);
  if (end_ == 0) {
    if (std::ferror(file_)) throw InputError("reading failed", {name_});
    eof_ = true;
    return false;
  }
  return true;
}

bool FileProgramSource::next_line(std::string& line) {
  line.clear();
  bool any = false;
  while (true) {
    if (begin_ == end_ && !fill()) return any;
    if (skip_newline_) {
      skip_newline_ = false;
      if (buffer_[begin_] == '\n') {
        ++begin_;
        continue;
      }
    }
    any = true;
    const char* start = buffer_.data() + begin_;
    const std::size_t available = end_ - begin_;
    std::size_t n = 0;
    while (n < available && start[n] != '\n' && start[n] != '\r') ++n;
    const std::size_t room = line_cap_ > line.size() ? line_cap_ - line.size() : 0;
    if (n > room) {
      line.append(start, room);
      begin_ += room;
      return true;  // over-long: the reader refuses it
    }
    line.append(start, n);
    begin_ += n;
    if (n < available) {
      skip_newline_ = buffer_[begin_] == '\r';
      ++begin_;
      return true;
    }
  }
}

}  // namespace dovetailor::cli
