#include <cstddef>
#include <string>

#include <gtest/gtest.h>

#include <dovetailor/rs274/program_source.hpp>
#include <dovetailor/rs274/rs274_interpreter.hpp>

#include "test_support.hpp"

namespace dovetailor {
namespace {

// Makes a program of `count` lines on demand without holding it: the way a
// file-backed source streams.
class GeneratedProgram : public ProgramSource {
 public:
  explicit GeneratedProgram(long count) : count_(count) {}

  bool next_line(std::string& line) override {
    ++asked_;
    if (produced_ == count_) return false;
    ++produced_;
    if (produced_ == 1)
      line = "G21 G90 G17 F600 S1000 M3";
    else if (produced_ == count_)
      line = "M30";
    else if (produced_ % 3 == 0)  // a full circle back to the previous line's end
      line = "G2 X" + std::to_string((produced_ - 1) % 50) + " Y" +
             std::to_string((produced_ - 1) % 7) + " I5 (full circle)";
    else
      line = "G1 X" + std::to_string(produced_ % 50) + " Y" + std::to_string(produced_ % 7);
    return true;
  }
  const std::string& name() const override { return name_; }

  long produced() const { return produced_; }
  long asked() const { return asked_; }

 private:
  long count_;
  long produced_ = 0;
  long asked_ = 0;
  std::string name_ = "generated.ngc";
};

TEST(rs274_streaming, a_million_lines_run_with_a_bounded_queue) {
  constexpr long lines = 1000000;
  GeneratedProgram source(lines);
  Rs274Interpreter interpreter(source);
  std::size_t events = 0;
  std::size_t most_queued = 0;
  long most_read_ahead = 0;
  long handed_out_line = 0;
  while (auto event = interpreter.next()) {
    ++events;
    most_queued = std::max(most_queued, interpreter.queued_events());
    // The reader never reads more than the line whose events it hands out.
    most_read_ahead = std::max(most_read_ahead, source.produced() - event->line);
    handed_out_line = event->line;
  }
  EXPECT_EQ(handed_out_line, lines);
  EXPECT_EQ(source.produced(), lines);
  // One event per line after the first, plus the spindle start.
  EXPECT_EQ(events, static_cast<std::size_t>(lines));
  // Structural bounds: the queue holds one block's events at most, and no
  // line is read ahead of the one being handed out.
  EXPECT_LE(most_queued, 2u);
  EXPECT_EQ(most_read_ahead, 0);
}

TEST(string_program_source, splits_lines_of_any_ending) {
  StringProgramSource source("a\r\nb\rc\n\nd", "x.ngc");
  std::string line;
  std::vector<std::string> lines;
  while (source.next_line(line)) lines.push_back(line);
  EXPECT_EQ(lines, (std::vector<std::string>{"a", "b", "c", "", "d"}));
  EXPECT_EQ(source.name(), "x.ngc");
}

}  // namespace
}  // namespace dovetailor
