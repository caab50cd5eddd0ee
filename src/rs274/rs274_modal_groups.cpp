#include "rs274_modal_groups.hpp"

#include <array>

namespace dovetailor::detail {

namespace {

using G = GCode;
using GG = GGroup;

// NISTIR 6556 table 4 "Modal groups" (from memory).
constexpr std::array g_table{
    GCodeClass{G::Rapid, GG::Motion},
    GCodeClass{G::Linear, GG::Motion},
    GCodeClass{G::ArcClockwise, GG::Motion},
    GCodeClass{G::ArcCounterclockwise, GG::Motion},
    GCodeClass{G::StraightProbe, GG::Motion, false},
    GCodeClass{G::CycleCancel, GG::Motion},
    GCodeClass{G::Drill, GG::Motion},
    GCodeClass{G::DrillDwell, GG::Motion},
    GCodeClass{G::PeckDrill, GG::Motion},
    GCodeClass{G::Tap, GG::Motion, false},
    GCodeClass{G::Bore, GG::Motion},
    GCodeClass{G::BoreSpindleStop, GG::Motion, false},
    GCodeClass{G::BackBore, GG::Motion, false},
    GCodeClass{G::BoreManualOut, GG::Motion, false},
    GCodeClass{G::BoreDwell, GG::Motion},
    GCodeClass{G::PlaneXY, GG::Plane},
    GCodeClass{G::PlaneZX, GG::Plane},
    GCodeClass{G::PlaneYZ, GG::Plane},
    GCodeClass{G::Absolute, GG::Distance},
    GCodeClass{G::Incremental, GG::Distance},
    GCodeClass{G::InverseTime, GG::FeedMode},
    GCodeClass{G::UnitsPerMinute, GG::FeedMode},
    GCodeClass{G::Inch, GG::Units},
    GCodeClass{G::Millimetre, GG::Units},
    GCodeClass{G::CompensationOff, GG::CutterCompensation},
    GCodeClass{G::CompensationLeft, GG::CutterCompensation},
    GCodeClass{G::CompensationRight, GG::CutterCompensation},
    GCodeClass{G::LengthOffset, GG::LengthOffset},
    GCodeClass{G::LengthOffsetCancel, GG::LengthOffset},
    GCodeClass{G::ReturnToOldZ, GG::ReturnMode},
    GCodeClass{G::ReturnToR, GG::ReturnMode},
    GCodeClass{G::System1, GG::CoordinateSystem},
    GCodeClass{G::System2, GG::CoordinateSystem},
    GCodeClass{G::System3, GG::CoordinateSystem},
    GCodeClass{G::System4, GG::CoordinateSystem},
    GCodeClass{G::System5, GG::CoordinateSystem},
    GCodeClass{G::System6, GG::CoordinateSystem},
    GCodeClass{G::System7, GG::CoordinateSystem},
    GCodeClass{G::System8, GG::CoordinateSystem},
    GCodeClass{G::System9, GG::CoordinateSystem},
    GCodeClass{G::ExactPath, GG::PathControl},
    GCodeClass{G::ExactStop, GG::PathControl},
    GCodeClass{G::Continuous, GG::PathControl},
    GCodeClass{G::Dwell, GG::NonModal},
    GCodeClass{G::SetCoordinateData, GG::NonModal},
    GCodeClass{G::Home, GG::NonModal},
    GCodeClass{G::SecondHome, GG::NonModal},
    GCodeClass{G::MachineCoordinates, GG::NonModal},
    GCodeClass{G::AxisOffset, GG::NonModal},
    GCodeClass{G::AxisOffsetClear, GG::NonModal},
    GCodeClass{G::AxisOffsetSuspend, GG::NonModal},
    GCodeClass{G::AxisOffsetRestore, GG::NonModal},
};

using M = MCode;
using MG = MGroup;

constexpr std::array m_table{
    MCodeClass{M::ProgramStop, MG::Stopping},
    MCodeClass{M::OptionalStop, MG::Stopping},
    MCodeClass{M::ProgramEnd, MG::Stopping},
    MCodeClass{M::ProgramEndRewind, MG::Stopping},
    MCodeClass{M::PalletStop, MG::Stopping},
    MCodeClass{M::ToolChange, MG::ToolChange},
    MCodeClass{M::SpindleClockwise, MG::Spindle},
    MCodeClass{M::SpindleCounterclockwise, MG::Spindle},
    MCodeClass{M::SpindleStop, MG::Spindle},
    MCodeClass{M::Mist, MG::Coolant},
    MCodeClass{M::Flood, MG::Coolant},
    MCodeClass{M::CoolantOff, MG::Coolant},
    MCodeClass{M::OverridesOn, MG::Overrides},
    MCodeClass{M::OverridesOff, MG::Overrides},
};

}  // namespace

std::optional<GCodeClass> classify_g_code(int number) {
  for (const GCodeClass& row : g_table)
    if (code_number(row.code) == number) return row;
  return std::nullopt;
}

std::optional<MCodeClass> classify_m_code(int number) {
  for (const MCodeClass& row : m_table)
    if (code_number(row.code) == number) return row;
  return std::nullopt;
}

}  // namespace dovetailor::detail
