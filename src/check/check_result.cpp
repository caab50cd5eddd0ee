#include <algorithm>

#include <dovetailor/check/check_result.hpp>

namespace dovetailor {

std::string_view finding_kind_name(FindingKind kind) {
  switch (kind) {
    case FindingKind::Gouge:
      return "gouge";
    case FindingKind::StockLeft:
      return "stock_left";
    case FindingKind::BodyCollision:
      return "body_collision";
    case FindingKind::FixtureCollision:
      return "fixture_collision";
    case FindingKind::RapidThroughMaterial:
      return "rapid_through_material";
    case FindingKind::SpindleStopped:
      return "spindle_stopped";
    case FindingKind::Plunge:
      return "plunge";
    case FindingKind::DepthOfCut:
      return "depth_of_cut";
    case FindingKind::CutterOverload:
      return "cutter_overload";
    case FindingKind::RapidBelowSafeHeight:
      return "rapid_below_safe_height";
    case FindingKind::SpindleSpeed:
      return "spindle_speed";
    case FindingKind::UnknownTool:
      return "unknown_tool";
    case FindingKind::ReadingOutOfTolerance:
      return "reading_out_of_tolerance";
    case FindingKind::NoProgramEnd:
      return "no_program_end";
    case FindingKind::HomeNotGiven:
      return "home_not_given";
  }
  return "?";
}

std::string_view tool_word_name(ToolWord word) {
  switch (word) {
    case ToolWord::None:
      return "none";
    case ToolWord::T:
      return "t";
    case ToolWord::M6:
      return "m6";
    case ToolWord::D:
      return "d";
    case ToolWord::H:
      return "h";
  }
  return "?";
}

std::string_view overload_name(Overload overload) {
  return overload == Overload::Slot ? "slot" : "radial_cut";
}

std::string_view severity_name(Severity severity) {
  return severity == Severity::Error ? "error" : "warning";
}

bool CheckReport::has_errors() const {
  return std::any_of(findings.begin(), findings.end(),
                     [](const Finding& f) { return f.severity == Severity::Error; });
}

long CheckReport::count(FindingKind kind) const {
  for (const FindingCount& c : counts)
    if (c.kind == kind) return c.count;
  return 0;
}

}  // namespace dovetailor
