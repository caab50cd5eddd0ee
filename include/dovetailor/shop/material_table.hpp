#pragma once

#include <string>
#include <string_view>
#include <vector>

#include <dovetailor/base/error.hpp>
#include <dovetailor/job/job.hpp>

namespace dovetailor {

// Starting cutting data and cutting-force constants for the work materials
// dovetailor knows. The built-in table comes from data/materials.toml,
// embedded at build time (no file is read at run time); that file documents
// its layout and the source of every figure.
//
// Internal units, whatever the file's `units`: surface speeds in m/min,
// diameters and chip loads in mm, specific cutting force in N/mm^2.

// A range of surface speeds, m/min.
struct SpeedRange {
  double low = 0;
  double high = 0;

  bool operator==(const SpeedRange&) const = default;
};

// The feed per tooth an end mill of `diameter` takes in this material (mm).
struct ChipLoadPoint {
  double diameter = 0;
  double per_tooth = 0;

  bool operator==(const ChipLoadPoint&) const = default;
};

struct Material {
  std::string key;   // short identifier, e.g. "low-carbon-steel"
  std::string name;  // for sheets and messages, e.g. "Low-carbon steel (1018, mild steel)"
  std::vector<std::string> aliases;
  // The ISO 513 application group the cutting data is given for: "P" steel,
  // "M" stainless steel, "K" cast iron, "N" non-ferrous metals and
  // non-metals (the groups of the turning catalogue tables).
  std::string group;
  SpeedRange hss_speed;      // m/min
  SpeedRange carbide_speed;  // m/min
  // End-mill chip load by tool diameter, diameters strictly ascending. The
  // same for HSS and carbide (the tool material sets the speed).
  std::vector<ChipLoadPoint> chip_load;
  // Kienzle constants: specific cutting force kc = kc11 * h^(-mc), h in mm.
  double kc11 = 0;  // N/mm^2 at h = 1 mm
  double mc = 0;
  std::string source;  // where the figures come from

  bool operator==(const Material&) const = default;
};

struct MaterialTable {
  std::string file;  // where the table was read from, for messages
  std::vector<Material> materials;

  bool operator==(const MaterialTable&) const = default;
};

// Reads a material table (TOML; layout in data/materials.toml). `file` names
// it in messages. Throws InputError with file, line and key for a missing or
// mistyped key, an unknown key, a low speed above its high one, chip-load
// columns that do not match `chip_load_diameters`, diameters not ascending,
// and a name or alias that two materials share.
MaterialTable read_material_table(std::string_view text, const std::string& file);

// The table built into the program from data/materials.toml, read once.
const MaterialTable& builtin_materials();

// The text of data/materials.toml as built in, e.g. for a user to copy.
std::string_view builtin_materials_text();

// A name as compared when matching: lower case, without spaces, hyphens and
// underscores ("Mild-Steel" and "mild steel" both give "mildsteel").
std::string material_match_key(std::string_view name);

// A name as people write it, in words: lower case, split at every character
// that is neither a letter nor a digit, "aluminum" read as "aluminium" and
// "gray" as "grey", aluminium tempers dropped ("T6", "T651"; "6061T6" gives
// "6061"), sorted, so the order of the words does not matter.
std::vector<std::string> material_name_words(std::string_view name);

// The material `name` means, or nullptr. In turn:
//  1. its key or an alias gives the same material_match_key ("Mild-Steel"),
//  2. or the same words in any order ("steel, mild"; "6061-T6" = "6061"),
//  3. or the same words once the words that only say what kind of material
//     it is are left out on both sides ("steel 1018" and "1018 steel" =
//     "1018"; "6061-T6 aluminum" = "6061"; "O1 tool steel" = "O1"). A kind
//     word ("steel", "aluminium", "stainless", "tool", "bronze", ...) counts
//     only where the material's own names use it, so "4140 stainless" means
//     nothing; standards' prefixes ("AISI", "SAE", "EN", "UNS") always drop.
// A name that steps 2 or 3 would give to two materials matches neither.
const Material* match_material(const MaterialTable& table, std::string_view name);

// Up to `count` names of the table (keys and aliases, as written there)
// nearest to `name`: most words in common first, then the fewest letters to
// change (Levenshtein distance between the match keys).
std::vector<std::string> nearest_material_names(const MaterialTable& table, std::string_view name,
                                                std::size_t count);

// As match_material, but an unknown or empty name is an InputError for the
// job key part.material at `where`, listing the nearest names.
const Material& find_material(const MaterialTable& table, std::string_view name,
                              const SourcePlace& where = {});

// Feed per tooth (mm) for an end mill of `tool_diameter` (mm): linear
// interpolation in the material's chip-load column; below the smallest
// diameter in proportion to the diameter (a smaller cutter, a smaller chip),
// above the largest the largest diameter's value (never extrapolated upward).
double chip_load_for(const Material& material, double tool_diameter);

// The speed range for cutters of `tool_material`.
const SpeedRange& speed_range(const Material& material, ToolMaterial tool_material);

}  // namespace dovetailor
