#include <algorithm>

#include <fmt/format.h>

#include <dovetailor/check_report.hpp>
#include <dovetailor/text_wrap.hpp>

namespace dovetailor {

std::string_view finding_kind_name(FindingKind kind) {
  switch (kind) {
    case FindingKind::Gouge:
      return "gouge";
    case FindingKind::StockLeft:
      return "stock_left";
    case FindingKind::BodyCollision:
      return "body_collision";
    case FindingKind::FixtureCollision:
      return "fixture_collision";
    case FindingKind::RapidThroughMaterial:
      return "rapid_through_material";
    case FindingKind::SpindleStopped:
      return "spindle_stopped";
    case FindingKind::Plunge:
      return "plunge";
    case FindingKind::DepthOfCut:
      return "depth_of_cut";
    case FindingKind::CutterOverload:
      return "cutter_overload";
    case FindingKind::RapidBelowSafeHeight:
      return "rapid_below_safe_height";
    case FindingKind::SpindleSpeed:
      return "spindle_speed";
    case FindingKind::UnknownTool:
      return "unknown_tool";
    case FindingKind::ReadingOutOfTolerance:
      return "reading_out_of_tolerance";
    case FindingKind::NoProgramEnd:
      return "no_program_end";
  }
  return "?";
}

std::string_view severity_name(Severity severity) {
  return severity == Severity::Error ? "error" : "warning";
}

bool CheckReport::has_errors() const {
  return std::any_of(findings.begin(), findings.end(),
                     [](const Finding& f) { return f.severity == Severity::Error; });
}

long CheckReport::count(FindingKind kind) const {
  for (const FindingCount& c : counts)
    if (c.kind == kind) return c.count;
  return 0;
}

namespace {

std::string_view end_words(EndKind end) {
  switch (end) {
    case EndKind::M2:
      return "M2";
    case EndKind::M30:
      return "M30";
    case EndKind::Percent:
      return "'%'";
    case EndKind::EndOfInput:
      return "the end of the file (no M2, M30 or '%')";
  }
  return "?";
}

std::string_view method_words(ReadingMethod m) {
  switch (m) {
    case ReadingMethod::OverPins:
      return "over 2 pins";
    case ReadingMethod::BetweenPins:
      return "between 2 pins";
    case ReadingMethod::SquareSideToPin:
      return "square side to 1 pin";
  }
  return "?";
}

}  // namespace

// Each line of the report fits an 80-column terminal: findings carry their
// words on indented lines below a short heading, and the sections come in two
// tables (the readings, then the shape).
std::string format_check_report(const CheckReport& r) {
  const Units u = r.units;
  const int dp = length_decimals(u);
  const auto num = [&](double mm) { return fmt::format("{:.{}f}", from_mm(mm, u), dp); };
  const auto sym = unit_symbol(u);
  const auto para = [](std::string& out, const std::string& text, const std::string& indent) {
    for (const std::string& line : wrap_words(text, 79 - indent.size()))
      out += indent + line + "\n";
  };
  std::string out;
  out += fmt::format("Check of {}: {}\n", r.program, r.has_errors() ? "FAIL" : "PASS");
  para(out,
       fmt::format("{} lines read, {} moves simulated, {} stations; the program ended at {}.",
                   r.lines, r.moves, r.stations.size(), end_words(r.end)),
       "");

  out += "\nFindings\n";
  if (r.findings.empty()) out += "  none\n";
  for (const Finding& f : r.findings) {
    out += fmt::format("  line {:<6} {:<7} {}", f.line, severity_name(f.severity),
                       finding_kind_name(f.kind));
    if (f.station_y) out += fmt::format(", at y = {} {}", num(*f.station_y), sym);
    out += "\n";
    para(out, f.text, "      ");
  }
  for (const FindingCount& c : r.counts) {
    long shown = 0;
    for (const Finding& f : r.findings) shown += f.kind == c.kind ? 1 : 0;
    if (c.count > shown)
      out += fmt::format("  ... and {} more {} finding(s)\n", c.count - shown,
                         finding_kind_name(c.kind));
  }

  if (!r.stations.empty()) {
    const StationResult& s0 = r.stations.front();
    out += "\n";
    para(
        out,
        fmt::format("Readings ({}), {} of {} {}; width tolerance {:+.{}f} to {:+.{}f} {}", sym,
                    method_words(s0.target_reading.method), num(s0.target_reading.pin_diameter),
                    sym, from_mm(r.tolerance.lower, u), dp, from_mm(r.tolerance.upper, u), dp, sym),
        "");
    out += fmt::format("  {:>9} {:>10} {:>10} {:>9}\n", "y", "reading", "target", "error");
    for (const StationResult& s : r.stations) {
      const auto& m = s.measured;
      const std::string reading = m.reading ? num(m.reading->value) : "-";
      const std::string error =
          m.reading
              ? fmt::format("{:+.{}f}", from_mm(m.reading->value - s.target_reading.value, u), dp)
              : "-";
      out += fmt::format("  {:>9} {:>10} {:>10} {:>9}{}\n", num(s.y), reading,
                         num(s.target_reading.value), error,
                         s.reading_in_tolerance ? "" : "  out of tolerance");
    }
    if (r.stations.size() > 1)
      para(out,
           fmt::format("reading along the slide: spread {} {}, taper {:+.6f} {} per {} of length",
                       num(r.reading_spread), sym, r.reading_taper, sym, sym),
           "  ");

    out += fmt::format("\nSection shape ({}; flank angles in degrees)\n", sym);
    out += fmt::format("  {:>9} {:>9} {:>9} {:>9} {:>7} {:>7} {:>9}\n", "y", "depth", "w bottom",
                       "w top", "left", "right", "straight");
    for (const StationResult& s : r.stations) {
      const auto& m = s.measured;
      const auto angle = [](const FlankMeasurement& f) {
        return f.found ? fmt::format("{:.2f}", f.angle) : std::string("-");
      };
      const double straight = std::max(m.left.max_deviation, m.right.max_deviation);
      out += fmt::format("  {:>9} {:>9} {:>9} {:>9} {:>7} {:>7} {:>9}\n", num(s.y), num(m.depth),
                         num(m.width_bottom), num(m.width_top), angle(m.left), angle(m.right),
                         num(straight));
    }
    para(out,
         fmt::format("target: depth {}, width {} at the base plane, {} at the top; straight = "
                     "the largest departure of a flank from its fitted line",
                     num(s0.target_depth), num(s0.target_width_bottom), num(s0.target_width_top)),
         "  ");
  }
  out += "\n";
  para(out,
       "The simulation is advice, not a guarantee: prove a new program by a dry run above the "
       "work and in single block, secure the work and the tool, and measure with the spindle "
       "stopped. Follow your shop's rules and the machine maker's instructions.",
       "");
  return out;
}

}  // namespace dovetailor
