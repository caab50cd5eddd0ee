#include <algorithm>
#include <cassert>
#include <cctype>
#include <map>

#include <fmt/format.h>

#include <dovetailor/material_table.hpp>

#include "toml_fields.hpp"

namespace dovetailor {
namespace {

using detail::TableReader;

constexpr double metres_per_foot = 0.3048;  // exact by definition (1959 international foot)

class MaterialReader {
 public:
  MaterialReader(std::string_view text, const std::string& file)
      : file_(file), root_(detail::parse_toml(text, file)) {}

  MaterialTable read() {
    TableReader top(root_, "", file_);
    auto units = top.choice<Units>("units", {{"inch", Units::Inch}, {"mm", Units::Millimetre}});
    if (!units)
      top.fail("units",
               "missing; write units = \"inch\" (ft/min and inches) or units = \"mm\" "
               "(m/min and mm) at the top");
    units_ = *units;
    read_diameters(top);
    int index = 0;
    for (const auto* table : top.tables("material")) read_material(*table, ++index);
    if (table_.materials.empty())
      top.fail("material", "the table lists no materials; add [[material]] tables");
    top.reject_unknown();
    table_.file = file_;
    return table_;
  }

 private:
  double speed_to_m_per_min(double v) const {
    return units_ == Units::Inch ? v * metres_per_foot : v;
  }

  void read_diameters(TableReader& top) {
    const auto* array = root_.get_as<toml::array>("chip_load_diameters");
    const std::size_t count = array && array->size() >= 2 ? array->size() : 2;
    auto values = top.numbers("chip_load_diameters", count, 0, 1e4);
    if (!values)
      top.fail("chip_load_diameters",
               "missing; give the tool diameters of the chip-load "
               "columns, at least two, ascending");
    for (std::size_t i = 0; i < values->size(); ++i) {
      if ((*values)[i] <= 0) top.fail("chip_load_diameters", "every diameter must be above zero");
      if (i > 0 && (*values)[i] <= (*values)[i - 1])
        top.fail("chip_load_diameters", "the diameters must be in ascending order");
      diameters_.push_back(to_mm((*values)[i], units_));
    }
  }

  SpeedRange speed(TableReader& t, std::string_view key) {
    auto pair = t.numbers(key, 2, 0, 1e5);
    if (!pair)
      t.fail(key, fmt::format("missing; give [low, high] surface speed in {}",
                              units_ == Units::Inch ? "ft/min" : "m/min"));
    if ((*pair)[0] <= 0) t.fail(key, "the surface speeds must be above zero");
    if ((*pair)[0] > (*pair)[1]) t.fail(key, "give [low, high]: the low speed is above the high");
    return {speed_to_m_per_min((*pair)[0]), speed_to_m_per_min((*pair)[1])};
  }

  std::string required_text(TableReader& t, std::string_view key) {
    auto value = t.text(key);
    if (!value || value->empty()) t.fail(key, "missing; give a non-empty text in quotes");
    return *value;
  }

  void claim_name(TableReader& t, std::string_view key, const std::string& name,
                  const std::string& owner) {
    const auto match = material_match_key(name);
    if (match.empty()) t.fail(key, "\"" + name + "\" has no letters or digits to match");
    auto [it, inserted] = owners_.emplace(match, owner);
    if (!inserted && it->second != owner)
      t.fail(key, fmt::format("\"{}\" would match both \"{}\" and \"{}\"; give each name to one "
                              "material",
                              name, it->second, owner));
  }

  void read_material(const toml::table& table, int index) {
    TableReader t(table, fmt::format("material[{}]", index), file_);
    Material m;
    m.key = required_text(t, "key");
    claim_name(t, "key", m.key, m.key);
    m.name = required_text(t, "name");
    m.aliases = t.texts("aliases").value_or(std::vector<std::string>{});
    for (const auto& alias : m.aliases) claim_name(t, "aliases", alias, m.key);
    m.hss_speed = speed(t, "hss_speed");
    m.carbide_speed = speed(t, "carbide_speed");
    auto loads = t.numbers("chip_load", diameters_.size(), 0, 1e3);
    if (!loads)
      t.fail("chip_load", fmt::format("missing; give {} feeds per tooth, one for each of "
                                      "chip_load_diameters",
                                      diameters_.size()));
    for (std::size_t i = 0; i < loads->size(); ++i) {
      if ((*loads)[i] <= 0) t.fail("chip_load", "every chip load must be above zero");
      m.chip_load.push_back({diameters_[i], to_mm((*loads)[i], units_)});
    }
    m.kc11 = t.required_number("kc11", 10, 10000);
    m.mc = t.required_number("mc", 0, 0.6);
    m.source = required_text(t, "source");
    t.reject_unknown();
    table_.materials.push_back(std::move(m));
  }

  std::string file_;
  toml::table root_;
  Units units_ = Units::Inch;
  std::vector<double> diameters_;
  std::map<std::string, std::string> owners_;  // match key -> material key
  MaterialTable table_;
};

}  // namespace

MaterialTable read_material_table(std::string_view text, const std::string& file) {
  return MaterialReader(text, file).read();
}

const MaterialTable& builtin_materials() {
  static const MaterialTable table =
      read_material_table(builtin_materials_text(), "materials.toml (built in)");
  return table;
}

std::string material_match_key(std::string_view name) {
  std::string key;
  for (char c : name) {
    if (c == ' ' || c == '-' || c == '_' || c == '\t') continue;
    key += static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  }
  return key;
}

const Material* match_material(const MaterialTable& table, std::string_view name) {
  const auto wanted = material_match_key(name);
  if (wanted.empty()) return nullptr;
  for (const auto& m : table.materials) {
    if (material_match_key(m.key) == wanted) return &m;
    for (const auto& alias : m.aliases)
      if (material_match_key(alias) == wanted) return &m;
  }
  return nullptr;
}

const Material& find_material(const MaterialTable& table, std::string_view name,
                              const SourcePlace& where) {
  if (const auto* found = match_material(table, name)) return *found;
  std::string known;
  for (const auto& m : table.materials) {
    known += fmt::format("\n  {}", m.key);
    for (const auto& alias : m.aliases) known += ", " + alias;
  }
  const auto what = name.empty() ? std::string("no material given")
                                 : fmt::format("unknown material \"{}\"", name);
  throw InputError(
      what + "; give one of these names (case, spaces and hyphens do not matter):" + known, where,
      "part.material");
}

double chip_load_for(const Material& material, double tool_diameter) {
  const auto& points = material.chip_load;
  assert(!points.empty() && tool_diameter > 0);
  if (tool_diameter <= points.front().diameter)
    return points.front().per_tooth * tool_diameter / points.front().diameter;
  if (tool_diameter >= points.back().diameter) return points.back().per_tooth;
  const auto upper =
      std::upper_bound(points.begin(), points.end(), tool_diameter,
                       [](double d, const ChipLoadPoint& p) { return d < p.diameter; });
  const auto lower = upper - 1;
  const double t = (tool_diameter - lower->diameter) / (upper->diameter - lower->diameter);
  return lower->per_tooth + t * (upper->per_tooth - lower->per_tooth);
}

const SpeedRange& speed_range(const Material& material, ToolMaterial tool_material) {
  return tool_material == ToolMaterial::Carbide ? material.carbide_speed : material.hss_speed;
}

}  // namespace dovetailor
