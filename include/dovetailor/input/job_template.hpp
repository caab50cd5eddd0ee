#pragma once

// A job file to start from, for `dovetailor new`.

#include <string>

#include <dovetailor/base/units.hpp>
#include <dovetailor/job/job.hpp>

namespace dovetailor {

// The text of a complete, valid job file (TOML) for a male or female
// dovetail in `units`: an example part of a fixture slide (an invented
// scenario) with sizes, tools, pins and machine sensible for those units, and
// a comment on every key saying what it means, its unit and the choices it
// takes; optional keys are shown commented out with their defaults. Lines
// fit 80 columns. read_job() reads it back and plan() plans it unchanged.
std::string job_template(DovetailType type, Units units);

}  // namespace dovetailor
