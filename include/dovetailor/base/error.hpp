#pragma once

#include <stdexcept>
#include <string>

namespace dovetailor {

// Where in a user's file something is: file name, 1-based line and column
// (0 when unknown). `file` may also name a command-line flag source.
struct SourcePlace {
  std::string file;
  int line = 0;
  int column = 0;

  bool operator==(const SourcePlace&) const = default;
};

// The one error type a user sees: bad input, an impossible job, a cutter
// that cannot do the work. It names where (file, line, column), which field
// (a job key such as "dovetail.angle", a G-code word, a flag) and says what
// would be valid. Programming mistakes are assertions, not InputErrors.
class InputError : public std::runtime_error {
 public:
  InputError(std::string message, SourcePlace where = {}, std::string field = {});

  const std::string& message() const { return message_; }
  const SourcePlace& where() const { return where_; }
  const std::string& field() const { return field_; }

 private:
  std::string message_;
  SourcePlace where_;
  std::string field_;
};

// "file:line:column: field: message" with the unknown parts left out.
std::string describe(const SourcePlace& where, const std::string& field,
                     const std::string& message);

}  // namespace dovetailor
