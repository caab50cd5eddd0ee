#include <string_view>

#include <fmt/format.h>

#include <dovetailor/input/job_template.hpp>
#include <dovetailor/job/job_words.hpp>

namespace dovetailor {

namespace {

// The sizes of the example part and its tools, as the file writes them.
// Both parts of the pair share the 60 degree angle, the cutters and the
// pins; the male's root is narrower than the female's mouth by a sliding
// clearance, so the two templates cut a pair that fits.
struct TemplateSizes {
  std::string_view stock, depth, width, tolerance, chamfer;
  std::string_view end_mill_diameter, end_mill_flute_length;
  std::string_view cutter_diameter, cutter_flute_length, cutter_neck, cutter_corner, cutter_shank,
      cutter_stickout;
  std::string_view pin, feed_unit, max_feed, finish_allowance, gib_thickness;
};

TemplateSizes sizes(DovetailType type, Units units) {
  const bool female = type == DovetailType::Female;
  if (units == Units::Inch)
    return {.stock = "[3.000, 5.000, 1.000]",
            .depth = "0.3125",
            .width = female ? "1.2500" : "1.2485",
            .tolerance = female ? "[0.0, 0.001]" : "[-0.001, 0.0]",
            .chamfer = "0.010",
            .end_mill_diameter = "0.500",
            .end_mill_flute_length = "0.750",
            .cutter_diameter = "0.750",
            .cutter_flute_length = "0.3125",
            .cutter_neck = "0.375",
            .cutter_corner = "0.005",
            .cutter_shank = "0.500",
            .cutter_stickout = "1.250",
            .pin = "0.1875",
            .feed_unit = "in/min",
            .max_feed = "100",
            .finish_allowance = "0.008",
            .gib_thickness = "0.094"};
  return {.stock = "[80, 125, 25]",
          .depth = "8",
          .width = female ? "32.00" : "31.96",
          .tolerance = female ? "[0.0, 0.02]" : "[-0.02, 0.0]",
          .chamfer = "0.3",
          .end_mill_diameter = "12",
          .end_mill_flute_length = "20",
          .cutter_diameter = "20",
          .cutter_flute_length = "8",
          .cutter_neck = "10",
          .cutter_corner = "0.1",
          .cutter_shank = "12",
          .cutter_stickout = "30",
          .pin = "5",
          .feed_unit = "mm/min",
          .max_feed = "2500",
          .finish_allowance = "0.2",
          .gib_thickness = "2.4"};
}

// Lines of the file: a key with its comment aligned at one column, the
// comment's further lines below it at that column.
class TemplateText {
 public:
  void comment(std::string_view text) { text_ += fmt::format("# {}\n", text); }
  void blank() { text_ += '\n'; }
  // A table header, after a blank line unless `introduced` (by a comment).
  void table(std::string_view header, bool introduced = false) {
    if (!introduced) text_ += '\n';
    text_ += header;
    text_ += '\n';
  }
  // `key = value  # note`; `commented_out` writes it as `# key = value`, an
  // optional key shown with its default or an example.
  void key(std::string_view name, std::string_view value, std::string_view note,
           std::string_view more = {}, bool commented_out = false) {
    const std::string setting = fmt::format("{}{} = {}", commented_out ? "# " : "", name, value);
    const std::string line = setting.size() < column
                                 ? fmt::format("{:<{}}# {}", setting, column, note)
                                 : fmt::format("{}  # {}", setting, note);
    if (line.size() > width) {  // the comment goes above a long setting
      comment(note);
      if (!more.empty()) comment(more);
      text_ += setting;
      text_ += '\n';
      return;
    }
    text_ += line + '\n';
    if (!more.empty()) text_ += fmt::format("{:<{}}# {}\n", "", column, more);
  }
  void optional(std::string_view name, std::string_view value, std::string_view note,
                std::string_view more = {}) {
    key(name, value, note, more, true);
  }
  std::string take() { return std::move(text_); }

 private:
  static constexpr std::size_t column = 31;
  static constexpr std::size_t width = 80;
  std::string text_;
};

// A key's value as the file writes it: "\"male\"", from the enum's word table.
template <class E>
std::string quoted(E value) {
  return fmt::format("\"{}\"", key_of(value));
}

void intro(TemplateText& t, bool female, Units units) {
  t.comment("dovetailor job file: one dovetail, its stock, tools, pins and machine.");
  t.comment(fmt::format("Written by `dovetailor new` as a start: the example is the {} of a",
                        female ? "female way" : "male carriage"));
  t.comment("fixture slide. Change every value to your job and your cutters, then");
  t.comment("check it with `dovetailor plan FILE`. A commented-out key shows its");
  t.comment(fmt::format("default or an example. Every length is in {}, angles in degrees.",
                        units == Units::Inch ? "inches" : "millimetres"));
  t.blank();
  t.key("units", quoted(units), key_list<Units>("or") + ", for every length here");
}

void part_and_stock(TemplateText& t, bool female, const TemplateSizes& s) {
  t.table("[part]");
  t.key("name", female ? "\"Fixture slide base\"" : "\"Fixture slide carriage\"",
        "shown on every plan, program and sheet");
  t.key("material", "\"6061\"", "work material, as named in the material table",
        "(e.g. \"1018\", \"cast iron\", \"brass\")");

  t.table("[stock]");
  t.key("size", s.stock, "x width, y length, z height as supplied");
  t.comment("Work zero: the top face, on the dovetail centre line, at the front end.");
}

void dovetail(TemplateText& t, DovetailType type, const TemplateSizes& s) {
  const bool female = type == DovetailType::Female;
  t.table("[dovetail]");
  t.key("type", quoted(type),
        fmt::format("{} (a tongue) or {} (a slot)", quoted(DovetailType::Male),
                    quoted(DovetailType::Female)));
  t.key("angle", "60", "flank to base plane, inside the void, 30 to 75");
  t.key("depth", s.depth, "base plane to top plane");
  t.key("width", s.width, "the functional width at width_at, before a gib");
  t.key("width_at", quoted(female ? WidthAt::Top : WidthAt::Bottom),
        quoted(WidthAt::Bottom) + " (the base plane the pins rest on)",
        "or " + quoted(WidthAt::Top) + " (the stock's top face)");
  t.key("tolerance", s.tolerance, "lower and upper limits on that width");
  t.key("chamfer", s.chamfer, "top edge break; the pins must touch below it");
  t.optional("sides", quoted(AngledSides::Both), "angled flanks: " + key_list<AngledSides>("or"));
  t.optional("center", "0", "offset of the centre line from mid-stock");
  t.optional("length", "...", "along Y from the front end (default: the stock)");
  t.optional("ends", quoted(Ends::Open), key_list<Ends>("or"));
  t.optional("gib",
             fmt::format("{{ side = {}, thickness = {}, taper = 0 }}", quoted(Side::Right),
                         s.gib_thickness),
             "a gib on that flank", "(taper 0, or N for 1:N)");
}

void tools(TemplateText& t, const TemplateSizes& s) {
  t.blank();
  t.comment("The end mill that roughs the slot or the shoulders.");
  t.table("[[tool]]", true);
  t.key("number", "1", "T number, 1 to 9999");
  t.key("kind", quoted(ToolKind::EndMill),
        fmt::format("{} or {}", quoted(ToolKind::EndMill), quoted(ToolKind::Dovetail)));
  t.key("diameter", s.end_mill_diameter, "cutting diameter");
  t.key("flutes", "4", "number of flutes");
  t.key("flute_length", s.end_mill_flute_length, "cutting height");
  t.key("material", quoted(ToolMaterial::Carbide), key_list<ToolMaterial>("or"));

  t.blank();
  t.comment("The dovetail cutter; its angle must match the dovetail's.");
  t.table("[[tool]]", true);
  t.key("number", "2", "T number");
  t.key("kind", quoted(ToolKind::Dovetail), "a dovetail cutter");
  t.key("diameter", s.cutter_diameter, "the large diameter, at the tip");
  t.key("flutes", "6", "number of flutes");
  t.key("flute_length", s.cutter_flute_length, "cutting height");
  t.key("material", quoted(ToolMaterial::Hss), key_list<ToolMaterial>("or"));
  t.key("angle", "60", "the cutter's angle, 30 to 75");
  t.key("neck_diameter", s.cutter_neck, "no larger than the small diameter");
  t.key("corner_radius", s.cutter_corner, "of the tip's edge (0: a sharp corner)");
  t.key("shank_diameter", s.cutter_shank, "for the collision check");
  t.key("stickout", s.cutter_stickout, "gauge length, holder face to tip");
  t.optional("rpm", "...", "overrides the computed speed, rev/min");
  t.optional("feed", "...", fmt::format("overrides the computed feed, {}", s.feed_unit),
             "(or chip_load, per tooth)");
}

void gauge_machine_strategy(TemplateText& t, const TemplateSizes& s, Units units) {
  t.table("[gauge]");
  t.key("pin_diameter", s.pin, "both measuring pins of one size");
  t.optional("pin_class", "\"ZZ\"", "the pins' class (ASME B89.1.5), for the record");

  t.table("[machine]");
  t.key("kind", quoted(MachineKind::Cnc), key_list<MachineKind>("or") + " (a manual mill needs its",
        "dials too: see the README's job-file table)");
  t.key("max_rpm", "6000", "spindle limit, rev/min");
  t.key("max_feed", s.max_feed, fmt::format("feed limit, {}", s.feed_unit));

  t.table("[strategy]");
  std::string checkpoints;
  for (const auto& w : word_table(CheckpointAt{}))
    checkpoints += fmt::format("{}\"{}\"", checkpoints.empty() ? "" : ", ", w.key);
  t.key("checkpoints", "[" + checkpoints + "]", "pin stops");
  t.key("spring_pass", "true", "repeat the finishing pass at the same setting");
  t.key("optional_stops", "false", "true: M1 at checkpoints, where the post has it");
  t.optional("direction", quoted(MillingMode::Climb),
             fmt::format("{} or {} (manual mills", quoted(MillingMode::Climb),
                         quoted(MillingMode::Conventional)),
             "always mill conventionally)");
  t.optional("finish_allowance", s.finish_allowance,
             fmt::format("stock per flank left to finish, {}", unit_symbol(units)));
}

}  // namespace

std::string job_template(DovetailType type, Units units) {
  const bool female = type == DovetailType::Female;
  const TemplateSizes s = sizes(type, units);
  TemplateText t;
  intro(t, female, units);
  part_and_stock(t, female, s);
  dovetail(t, type, s);
  tools(t, s);
  gauge_machine_strategy(t, s, units);
  return t.take();
}

}  // namespace dovetailor
