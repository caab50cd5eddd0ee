#include <utility>

#include <dovetailor/rs274/program_source.hpp>

namespace dovetailor {

ProgramSource::~ProgramSource() = default;

StringProgramSource::StringProgramSource(std::string text, std::string name)
    : text_(std::move(text)), name_(std::move(name)) {}

bool StringProgramSource::next_line(std::string& line) {
  if (position_ >= text_.size()) return false;
  const auto end = text_.find_first_of("\r\n", position_);
  if (end == std::string::npos) {
    line.assign(text_, position_, std::string::npos);
    position_ = text_.size();
    return true;
  }
  line.assign(text_, position_, end - position_);
  position_ = end + 1;
  if (text_[end] == '\r' && position_ < text_.size() && text_[position_] == '\n') ++position_;
  return true;
}

}  // namespace dovetailor
