#include "file_io.hpp"

#include <cerrno>
#include <cstdio>
#include <cstring>
#include <filesystem>
#include <fstream>
#include <random>
#include <sstream>

#include <dovetailor/error.hpp>

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

void write_file_atomically(const std::string& path, const std::string& content, bool force) {
  namespace fs = std::filesystem;
  std::error_code ec;
  if (fs::exists(path, ec) && !force)
    throw InputError("already exists; give --force to replace it", {path});
  const fs::path target(path);
  const fs::path folder = target.has_parent_path() ? target.parent_path() : fs::path(".");
  std::random_device random;
  const fs::path temp =
      folder / ("." + target.filename().string() + ".tmp" + std::to_string(random() % 1000000));
  {
    std::ofstream out(temp, std::ios::binary | std::ios::trunc);
    if (!out) throw InputError(std::string("cannot write here: ") + std::strerror(errno), {path});
    out.write(content.data(), static_cast<std::streamsize>(content.size()));
    out.flush();
    if (!out) {
      fs::remove(temp, ec);
      throw InputError("writing failed (disk full?); the old file is unchanged", {path});
    }
  }
  fs::rename(temp, target, ec);
  if (ec) {
    fs::remove(temp, ec);
    throw InputError("cannot replace the file: " + ec.message(), {path});
  }
}

}  // namespace dovetailor::cli
