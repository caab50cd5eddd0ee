#pragma once

#include <string>
#include <vector>

#include <dovetailor/check/check_result.hpp>

namespace dovetailor {

// Findings of one kind and severity whose words differ only in their
// figures (the same thing seen at several lines or stations), taken
// together for the text report.
struct FindingGroup {
  FindingKind kind = FindingKind::Gouge;
  Severity severity = Severity::Error;
  std::string text;                        // the first finding's
  long count = 0;                          // findings kept in the group
  std::vector<int> lines;                  // distinct lines, in program order
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

// The report as JSON text: "verdict" ("pass" when no error findings, else
// "fail"), "units", "findings" (kind, severity, line, station_y, amount,
// limit, text; every finding kept), "finding_groups" (kind, severity,
// count, lines, text), "finding_counts", "stations" (y, reading, width_bottom,
// width_top, depth, target_reading, in_tolerance, flank angles and
// straightness), "reading_taper", "reading_spread". Lengths in the job's
// units, angles in degrees.
std::string check_json(const CheckReport& report);

}  // namespace dovetailor
