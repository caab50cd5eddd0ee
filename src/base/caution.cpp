#include <dovetailor/base/caution.hpp>

namespace dovetailor {

std::string caution_paragraph(CautionForm form) {
  std::string text = "CAUTION:";
  for (const Caution& c : cautions) {
    text += ' ';
    text += caution_line(c, form);
  }
  return text;
}

}  // namespace dovetailor
