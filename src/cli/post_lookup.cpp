#include "post_lookup.hpp"

#include <cstdlib>
#include <filesystem>

#include <dovetailor/base/error.hpp>

#include "file_io.hpp"

namespace dovetailor::cli {

namespace {

// True when `path` lies inside `folder` (both absolute, compared by parts).
bool is_inside(const std::filesystem::path& path, const std::filesystem::path& folder) {
  auto p = path.begin();
  for (auto f = folder.begin(); f != folder.end(); ++f, ++p) {
    if (f->empty()) continue;  // a trailing separator
    if (p == path.end() || *p != *f) return false;
  }
  return true;
}

}  // namespace

std::vector<std::string> post_folders() {
  namespace fs = std::filesystem;
  if (const char* dir = std::getenv("DOVETAILOR_POST_DIR"); dir && *dir) return {dir};
  std::vector<std::string> folders;
  std::error_code ec;
  const fs::path exe = fs::read_symlink("/proc/self/exe", ec);
  if (ec) return {DOVETAILOR_SOURCE_POST_DIR};
  folders.push_back(
      (exe.parent_path() / DOVETAILOR_INSTALLED_POST_DIR).lexically_normal().string());
  // Only a program still in the build folder reads the source tree's posts:
  // an installed copy must find its own, or say it cannot.
  const fs::path build_dir = fs::weakly_canonical(DOVETAILOR_BUILD_DIR, ec);
  if (!ec && is_inside(fs::weakly_canonical(exe, ec), build_dir))
    folders.push_back(DOVETAILOR_SOURCE_POST_DIR);
  return folders;
}

Post load_post(const std::string& name_or_path) {
  namespace fs = std::filesystem;
  const bool is_path =
      name_or_path.find('/') != std::string::npos || name_or_path.ends_with(".toml");
  if (is_path) return read_post(read_text_file(name_or_path), name_or_path);
  std::string searched;
  for (const auto& folder : post_folders()) {
    const fs::path file = fs::path(folder) / (name_or_path + ".toml");
    std::error_code ec;
    if (fs::is_regular_file(file, ec))
      return read_post(read_text_file(file.string()), file.string());
    searched += (searched.empty() ? "" : ", ") + folder;
  }
  throw InputError("no post \"" + name_or_path + "\" in " + searched +
                       "; give a shipped name (rs274ngc-full, small-control, iso6983-numbered) or "
                       "the path of a post file",
                   {}, "--post");
}

}  // namespace dovetailor::cli
