// dovetailor fit: the clearance of a male/female pair, and the reading to aim for.

#include <cmath>
#include <optional>
#include <string>
#include <vector>

#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include <dovetailor/base/length.hpp>
#include <dovetailor/base/text_wrap.hpp>
#include <dovetailor/geometry/fit.hpp>
#include <dovetailor/input/job_reader.hpp>

#include "commands.hpp"
#include "file_io.hpp"
#include "flags.hpp"

namespace dovetailor::cli {
namespace {

struct FitOptions {
  std::vector<std::string> job_files;
  std::string units = "inch";
  std::string sides = "both";
  double angle = NAN;
  double female_reading = NAN;
  double female_pin = NAN;
  double female_depth = NAN;
  double male_reading = NAN;
  double male_pin = NAN;
  double male_depth = NAN;
  double clearance = NAN;
  bool json = false;
};

constexpr const char* convention =
    "Assembly: the female rests as low as it goes, its top face on the male's shelf\n"
    "or, when the male is the deeper, its floor on the male's top. Lateral clearance\n"
    "is the total side play of both flanks together there; positive is clearance,\n"
    "negative interference. Normal clearance is measured square to the flanks.";

struct FitResult {
  Units units = Units::Inch;
  double angle = 0;
  int angled_flanks = 2;
  std::optional<MeasuredPart> female;  // reading known
  std::optional<MeasuredPart> male;
  std::optional<Fit> fit;
  std::optional<double> clearance;      // wanted
  std::optional<double> target_male;    // reading to aim for on the male
  std::optional<double> target_female;  // reading to aim for on the female
  double female_pin = 0;
  double female_depth = 0;
  double male_pin = 0;
  double male_depth = 0;
  double female_gib = 0;  // lateral gib allowances in the readings
  double male_gib = 0;
  bool as_planned = false;  // from job files: each part at the middle of its band
};

// A job's part as the planner cuts it: at the middle of its tolerance band.
DovetailSection planned_section(const Job& job) { return section_of(aimed_spec(job.dovetail)); }

MeasuredPart part_from_job(const Job& job) {
  const auto section = planned_section(job);
  if (!job.gauge)
    throw InputError("needs [gauge] pin_diameter to state its reading", {job.source},
                     "gauge.pin_diameter");
  return {job.dovetail.type, reading_of(section, job.gauge->pin_diameter).value,
          job.gauge->pin_diameter, job.dovetail.depth, section.gib_allowance};
}

FitResult fit_from_jobs(const FitOptions& o) {
  if (o.job_files.size() != 2)
    throw InputError("give two job files, one male and one female, or describe them by flags",
                     {"flags"}, "job");
  Job a = read_job(read_text_file(o.job_files[0]), o.job_files[0]);
  Job b = read_job(read_text_file(o.job_files[1]), o.job_files[1]);
  if (a.dovetail.type == b.dovetail.type)
    throw InputError(fmt::format("both jobs are {}; a fit needs one male and one female",
                                 key_of(a.dovetail.type)),
                     {b.source}, "dovetail.type");
  const Job& female = a.dovetail.type == DovetailType::Female ? a : b;
  const Job& male = a.dovetail.type == DovetailType::Male ? a : b;
  if (std::abs(female.dovetail.angle - male.dovetail.angle) > 0.1)
    throw InputError(fmt::format("the angles differ ({:g} and {:g} deg): the flanks would not "
                                 "bear",
                                 female.dovetail.angle, male.dovetail.angle),
                     {male.source}, "dovetail.angle");
  if (female.dovetail.sides != male.dovetail.sides)
    throw InputError("the two parts have different angled flanks (dovetail.sides)", {male.source},
                     "dovetail.sides");
  if (female.units != male.units)
    throw InputError("the two jobs use different units; the report uses the female's",
                     {male.source}, "units");
  FitResult r;
  r.units = female.units;
  r.angle = female.dovetail.angle;
  r.angled_flanks = female.dovetail.sides == AngledSides::Both ? 2 : 1;
  r.fit = fit_of(planned_section(female), planned_section(male));
  r.as_planned = true;
  if (female.gauge) r.female = part_from_job(female);
  if (male.gauge) r.male = part_from_job(male);
  r.female_pin = female.gauge ? female.gauge->pin_diameter : 0;
  r.male_pin = male.gauge ? male.gauge->pin_diameter : 0;
  r.female_depth = female.dovetail.depth;
  r.male_depth = male.dovetail.depth;
  r.female_gib = planned_section(female).gib_allowance;
  r.male_gib = planned_section(male).gib_allowance;
  if (!std::isnan(o.clearance)) r.clearance = to_mm(o.clearance, r.units);
  return r;
}

FitResult fit_from_flags(const FitOptions& o) {
  FitResult r;
  r.units = parse_word<Units>(o.units, "--units");
  r.angle = require_flag(o.angle, "--angle", 0, 90);
  r.angled_flanks = parse_word<AngledSides>(o.sides, "--sides") == AngledSides::Both ? 2 : 1;
  const auto len = [&](double v, const char* flag) {
    return to_mm(require_flag(v, flag, 0, 1e4), r.units);
  };
  r.female_pin = len(o.female_pin, "--female-pin");
  r.female_depth = len(o.female_depth, "--female-depth");
  r.male_pin = len(o.male_pin, "--male-pin");
  r.male_depth = len(o.male_depth, "--male-depth");
  if (!std::isnan(o.female_reading)) {
    // Between two pins that fit the groove the reading is their gap, which
    // is positive: P = (distance of the centres) - D.
    if (o.female_reading <= 0)
      throw InputError(fmt::format("a reading between pins of {} or less means the pins "
                                   "overlap or touch; measure again, or use smaller pins",
                                   shown(0, r.units)),
                       {"flags"}, "--female-reading");
    r.female = MeasuredPart{DovetailType::Female, to_mm(o.female_reading, r.units), r.female_pin,
                            r.female_depth};
  }
  if (!std::isnan(o.male_reading))
    r.male =
        MeasuredPart{DovetailType::Male, to_mm(o.male_reading, r.units), r.male_pin, r.male_depth};
  if (!std::isnan(o.clearance)) r.clearance = to_mm(o.clearance, r.units);
  if (!r.female && !r.male)
    throw InputError("give --female-reading, --male-reading or both", {"flags"}, "--*-reading");
  if ((!r.female || !r.male) && !r.clearance)
    throw InputError("with one reading only, give --clearance to get the other part's target",
                     {"flags"}, "--clearance");
  if (r.female && r.male) r.fit = fit_of(*r.female, *r.male, r.angle, r.angled_flanks);
  return r;
}

void add_targets(FitResult& r) {
  if (!r.clearance) return;
  const MeasuredPart male_target{DovetailType::Male, 0, r.male_pin, r.male_depth, r.male_gib};
  const MeasuredPart female_target{DovetailType::Female, 0, r.female_pin, r.female_depth,
                                   r.female_gib};
  if (r.female && r.male_pin > 0)
    r.target_male =
        reading_for_clearance(*r.female, male_target, r.angle, r.angled_flanks, *r.clearance);
  if (r.male && r.female_pin > 0) {
    r.target_female =
        reading_for_clearance(*r.male, female_target, r.angle, r.angled_flanks, *r.clearance);
    if (*r.target_female <= 0)
      throw InputError(fmt::format("the female would read {} between {} pins: pins that size "
                                   "would overlap in its groove; give smaller pins",
                                   shown(*r.target_female, r.units), shown(r.female_pin, r.units)),
                       {"flags"}, "--female-pin");
  }
}

// What the depths do to the fit, in words, and whether it assembles.
std::vector<std::string> fit_notes(const FitResult& r) {
  std::vector<std::string> notes;
  if (!r.fit) return notes;
  const Fit& f = *r.fit;
  const Units u = r.units;
  if (f.shelf_gap > 0)
    notes.push_back(fmt::format(
        "The male is {} deeper than the female: its top bears on the female's floor and "
        "holds the female's top face {} above the shelf, and the flanks close in by {} "
        "({} x {:n} x cot {:g}).",
        shown(f.shelf_gap, u), shown(f.shelf_gap, u),
        shown(f.shelf_clearance - f.lateral_clearance, u), r.angled_flanks, shown(f.shelf_gap, u),
        r.angle));
  if (!f.can_assemble) {
    if (f.bearing_height <= 0)
      notes.push_back("CANNOT ASSEMBLE: the flanks do not face each other.");
    else if (f.shelf_gap > 0 && f.shelf_clearance >= 0)
      notes.push_back(
          fmt::format("CANNOT ASSEMBLE: the flanks interfere by {} where the parts "
                      "come to rest; cut the male's top down to the female's depth "
                      "or take the female's floor {} deeper.",
                      shown(-f.lateral_clearance, u), shown(f.shelf_gap, u)));
    else
      notes.push_back(
          fmt::format("CANNOT ASSEMBLE: the flanks interfere by {}; the female's mouth is narrower "
                      "than the male's root.",
                      shown(-f.lateral_clearance, u)));
  }
  return notes;
}

void print_text(const FitResult& r) {
  const Units u = r.units;
  fmt::print("Fit of a dovetail pair, {:g} deg, {} angled. All lengths in {}.\n\n", r.angle,
             r.angled_flanks == 2 ? "both flanks" : "one flank", unit_name(u));
  const auto row = [](std::string_view label, const std::string& value) {
    fmt::print("  {:<34}{}\n", label, value);
  };
  if (r.female)
    row("Female reading between pins",
        fmt::format("{} ({:n} pins, depth {})", shown(r.female->reading, u), shown(r.female_pin, u),
                    shown(r.female_depth, u)));
  if (r.male)
    row("Male reading over pins", fmt::format("{} ({:n} pins, depth {})", shown(r.male->reading, u),
                                              shown(r.male_pin, u), shown(r.male_depth, u)));
  if (r.fit) {
    const Fit& f = *r.fit;
    if (!r.female || !r.male)
      row("Depths",
          fmt::format("female {}, male {}", shown(r.female_depth, u), shown(r.male_depth, u)));
    if (f.shelf_gap > 0) {
      row("Seat", "male's top on the female's floor");
      row("Female top face above the shelf", fmt::format("{}", shown(f.shelf_gap, u)));
      row("Clearance at the shelf would be", fmt::format("{:+}", shown(f.shelf_clearance, u)));
    } else {
      row("Seat", "female's top face on the male's shelf");
      row("Male top below the female floor", fmt::format("{}", shown(f.floor_gap, u)));
    }
    row("Lateral clearance", fmt::format("{:+}", shown(f.lateral_clearance, u)) +
                                 (f.lateral_clearance < 0 ? "  INTERFERENCE" : ""));
    row("  per flank", fmt::format("{:+}", shown(f.lateral_clearance / r.angled_flanks, u)));
    row("Normal clearance", fmt::format("{:+}", shown(f.normal_clearance, u)));
    row("Flanks face each other over", fmt::format("{}", shown(f.bearing_height, u)));
    row("Assembles", f.can_assemble ? "yes" : "NO");
  }
  if (r.clearance) {
    fmt::print("\n");
    row("Wanted lateral clearance", fmt::format("{:+}", shown(*r.clearance, u)));
    if (r.target_male)
      row("Aim the male over pins at",
          fmt::format("{} ({:n} pins)", shown(*r.target_male, u), shown(r.male_pin, u)));
    if (r.target_female)
      row("Aim the female between pins at",
          fmt::format("{} ({:n} pins)", shown(*r.target_female, u), shown(r.female_pin, u)));
  }
  for (const auto& note : fit_notes(r)) {
    fmt::print("\n");
    for (const auto& line : wrap_words(note, 80)) fmt::print("{}\n", line);
  }
  fmt::print("\n{}\n", convention);
  if (r.as_planned)
    fmt::print("From the job files: each part as planned, at the middle of its width tolerance.\n");
}

void print_json(const FitResult& r) {
  const Units u = r.units;
  nlohmann::json j;
  j["units"] = unit_name(u);
  j["angle"] = r.angle;
  j["convention"] =
      "female as low as it goes (top face on the male's shelf, or floor on the male's top "
      "when the male is deeper); lateral clearance is the total of both flanks there";
  if (r.female) j["female_reading"] = length_value(r.female->reading, u);
  if (r.male) j["male_reading"] = length_value(r.male->reading, u);
  j["female_depth"] = length_value(r.female_depth, u);
  j["male_depth"] = length_value(r.male_depth, u);
  if (r.fit) {
    const Fit& f = *r.fit;
    j["lateral_clearance"] = length_value(f.lateral_clearance, u);
    j["normal_clearance"] = length_value(f.normal_clearance, u);
    j["shelf_clearance"] = length_value(f.shelf_clearance, u);
    j["seat"] = f.shelf_gap > 0 ? "male-top-on-female-floor" : "female-top-on-male-shelf";
    j["shelf_gap"] = length_value(f.shelf_gap, u);
    j["floor_gap"] = length_value(f.floor_gap, u);
    j["bearing_height"] = length_value(f.bearing_height, u);
    j["can_assemble"] = f.can_assemble;
    j["notes"] = fit_notes(r);
  }
  if (r.clearance) j["wanted_clearance"] = length_value(*r.clearance, u);
  if (r.target_male) j["target_male_reading"] = length_value(*r.target_male, u);
  if (r.target_female) j["target_female_reading"] = length_value(*r.target_female, u);
  fmt::print("{}\n", j.dump(2));
}

void run_fit(const FitOptions& o) {
  FitResult r = o.job_files.empty() ? fit_from_flags(o) : fit_from_jobs(o);
  add_targets(r);
  if (o.json) {
    print_json(r);
  } else {
    print_text(r);
  }
}

}  // namespace

void setup_fit(CLI::App& app) {
  auto o = std::make_shared<FitOptions>();
  auto* cmd = app.add_subcommand(
      "fit", "Clearance of a male/female pair, from two job files or from pin readings.");
  cmd->add_option("jobs", o->job_files, "Two job files, one male and one female (either order)");
  cmd->add_option("--units", o->units, "inch or mm (flags mode)")
      ->check(CLI::IsMember(keys_of<Units>()));
  cmd->add_option("--angle", o->angle, "Flank angle, degrees");
  cmd->add_option("--sides", o->sides, "Angled flanks: both, left or right")
      ->check(CLI::IsMember(keys_of<AngledSides>()));
  cmd->add_option("--female-reading", o->female_reading, "Female reading between pins");
  cmd->add_option("--female-pin", o->female_pin, "Pin diameter used on the female");
  cmd->add_option("--female-depth", o->female_depth, "Female depth, floor to mouth");
  cmd->add_option("--male-reading", o->male_reading, "Male reading over pins");
  cmd->add_option("--male-pin", o->male_pin, "Pin diameter used on the male");
  cmd->add_option("--male-depth", o->male_depth, "Male depth, shelf to top face");
  cmd->add_option("--clearance", o->clearance,
                  "Wanted lateral clearance; prints the reading to aim for");
  cmd->add_flag("--json", o->json, "Print JSON instead of text");
  cmd->callback([o] { run_fit(*o); });
}

}  // namespace dovetailor::cli
