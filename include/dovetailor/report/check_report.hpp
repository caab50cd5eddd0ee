#pragma once

#include <optional>
#include <string>
#include <vector>

#include <dovetailor/check/check_result.hpp>

namespace dovetailor {

// What a finding says, in words a machinist reads: its figures in the
// report's units, its fixture by the name the job gives it. One sentence,
// no line number or station (the report puts those in its heading).
std::string finding_text(const Finding& finding, const CheckReport& report);

// Why a section could not be measured, in words: "no left flank was found
// between the floor and the top face", ...
std::string measure_problem_text(const MeasureProblem& problem);

// Findings that say the same thing at several lines or stations, taken
// together for the report: the same kind and severity and the same data
// apart from their figures (the same tool, body part, fixture, tool word,
// kind of overload, home return, or reason a section cannot be read; for
// the kinds whose words name them).
struct FindingGroup {
  FindingKind kind = FindingKind::Gouge;
  Severity severity = Severity::Error;
  Finding first{};                         // its words stand for the group
  long count = 0;                          // findings kept in the group
  std::vector<int> lines{};                // distinct lines, in program order
  std::optional<double> y_min{}, y_max{};  // stations, when tied to them

  bool operator==(const FindingGroup&) const = default;
};

// Errors first, then warnings; within each, in the order the first finding
// of each group came.
std::vector<FindingGroup> group_findings(const std::vector<Finding>& findings);

// The text report: findings first (grouped: errors first, a finding seen
// many times on one line with its count and lines), then the measured section per station
// against the target, with the usual cautions. In the job's units.
std::string format_check_report(const CheckReport& report);

// The report as JSON text. Lengths in the job's units (rounded two decimals
// finer than the text report shows them), angles in degrees:
//  "verdict" ("pass" when no error findings, else "fail"), "program",
//  "units", "lines", "moves";
//  "findings", every finding kept: "kind", "severity", "line",
//    "station_y" (null when not tied to a station), "amount", "limit"
//    (rev/min for spindle_speed; the T number for unknown_tool), "text"
//    (finding_text), and only what its kind says: "tool" (T number),
//    "part" ("flutes", "neck", "shank", "holder"), "fixture" (its name) and
//    "fixture_index" (in the job's [[fixture]] list, from 0), "x" and "z"
//    (section coordinates: a gouge's deepest place, a body's touch),
//    "extent" ({"x_min", "x_max", "z_min", "z_max"}: stock left), "area"
//    (rapid_through_material, square units), "overload" ("slot" with
//    "on_axis", or "radial_cut"), "named_by" (unknown_tool: "t", "m6",
//    "d", "h", or "none" for no tool at all), "home_return" ("G28",
//    "G30"), and for reading_out_of_tolerance "band" ([low, high]: the good
//    readings), "pin_diameter" and, when the section cannot be read,
//    "problem" ({"kind": "no_material" | "no_flank" | "pin_does_not_fit",
//    "side": "left" | "right"});
//  "finding_groups" (group_findings): "kind", "severity", "count",
//    "lines", "text" (the first finding's);
//  "finding_counts": {kind: count} for every kind that occurred;
//  "stations": "y", "reading" (null when none), "target_reading",
//    "pin_diameter", "in_tolerance", "width_bottom", "width_top", "depth",
//    "left_flank" and "right_flank" ("found", "angle", "straightness",
//    "base_x"), "problems" (measure_problem_text);
//  "reading_taper" (per unit of length), "reading_spread".
std::string check_json(const CheckReport& report);

}  // namespace dovetailor
