#pragma once

// Checks shared by the subcommands that describe a dovetail by flags.

#include <string>
#include <vector>

#include <dovetailor/base/error.hpp>
#include <dovetailor/base/words.hpp>
#include <dovetailor/job/job_words.hpp>

namespace dovetailor::cli {

// The value a flag's word names, by the enum's word table (base/words.hpp);
// an InputError naming the flag when it names none ("missing" when empty).
template <class E>
E parse_word(const std::string& word, const std::string& flag) {
  if (auto value = from_key<E>(word)) return *value;
  throw InputError(
      (word.empty() ? "missing; give " : "\"" + word + "\" is not one of ") + key_list<E>("or"),
      {"flags"}, flag);
}

// The keys of an enum's word table, for CLI::IsMember.
template <class E>
std::vector<std::string> keys_of() {
  std::vector<std::string> keys;
  for (const auto& w : word_table(E{})) keys.emplace_back(w.key);
  return keys;
}

// The flag's value; an InputError naming the flag when it is missing (NaN),
// not finite, or outside (min, max].
double require_flag(double value, const std::string& flag, double min, double max);

}  // namespace dovetailor::cli
