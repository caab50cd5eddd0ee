#include <cmath>

#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include <dovetailor/base/length.hpp>
#include <dovetailor/report/check_report.hpp>

namespace dovetailor {
namespace {

// A length in the job's units, rounded two places finer than it is shown.
double len(double mm, Units u) { return length_value(mm, u); }

std::string_view side_word(Side side) { return side == Side::Left ? "left" : "right"; }

// The finding's data besides kind, severity, line and figures: only what its
// kind uses.
void add_finding_data(nlohmann::json& o, const Finding& f, const CheckReport& r) {
  const Units u = r.units;
  if (f.tool != 0) o["tool"] = f.tool;
  if (f.kind == FindingKind::UnknownTool) o["named_by"] = tool_word_name(f.named_by);
  if (f.part) o["part"] = body_part_name(*f.part);
  if (f.fixture >= 0) {
    o["fixture_index"] = f.fixture;
    if (static_cast<std::size_t>(f.fixture) < r.fixtures.size())
      o["fixture"] = r.fixtures[static_cast<std::size_t>(f.fixture)];
  }
  if (f.at) {
    o["x"] = len(f.at->x, u);
    o["z"] = len(f.at->z, u);
  }
  if (f.extent)
    o["extent"] = {{"x_min", len(f.extent->x_min, u)},
                   {"x_max", len(f.extent->x_max, u)},
                   {"z_min", len(f.extent->z_min, u)},
                   {"z_max", len(f.extent->z_max, u)}};
  if (f.kind == FindingKind::RapidThroughMaterial) {
    const double unit = to_mm(1, u);
    o["area"] = std::round(f.area / (unit * unit) * 1e6) / 1e6;
  }
  if (f.kind == FindingKind::CutterOverload) {
    o["overload"] = overload_name(f.overload);
    if (f.overload == Overload::Slot) o["on_axis"] = len(f.on_axis, u);
  }
  if (f.kind == FindingKind::HomeNotGiven) o["home_return"] = fmt::format("G{}", f.home_return);
  if (f.kind == FindingKind::ReadingOutOfTolerance) {
    o["band"] = {len(f.band_low, u), len(f.band_high, u)};
    o["pin_diameter"] = len(f.pin_diameter, u);
    if (f.problem)
      o["problem"] = {{"kind", measure_problem_name(f.problem->kind)},
                      {"side", side_word(f.problem->side)}};
  }
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
    o["text"] = finding_text(f, r);
    add_finding_data(o, f, r);
    findings.push_back(o);
  }
  auto& groups = j["finding_groups"] = nlohmann::json::array();
  for (const FindingGroup& g : group_findings(r.findings)) {
    nlohmann::json o;
    o["kind"] = finding_kind_name(g.kind);
    o["severity"] = severity_name(g.severity);
    o["count"] = g.count;
    o["lines"] = g.lines;
    o["text"] = finding_text(g.first, r);
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
    auto& problems = o["problems"] = nlohmann::json::array();
    for (const MeasureProblem& p : m.problems) problems.push_back(measure_problem_text(p));
    stations.push_back(o);
  }
  j["reading_taper"] = r.reading_taper;
  j["reading_spread"] = len(r.reading_spread, u);
  return j.dump(2);
}

}  // namespace dovetailor
