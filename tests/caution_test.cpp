#include <cctype>
#include <string>

#include <gtest/gtest.h>

#include <dovetailor/base/caution.hpp>
#include <dovetailor/check/checker.hpp>
#include <dovetailor/gcode/gcode_writer.hpp>
#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/plan/planner.hpp>
#include <dovetailor/report/check_report.hpp>
#include <dovetailor/report/plan_report.hpp>
#include <dovetailor/report/sheet.hpp>
#include <dovetailor/report/sheet_text.hpp>
#include <dovetailor/rs274/program_source.hpp>

#include "test_support.hpp"

namespace dovetailor {
namespace {

using testing::read_source_file;

// The guide's cautions (verify by dry run and single block, secure
// workholding, guards and eye protection, fragile dovetail cutters, the
// shop's rules and the machine maker's instructions) as words each form of
// every caution list must hold between them (common practice, no source).
TEST(caution, every_form_names_what_the_trade_asks) {
  for (CautionForm form : {CautionForm::Long, CautionForm::Short, CautionForm::Manual}) {
    std::string text = caution_paragraph(form);
    for (char& ch : text) ch = static_cast<char>(std::tolower(static_cast<unsigned char>(ch)));
    SCOPED_TRACE(text);
    for (const char* words : {"dry run", "secure the work", "eye protection", "fragile",
                              "shop's rules", "machine maker's instructions", "spindle stopped"})
      EXPECT_NE(text.find(words), std::string::npos) << words;
  }
  EXPECT_NE(caution_paragraph(CautionForm::Long).find("single block"), std::string::npos);
  EXPECT_NE(caution_paragraph(CautionForm::Short).find("single block"), std::string::npos);
}

// Words with every run of spaces and line breaks made one space.
std::string flat(const std::string& text) {
  std::string out;
  for (char c : text) {
    const bool space = c == ' ' || c == '\n' || c == '\r';
    if (space && (out.empty() || out.back() == ' ')) continue;
    out += space ? ' ' : c;
  }
  return out;
}

// The comment words of a program, its lines' comments joined.
std::string comment_words(const std::string& program) {
  std::string out;
  for (std::size_t at = program.find('('); at != std::string::npos;
       at = program.find('(', at + 1)) {
    const std::size_t end = program.find(')', at);
    out += program.substr(at + 1, end - at - 1) + " ";
  }
  return flat(out);
}

void expect_every_caution(const std::string& text, CautionForm form) {
  for (const Caution& c : cautions) {
    // Writers may wrap a line; compare the words.
    const std::string line = flat(std::string(caution_line(c, form)));
    EXPECT_NE(text.find(line), std::string::npos) << "missing: " << line;
  }
}

Plan sample_plan(const std::string& name) {
  const std::string path = "samples/" + name + ".toml";
  return plan(read_job(read_source_file(path), path));
}

TEST(caution, plan_report_carries_every_caution) {
  expect_every_caution(flat(format_plan(sample_plan("stop-block-male"))), CautionForm::Long);
}

TEST(caution, program_header_carries_every_caution) {
  const Plan p = sample_plan("stop-block-male");
  for (const char* post : {"rs274ngc-full", "iso6983-numbered", "small-control"}) {
    SCOPED_TRACE(post);
    const std::string path = std::string("post/") + post + ".toml";
    const std::string program = write_program(p, read_post(read_source_file(path), path), {});
    expect_every_caution(comment_words(program), CautionForm::Short);
  }
}

TEST(caution, sheets_carry_every_caution) {
  expect_every_caution(flat(sheet_text(build_sheet(sample_plan("stop-block-male"), {}))),
                       CautionForm::Long);
  // A manual mill's sheet: the manual form (no program to run in single block).
  expect_every_caution(flat(sheet_text(build_sheet(sample_plan("height-stop-half-female"), {}))),
                       CautionForm::Manual);
}

TEST(caution, check_report_carries_every_caution) {
  const Job job = read_job(read_source_file("samples/stop-block-male.toml"), "stop-block-male");
  StringProgramSource source("G21 G90 G17\nM30\n", "empty.ngc");
  expect_every_caution(flat(format_check_report(check(source, job))), CautionForm::Long);
}

}  // namespace
}  // namespace dovetailor
