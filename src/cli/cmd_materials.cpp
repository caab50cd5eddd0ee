// dovetailor materials: the work materials the planner knows, with their names
// and cutting figures.

#include <cmath>
#include <string>
#include <vector>

#include <fmt/format.h>
#include <nlohmann/json.hpp>

#include <dovetailor/base/text_wrap.hpp>
#include <dovetailor/shop/material_table.hpp>

#include "commands.hpp"
#include "flags.hpp"

namespace dovetailor::cli {
namespace {

struct MaterialsOptions {
  std::string name;  // optional: show only the material this name means
  std::string units = "inch";
  bool json = false;
};

constexpr double metres_per_foot = 0.3048;  // exact (1959 international foot)

// A surface speed (m/min inside) in ft/min or m/min.
double speed_in(double m_per_min, Units units) {
  return units == Units::Inch ? m_per_min / metres_per_foot : m_per_min;
}

// JSON figures at the decimals the table is written in, not the ulps of a
// unit conversion.
double rounded(double value, int decimals) {
  const double scale = std::pow(10.0, decimals);
  return std::round(value * scale) / scale;
}

std::string speed_text(const SpeedRange& range, Units units) {
  return fmt::format("{:.0f}-{:.0f}", speed_in(range.low, units), speed_in(range.high, units));
}

std::vector<const Material*> chosen(const MaterialsOptions& o) {
  const auto& table = builtin_materials();
  if (!o.name.empty()) {
    try {
      return {&find_material(table, o.name)};
    } catch (const InputError& e) {
      throw InputError(e.message(), {"flags"}, "name");
    }
  }
  std::vector<const Material*> all;
  for (const auto& m : table.materials) all.push_back(&m);
  return all;
}

void print_indented(const std::string& text) {
  for (const auto& line : wrap_words(text, 76)) fmt::print("    {}\n", line);
}

void print_text(const std::vector<const Material*>& materials, Units units) {
  const char* speed_unit = units == Units::Inch ? "ft/min" : "m/min";
  fmt::print(
      "Work materials (data/materials.toml, built into the program). Surface speeds\n"
      "in {}; Kienzle kc = kc1.1 h^-mc, kc1.1 in N/mm^2 at a chip of h = 1 mm.\n"
      "Group (ISO 513): P steel, M stainless steel, K cast iron, N non-ferrous\n"
      "metals and non-metals. A job's [part] material may be any of the names;\n"
      "case, spaces, hyphens, the order of the words and tempers like -T6 do not\n"
      "matter. Starting figures, not guarantees.\n\n",
      speed_unit);
  fmt::print("  {:<27}{:>5}{:>7}{:>6}{:>12}{:>15}\n", "Key", "Group", "kc1.1", "mc", "HSS speed",
             "Carbide speed");
  for (const Material* m : materials) {
    fmt::print("\n  {:<27}{:>5}{:>7.0f}{:>6.2f}{:>12}{:>15}\n", m->key,
               m->group.empty() ? "-" : m->group, m->kc11, m->mc, speed_text(m->hss_speed, units),
               speed_text(m->carbide_speed, units));
    print_indented(m->name);
    std::string names;
    for (const auto& alias : m->aliases) {
      if (!names.empty()) names += ", ";
      names += alias;
    }
    if (!names.empty()) print_indented(fmt::format("Names: {}", names));
    print_indented(fmt::format("Source: {}", m->source));
  }
}

void print_json(const std::vector<const Material*>& materials, Units units) {
  nlohmann::json j;
  j["speed_unit"] = units == Units::Inch ? "ft/min" : "m/min";
  j["chip_load_unit"] = units == Units::Inch ? "in" : "mm";
  j["kc11_unit"] = "N/mm^2";
  auto& list = j["materials"] = nlohmann::json::array();
  for (const Material* m : materials) {
    nlohmann::json chip = nlohmann::json::array();
    for (const auto& p : m->chip_load)
      chip.push_back({{"diameter", rounded(from_mm(p.diameter, units), 6)},
                      {"per_tooth", rounded(from_mm(p.per_tooth, units), 6)}});
    const auto speeds = [&](const SpeedRange& r) {
      return nlohmann::json::array(
          {rounded(speed_in(r.low, units), 1), rounded(speed_in(r.high, units), 1)});
    };
    list.push_back({{"key", m->key},
                    {"name", m->name},
                    {"aliases", m->aliases},
                    {"group", m->group},
                    {"kc11", m->kc11},
                    {"mc", m->mc},
                    {"hss_speed", speeds(m->hss_speed)},
                    {"carbide_speed", speeds(m->carbide_speed)},
                    {"chip_load", chip},
                    {"source", m->source}});
  }
  fmt::print("{}\n", j.dump(2));
}

void run_materials(const MaterialsOptions& o) {
  const Units units = parse_word<Units>(o.units, "--units");
  const auto materials = chosen(o);
  if (o.json) {
    print_json(materials, units);
  } else {
    print_text(materials, units);
  }
}

}  // namespace

void setup_materials(CLI::App& app) {
  auto o = std::make_shared<MaterialsOptions>();
  auto* cmd = app.add_subcommand(
      "materials", "The work materials known, their names, cutting speeds and force constants.");
  cmd->add_option("name", o->name, "Show only the material this name means (as in a job file)");
  cmd->add_option("--units", o->units, "inch (ft/min) or mm (m/min)")
      ->check(CLI::IsMember(keys_of<Units>()));
  cmd->add_flag("--json", o->json, "Print JSON instead of text");
  cmd->callback([o] { run_materials(*o); });
}

}  // namespace dovetailor::cli
