#include <utility>

#include <dovetailor/base/error.hpp>

namespace dovetailor {

std::string describe(const SourcePlace& where, const std::string& field,
                     const std::string& message) {
  std::string out;
  if (!where.file.empty()) {
    out += where.file;
    if (where.line > 0) {
      // Appended piece by piece: GCC 12 at -O3 warns falsely (-Wrestrict)
      // on `":" + std::to_string(n)`.
      out += ':';
      out += std::to_string(where.line);
      if (where.column > 0) {
        out += ':';
        out += std::to_string(where.column);
      }
    }
    out += ": ";
  }
  if (!field.empty()) {
    out += field;
    out += ": ";
  }
  out += message;
  return out;
}

InputError::InputError(std::string message, SourcePlace where, std::string field)
    : std::runtime_error(describe(where, field, message)),
      message_(std::move(message)),
      where_(std::move(where)),
      field_(std::move(field)) {}

}  // namespace dovetailor
