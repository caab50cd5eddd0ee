#include <dovetailor/base/text_wrap.hpp>

namespace dovetailor {

std::vector<std::string> wrap_words(const std::string& text, std::size_t width) {
  std::vector<std::string> lines;
  std::string row;
  std::size_t start = 0;
  while (start <= text.size()) {
    std::size_t end = text.find(' ', start);
    if (end == std::string::npos) end = text.size();
    const std::string word = text.substr(start, end - start);
    start = end + 1;
    if (word.empty()) continue;
    if (!row.empty() && row.size() + 1 + word.size() > width) {
      lines.push_back(row);
      row.clear();
    }
    row += (row.empty() ? "" : " ") + word;
  }
  if (!row.empty()) lines.push_back(row);
  return lines;
}

}  // namespace dovetailor
