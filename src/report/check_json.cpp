#include <cmath>

#include <nlohmann/json.hpp>

#include <dovetailor/report/check_report.hpp>

namespace dovetailor {
namespace {

// A length in the job's units, rounded two places finer than it is shown.
double len(double mm, Units u) {
  const double scale = std::pow(10.0, length_decimals(u) + 2);
  return std::round(from_mm(mm, u) * scale) / scale;
}

nlohmann::json flank_json(const FlankMeasurement& f, Units u) {
  nlohmann::json j;
  j["found"] = f.found;
  if (!f.found) return j;
  j["angle"] = std::round(f.angle * 1e4) / 1e4;
  j["straightness"] = len(f.max_deviation, u);
  j["base_x"] = len(f.base_x, u);
  return j;
}

}  // namespace

std::string check_json(const CheckReport& r) {
  const Units u = r.units;
  nlohmann::json j;
  j["verdict"] = r.has_errors() ? "fail" : "pass";
  j["program"] = r.program;
  j["units"] = unit_name(u);
  j["lines"] = r.lines;
  j["moves"] = r.moves;
  auto& findings = j["findings"] = nlohmann::json::array();
  for (const Finding& f : r.findings) {
    nlohmann::json o;
    o["kind"] = finding_kind_name(f.kind);
    o["severity"] = severity_name(f.severity);
    o["line"] = f.line;
    o["station_y"] = f.station_y ? nlohmann::json(len(*f.station_y, u)) : nlohmann::json();
    const bool speed = f.kind == FindingKind::SpindleSpeed || f.kind == FindingKind::UnknownTool;
    o["amount"] = speed ? f.amount : len(f.amount, u);
    o["limit"] = speed ? f.limit : len(f.limit, u);
    o["text"] = f.text;
    findings.push_back(o);
  }
  auto& groups = j["finding_groups"] = nlohmann::json::array();
  for (const FindingGroup& g : group_findings(r.findings)) {
    nlohmann::json o;
    o["kind"] = finding_kind_name(g.kind);
    o["severity"] = severity_name(g.severity);
    o["count"] = g.count;
    o["lines"] = g.lines;
    o["text"] = g.text;
    groups.push_back(o);
  }
  auto& counts = j["finding_counts"] = nlohmann::json::object();
  for (const FindingCount& c : r.counts) counts[std::string(finding_kind_name(c.kind))] = c.count;
  auto& stations = j["stations"] = nlohmann::json::array();
  for (const StationResult& s : r.stations) {
    const auto& m = s.measured;
    nlohmann::json o;
    o["y"] = len(s.y, u);
    o["reading"] = m.reading ? nlohmann::json(len(m.reading->value, u)) : nlohmann::json();
    o["target_reading"] = len(s.target_reading.value, u);
    o["pin_diameter"] = len(s.target_reading.pin_diameter, u);
    o["in_tolerance"] = s.reading_in_tolerance;
    o["width_bottom"] = len(m.width_bottom, u);
    o["width_top"] = len(m.width_top, u);
    o["depth"] = len(m.depth, u);
    o["left_flank"] = flank_json(m.left, u);
    o["right_flank"] = flank_json(m.right, u);
    o["problems"] = m.problems;
    stations.push_back(o);
  }
  j["reading_taper"] = r.reading_taper;
  j["reading_spread"] = len(r.reading_spread, u);
  return j.dump(2);
}

}  // namespace dovetailor
