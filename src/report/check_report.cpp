#include <algorithm>

#include <fmt/format.h>

#include <dovetailor/base/caution.hpp>
#include <dovetailor/base/length.hpp>
#include <dovetailor/base/text_wrap.hpp>
#include <dovetailor/report/check_report.hpp>

namespace dovetailor {

namespace {

// A finding's words with every figure replaced by '#': findings that differ
// only in their figures share a pattern.
std::string pattern_of(const std::string& text) {
  std::string out;
  const auto digit = [](char c) { return c >= '0' && c <= '9'; };
  for (std::size_t i = 0; i < text.size(); ++i) {
    const char c = text[i];
    const bool sign = (c == '-' || c == '+') && i + 1 < text.size() && digit(text[i + 1]);
    if (!digit(c) && !sign) {
      out += c;
      continue;
    }
    std::size_t j = i + 1;
    while (j < text.size() &&
           (digit(text[j]) || (text[j] == '.' && j + 1 < text.size() && digit(text[j + 1]))))
      ++j;
    out += '#';
    i = j - 1;
  }
  return out;
}

}  // namespace

std::vector<FindingGroup> group_findings(const std::vector<Finding>& findings) {
  std::vector<FindingGroup> groups;
  std::vector<std::string> patterns;
  for (const Finding& f : findings) {
    const std::string pattern = pattern_of(f.text);
    std::size_t g = 0;
    while (g < groups.size() && !(groups[g].kind == f.kind && groups[g].severity == f.severity &&
                                  patterns[g] == pattern))
      ++g;
    if (g == groups.size()) {
      FindingGroup group;
      group.kind = f.kind;
      group.severity = f.severity;
      group.text = f.text;
      groups.push_back(std::move(group));
      patterns.push_back(pattern);
    }
    FindingGroup& group = groups[g];
    ++group.count;
    if (std::find(group.lines.begin(), group.lines.end(), f.line) == group.lines.end())
      group.lines.push_back(f.line);
    if (f.station_y) {
      group.y_min = std::min(group.y_min.value_or(*f.station_y), *f.station_y);
      group.y_max = std::max(group.y_max.value_or(*f.station_y), *f.station_y);
    }
  }
  for (FindingGroup& g : groups) std::sort(g.lines.begin(), g.lines.end());
  std::stable_sort(groups.begin(), groups.end(), [](const FindingGroup& a, const FindingGroup& b) {
    return a.severity == Severity::Error && b.severity != Severity::Error;
  });
  return groups;
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

std::string_view method_words(ReadingMethod m) { return text_of(m); }

}  // namespace

// Each line of the report fits an 80-column terminal: findings carry their
// words on indented lines below a short heading, and the sections come in two
// tables (the readings, then the shape).
std::string format_check_report(const CheckReport& r) {
  const Units u = r.units;
  const auto num = [&](double mm) { return fmt::format("{:n}", shown(mm, u)); };
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
  const ProgramSetup& p = r.setup;
  if (p.zero != Point3{} || p.slide != SlideAxis::PlusY)
    para(out,
         fmt::format("Program zero at x = {}, y = {}, z = {} {} in the job's frame; the slide "
                     "runs along the program's {}{}.",
                     num(p.zero.x), num(p.zero.y), num(p.zero.z), sym,
                     p.slide == SlideAxis::PlusX || p.slide == SlideAxis::PlusY ? '+' : '-',
                     p.slide == SlideAxis::PlusX || p.slide == SlideAxis::MinusX ? 'X' : 'Y'),
         "");

  long errors = 0, warnings = 0;
  for (const FindingCount& c : r.counts) {
    // A kind's findings share its severity, but for unknown_tool (an
    // error for a tool not in the job, a warning for no tool at all).
    long kept_errors = 0, kept = 0;
    for (const Finding& f : r.findings) {
      if (f.kind != c.kind) continue;
      ++kept;
      kept_errors += f.severity == Severity::Error ? 1 : 0;
    }
    const long rest = c.count - kept;
    errors += kept_errors + (kept_errors > 0 ? rest : 0);
    warnings += kept - kept_errors + (kept_errors > 0 ? 0 : rest);
  }
  out += r.findings.empty()
             ? std::string("\nFindings\n")
             : fmt::format("\nFindings: {} error{}, {} warning{} (errors first)\n", errors,
                           errors == 1 ? "" : "s", warnings, warnings == 1 ? "" : "s");
  if (r.findings.empty()) out += "  none\n";
  for (const FindingGroup& g : group_findings(r.findings)) {
    const std::string where = g.lines.size() == 1
                                  ? fmt::format("line {}", g.lines.front())
                                  : fmt::format("lines {}-{}", g.lines.front(), g.lines.back());
    std::string head = fmt::format("  {:<11} {:<7} {}", where, severity_name(g.severity),
                                   finding_kind_name(g.kind));
    if (g.count > 1) head += fmt::format(", {} times", g.count);
    std::string at;
    if (g.y_min && *g.y_min == *g.y_max)
      at = fmt::format("at y = {} {}", num(*g.y_min), sym);
    else if (g.y_min)
      at = fmt::format("at y = {} to {} {}", num(*g.y_min), num(*g.y_max), sym);
    // The stations go on the heading when they fit in 80 columns, else
    // they open the words below it.
    const bool at_fits = at.empty() || head.size() + 2 + at.size() <= 80;
    out += head;
    if (at_fits && !at.empty()) out += fmt::format(", {}", at);
    out += "\n";
    std::string text = at_fits ? g.text : fmt::format("{}: {}", at, g.text);
    if (g.count > 1) text += " (the first";
    if (g.lines.size() > 1) {
      text += "; lines";
      const std::size_t shown = std::min<std::size_t>(g.lines.size(), 8);
      for (std::size_t i = 0; i < shown; ++i)
        text += fmt::format("{} {}", i == 0 ? "" : ",", g.lines[i]);
      if (shown < g.lines.size()) text += ", ...";
    }
    if (g.count > 1) text += ")";
    para(out, text, "      ");
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
    para(out,
         fmt::format("Readings ({}), {} of {} {}; width tolerance {} to {} {}, the "
                     "target at its middle",
                     sym, method_words(s0.target_reading.method),
                     num(s0.target_reading.pin_diameter), sym,
                     fmt::format("{:+n}", shown(r.tolerance.lower, u)),
                     fmt::format("{:+n}", shown(r.tolerance.upper, u)), sym),
         "");
    out += fmt::format("  {:>9} {:>10} {:>10} {:>9}\n", "y", "reading", "target", "error");
    for (const StationResult& s : r.stations) {
      const auto& m = s.measured;
      const std::string reading = m.reading ? num(m.reading->value) : "-";
      const std::string error =
          m.reading ? fmt::format("{:+n}", shown(m.reading->value - s.target_reading.value, u))
                    : "-";
      out += fmt::format("  {:>9} {:>10} {:>10} {:>9}{}\n", num(s.y), reading,
                         num(s.target_reading.value), error,
                         s.reading_in_tolerance ? "" : "  out of tolerance");
    }
    if (r.stations.size() > 1)
      para(out,
           fmt::format("reading along the slide: spread {} {}, taper {} {} per {} of length",
                       num(r.reading_spread), sym, fmt::format("{:+}", figure(r.reading_taper, 6)),
                       sym, sym),
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
  para(out, caution_paragraph(), "");
  return out;
}

}  // namespace dovetailor
