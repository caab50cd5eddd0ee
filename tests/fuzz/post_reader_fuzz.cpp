// libFuzzer target for the post-file reader and the block writer it drives.
// Any input must end in a Post or an InputError. Built only with
// -DDOVETAILOR_FUZZ=ON (clang++).

#include <cstddef>
#include <cstdint>
#include <string>

#include <dovetailor/base/error.hpp>
#include <dovetailor/gcode/program_text.hpp>

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  using namespace dovetailor;
  const std::string text(reinterpret_cast<const char*>(data), size);
  try {
    const Post post = read_post(text, "fuzz-post.toml");
    ProgramText program(post, program_units(post, Units::Millimetre));
    program.add_comment("a comment (with brackets) that may be split across lines by the post");
    program.add({.words = {{'G', 1}, {'X', -12.3456}, {'Y', 0.0}, {'F', 250}}});
    (void)program.finish();
  } catch (const InputError&) {
  }
  return 0;
}
