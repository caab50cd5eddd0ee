#include "file_io.hpp"

#include <cctype>
#include <cerrno>
#include <cstdio>
#include <cstring>
#include <fcntl.h>
#include <filesystem>
#include <fstream>
#include <random>
#include <sstream>
#include <unistd.h>
#include <utility>

#include <fmt/format.h>

#include <dovetailor/base/error.hpp>

namespace dovetailor::cli {

std::string read_text_file(const std::string& path, std::size_t max_bytes) {
  std::error_code ec;
  if (std::filesystem::is_directory(path, ec)) throw InputError("is a folder, not a file", {path});
  std::ifstream in(path, std::ios::binary);
  if (!in) throw InputError(std::string("cannot open: ") + std::strerror(errno), {path});
  std::string text;
  char buffer[1 << 16];
  while (in.read(buffer, sizeof buffer) || in.gcount() > 0) {
    text.append(buffer, static_cast<std::size_t>(in.gcount()));
    if (text.size() > max_bytes)
      throw InputError("is larger than " + std::to_string(max_bytes >> 20) + " MiB", {path});
  }
  return text;
}

std::string output_extension(const std::string& path) {
  std::string ext = std::filesystem::path(path).extension().string();
  for (auto& ch : ext) ch = static_cast<char>(std::tolower(static_cast<unsigned char>(ch)));
  return ext;
}

AtomicFile::AtomicFile(std::string path, bool force) : path_(std::move(path)) {
  namespace fs = std::filesystem;
  std::error_code ec;
  if (fs::exists(path_, ec) && !force)
    throw InputError("already exists; give --force to replace it", {path_});
  if (fs::is_directory(path_, ec)) throw InputError("is a folder, not a file", {path_});
  const fs::path target(path_);
  const fs::path folder = target.has_parent_path() ? target.parent_path() : fs::path(".");
  std::random_device random;
  for (int attempt = 0; attempt < 100 && fd_ < 0; ++attempt) {
    temp_ = (folder / fmt::format(".{}.tmp{}", target.filename().string(), random() % 1000000))
                .string();
    fd_ = ::open(temp_.c_str(), O_WRONLY | O_CREAT | O_EXCL | O_CLOEXEC, 0644);
    if (fd_ < 0 && errno != EEXIST) break;
  }
  if (fd_ < 0) throw InputError(std::string("cannot write here: ") + std::strerror(errno), {path_});
}

AtomicFile::~AtomicFile() {
  if (fd_ >= 0) ::close(fd_);
  if (!committed_) ::unlink(temp_.c_str());
}

void AtomicFile::write(std::string_view text) {
  while (!text.empty()) {
    const ssize_t n = ::write(fd_, text.data(), text.size());
    if (n < 0 && errno == EINTR) continue;
    if (n <= 0)
      throw InputError(
          std::string("writing failed (") + std::strerror(errno) + "); the old file is unchanged",
          {path_});
    text.remove_prefix(static_cast<std::size_t>(n));
  }
}

void AtomicFile::commit() {
  if (::fsync(fd_) != 0 || ::close(fd_) != 0) {
    fd_ = -1;
    throw InputError(
        std::string("writing failed (") + std::strerror(errno) + "); the old file is unchanged",
        {path_});
  }
  fd_ = -1;
  if (::rename(temp_.c_str(), path_.c_str()) != 0)
    throw InputError(std::string("cannot replace the file: ") + std::strerror(errno), {path_});
  committed_ = true;
}

void write_file_atomically(const std::string& path, const std::string& content, bool force) {
  AtomicFile file(path, force);
  file.write(content);
  file.commit();
}

void write_output(const std::string& path, const std::string& content, bool force) {
  if (!is_standard_output(path)) {
    write_file_atomically(path, content, force);
    return;
  }
  if (std::fwrite(content.data(), 1, content.size(), stdout) != content.size() ||
      std::fflush(stdout) != 0)
    throw InputError(std::string("writing to standard output failed: ") + std::strerror(errno), {},
                     "-o");
}

}  // namespace dovetailor::cli
