#include <algorithm>
#include <cassert>
#include <cctype>
#include <map>
#include <set>

#include <fmt/format.h>

#include <dovetailor/shop/material_table.hpp>

#include "input/toml_fields.hpp"

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
    auto units = top.choice<Units>("units");
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
    // The same words in another order match too (match_material, step 2).
    std::string words;
    for (const auto& w : material_name_words(name)) words += w + ' ';
    for (const auto& claimed : {match, fmt::format("words: {}", words)}) {
      auto [it, inserted] = owners_.emplace(claimed, owner);
      if (!inserted && it->second != owner)
        t.fail(key, fmt::format("\"{}\" would match both \"{}\" and \"{}\"; give each name to "
                                "one material",
                                name, it->second, owner));
    }
  }

  void read_material(const toml::table& table, int index) {
    TableReader t(table, fmt::format("material[{}]", index), file_);
    Material m;
    m.key = required_text(t, "key");
    claim_name(t, "key", m.key, m.key);
    m.name = required_text(t, "name");
    m.aliases = t.texts("aliases").value_or(std::vector<std::string>{});
    for (const auto& alias : m.aliases) claim_name(t, "aliases", alias, m.key);
    m.group = t.text("group").value_or("");
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

namespace {

std::string lower(std::string_view text) {
  std::string out;
  for (char c : text) out += static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
  return out;
}

bool all_digits(std::string_view text) {
  return !text.empty() && std::all_of(text.begin(), text.end(), [](char c) {
    return std::isdigit(static_cast<unsigned char>(c)) != 0;
  });
}

// An aluminium temper: T and one to four digits ("t6", "t651", "t6511").
bool is_temper(std::string_view word) {
  return word.size() >= 2 && word.size() <= 5 && word[0] == 't' && all_digits(word.substr(1));
}

// Prefixes of standards' designations: "AISI 1018" is 1018.
bool is_standard_prefix(std::string_view word) {
  static const std::set<std::string_view> prefixes = {"aisi", "sae", "astm", "uns",  "en",
                                                      "din",  "iso", "jis",  "grade"};
  return prefixes.count(word) > 0;
}

// Words that say what kind of material a name is, not which one.
bool is_kind_word(std::string_view word) {
  static const std::set<std::string_view> kinds = {
      "steel", "aluminium", "alloy",  "stainless", "tool",    "bronze", "brass",
      "iron",  "cast",      "carbon", "annealed",  "wrought", "metal"};
  return kinds.count(word) > 0;
}

// The words left to tell materials of one kind apart (step 3 of match_material).
std::vector<std::string> core_words(const std::vector<std::string>& words) {
  std::vector<std::string> out;
  for (const auto& w : words)
    if (!is_standard_prefix(w) && !is_kind_word(w)) out.push_back(w);
  return out;
}

// Every name a material answers to: its key, then its aliases.
std::vector<std::string_view> names_of(const Material& m) {
  std::vector<std::string_view> names{m.key};
  for (const auto& alias : m.aliases) names.push_back(alias);
  return names;
}

// The single material in `found`, or nullptr for none or several.
const Material* only(const std::set<const Material*>& found) {
  return found.size() == 1 ? *found.begin() : nullptr;
}

std::size_t levenshtein(std::string_view a, std::string_view b) {
  std::vector<std::size_t> row(b.size() + 1);
  for (std::size_t j = 0; j <= b.size(); ++j) row[j] = j;
  for (std::size_t i = 1; i <= a.size(); ++i) {
    std::size_t diagonal = row[0];
    row[0] = i;
    for (std::size_t j = 1; j <= b.size(); ++j) {
      const std::size_t above = row[j];
      row[j] = std::min({row[j] + 1, row[j - 1] + 1, diagonal + (a[i - 1] == b[j - 1] ? 0 : 1)});
      diagonal = above;
    }
  }
  return row[b.size()];
}

}  // namespace

std::vector<std::string> material_name_words(std::string_view name) {
  std::vector<std::string> words;
  std::string word;
  const auto finish = [&] {
    if (word.empty()) return;
    if (word == "aluminum") word = "aluminium";
    if (word == "gray") word = "grey";
    // "6061t6": the alloy's four digits with its temper written on.
    if (word.size() > 5 && all_digits(word.substr(0, 4)) && is_temper(word.substr(4)))
      word.resize(4);
    if (!is_temper(word)) words.push_back(word);
    word.clear();
  };
  for (char c : lower(name)) {
    if (std::isalnum(static_cast<unsigned char>(c)) != 0) {
      word += c;
    } else {
      finish();
    }
  }
  finish();
  std::sort(words.begin(), words.end());
  return words;
}

const Material* match_material(const MaterialTable& table, std::string_view name) {
  const auto wanted = material_match_key(name);
  if (wanted.empty()) return nullptr;
  for (const auto& m : table.materials)
    for (auto n : names_of(m))
      if (material_match_key(n) == wanted) return &m;

  const auto words = material_name_words(name);
  if (words.empty()) return nullptr;
  std::set<const Material*> same_words;
  for (const auto& m : table.materials)
    for (auto n : names_of(m))
      if (material_name_words(n) == words) same_words.insert(&m);
  if (!same_words.empty()) return only(same_words);

  std::set<const Material*> same_core;
  for (const auto& m : table.materials) {
    // The kind words this material's own names use.
    std::set<std::string> own;
    for (auto n : names_of(m))
      for (auto& w : material_name_words(n)) own.insert(w);
    for (auto& w : material_name_words(m.name)) own.insert(w);
    std::vector<std::string> core;
    bool foreign_kind = false;
    for (const auto& w : words) {
      if (is_standard_prefix(w)) continue;
      if (is_kind_word(w)) {
        foreign_kind = foreign_kind || own.count(w) == 0;
        continue;
      }
      core.push_back(w);
    }
    if (foreign_kind || core.empty()) continue;
    for (auto n : names_of(m))
      if (core_words(material_name_words(n)) == core) same_core.insert(&m);
  }
  return only(same_core);
}

std::vector<std::string> nearest_material_names(const MaterialTable& table, std::string_view name,
                                                std::size_t count) {
  struct Candidate {
    std::size_t shared = 0;
    std::size_t distance = 0;
    std::string name;
  };
  const auto wanted_key = material_match_key(name);
  const auto wanted_words = core_words(material_name_words(name));
  std::vector<Candidate> candidates;
  for (const auto& m : table.materials) {
    for (auto n : names_of(m)) {
      Candidate c;
      c.name = std::string(n);
      c.distance = levenshtein(wanted_key, material_match_key(n));
      for (const auto& w : core_words(material_name_words(n)))
        c.shared +=
            static_cast<std::size_t>(std::count(wanted_words.begin(), wanted_words.end(), w));
      candidates.push_back(std::move(c));
    }
  }
  std::stable_sort(candidates.begin(), candidates.end(),
                   [](const Candidate& a, const Candidate& b) {
                     if (a.shared != b.shared) return a.shared > b.shared;
                     return a.distance < b.distance;
                   });
  std::vector<std::string> out;
  for (const auto& c : candidates) {
    if (out.size() >= count) break;
    out.push_back(c.name);
  }
  return out;
}

const Material& find_material(const MaterialTable& table, std::string_view name,
                              const SourcePlace& where) {
  if (const auto* found = match_material(table, name)) return *found;
  std::string nearest;
  for (const auto& n : nearest_material_names(table, name, 5)) {
    const auto* m = match_material(table, n);
    nearest += fmt::format("\n  {}", n);
    if (m && m->key != n) nearest += fmt::format(" ({})", m->key);
  }
  const auto what = name.empty() ? std::string("no material given")
                                 : fmt::format("unknown material \"{}\"", name);
  throw InputError(what + "; the nearest names it knows:" + nearest +
                       "\n`dovetailor materials` lists every name (case, spaces, hyphens, word "
                       "order\nand tempers like -T6 do not matter)",
                   where, "part.material");
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
