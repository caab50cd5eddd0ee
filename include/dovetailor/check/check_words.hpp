#pragma once

// The words of the checker's enums: the keys of the check JSON and the
// report (see base/words.hpp).

#include <array>

#include <dovetailor/base/words.hpp>
#include <dovetailor/check/check_result.hpp>

namespace dovetailor {

constexpr std::array<EnumWord<FindingKind>, 15> word_table(FindingKind) {
  return {{{FindingKind::Gouge, "gouge"},
           {FindingKind::StockLeft, "stock_left"},
           {FindingKind::BodyCollision, "body_collision"},
           {FindingKind::FixtureCollision, "fixture_collision"},
           {FindingKind::RapidThroughMaterial, "rapid_through_material"},
           {FindingKind::SpindleStopped, "spindle_stopped"},
           {FindingKind::Plunge, "plunge"},
           {FindingKind::DepthOfCut, "depth_of_cut"},
           {FindingKind::CutterOverload, "cutter_overload"},
           {FindingKind::RapidBelowSafeHeight, "rapid_below_safe_height"},
           {FindingKind::SpindleSpeed, "spindle_speed"},
           {FindingKind::UnknownTool, "unknown_tool"},
           {FindingKind::ReadingOutOfTolerance, "reading_out_of_tolerance"},
           {FindingKind::NoProgramEnd, "no_program_end"},
           {FindingKind::HomeNotGiven, "home_not_given"}}};
}

constexpr std::array<EnumWord<Severity>, 2> word_table(Severity) {
  return {{{Severity::Error, "error"}, {Severity::Warning, "warning"}}};
}

constexpr std::array<EnumWord<ToolWord>, 5> word_table(ToolWord) {
  return {{{ToolWord::None, "none"},
           {ToolWord::T, "t"},
           {ToolWord::M6, "m6"},
           {ToolWord::D, "d"},
           {ToolWord::H, "h"}}};
}

constexpr std::array<EnumWord<Overload>, 2> word_table(Overload) {
  return {{{Overload::Slot, "slot"}, {Overload::RadialCut, "radial_cut"}}};
}

}  // namespace dovetailor
