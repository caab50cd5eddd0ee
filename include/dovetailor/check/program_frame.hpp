#pragma once

#include <string_view>

#include <dovetailor/job/job.hpp>
#include <dovetailor/rs274/rs274_events.hpp>

namespace dovetailor {

// The program's frame against the job's (job.hpp, ProgramSetup): a turn
// about Z that brings the program's slide axis onto the job's +Y, then a
// shift by the program zero. Z is up in both frames and nothing is mirrored,
// so arcs keep their sense seen from the positive end of their normal axis
// (a G18 or G19 arc may move to the other vertical plane):
//
//   slide "+y": job = (x, y, z) + zero       slide "-y": (-x, -y, z) + zero
//   slide "+x": job = (-y, x, z) + zero      slide "-x": ( y, -x, z) + zero

// "+x", "-x", "+y", "-y"
std::string_view slide_axis_name(SlideAxis axis);

Point3 program_to_job(const ProgramSetup& setup, const Point3& program);
Point3 job_to_program(const ProgramSetup& setup, const Point3& job);
PathSegment program_to_job(const ProgramSetup& setup, const PathSegment& program);

}  // namespace dovetailor
