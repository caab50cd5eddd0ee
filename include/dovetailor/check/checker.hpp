#pragma once

#include <functional>
#include <vector>

#include <dovetailor/check/check_result.hpp>
#include <dovetailor/job/job.hpp>
#include <dovetailor/rs274/program_source.hpp>

namespace dovetailor {

// The checker: reads an RS-274 program (rs274_interpreter.hpp), simulates
// every move of the whole tool body against the job's stock in section
// planes across the slide ("stations") and in plan view, and measures the
// result at every station with virtual pins (section_measure.hpp).
//
// Simulation, per station plane y:
//  - The stock starts as the stock rectangle. Each move's flutes sweep
//    (swept_region.hpp) is taken from it; neck, shank and holder sweeps must
//    not overlap it. The tool is the job's [[tool]] with the program's T
//    number in the spindle (M6). A move with no tool in the spindle uses the
//    tool last selected with T; a tool the job does not list is an error
//    finding (UnknownTool) and its moves are not simulated, because nothing
//    can be said about them.
//  - Consecutive moves along Y at one X and Z with the same tool, kind and
//    spindle state are swept as one move (their union is the same area);
//    findings then name the line of the move that crosses the station, or the
//    run's nearest end move when none crosses it.
//  - Moves that continue one straight line (each joint within 0.1 um of it)
//    are swept as one line too. A straight move that crosses a station more
//    than the body's largest radius inside both its ends sweeps there a
//    shape that depends only on the tool and the move's slope (dx/dy,
//    dz/dy, rounded to 1e-6: the body then lies within radius * 5e-7 of its
//    place); it is swept once and moved to each station it crosses.
//  - Stations that hold the same material share one evaluation of a move
//    (stock is shared between them until they differ), and a small cache
//    remembers the result of (material, move shape) pairs, so repeated passes
//    cost one lookup.
// In 3-D (not tied to stations): every move of the body, taken as a stack
// of cylinders of each part's largest radius, against the [[fixture]] boxes;
// rapids below the safe height against the stock outline in plan view
// (the flutes' circle against the stock rectangle); spindle speeds against
// machine.max_rpm.
//
// Tolerances: a gouge is material removed from the finished part deeper than
// half the width tolerance band (at least 1 um); its depth is the largest
// distance of the material cut from the finished part's outline. Stock left
// is material outside the finished part thicker than the same. The reading
// at each station must lie in the width tolerance band around the target
// reading.
// A dovetail cutter is overloaded (an error) when a move removes material
// on its axis above the skin its bottom face may take across its diameter
// (a female's floor allowance, at least the planner's default: it slots,
// engaged across its diameter), or, above the floor skin the planner's own
// passes take (a female's floor allowance), a lateral cut on one side wider
// than the largest radial step the planner takes with it for this job
// (plan.hpp), or a tenth of its diameter when the job cannot be planned (the
// planner's cap, common practice); each limit plus 2 % and 5 um for a
// program's rounding. It is measured for moves along Y and straight moves
// within 45 deg of Y. End mills are not limited (they slot at full width by
// design).
//
// Frames: every move comes from the interpreter in the work coordinates of
// the active system; with the job's ProgramSetup (Job::program: program
// zero, slide axis, work offsets, G28/G30 homes) it is taken through machine
// coordinates to the system the program started in and turned and shifted
// into the job's frame (program_frame.hpp) before it is simulated. G28/G30
// with no home given rise straight up (HomeNotGiven warning); a D or H for a
// tool the job does not list is an UnknownTool finding and the check goes on.
//
// The safe height is the planner's (plan.hpp: 0.2 in / 5 mm above the top
// face); the simulated tool starts above work zero at that height.

struct CheckOptions {
  // Stations: both ends of the finished dovetail, 1 mm (0.04 in) inside each
  // end, and evenly between. At least 1; one station sits in the middle.
  int stations = 5;
  // Findings kept per kind (the rest are only counted).
  int findings_per_kind = 20;
  // Called now and then with the number of program lines read so far, so a
  // caller can show progress (the core prints nothing).
  std::function<void(long lines)> progress{};
  // How many lines between progress calls.
  long progress_every = 10000;
  // A program longer than this many lines is refused: far beyond any
  // dovetail program, it is a wrong file or a runaway generator.
  long max_lines = 20'000'000;
};

// The station planes for a job: y positions in mm, front to back. Where the
// finished section runs: the whole dovetail length for open ends; short of a
// closed end by the largest tool radius (the cutter's round end is there).
std::vector<double> station_positions(const Job& job, int stations);

// Reads and simulates the whole program. Throws InputError for a program the
// reader refuses (with the program's name and line) and for options out of
// range (stations below 1 or above 1000).
CheckReport check(ProgramSource& program, const Job& job, const CheckOptions& options = {});

}  // namespace dovetailor
