#pragma once

#include <optional>
#include <string>

#include <dovetailor/plan/plan.hpp>
#include <dovetailor/plan/sizing.hpp>
#include <dovetailor/shop/post.hpp>

namespace dovetailor {

// The RS-274 program for a plan, written for one post (post.hpp). Words and
// their meaning follow the NIST RS274NGC Interpreter, Version 3 (Kramer,
// Proctor, Messina, NISTIR 6556, 2000); the program format (N words, `%`)
// ISO 6983-1. Pure: the caller supplies the date and writes the text.
//
// Program structure, in order:
//  1. a header of comments: job, date, units, work zero, stock, target
//     section and final pin reading, tools with their data, coolant, how to
//     size the flanks without editing coordinates (below), the cautions in
//     short form and "verify by dry run before cutting";
//  2. modal set-up in one block: G20/G21, G17, G90, G94, G40 (where the post
//     has cutter compensation), G49 (where it has length offsets), G80;
//  3. per operation: M5/M9 when a tool ran before, the tool change (T M6, or
//     M5 M0 and a comment where the post has no changer), G0 Z to the safe
//     height (with G43 H<tool> where the post has length offsets), spindle
//     S M3 and coolant, then each pass's moves from the plan: rapids only
//     where the plan has them (at the safe height, or outside the stock),
//     feeds for everything else; the dovetail cutter enters at cutting depth
//     outside the stock, from the open end;
//  4. a checkpoint after its pass: M5 and M9, comments (which checkpoint, the
//     pins, the reading to expect, the depth to check, stock left, the
//     correction rule), M0 (M1 when job.strategy.optional_stops and the post
//     has optional_stop), then spindle and coolant on again before the next
//     cut; the tool is at the safe height outside the stock there;
//  5. M5 M9, a rapid to X0 in front of the stock at the safe height, then the
//     post's end lines.
// Axis words are written when their text changes (an expression always); G0
// or G1 on every motion line; F when it changes.

// G41 or G42 for a compensated cut along Y on `side`'s flank, travelling +Y
// when `travel_y` > 0. G41 keeps the tool left of the programmed path seen in
// the direction of travel, G42 right (NISTIR 6556, from memory: section
// 3.5.14). The tool lies on the side opposite the flank, so:
//   flank at +X of the tool (female right, male left): +Y -> G41, -Y -> G42;
//   flank at -X of the tool (female left, male right): +Y -> G42, -Y -> G41.
// With the spindle turning clockwise (M3), G41 is climb milling.
int compensation_code(DovetailType type, Side side, double travel_y);

// Lateral distance from the cutter's axis to the programmed (compensated)
// path, signed toward the flank: R * sqrt(1 + m^2) * toward_flank, where R
// is the large radius at the tip and m the pass's taper slope dx/dy. The
// control offsets the tool by R normal to the programmed line; on a line
// that runs at a taper the normal offset R is R * sqrt(1 + m^2) across X.
double contour_offset(const Plan& plan, const Pass& pass);

// The length of the straight lead-in and lead-out of a compensated pass,
// along the flank line, outside the stock: the cutter's large radius plus
// the plan's clearance. NISTIR 6556 (from memory, section 3.5.14) wants the
// first compensated move straight (an arc there is an error) and at least
// as long as the compensation radius; the clearance leaves room for a
// positive wear offset.
double lead_length(const Plan& plan);

enum class CoolantChoice { Flood, Mist, Off };

struct ProgramOptions {
  std::string date{};            // written as given in the header; empty: no date line
  std::optional<Units> units{};  // default: program_units(post, job units)
  CoolantChoice coolant = CoolantChoice::Flood;
  std::string title{};  // first header line; empty: "program for <part>"
};

// A compensated finishing pass (SizingStyle::CutterCompensation) is written
// from the pass's parts (plan.hpp): the moves of its entry (down from the
// safe height to cutting depth) at the lead-in start on the flank line, L =
// lead_length() before the start of the cut (outside the stock); G41/G42 G1
// D<tool> to the start of the cut moved onto the flank line (the entry:
// straight, along the flank line, length L); G1 to the end of the cut on the
// flank line; G40 G1 L further along the line (the exit, outside the
// stock); the moves of its exit (up to the safe height) there. Such a pass
// must come straight down and go straight up at the ends of one straight
// cut (open ends); any other shape is a programming error (logic_error).
// All other passes follow the plan's moves exactly.
//
// Throws InputError naming the post key (or "coolant") when the post cannot
// write what the program needs, e.g. mist coolant on a post without a mist
// code, or inch on a metric-only control.
std::string write_program(const Plan& plan, const Post& post, const ProgramOptions& options);

}  // namespace dovetailor
