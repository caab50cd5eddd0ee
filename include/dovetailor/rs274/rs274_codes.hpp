#pragma once

#include <optional>
#include <string>

namespace dovetailor {

// The names of the RS-274/NGC words and codes the interpreter acts on, after
// NISTIR 6556 (Kramer, Proctor, Messina 2000) section 3.2 "words" and
// section 3.5 "G codes", 3.6 "M codes" (section numbers from memory, given
// where recalled).

// A word's letter (as Rs274Block keeps it, lower case). What each means, per
// NISTIR 6556 table 3 "Words" (from memory):
//   X Y Z   linear axes            A B C   rotary axes (refused)
//   I J K   arc centre offsets along X, Y, Z
//   R       arc radius; the retract plane of a canned cycle
//   F feed rate   S spindle speed   T tool selection
//   D       tool for cutter radius compensation (G41/G42)
//   H       tool for the tool length offset (G43)
//   L       repeats of a canned cycle; the kind of data G10 sets
//   P       dwell time (G4, G82, G89); the coordinate system of G10
//   Q       peck depth of G83
enum class Word : char {
  A = 'a',
  B = 'b',
  C = 'c',
  D = 'd',
  F = 'f',
  H = 'h',
  I = 'i',
  J = 'j',
  K = 'k',
  L = 'l',
  P = 'p',
  Q = 'q',
  R = 'r',
  S = 's',
  T = 't',
  X = 'x',
  Y = 'y',
  Z = 'z',
};

// The letter as a program shows it: Word::X -> "X".
std::string word_name(Word word);
// The word a lower-case letter starts; nothing for G, M and N (read apart)
// and for letters that are no word (E O U V W, and N in mid-line).
std::optional<Word> word_of(char letter);

// G codes, kept times ten as Rs274Code does (G59.1 is 591, G1 is 10).
enum class GCode : int {
  Rapid = 0,                 // G0    (3.5.1)
  Linear = 10,               // G1    (3.5.2)
  ArcClockwise = 20,         // G2    (3.5.3)
  ArcCounterclockwise = 30,  // G3    (3.5.3)
  Dwell = 40,                // G4    (3.5.4)
  SetCoordinateData = 100,   // G10   (L2, and the later L20)
  PlaneXY = 170,             // G17
  PlaneZX = 180,             // G18
  PlaneYZ = 190,             // G19
  Inch = 200,                // G20
  Millimetre = 210,          // G21
  Home = 280,                // G28
  SecondHome = 300,          // G30
  StraightProbe = 382,       // G38.2 (not simulated)
  CompensationOff = 400,     // G40
  CompensationLeft = 410,    // G41
  CompensationRight = 420,   // G42
  LengthOffset = 430,        // G43
  LengthOffsetCancel = 490,  // G49
  MachineCoordinates = 530,  // G53   (3.5.12)
  System1 = 540,             // G54
  System2 = 550,             // G55
  System3 = 560,             // G56
  System4 = 570,             // G57
  System5 = 580,             // G58
  System6 = 590,             // G59
  System7 = 591,             // G59.1
  System8 = 592,             // G59.2
  System9 = 593,             // G59.3
  ExactPath = 610,           // G61
  ExactStop = 611,           // G61.1
  Continuous = 640,          // G64
  CycleCancel = 800,         // G80   (3.5.15)
  Drill = 810,               // G81   (3.5.16)
  DrillDwell = 820,          // G82
  PeckDrill = 830,           // G83
  Tap = 840,                 // G84   (not simulated)
  Bore = 850,                // G85
  BoreSpindleStop = 860,     // G86   (not simulated)
  BackBore = 870,            // G87   (not simulated)
  BoreManualOut = 880,       // G88   (not simulated)
  BoreDwell = 890,           // G89
  Absolute = 900,            // G90
  Incremental = 910,         // G91
  AxisOffset = 920,          // G92
  AxisOffsetClear = 921,     // G92.1
  AxisOffsetSuspend = 922,   // G92.2
  AxisOffsetRestore = 923,   // G92.3
  InverseTime = 930,         // G93   (3.5.19)
  UnitsPerMinute = 940,      // G94
  ReturnToOldZ = 980,        // G98
  ReturnToR = 990,           // G99
};

// M codes, kept as they are (M3 is 3).
enum class MCode : int {
  ProgramStop = 0,              // M0  (3.6.1)
  OptionalStop = 1,             // M1
  ProgramEnd = 2,               // M2
  SpindleClockwise = 3,         // M3  (3.6.2)
  SpindleCounterclockwise = 4,  // M4
  SpindleStop = 5,              // M5
  ToolChange = 6,               // M6  (3.6.3)
  Mist = 7,                     // M7  (3.6.4)
  Flood = 8,                    // M8
  CoolantOff = 9,               // M9
  ProgramEndRewind = 30,        // M30 (3.6.1)
  OverridesOn = 48,             // M48 (3.6.5)
  OverridesOff = 49,            // M49
  PalletStop = 60,              // M60 (3.6.1)
};

constexpr int code_number(GCode code) { return static_cast<int>(code); }
constexpr int code_number(MCode code) { return static_cast<int>(code); }

// "G59.1", "M3".
std::string code_name(GCode code);
std::string code_name(MCode code);
std::string g_code_name(int number);  // times ten: 591 -> "G59.1"
std::string m_code_name(int number);  // 3 -> "M3"

// The canned cycles G81 .. G89.
constexpr bool is_canned_cycle(GCode code) {
  return code >= GCode::Drill && code <= GCode::BoreDwell;
}
constexpr bool is_arc(GCode code) {
  return code == GCode::ArcClockwise || code == GCode::ArcCounterclockwise;
}

// The parameters the interpreter reads and writes, NISTIR 6556 section 3.2.1
// table "Parameters used" (from memory). A system's origin is its first
// parameter (X) and the next two (Y, Z).
namespace parameter {
inline constexpr int g28_home = 5161;          // X; Y, Z follow
inline constexpr int g30_home = 5181;          // X; Y, Z follow
inline constexpr int axis_offset = 5211;       // G92 offset X; Y, Z follow (5211..5216 with A B C)
inline constexpr int axis_offset_last = 5216;  // C
inline constexpr int selected_system = 5220;   // 1 (G54) .. 9 (G59.3)
// The origin of coordinate system n (1 .. 9): X at 5221 + 20 (n - 1).
constexpr int system_origin(int n) { return 5221 + 20 * (n - 1); }
}  // namespace parameter

}  // namespace dovetailor
