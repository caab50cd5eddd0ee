// dovetailor pins: the widths of a dovetail and its pin reading, both ways.

#include <cmath>
#include <iostream>
#include <optional>

#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include <dovetailor/base/length.hpp>
#include <dovetailor/geometry/dovetail_section.hpp>
#include <dovetailor/geometry/pin_gauge.hpp>
#include <dovetailor/input/job_reader.hpp>

#include "commands.hpp"
#include "file_io.hpp"
#include "flags.hpp"

namespace dovetailor::cli {
namespace {

struct PinsOptions {
  std::string job_file;
  std::string type;
  std::string units = "inch";
  std::string width_at = "bottom";
  std::string sides = "both";
  double angle = NAN;
  double depth = NAN;
  double pin = NAN;
  double width = NAN;
  double reading = NAN;
  double chamfer = 0;
  double corner_radius = 0;
  bool json = false;
};

// What the report is about, whichever way it was described.
struct PinsCase {
  std::string title;
  Units units = Units::Inch;
  DovetailSection section;
  Tolerance tolerance;
  // How far the reading to aim at lies from the nominal one: the middle of
  // the tolerance band, as the planner aims (0 for a measured --reading).
  double aim = 0;
  double pin = 0;
  double corner_radius = 0;
  std::optional<StockFaces> stock;  // known from a job: a male's pins must rest on its shelf
  std::string source;               // the file, or "flags"
  std::string pin_field;            // where the pin size came from, for messages
  std::optional<Job> job;
};

std::string method_text(const PinReading& r) {
  const std::string_view words = text_of(r.method);
  return r.method == ReadingMethod::SquareSideToPin ? "Square side to 1 pin"
                                                    : fmt::format("Reading {}", words);
}

std::string method_key(const PinReading& r) { return std::string(key_of(r.method)); }

PinsCase case_from_job(const PinsOptions& o) {
  PinsCase c;
  Job job = read_job(read_text_file(o.job_file), o.job_file);
  c.units = job.units;
  c.title = job.part.name.empty() ? o.job_file : job.part.name;
  c.section = section_of(job.dovetail);
  c.tolerance = job.dovetail.tolerance;
  c.aim = band_middle(c.tolerance);
  c.source = o.job_file;
  c.stock = stock_faces(job);
  if (!std::isnan(o.pin)) {
    c.pin = to_mm(o.pin, job.units);
    c.pin_field = "--pin";
  } else if (job.gauge) {
    c.pin = job.gauge->pin_diameter;
    c.pin_field = "gauge.pin_diameter";
  } else {
    throw InputError("no pin size: add [gauge] pin_diameter to the job or give --pin", {o.job_file},
                     "gauge.pin_diameter");
  }
  if (const Tool* cutter = first_tool(job, ToolKind::Dovetail))
    c.corner_radius = cutter->corner_radius;
  c.job = std::move(job);
  return c;
}

PinsCase case_from_flags(const PinsOptions& o) {
  PinsCase c;
  c.units = parse_word<Units>(o.units, "--units");
  DovetailSpec spec;
  spec.type = parse_word<DovetailType>(o.type, "--type");
  spec.angle = require_flag(o.angle, "--angle", 30, 75);
  spec.depth = to_mm(require_flag(o.depth, "--depth", 0, 1e4), c.units);
  spec.sides = parse_word<AngledSides>(o.sides, "--sides");
  spec.chamfer = to_mm(o.chamfer, c.units);
  c.pin = to_mm(require_flag(o.pin, "--pin", 0, 1e4), c.units);
  c.source = "flags";
  c.pin_field = "--pin";
  c.corner_radius = to_mm(o.corner_radius, c.units);
  const int angled = spec.sides == AngledSides::Both ? 2 : 1;
  if (std::isnan(o.width) == std::isnan(o.reading))
    throw InputError("give either --width (with --width-at) or --reading, not both", {"flags"},
                     "--width/--reading");
  if (!std::isnan(o.width)) {
    spec.width = to_mm(require_flag(o.width, "--width", 0, 1e4), c.units);
    spec.width_at = parse_word<WidthAt>(o.width_at, "--width-at");
  } else {
    spec.width = width_for_reading(spec.type, angled, to_mm(o.reading, c.units), c.pin, spec.angle);
    spec.width_at = WidthAt::Bottom;
  }
  const double bottom = design_width_bottom(spec);
  const double top = width_top_from_bottom(spec.type, bottom, spec.depth, spec.angle, angled);
  if (bottom <= 0 || top <= 0)
    throw InputError("these sizes make the flanks cross (a width at or below zero)", {"flags"},
                     std::isnan(o.reading) ? "--width" : "--reading");
  if (spec.chamfer >= spec.depth)
    throw InputError("must be smaller than the depth", {"flags"}, "--chamfer");
  c.section = section_of(spec);
  c.tolerance = default_tolerance(spec.type, c.units);
  if (std::isnan(o.reading)) c.aim = band_middle(c.tolerance);
  c.title = "Dovetail given by flags";
  return c;
}

void print_text(const PinsCase& c) {
  const auto& s = c.section;
  const Units u = c.units;
  const PinReading r = reading_of(s, c.pin);
  const bool female = s.type == DovetailType::Female;
  fmt::print("{} ({} dovetail, {:g} deg, {} angled)\n", c.title, key_of(s.type), s.angle,
             s.angled_flanks() == 2 ? "both flanks" : "one flank");
  fmt::print("All lengths in {}.\n\n", unit_name(u));
  const auto row = [](std::string_view label, const std::string& value) {
    fmt::print("  {:<34}{}\n", label, value);
  };
  row(female ? "Width at base plane (floor)" : "Width at base plane (root)",
      fmt::format("{}", shown(s.width_bottom(), u)));
  row(female ? "Width at top plane (mouth)" : "Width at top plane (top face)",
      fmt::format("{}", shown(s.width_top(), u)));
  row("Depth", fmt::format("{}", shown(s.depth, u)));
  if (s.gib_side)
    row(fmt::format("Gib allowance ({} flank)", *s.gib_side == Side::Left ? "left" : "right"),
        fmt::format("{}", shown(s.gib_allowance, u)) + " (included above)");
  fmt::print("\n");
  row(method_text(r), fmt::format("{}   with {} pin{}", shown(r.value + c.aim, u), shown(c.pin, u),
                                  r.pins == 1 ? "" : "s"));
  row("  good from", fmt::format("{:n} to {}", shown(r.value + c.tolerance.lower, u),
                                 shown(r.value + c.tolerance.upper, u)));
  if (c.aim != 0)
    row("  nominal (the widths above)",
        fmt::format("{}", shown(r.value, u)) + "; aim at the middle");
  const double h = contact_height(c.pin, s.angle);
  row("Pin touches the flank at", fmt::format("{} above the base ({:.0f} % of the flank)",
                                              shown(h, u), 100 * h / (s.depth - s.chamfer)));
  row("Pin constant 1 + cot(a/2)", fmt::format("{:.7f}", pin_constant(s.angle)));
  if (c.job && !female) {
    for (Side side : {Side::Left, Side::Right}) {
      if (!s.flank(side).angled) continue;
      const bool left = side == Side::Left;
      const double face = left ? stock_right_x(*c.job) : stock_left_x(*c.job);
      row(fmt::format("{} stock face to {} pin", left ? "Right" : "Left", left ? "left" : "right"),
          fmt::format("{}", shown(reference_reading(s, side, c.pin, face), u)));
    }
  }
  const auto advice = advise_pins(s, c.corner_radius, u, c.stock);
  fmt::print("\nCommon pin sizes that fit (* = contact in the middle third of the flank):\n");
  if (advice.empty()) fmt::print("  none: the flank is too short for the common sizes\n");
  for (const auto& a : advice)
    fmt::print("  {} {:>10}   touches at {}\n", a.middle_third ? '*' : ' ', shown(a.diameter, u),
               shown(a.contact_height, u));
}

void print_json(const PinsCase& c) {
  const auto& s = c.section;
  const Units u = c.units;
  const PinReading r = reading_of(s, c.pin);
  nlohmann::json j;
  j["units"] = unit_name(u);
  j["type"] = key_of(s.type);
  j["angle"] = s.angle;
  j["method"] = method_key(r);
  j["pins"] = r.pins;
  j["pin_diameter"] = length_value(c.pin, u);
  j["reading"] = length_value(r.value + c.aim, u);
  j["reading_nominal"] = length_value(r.value, u);
  j["reading_min"] = length_value(r.value + c.tolerance.lower, u);
  j["reading_max"] = length_value(r.value + c.tolerance.upper, u);
  j["width_bottom"] = length_value(s.width_bottom(), u);
  j["width_top"] = length_value(s.width_top(), u);
  j["depth"] = length_value(s.depth, u);
  j["gib_allowance"] = length_value(s.gib_allowance, u);
  j["contact_height"] = length_value(contact_height(c.pin, s.angle), u);
  j["pin_constant"] = pin_constant(s.angle);
  j["problems"] = pin_problems(s, c.pin, c.corner_radius, u, c.stock);
  auto& advice = j["pin_advice"] = nlohmann::json::array();
  for (const auto& a : advise_pins(s, c.corner_radius, u, c.stock))
    advice.push_back({{"diameter", length_value(a.diameter, u)},
                      {"contact_height", length_value(a.contact_height, u)},
                      {"middle_third", a.middle_third}});
  fmt::print("{}\n", j.dump(2));
}

void run_pins(const PinsOptions& o) {
  const PinsCase c = o.job_file.empty() ? case_from_flags(o) : case_from_job(o);
  // A pin that cannot measure this dovetail gives no reading worth printing.
  const auto problems = pin_problems(c.section, c.pin, c.corner_radius, c.units, c.stock);
  if (!problems.empty()) {
    std::string why = problems.front();
    for (std::size_t i = 1; i < problems.size(); ++i) {
      why += "; and ";
      why += problems[i];
    }
    throw InputError(why, {c.source}, c.pin_field);
  }
  if (o.json) {
    print_json(c);
  } else {
    print_text(c);
  }
}

}  // namespace

void setup_pins(CLI::App& app) {
  auto o = std::make_shared<PinsOptions>();
  auto* cmd = app.add_subcommand(
      "pins", "Widths and the pin reading of a dovetail, from a job file or from flags.");
  cmd->add_option("job", o->job_file, "Job file (TOML); omit to describe the dovetail by flags");
  cmd->add_option("--type", o->type, "male or female")
      ->check(CLI::IsMember(keys_of<DovetailType>()));
  cmd->add_option("--units", o->units, "inch or mm (flags mode)")
      ->check(CLI::IsMember(keys_of<Units>()));
  cmd->add_option("--angle", o->angle, "Flank angle, degrees (30 to 75)");
  cmd->add_option("--depth", o->depth, "Depth, base plane to top plane");
  cmd->add_option("--width", o->width, "Width at --width-at");
  cmd->add_option("--width-at", o->width_at, "bottom (base plane) or top")
      ->check(CLI::IsMember(keys_of<WidthAt>()));
  cmd->add_option("--reading", o->reading, "A pin reading, instead of --width");
  cmd->add_option("--pin", o->pin, "Pin diameter (overrides the job's gauge)");
  cmd->add_option("--sides", o->sides, "Angled flanks: both, left or right")
      ->check(CLI::IsMember(keys_of<AngledSides>()));
  cmd->add_option("--chamfer", o->chamfer, "Top edge break (flags mode)");
  cmd->add_option("--corner-radius", o->corner_radius, "Cutter corner radius (flags mode)");
  cmd->add_flag("--json", o->json, "Print JSON instead of text");
  cmd->callback([o] { run_pins(*o); });
}

}  // namespace dovetailor::cli
