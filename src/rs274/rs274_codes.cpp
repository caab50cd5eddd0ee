#include <fmt/format.h>

#include <dovetailor/rs274/rs274_codes.hpp>

namespace dovetailor {

std::string word_name(Word word) {
  return std::string(1, static_cast<char>(static_cast<char>(word) - 'a' + 'A'));
}

std::optional<Word> word_of(char letter) {
  using W = Word;
  for (Word w : {W::A, W::B, W::C, W::D, W::F, W::H, W::I, W::J, W::K, W::L, W::P, W::Q, W::R, W::S,
                 W::T, W::X, W::Y, W::Z})
    if (static_cast<char>(w) == letter) return w;
  return std::nullopt;
}

std::string g_code_name(int number) {
  return number % 10 ? fmt::format("G{}.{}", number / 10, number % 10)
                     : fmt::format("G{}", number / 10);
}
std::string m_code_name(int number) { return fmt::format("M{}", number); }
std::string code_name(GCode code) { return g_code_name(code_number(code)); }
std::string code_name(MCode code) { return m_code_name(code_number(code)); }

}  // namespace dovetailor
