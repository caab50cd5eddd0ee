#include <cmath>

#include <dovetailor/base/error.hpp>
#include <dovetailor/rs274/rs274_interpreter.hpp>

#include "rs274_block_executor.hpp"

namespace dovetailor {

Rs274Interpreter::Rs274Interpreter(ProgramSource& source, InterpreterOptions options)
    : source_(source), options_(std::move(options)), parameters_(options_.highest_parameter) {
  for (const auto& [number, value] : options_.parameters)
    if (parameters_.valid(number)) parameters_.set(number, value);
  state_.program_units = options_.initial_units;
  // The program starts in the system #5220 names (1 when it holds 0 or
  // something else), with the G92 offset of #5211..#5213 (NISTIR 6556,
  // parameters 5211-5216 and 5220, from memory).
  const auto units = options_.initial_units;
  const auto stored = [&](int number) {
    return parameters_.valid(number) ? to_mm(parameters_.get(number), units) : 0.0;
  };
  int system = 1;
  if (parameters_.valid(parameter::selected_system)) {
    const double n = parameters_.get(parameter::selected_system);
    if (n >= 1 && n <= 9 && n == std::floor(n)) system = static_cast<int>(n);
    parameters_.set(parameter::selected_system, system);
  }
  const int first = parameter::system_origin(system);
  state_.coordinate_system = system;
  state_.work_offset_mm = {stored(first), stored(first + 1), stored(first + 2)};
  const int g92 = parameter::axis_offset;
  state_.axis_offset_mm = {stored(g92), stored(g92 + 1), stored(g92 + 2)};
  position_ = options_.start_mm;
}

void Rs274Interpreter::fail(const Rs274Block& block, int column, const std::string& field,
                            const std::string& message) const {
  throw InputError(message, {source_.name(), block.line, column}, field);
}

void Rs274Interpreter::push(int line, EventBody body) {
  queue_.push_back(Event{line, state_, std::move(body)});
}

void Rs274Interpreter::push_motion(int line, MotionKind kind, PathSegment programmed,
                                   std::vector<PathSegment> tool_centre, double feed, bool canned) {
  push(line, Motion{kind, programmed, std::move(tool_centre), feed, canned});
}

bool Rs274Interpreter::read_block() {
  if (!source_.next_line(text_)) return false;
  ++line_;
  // A UTF-8 byte-order mark, as some editors write at the start of a file,
  // is not part of the program.
  if (line_ == 1 && text_.starts_with("\xEF\xBB\xBF")) text_.erase(0, 3);
  if (options_.block_delete) {
    const auto first = text_.find_first_not_of(" \t");
    if (first != std::string::npos && text_[first] == '/') return true;
  }
  const Rs274Block block =
      read_rs274_block(text_, line_, source_.name(), parameters_, options_.limits);
  if (block.percent_line) {
    if (content_seen_) push(line_, ProgramEnd{EndKind::Percent});
    content_seen_ = true;
    return true;
  }
  if (block.empty()) return true;
  content_seen_ = true;
  for (const auto& setting : block.settings) parameters_.set(setting.number, setting.value);
  execute(block);
  return true;
}

void Rs274Interpreter::execute(const Rs274Block& block) { Rs274BlockExecutor(*this, block).run(); }

std::optional<Event> Rs274Interpreter::next() {
  for (;;) {
    if (!queue_.empty()) {
      Event event = std::move(queue_.front());
      queue_.pop_front();
      if (std::holds_alternative<ProgramEnd>(event.body)) {
        ended_ = true;
        queue_.clear();
        cycle_.reset();
        after_cycle_.clear();
      }
      return event;
    }
    if (ended_) return std::nullopt;
    if (cycle_) {
      next_hole();
      continue;
    }
    if (!after_cycle_.empty()) {
      for (auto& [line, body] : after_cycle_) push(line, std::move(body));
      after_cycle_.clear();
      continue;
    }
    if (!read_block()) push(line_, ProgramEnd{EndKind::EndOfInput});
  }
}

}  // namespace dovetailor
