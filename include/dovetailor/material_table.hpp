#pragma once

#include <string>
#include <string_view>
#include <vector>

#include <dovetailor/error.hpp>
#include <dovetailor/job.hpp>

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

// The material whose key or one of whose aliases matches `name` leniently
// (see material_match_key), or nullptr.
const Material* match_material(const MaterialTable& table, std::string_view name);

// As match_material, but an unknown or empty name is an InputError for the
// job key part.material at `where`, listing the names that would be valid.
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
