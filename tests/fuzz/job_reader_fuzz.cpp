// libFuzzer target for the job-file reader and the planner behind it. Any
// input must end in a Job and a Plan, or an InputError: never a crash, a
// hang, a sanitizer report or another exception. Built only with
// -DDOVETAILOR_FUZZ=ON (clang++).

#include <cstddef>
#include <cstdint>
#include <string>

#include <dovetailor/base/error.hpp>
#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/plan/planner.hpp>
#include <dovetailor/report/plan_report.hpp>

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  using namespace dovetailor;
  const std::string text(reinterpret_cast<const char*>(data), size);
  try {
    const Job job = read_job(text, "fuzz.toml");
    const Plan p = plan(job);
    (void)format_plan(p);
  } catch (const InputError&) {
  }
  return 0;
}
