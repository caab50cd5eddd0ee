#include <dovetailor/job/job.hpp>

namespace dovetailor {

Tolerance default_tolerance(DovetailType type, Units units) {
  // A sliding fit wants the female a little large and the male a little
  // small, never the other way (common practice, no source).
  const double band = units == Units::Inch ? to_mm(0.001, Units::Inch) : 0.02;
  return type == DovetailType::Female ? Tolerance{0, band} : Tolerance{-band, 0};
}

const Tool* find_tool(const Job& job, int number) {
  for (const auto& tool : job.tools)
    if (tool.number == number) return &tool;
  return nullptr;
}

const Tool* first_tool(const Job& job, ToolKind kind) {
  for (const auto& tool : job.tools)
    if (tool.kind == kind) return &tool;
  return nullptr;
}

}  // namespace dovetailor
