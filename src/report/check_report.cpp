#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include <dovetailor/base/caution.hpp>
#include <dovetailor/base/length.hpp>
#include <dovetailor/base/text_wrap.hpp>
#include <dovetailor/report/check_report.hpp>

namespace dovetailor {

namespace {

std::string_view side_word(Side side) { return side == Side::Left ? "left" : "right"; }

std::string fixture_name(const CheckReport& r, int index) {
  if (index >= 0 && static_cast<std::size_t>(index) < r.fixtures.size())
    return r.fixtures[static_cast<std::size_t>(index)];
  return fmt::format("fixture {}", index + 1);
}

// "the neck of T4 runs", "the flutes of T3 run".
std::string part_of_tool(const Finding& f) {
  const BodyPart part = f.part.value_or(BodyPart::Flutes);
  return fmt::format("the {} of T{} {}", body_part_name(part), f.tool,
                     part == BodyPart::Flutes ? "run" : "runs");
}

std::string unknown_tool_text(const Finding& f) {
  const int t = f.tool;
  switch (f.named_by) {
    case ToolWord::None:
      return "moves below the top face with no tool in the spindle (no T and M6 yet): not "
             "simulated";
    case ToolWord::T:
      return fmt::format(
          "the program cuts with T{}, which the job does not list in [[tool]]: its moves cannot "
          "be checked",
          t);
    case ToolWord::M6:
      return fmt::format(
          "M6 loads T{}, which the job does not list in [[tool]]: its moves cannot be checked", t);
    case ToolWord::D:
    case ToolWord::H: {
      const bool d = f.named_by == ToolWord::D;
      return fmt::format(
          "{}{} names T{}, which the job does not list in [[tool]]: taken as zero {}; moves "
          "with T{} cannot be checked",
          d ? 'D' : 'H', t, t, d ? "radius" : "length", t);
    }
  }
  return "?";
}

std::string cutter_overload_text(const Finding& f, Units u) {
  const auto show = [u](double mm) { return fmt::format("{}", shown(mm, u)); };
  if (f.overload == Overload::Slot)
    return fmt::format(
        "dovetail cutter T{} slots through material, engaged across its diameter: a cut {} wide "
        "with {} of material on its axis, where the planner steps it {} at a time from one side; "
        "it breaks",
        f.tool, show(f.amount), show(f.on_axis), show(f.limit));
  return fmt::format(
      "dovetail cutter T{} takes a radial cut of {}; the largest step the planner takes with it "
      "is {}",
      f.tool, show(f.amount), show(f.limit));
}

std::string reading_text(const Finding& f, Units u) {
  const auto show = [u](double mm) { return fmt::format("{}", shown(mm, u)); };
  if (f.problem)
    return fmt::format("the section cannot be read with {} pins: {}", show(f.pin_diameter),
                       measure_problem_text(*f.problem));
  return fmt::format("the section reads {} against {} ({} to {})", show(f.amount), show(f.limit),
                     show(f.band_low), show(f.band_high));
}

}  // namespace

std::string measure_problem_text(const MeasureProblem& p) {
  switch (p.kind) {
    case MeasureProblemKind::NoMaterial:
      return "no material is left in this section";
    case MeasureProblemKind::NoFlank:
      return fmt::format("no {} flank was found between the floor and the top face",
                         side_word(p.side));
    case MeasureProblemKind::PinDoesNotFit:
      return fmt::format("a pin of this size does not fit into the {} corner", side_word(p.side));
  }
  return "?";
}

std::string finding_text(const Finding& f, const CheckReport& r) {
  const Units u = r.units;
  const auto show = [u](double mm) { return fmt::format("{}", shown(mm, u)); };
  const auto near = [&] {
    const Point2 at = f.at.value_or(Point2{});
    return fmt::format("near x = {}, z = {}", show(at.x), show(at.z));
  };
  switch (f.kind) {
    case FindingKind::Gouge:
      return fmt::format("gouge {} deep into the finished part, allowed {}; deepest {}",
                         show(f.amount), show(f.limit), near());
    case FindingKind::StockLeft: {
      const Bounds2 b = f.extent.value_or(Bounds2{});
      return fmt::format(
          "stock left outside the finished part, about {} thick, from x = {} to {}, z = {} to {}",
          show(f.amount), show(b.x_min), show(b.x_max), show(b.z_min), show(b.z_max));
    }
    case FindingKind::BodyCollision:
      return fmt::format("{} into material about {} deep {}", part_of_tool(f), show(f.amount),
                         near());
    case FindingKind::FixtureCollision:
      return fmt::format("{} into {}", part_of_tool(f), fixture_name(r, f.fixture));
    case FindingKind::RapidThroughMaterial:
      return fmt::format("rapid move meets material: {:.4g} {}^2 of it in the tool's path, {} high",
                         f.area / std::pow(to_mm(1, u), 2), unit_symbol(u), show(f.amount));
    case FindingKind::SpindleStopped:
      return fmt::format("feed move into material with the spindle stopped ({} high)",
                         show(f.amount));
    case FindingKind::Plunge:
      return fmt::format(
          "dovetail cutter T{} moves down into material ({} of material); it has no end-cutting "
          "centre and breaks",
          f.tool, show(f.amount));
    case FindingKind::DepthOfCut:
      return fmt::format(
          "T{} cuts deeper than its flutes are long ({}): material runs {} above the top of the "
          "flutes",
          f.tool, show(f.limit), show(f.amount));
    case FindingKind::CutterOverload:
      return cutter_overload_text(f, u);
    case FindingKind::RapidBelowSafeHeight:
      return fmt::format("rapid move over the stock {} below the safe height {}", show(f.amount),
                         show(f.limit));
    case FindingKind::SpindleSpeed:
      return fmt::format(
          "spindle speed {:.0f} rev/min is above the machine's maximum {:.0f} rev/min "
          "(machine.max_rpm)",
          f.amount, f.limit);
    case FindingKind::UnknownTool:
      return unknown_tool_text(f);
    case FindingKind::ReadingOutOfTolerance:
      return reading_text(f, u);
    case FindingKind::NoProgramEnd:
      return "the program ends without M2, M30 or '%'";
    case FindingKind::HomeNotGiven:
      return fmt::format(
          "G{0} return with no home position given ([program] g{0} or --home G{0}=X..,Y..,Z..): "
          "taken as straight up from its intermediate point",
          f.home_return);
  }
  return "?";
}

namespace {

// Whether two findings say the same thing but for their figures: the data
// each kind's words name, besides kind and severity.
bool same_words(const Finding& a, const Finding& b) {
  if (a.kind != b.kind || a.severity != b.severity) return false;
  switch (a.kind) {
    case FindingKind::BodyCollision:
      return a.tool == b.tool && a.part == b.part;
    case FindingKind::FixtureCollision:
      return a.tool == b.tool && a.part == b.part && a.fixture == b.fixture;
    case FindingKind::Plunge:
    case FindingKind::DepthOfCut:
      return a.tool == b.tool;
    case FindingKind::CutterOverload:
      return a.tool == b.tool && a.overload == b.overload;
    case FindingKind::UnknownTool:
      return a.tool == b.tool && a.named_by == b.named_by;
    case FindingKind::HomeNotGiven:
      return a.home_return == b.home_return;
    case FindingKind::ReadingOutOfTolerance:
      return a.problem == b.problem;
    default:
      return true;
  }
}

}  // namespace

std::vector<FindingGroup> group_findings(const std::vector<Finding>& findings) {
  std::vector<FindingGroup> groups;
  for (const Finding& f : findings) {
    auto g = std::find_if(groups.begin(), groups.end(),
                          [&](const FindingGroup& group) { return same_words(group.first, f); });
    if (g == groups.end()) {
      groups.push_back({.kind = f.kind, .severity = f.severity, .first = f});
      g = groups.end() - 1;
    }
    ++g->count;
    if (std::find(g->lines.begin(), g->lines.end(), f.line) == g->lines.end())
      g->lines.push_back(f.line);
    if (f.station_y) {
      g->y_min = std::min(g->y_min.value_or(*f.station_y), *f.station_y);
      g->y_max = std::max(g->y_max.value_or(*f.station_y), *f.station_y);
    }
  }
  for (FindingGroup& g : groups) std::sort(g.lines.begin(), g.lines.end());
  std::stable_sort(groups.begin(), groups.end(), [](const FindingGroup& a, const FindingGroup& b) {
    return a.severity == Severity::Error && b.severity != Severity::Error;
  });
  return groups;
}

namespace {

// Writes the report, each line within 80 columns: findings carry their
// words on indented lines below a short heading, and the sections come in
// two tables (the readings, then the shape).
class ReportText {
 public:
  explicit ReportText(const CheckReport& r) : r_(r), u_(r.units), sym_(unit_symbol(r.units)) {}

  std::string write() {
    head();
    findings();
    if (!r_.stations.empty()) {
      readings();
      shape();
    }
    out_ += "\n";
    para(caution_paragraph(), "");
    return std::move(out_);
  }

 private:
  std::string num(double mm) const { return fmt::format("{:n}", shown(mm, u_)); }

  void para(const std::string& text, const std::string& indent) {
    for (const std::string& line : wrap_words(text, 79 - indent.size()))
      out_ += indent + line + "\n";
  }

  void head() {
    out_ += fmt::format("Check of {}: {}\n", r_.program, r_.has_errors() ? "FAIL" : "PASS");
    para(fmt::format("{} lines read, {} moves simulated, {} stations; the program ended at {}.",
                     r_.lines, r_.moves, r_.stations.size(), text_of(r_.end)),
         "");
    const ProgramSetup& p = r_.setup;
    if (p.zero != Point3{} || p.slide != SlideAxis::PlusY)
      para(fmt::format("Program zero at x = {}, y = {}, z = {} {} in the job's frame; the slide "
                       "runs along the program's {}{}.",
                       num(p.zero.x), num(p.zero.y), num(p.zero.z), sym_,
                       p.slide == SlideAxis::PlusX || p.slide == SlideAxis::PlusY ? '+' : '-',
                       p.slide == SlideAxis::PlusX || p.slide == SlideAxis::MinusX ? 'X' : 'Y'),
           "");
  }

  // How many errors and warnings in all, the findings not kept included.
  std::pair<long, long> tally() const {
    long errors = 0, warnings = 0;
    for (const FindingCount& c : r_.counts) {
      // A kind's findings share its severity, but for unknown_tool (an
      // error for a tool not in the job, a warning for no tool at all).
      long kept_errors = 0, kept = 0;
      for (const Finding& f : r_.findings) {
        if (f.kind != c.kind) continue;
        ++kept;
        kept_errors += f.severity == Severity::Error ? 1 : 0;
      }
      const long rest = c.count - kept;
      errors += kept_errors + (kept_errors > 0 ? rest : 0);
      warnings += kept - kept_errors + (kept_errors > 0 ? 0 : rest);
    }
    return {errors, warnings};
  }

  void findings() {
    const auto [errors, warnings] = tally();
    out_ += r_.findings.empty()
                ? std::string("\nFindings\n")
                : fmt::format("\nFindings: {} error{}, {} warning{} (errors first)\n", errors,
                              errors == 1 ? "" : "s", warnings, warnings == 1 ? "" : "s");
    if (r_.findings.empty()) out_ += "  none\n";
    for (const FindingGroup& g : group_findings(r_.findings)) group(g);
    for (const FindingCount& c : r_.counts) {
      long shown = 0;
      for (const Finding& f : r_.findings) shown += f.kind == c.kind ? 1 : 0;
      if (c.count > shown)
        out_ += fmt::format("  ... and {} more {} finding(s)\n", c.count - shown,
                            finding_kind_name(c.kind));
    }
  }

  // A group: a heading with its lines, severity, kind, count and stations,
  // then the first finding's words and the lines it was seen at.
  void group(const FindingGroup& g) {
    const std::string where = g.lines.size() == 1
                                  ? fmt::format("line {}", g.lines.front())
                                  : fmt::format("lines {}-{}", g.lines.front(), g.lines.back());
    std::string head = fmt::format("  {:<11} {:<7} {}", where, severity_name(g.severity),
                                   finding_kind_name(g.kind));
    if (g.count > 1) head += fmt::format(", {} times", g.count);
    std::string at;
    if (g.y_min && *g.y_min == *g.y_max)
      at = fmt::format("at y = {} {}", num(*g.y_min), sym_);
    else if (g.y_min)
      at = fmt::format("at y = {} to {} {}", num(*g.y_min), num(*g.y_max), sym_);
    // The stations go on the heading when they fit in 80 columns, else
    // they open the words below it.
    const bool at_fits = at.empty() || head.size() + 2 + at.size() <= 80;
    out_ += head;
    if (at_fits && !at.empty()) out_ += fmt::format(", {}", at);
    out_ += "\n";
    const std::string words = finding_text(g.first, r_);
    std::string text = at_fits ? words : fmt::format("{}: {}", at, words);
    if (g.count > 1) text += " (the first";
    if (g.lines.size() > 1) {
      text += "; lines";
      const std::size_t shown = std::min<std::size_t>(g.lines.size(), 8);
      for (std::size_t i = 0; i < shown; ++i)
        text += fmt::format("{} {}", i == 0 ? "" : ",", g.lines[i]);
      if (shown < g.lines.size()) text += ", ...";
    }
    if (g.count > 1) text += ")";
    para(text, "      ");
  }

  void readings() {
    const StationResult& s0 = r_.stations.front();
    out_ += "\n";
    para(fmt::format("Readings ({}), {} of {} {}; width tolerance {} to {} {}, the "
                     "target at its middle",
                     sym_, text_of(s0.target_reading.method), num(s0.target_reading.pin_diameter),
                     sym_, fmt::format("{:+n}", shown(r_.tolerance.lower, u_)),
                     fmt::format("{:+n}", shown(r_.tolerance.upper, u_)), sym_),
         "");
    out_ += fmt::format("  {:>9} {:>10} {:>10} {:>9}\n", "y", "reading", "target", "error");
    for (const StationResult& s : r_.stations) {
      const auto& m = s.measured;
      const std::string reading = m.reading ? num(m.reading->value) : "-";
      const std::string error =
          m.reading ? fmt::format("{:+n}", shown(m.reading->value - s.target_reading.value, u_))
                    : "-";
      out_ += fmt::format("  {:>9} {:>10} {:>10} {:>9}{}\n", num(s.y), reading,
                          num(s.target_reading.value), error,
                          s.reading_in_tolerance ? "" : "  out of tolerance");
    }
    if (r_.stations.size() > 1)
      para(fmt::format("reading along the slide: spread {} {}, taper {} {} per {} of length",
                       num(r_.reading_spread), sym_,
                       fmt::format("{:+}", figure(r_.reading_taper, 6)), sym_, sym_),
           "  ");
  }

  void shape() {
    const StationResult& s0 = r_.stations.front();
    out_ += fmt::format("\nSection shape ({}; flank angles in degrees)\n", sym_);
    out_ += fmt::format("  {:>9} {:>9} {:>9} {:>9} {:>7} {:>7} {:>9}\n", "y", "depth", "w bottom",
                        "w top", "left", "right", "straight");
    const auto angle = [](const FlankMeasurement& f) {
      return f.found ? fmt::format("{:.2f}", f.angle) : std::string("-");
    };
    for (const StationResult& s : r_.stations) {
      const auto& m = s.measured;
      const double straight = std::max(m.left.max_deviation, m.right.max_deviation);
      out_ += fmt::format("  {:>9} {:>9} {:>9} {:>9} {:>7} {:>7} {:>9}\n", num(s.y), num(m.depth),
                          num(m.width_bottom), num(m.width_top), angle(m.left), angle(m.right),
                          num(straight));
    }
    para(fmt::format("target: depth {}, width {} at the base plane, {} at the top; straight = "
                     "the largest departure of a flank from its fitted line",
                     num(s0.target_depth), num(s0.target_width_bottom), num(s0.target_width_top)),
         "  ");
  }

  const CheckReport& r_;
  Units u_;
  std::string_view sym_;
  std::string out_;
};

}  // namespace

std::string format_check_report(const CheckReport& r) { return ReportText(r).write(); }

}  // namespace dovetailor
