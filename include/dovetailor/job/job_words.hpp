#pragma once

// The words of the job's enums: job file keys (read by the job reader,
// written by the job template, JSON and the command line) and the words
// the writers print. See base/words.hpp.

#include <array>

#include <dovetailor/base/words.hpp>
#include <dovetailor/job/handwheel.hpp>
#include <dovetailor/job/job.hpp>

namespace dovetailor {

constexpr std::array<EnumWord<DovetailType>, 2> word_table(DovetailType) {
  return {{{DovetailType::Male, "male"}, {DovetailType::Female, "female"}}};
}

constexpr std::array<EnumWord<WidthAt>, 2> word_table(WidthAt) {
  return {{{WidthAt::Bottom, "bottom"}, {WidthAt::Top, "top"}}};
}

constexpr std::array<EnumWord<AngledSides>, 3> word_table(AngledSides) {
  return {
      {{AngledSides::Both, "both"}, {AngledSides::Left, "left"}, {AngledSides::Right, "right"}}};
}

constexpr std::array<EnumWord<Ends>, 3> word_table(Ends) {
  return {{{Ends::Open, "open"},
           {Ends::FrontOpen, "front-open", "open at the front"},
           {Ends::Closed, "closed"}}};
}

constexpr std::array<EnumWord<Side>, 2> word_table(Side) {
  return {{{Side::Left, "left"}, {Side::Right, "right"}}};
}

constexpr std::array<EnumWord<ToolKind>, 4> word_table(ToolKind) {
  return {{{ToolKind::EndMill, "end-mill", "end mill"},
           {ToolKind::Dovetail, "dovetail", "dovetail cutter"},
           {ToolKind::Drill, "drill"},
           {ToolKind::ChamferMill, "chamfer-mill", "chamfer mill"}}};
}

constexpr std::array<EnumWord<ToolMaterial>, 2> word_table(ToolMaterial) {
  return {{{ToolMaterial::Hss, "hss", "HSS"}, {ToolMaterial::Carbide, "carbide"}}};
}

constexpr std::array<EnumWord<MachineKind>, 2> word_table(MachineKind) {
  return {{{MachineKind::Cnc, "cnc", "CNC"}, {MachineKind::Manual, "manual"}}};
}

// "both" is the planner's (roughing both ways); a job asks for one of the
// other two.
constexpr std::array<EnumWord<MillingMode>, 3> word_table(MillingMode) {
  return {{{MillingMode::Conventional, "conventional"},
           {MillingMode::Climb, "climb"},
           {MillingMode::Both, "both"}}};
}

constexpr std::array<EnumWord<CheckpointAt>, 3> word_table(CheckpointAt) {
  return {{{CheckpointAt::AfterRoughing, "after-roughing", "after roughing"},
           {CheckpointAt::BeforeFinish, "before-finish", "before the finish"},
           {CheckpointAt::AfterFinish, "after-finish", "after the finish"}}};
}

constexpr std::array<EnumWord<XDatumMethod>, 2> word_table(XDatumMethod) {
  return {{{XDatumMethod::EdgeFinder, "edge-finder", "edge finder"},
           {XDatumMethod::TouchOff, "touch-off", "touch off"}}};
}

constexpr std::array<EnumWord<FixtureKind>, 3> word_table(FixtureKind) {
  return {{{FixtureKind::ViseJaw, "vise-jaw", "vise jaw"},
           {FixtureKind::Clamp, "clamp"},
           {FixtureKind::Other, "other"}}};
}

constexpr std::array<EnumWord<SlideAxis>, 4> word_table(SlideAxis) {
  return {{{SlideAxis::PlusX, "+x", "+X"},
           {SlideAxis::MinusX, "-x", "-X"},
           {SlideAxis::PlusY, "+y", "+Y"},
           {SlideAxis::MinusY, "-y", "-Y"}}};
}

constexpr std::array<EnumWord<AxisDirection>, 2> word_table(AxisDirection) {
  return {{{AxisDirection::Plus, "plus", "+"}, {AxisDirection::Minus, "minus", "-"}}};
}

constexpr std::array<EnumWord<CommonDial>, 4> word_table(CommonDial) {
  return {{{CommonDial::Inch200, "inch-200"},
           {CommonDial::Inch100, "inch-100"},
           {CommonDial::Metric5mm, "metric-5"},
           {CommonDial::Metric2mm, "metric-2"}}};
}

}  // namespace dovetailor
