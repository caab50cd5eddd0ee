// libFuzzer target for the RS-274 reader, expression evaluator and
// interpreter. Any input must end in events or an InputError: never a
// crash, a hang, a sanitizer report or an uncaught exception of another
// type. Built only with -DDOVETAILOR_FUZZ=ON (clang++).

#include <cstddef>
#include <cstdint>
#include <string>

#include <dovetailor/base/error.hpp>
#include <dovetailor/rs274/program_source.hpp>
#include <dovetailor/rs274/rs274_expression.hpp>
#include <dovetailor/rs274/rs274_interpreter.hpp>

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  using namespace dovetailor;
  if (size == 0) return 0;
  const std::string text(reinterpret_cast<const char*>(data) + 1, size - 1);
  if (data[0] % 4 == 0) {
    // The expression evaluator on its own.
    Rs274Parameters parameters;
    parameters.set(1, 2.5);
    try {
      evaluate_rs274_value(text, parameters);
    } catch (const InputError&) {
    }
    return 0;
  }
  StringProgramSource source(text, "fuzz.ngc");
  InterpreterOptions options{
      .tools = {{.number = 1, .radius_mm = 3, .length_mm = 50},
                {.number = 2, .radius_mm = 0.5, .length_mm = 20}},
      .initial_units = data[0] % 2 ? Units::Millimetre : Units::Inch,
      .block_delete = data[0] % 3 == 0,
  };
  try {
    Rs274Interpreter interpreter(source, options);
    // Bound the work per input: a legal program can ask for 10^7 moves
    // (L10000 holes of 1000 pecks), which is not a bug.
    for (int i = 0; i < 20000; ++i)
      if (!interpreter.next()) break;
  } catch (const InputError&) {
  }
  return 0;
}
