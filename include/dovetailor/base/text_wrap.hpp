#pragma once

#include <string>
#include <vector>

namespace dovetailor {

// The words of `text` (split at spaces) in lines of at most `width`
// characters (none for a text without words); a word longer than `width`
// stands alone on its line. Used by
// every writer that lays text out for a terminal, a program comment or paper.
std::vector<std::string> wrap_words(const std::string& text, std::size_t width);

}  // namespace dovetailor
