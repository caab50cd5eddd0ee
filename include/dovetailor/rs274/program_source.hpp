#pragma once

#include <cstddef>
#include <string>

namespace dovetailor {

// Where the RS-274 reader gets its lines from, one at a time (pull model).
// The reader asks for the next line only when it has finished the previous
// one and keeps no earlier line, so memory stays bounded however long the
// program is. A file-backed source lives in the CLI (the core does no I/O).
//
// Contract for implementers: `next_line` replaces `line` with the next line
// without its end-of-line characters ("\n", "\r\n" or "\r") and returns
// true, or returns false at the end of the program. A source that reads
// from a stream should itself stop reading a line at some bound (a few
// times the reader's line limit) and hand over what it has: the reader then
// refuses the over-long line with a clear message.
class ProgramSource {
 public:
  virtual ~ProgramSource();
  virtual bool next_line(std::string& line) = 0;
  // The name used as the file in error messages ("bracket.ngc", "<stdin>").
  virtual const std::string& name() const = 0;
};

// A whole program held in memory: for tests and small programs.
class StringProgramSource : public ProgramSource {
 public:
  StringProgramSource(std::string text, std::string name);

  bool next_line(std::string& line) override;
  const std::string& name() const override { return name_; }

 private:
  std::string text_;
  std::string name_;
  std::size_t position_ = 0;
};

}  // namespace dovetailor
