#include <dovetailor/check/program_frame.hpp>

namespace dovetailor {

std::string_view slide_axis_name(SlideAxis axis) {
  switch (axis) {
    case SlideAxis::PlusX:
      return "+x";
    case SlideAxis::MinusX:
      return "-x";
    case SlideAxis::PlusY:
      return "+y";
    case SlideAxis::MinusY:
      return "-y";
  }
  return "?";
}

namespace {

// The turn alone, program to job.
Point3 turn(SlideAxis axis, const Point3& p) {
  switch (axis) {
    case SlideAxis::PlusX:
      return {-p.y, p.x, p.z};
    case SlideAxis::MinusX:
      return {p.y, -p.x, p.z};
    case SlideAxis::MinusY:
      return {-p.x, -p.y, p.z};
    case SlideAxis::PlusY:
      break;
  }
  return p;
}

// The plane a program arc lies in once turned, and whether its normal axis
// now points the other way (its sense, seen from the new normal's positive
// end, reverses). The turn maps program X to job +Y ("+x") or -Y ("-x"),
// program Y to job -X ("+x") or +X ("-x").
struct TurnedPlane {
  Plane plane;
  bool reversed;
};

TurnedPlane turned_plane(SlideAxis axis, Plane plane) {
  if (plane == Plane::XY) return {Plane::XY, false};
  const bool zx = plane == Plane::ZX;  // normal Y; else YZ, normal X
  switch (axis) {
    case SlideAxis::PlusY:
      return {plane, false};
    case SlideAxis::MinusY:
      return {plane, true};
    case SlideAxis::PlusX:  // Y -> -X, X -> +Y
      return zx ? TurnedPlane{Plane::YZ, true} : TurnedPlane{Plane::ZX, false};
    case SlideAxis::MinusX:  // Y -> +X, X -> -Y
      return zx ? TurnedPlane{Plane::YZ, false} : TurnedPlane{Plane::ZX, true};
  }
  return {plane, false};
}

}  // namespace

Point3 program_to_job(const ProgramSetup& setup, const Point3& program) {
  const Point3 t = turn(setup.slide, program);
  return {t.x + setup.zero.x, t.y + setup.zero.y, t.z + setup.zero.z};
}

Point3 job_to_program(const ProgramSetup& setup, const Point3& job) {
  const Point3 p{job.x - setup.zero.x, job.y - setup.zero.y, job.z - setup.zero.z};
  switch (setup.slide) {
    case SlideAxis::PlusX:
      return {p.y, -p.x, p.z};
    case SlideAxis::MinusX:
      return {-p.y, p.x, p.z};
    case SlideAxis::MinusY:
      return {-p.x, -p.y, p.z};
    case SlideAxis::PlusY:
      break;
  }
  return p;
}

PathSegment program_to_job(const ProgramSetup& setup, const PathSegment& program) {
  PathSegment out{program_to_job(setup, program.start), program_to_job(setup, program.end),
                  program.arc};
  if (out.arc) {
    out.arc->centre = program_to_job(setup, program.arc->centre);
    const TurnedPlane turned = turned_plane(setup.slide, program.arc->plane);
    out.arc->plane = turned.plane;
    if (turned.reversed)
      out.arc->direction = out.arc->direction == ArcDirection::Clockwise
                               ? ArcDirection::Counterclockwise
                               : ArcDirection::Clockwise;
  }
  return out;
}

}  // namespace dovetailor
