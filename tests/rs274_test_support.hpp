#pragma once

// Helpers for the RS-274 interpreter tests: run a program held in a string.

#include <string>
#include <variant>
#include <vector>

#include <dovetailor/rs274/program_source.hpp>
#include <dovetailor/rs274/rs274_interpreter.hpp>

namespace dovetailor::testing {

inline std::vector<Event> run_program(const std::string& text, InterpreterOptions options = {}) {
  StringProgramSource source(text, "test.ngc");
  Rs274Interpreter interpreter(source, std::move(options));
  std::vector<Event> events;
  while (auto event = interpreter.next()) events.push_back(std::move(*event));
  return events;
}

inline std::vector<Motion> motions(const std::vector<Event>& events) {
  std::vector<Motion> out;
  for (const auto& event : events)
    if (const auto* motion = std::get_if<Motion>(&event.body)) out.push_back(*motion);
  return out;
}

}  // namespace dovetailor::testing
