#pragma once

#include <string>
#include <vector>

#include <dovetailor/shop/post.hpp>

namespace dovetailor::cli {

// The post named on the command line. A value with a '/' or ending in
// ".toml" is a file path; anything else is a name looked up as NAME.toml in,
// in order: $DOVETAILOR_POST_DIR (when set, the only place looked), the
// installed folder ../share/dovetailor/post next to the executable, and,
// only for a program that still lives in the build folder, the source
// tree's post/ folder (so an installed copy never hides a missing install).
// Throws InputError (field "--post") listing the folders searched.
Post load_post(const std::string& name_or_path);

// The folders searched for a post name, in order.
std::vector<std::string> post_folders();

}  // namespace dovetailor::cli
