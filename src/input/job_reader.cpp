#include <array>
#include <cmath>
#include <set>

#include <fmt/format.h>

#include <dovetailor/base/length.hpp>
#include <dovetailor/geometry/dovetail_section.hpp>
#include <dovetailor/geometry/fit.hpp>
#include <dovetailor/geometry/pin_gauge.hpp>
#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/job/job_words.hpp>

#include "toml_fields.hpp"

namespace dovetailor {
namespace {

using detail::TableReader;

// Lengths above this, in the file's units, are refused as typing errors
// rather than planned: no dovetail slide is 100 in long or wide.
double largest_length(Units units) { return units == Units::Inch ? 100.0 : 2500.0; }

// Spindle speeds above this are refused as typing errors.
constexpr double largest_rpm = 200000;

class JobReader {
 public:
  JobReader(std::string_view text, const std::string& file)
      : file_(file), root_(detail::parse_toml(text, file)) {}

  Job read() {
    job_.source = file_;
    TableReader top(root_, "", file_);
    auto units = top.choice<Units>("units");
    if (!units) top.fail("units", "missing; write units = \"inch\" or units = \"mm\" at the top");
    job_.units = *units;
    read_part(top);
    read_stock(top);
    read_dovetail(top);
    read_tools(top);
    read_gauge(top);
    read_machine(top);
    read_strategy(top);
    read_fixtures(top);
    read_program(top);
    top.reject_unknown();
    check_combinations();
    return job_;
  }

 private:
  const toml::table& required_table(TableReader& top, std::string_view key) {
    const auto* t = top.table(key);
    if (!t) top.fail(key, fmt::format("missing table [{}]", key));
    return *t;
  }

  double length(TableReader& t, std::string_view key, double min, bool required,
                double fallback_mm = 0) {
    auto value = t.number(key, min, largest_length(job_.units));
    if (!value) {
      if (required) t.fail(key, fmt::format("missing; give a length in {}", unit_name(job_.units)));
      return fallback_mm;
    }
    return to_mm(*value, job_.units);
  }

  double positive_length(TableReader& t, std::string_view key) {
    auto mm = length(t, key, 0, true);
    if (mm <= 0) t.fail(key, "must be greater than zero");
    return mm;
  }

  std::optional<double> optional_positive_length(TableReader& t, std::string_view key) {
    if (!t.has(key)) {
      t.allow(key);
      return std::nullopt;
    }
    return positive_length(t, key);
  }

  // An optional number above zero, at most `max`.
  std::optional<double> positive_number(TableReader& t, std::string_view key, double max,
                                        std::string_view unit) {
    auto value = t.number(key, 0, max);
    if (value && *value <= 0) t.fail(key, fmt::format("must be greater than zero ({})", unit));
    return value;
  }

  // An optional feed rate, in the file's length units per minute, as mm/min.
  std::optional<double> positive_feed(TableReader& t, std::string_view key) {
    const double max = 100 * largest_length(job_.units);
    auto value = positive_number(t, key, max, fmt::format("{}/min", unit_name(job_.units)));
    if (!value) return std::nullopt;
    return to_mm(*value, job_.units);
  }

  void read_part(TableReader& top) {
    const auto* table = top.table("part");
    if (!table) return;
    TableReader t(*table, "part", file_);
    job_.part.name = t.text("name").value_or("");
    job_.part.material = t.text("material").value_or("");
    t.reject_unknown();
  }

  void read_stock(TableReader& top) {
    TableReader t(required_table(top, "stock"), "stock", file_);
    auto size = t.numbers("size", 3, 0, largest_length(job_.units));
    if (!size) t.fail("size", "missing; give size = [x_width, y_length, z_height]");
    for (double v : *size)
      if (v <= 0) t.fail("size", "every stock size must be greater than zero");
    job_.stock = {to_mm((*size)[0], job_.units), to_mm((*size)[1], job_.units),
                  to_mm((*size)[2], job_.units)};
    t.reject_unknown();
    stock_place_ = t.place("size");
  }

  void read_dovetail(TableReader& top) {
    TableReader t(required_table(top, "dovetail"), "dovetail", file_);
    auto& d = job_.dovetail;
    auto type = t.choice<DovetailType>("type");
    if (!type) t.fail("type", "missing; give type = \"male\" or \"female\"");
    d.type = *type;
    d.angle = t.required_number("angle", 30, 75);
    d.depth = positive_length(t, "depth");
    d.sides = t.choice<AngledSides>("sides").value_or(AngledSides::Both);
    if (const auto* mate = t.table("mate")) read_mate(*mate);
    const bool given = t.has("width");
    if (given == d.mate.has_value())
      t.fail("width", d.mate ? "give either width or mate, not both: the mate sets the width"
                             : "missing; give the width (with width_at), or a mate to derive it");
    auto at = t.choice<WidthAt>("width_at");
    if (given) {
      d.width = positive_length(t, "width");
      if (!at) t.fail("width_at", "missing; give width_at = \"bottom\" (base plane) or \"top\"");
      d.width_at = *at;
    } else if (at) {
      t.fail("width_at", "the mate sets the width; leave width_at out");
    } else {
      resolve_mate(t);
    }
    d.center = to_mm(
        t.number("center", -largest_length(job_.units), largest_length(job_.units)).value_or(0),
        job_.units);
    d.length = length(t, "length", 0, false, job_.stock.length);
    if (t.has("length") && d.length <= 0) t.fail("length", "must be greater than zero");
    if (d.length > job_.stock.length + 1e-9)
      t.fail("length", "is longer than the stock (stock.size[1])");
    d.tolerance = default_tolerance(d.type, job_.units);
    if (auto band =
            t.numbers("tolerance", 2, -largest_length(job_.units), largest_length(job_.units))) {
      if ((*band)[0] >= (*band)[1])
        t.fail("tolerance", "the lower limit must be below the upper, as [lower, upper]");
      d.tolerance = {to_mm((*band)[0], job_.units), to_mm((*band)[1], job_.units)};
    }
    d.ends = t.choice<Ends>("ends").value_or(Ends::Open);
    d.chamfer = length(t, "chamfer", 0, false, 0);
    if (d.chamfer >= d.depth) t.fail("chamfer", "must be smaller than the depth");
    if (const auto* gib = t.table("gib")) read_gib(*gib);
    t.reject_unknown();
    dovetail_place_ = t.place("width");
  }

  void read_mate(const toml::table& table) {
    TableReader t(table, "dovetail.mate", file_);
    Mate mate;
    auto type = t.choice<DovetailType>("type");
    if (!type) t.fail("type", "missing; the measured mating part is \"male\" or \"female\"");
    if (*type == job_.dovetail.type)
      t.fail("type", "the mate must be of the other type than this part");
    mate.type = *type;
    mate.reading = positive_length(t, "reading");
    mate.pin_diameter = positive_length(t, "pin_diameter");
    // A female mate's depth is needed (its floor carries the pins); a male
    // mate's is optional.
    if (mate.type == DovetailType::Female || t.has("depth"))
      mate.depth = positive_length(t, "depth");
    mate.clearance = to_mm(t.number("clearance", -1, 1).value_or(0), job_.units);
    t.reject_unknown();
    job_.dovetail.mate = mate;
  }

  // The width of this part from the measured mate (fit.hpp conventions).
  void resolve_mate(TableReader& t) {
    auto& d = job_.dovetail;
    const Mate& m = *d.mate;
    const int n = d.sides == AngledSides::Both ? 2 : 1;
    const double mate_bottom = width_for_reading(m.type, n, m.reading, m.pin_diameter, d.angle);
    // A male deeper than the female lifts it off the shelf and closes the
    // gap by n (H_m - H_f) cot a (fit.hpp); a male mate's depth is optional.
    const bool mate_male = m.type == DovetailType::Male;
    const double loss = mate_male
                            ? (m.depth > 0 ? depth_clearance_loss(d.depth, m.depth, d.angle, n) : 0)
                            : depth_clearance_loss(m.depth, d.depth, d.angle, n);
    MateDerivation how{.mate_width = mate_bottom,
                       .depth_loss = loss > 0 ? loss : 0,
                       .depth_difference = loss > 0 ? std::abs(m.depth - d.depth) : 0};
    if (mate_male) {
      // The female's mouth must be the male's root plus the clearance.
      d.width = mate_bottom + m.clearance + loss;
      d.width_at = WidthAt::Top;
    } else {
      how.mate_mouth =
          width_top_from_bottom(DovetailType::Female, mate_bottom, m.depth, d.angle, n);
      d.width = how.mate_mouth - m.clearance - loss;
      d.width_at = WidthAt::Bottom;
    }
    how.width = d.width;
    d.mate_derivation = how;
    if (d.width <= 0) t.fail("mate", "the measured mate leaves no width for this part");
  }

  void read_gib(const toml::table& table) {
    TableReader t(table, "dovetail.gib", file_);
    Gib gib;
    auto side = t.choice<Side>("side");
    if (!side) t.fail("side", "missing; give side = \"left\" or \"right\"");
    gib.side = *side;
    gib.thickness = positive_length(t, "thickness");
    gib.taper = t.number("taper", 0, 1000).value_or(0);
    if (gib.taper != 0 && gib.taper < 10)
      t.fail("taper",
             "give 0 for a parallel gib or N >= 10 for a taper of 1:N (1:50 to 1:100 "
             "is usual)");
    const auto sides = job_.dovetail.sides;
    if ((sides == AngledSides::Left && gib.side == Side::Right) ||
        (sides == AngledSides::Right && gib.side == Side::Left))
      t.fail("side", "the gib must sit on an angled flank; that side is square");
    t.reject_unknown();
    job_.dovetail.gib = gib;
  }

  void read_tools(TableReader& top) {
    std::set<int> numbers;
    int index = 0;
    for (const auto* table : top.tables("tool")) {
      ++index;
      TableReader t(*table, fmt::format("tool[{}]", index), file_);
      Tool tool;
      auto number = t.integer("number", 1, 9999);
      if (!number) t.fail("number", "missing; give the tool number (the T word), 1 to 9999");
      tool.number = static_cast<int>(*number);
      if (!numbers.insert(tool.number).second)
        t.fail("number", fmt::format("tool number {} is used twice", tool.number));
      auto kind = t.choice<ToolKind>("kind");
      if (!kind)
        t.fail("kind",
               "missing; give kind = \"end-mill\", \"dovetail\", \"drill\" or \"chamfer-mill\"");
      tool.kind = *kind;
      tool.diameter = positive_length(t, "diameter");
      auto flutes = t.integer("flutes", 1, 32);
      if (!flutes) t.fail("flutes", "missing; give the number of flutes, 1 to 32");
      tool.flutes = static_cast<int>(*flutes);
      tool.flute_length = positive_length(t, "flute_length");
      auto material = t.choice<ToolMaterial>("material");
      if (!material) t.fail("material", "missing; give material = \"hss\" or \"carbide\"");
      tool.material = *material;
      const bool dovetail = tool.kind == ToolKind::Dovetail;
      const bool chamfer = tool.kind == ToolKind::ChamferMill;
      const auto only_for = [&](std::string_view key, bool fits, std::string_view kinds) {
        if (!fits && t.has(key)) t.fail(key, fmt::format("applies only to {}", kinds));
      };
      only_for("angle", dovetail || chamfer,
               "dovetail cutters and chamfer mills (kind = \"dovetail\" or \"chamfer-mill\")");
      for (std::string_view key : {"neck_diameter", "corner_radius"})
        only_for(key, dovetail, "dovetail cutters (kind = \"dovetail\")");
      only_for("point_angle", tool.kind == ToolKind::Drill, "drills (kind = \"drill\")");
      only_for("tip_diameter", chamfer, "chamfer mills (kind = \"chamfer-mill\")");
      if (dovetail) {
        tool.angle = t.required_number("angle", 30, 75);
        tool.neck_diameter = positive_length(t, "neck_diameter");
        tool.corner_radius = length(t, "corner_radius", 0, false, 0);
        const double small = tool.diameter - 2 * tool.flute_length * cot_deg(tool.angle);
        if (small <= 0)
          t.fail("flute_length",
                 "the cone would close before the flute length ends; check "
                 "diameter, angle and flute_length");
        if (tool.neck_diameter > small + 1e-9)
          t.fail("neck_diameter",
                 "must be no larger than the small diameter at the top of the "
                 "flutes (diameter - 2 * flute_length * cot(angle))");
        if (tool.corner_radius >= tool.flute_length)
          t.fail("corner_radius", "must be smaller than the flute length");
      }
      if (tool.kind == ToolKind::Drill) {
        tool.point_angle = t.number("point_angle", 60, 160).value_or(118);
        const double point = tool.diameter / 2 / std::tan(radians(tool.point_angle / 2));
        if (point > tool.flute_length + 1e-9)
          t.fail("flute_length", "is shorter than the drill's point");
      }
      if (chamfer) {
        tool.angle = t.required_number("angle", 30, 150);
        tool.tip_diameter = length(t, "tip_diameter", 0, false, 0);
        if (tool.tip_diameter >= tool.diameter)
          t.fail("tip_diameter", "must be smaller than the diameter");
        const double cone =
            (tool.diameter - tool.tip_diameter) / 2 / std::tan(radians(tool.angle / 2));
        if (cone > tool.flute_length + 1e-9)
          t.fail("flute_length",
                 fmt::format("is shorter than the cone ({} from the tip diameter to the "
                             "diameter at this angle)",
                             shown(cone, job_.units)));
      }
      tool.shank_diameter = optional_positive_length(t, "shank_diameter");
      tool.stickout = optional_positive_length(t, "stickout");
      tool.holder_diameter = optional_positive_length(t, "holder_diameter");
      if (tool.stickout && *tool.stickout < tool.flute_length)
        t.fail("stickout", "is shorter than the flute length");
      tool.rpm = positive_number(t, "rpm", largest_rpm, "rev/min");
      tool.feed = positive_feed(t, "feed");
      tool.chip_load = optional_positive_length(t, "chip_load");
      if (tool.feed && tool.chip_load)
        t.fail("chip_load", "give feed or chip_load for a tool, not both");
      t.reject_unknown();
      job_.tools.push_back(tool);
    }
  }

  void read_gauge(TableReader& top) {
    const auto* table = top.table("gauge");
    if (!table) return;
    TableReader t(*table, "gauge", file_);
    Gauge g;
    g.pin_diameter = positive_length(t, "pin_diameter");
    g.pin_class = t.text("pin_class").value_or("");
    t.reject_unknown();
    gauge_place_ = t.place("pin_diameter");
    job_.gauge = g;
  }

  void read_machine(TableReader& top) {
    const auto* table = top.table("machine");
    if (!table) return;
    TableReader t(*table, "machine", file_);
    job_.machine.kind = t.choice<MachineKind>("kind").value_or(MachineKind::Cnc);
    job_.machine.max_rpm = positive_number(t, "max_rpm", largest_rpm, "rev/min");
    job_.machine.max_feed = positive_feed(t, "max_feed");
    const auto* x_dial = t.table("x_dial");
    const auto* z_dial = t.table("z_dial");
    const auto* datum = t.table("datum");
    if (x_dial || z_dial || datum) {
      const std::string_view given = x_dial ? "x_dial" : z_dial ? "z_dial" : "datum";
      if (job_.machine.kind != MachineKind::Manual)
        t.fail(given, "dials and the datum procedure belong to kind = \"manual\"");
      if (!x_dial) t.fail("x_dial", "missing; a manual machine with dials needs [machine.x_dial]");
      if (!z_dial) t.fail("z_dial", "missing; a manual machine with dials needs [machine.z_dial]");
      ManualFeeds feeds;
      feeds.x = read_dial(*x_dial, "machine.x_dial", std::nullopt);
      feeds.z = read_dial(*z_dial, "machine.z_dial", AxisDirection::Minus);
      if (feeds.z.approach != AxisDirection::Minus) {
        TableReader z(*z_dial, "machine.z_dial", file_);
        z.fail("approach",
               "the top face is touched off moving down, so Z settings are reached moving "
               "\"minus\" as well; give approach = \"minus\"");
      }
      // The face met moving in the X approach direction: left moving plus.
      const Side face = feeds.x.approach == AxisDirection::Plus ? Side::Left : Side::Right;
      if (datum) {
        feeds.datum = read_datum(*datum, face);
      } else {
        feeds.datum.x_method = XDatumMethod::TouchOff;
        feeds.datum.x_face = face;
      }
      job_.machine.manual = feeds;
    }
    t.reject_unknown();
  }

  // One handwheel: a preset, or travel per turn and divisions, in the dial's
  // own units (default the job's), so an inch job can be cut on metric dials.
  Handwheel read_dial(const toml::table& table, const std::string& path,
                      std::optional<AxisDirection> default_approach) {
    TableReader t(table, path, file_);
    const Units dial_units = t.choice<Units>("units").value_or(job_.units);
    Handwheel wheel;
    const auto preset = t.choice<CommonDial>("preset");
    if (preset) {
      for (std::string_view key : {"travel_per_turn", "divisions", "units"})
        if (t.has(key)) t.fail(key, "leave this out when a preset gives the dial");
      wheel = common_dial(*preset);
      t.allow("travel_per_turn");
      t.allow("divisions");
    } else {
      const double largest = dial_units == Units::Inch ? 2.0 : 50.0;
      auto travel = t.number("travel_per_turn", 0, largest);
      if (!travel || *travel <= 0)
        t.fail(
            "travel_per_turn",
            fmt::format("{}; give the axis travel for one turn of the wheel in {}, or a "
                        "preset (\"inch-200\", \"inch-100\", \"metric-5\", \"metric-2\")",
                        travel ? "must be greater than zero" : "missing", unit_name(dial_units)));
      auto divisions = t.integer("divisions", 10, 2000);
      if (!divisions)
        t.fail("divisions", "missing; give the graduations round the dial, 10 to 2000");
      wheel.travel_per_turn = to_mm(*travel, dial_units);
      wheel.divisions = static_cast<int>(*divisions);
    }
    const auto direction = [&](std::string_view key) { return t.choice<AxisDirection>(key); };
    wheel.reading_grows = direction("reading_grows").value_or(AxisDirection::Plus);
    wheel.approach = direction("approach").value_or(default_approach.value_or(wheel.reading_grows));
    const double backlash =
        t.number("backlash", 0, dial_units == Units::Inch ? 0.1 : 2.5).value_or(0);
    wheel.backlash = to_mm(backlash, dial_units);
    t.reject_unknown();
    return wheel;
  }

  // The X zero must be found moving the way every X setting is approached,
  // so the dial zero has the backlash taken up on the same side: `face`.
  Datum read_datum(const toml::table& table, Side face) {
    TableReader t(table, "machine.datum", file_);
    Datum d;
    d.x_method = t.choice<XDatumMethod>("x").value_or(XDatumMethod::EdgeFinder);
    d.x_face = t.choice<Side>("face").value_or(face);
    if (d.x_face != face)
      t.fail("face", fmt::format("the X settings are approached moving {}, so X zero must be "
                                 "found moving that way too: on the {} face",
                                 face == Side::Left ? "plus" : "minus",
                                 face == Side::Left ? "left" : "right"));
    if (d.x_method == XDatumMethod::EdgeFinder) {
      if (!t.has("edge_finder_diameter"))
        t.fail("edge_finder_diameter",
               fmt::format("missing; give the edge finder's tip diameter in {} (with x = "
                           "\"edge-finder\", the default)",
                           unit_name(job_.units)));
      d.edge_finder_diameter = positive_length(t, "edge_finder_diameter");
    } else if (t.has("edge_finder_diameter")) {
      t.fail("edge_finder_diameter", "applies only to x = \"edge-finder\"");
    }
    d.shim = length(t, "shim", 0, false, 0);
    if (d.shim > to_mm(0.05, Units::Inch))
      t.fail("shim", "a feeler for touching off is thin: at most 0.05 in (1.27 mm)");
    t.reject_unknown();
    return d;
  }

  void read_strategy(TableReader& top) {
    const auto* table = top.table("strategy");
    if (!table) return;
    TableReader t(*table, "strategy", file_);
    auto& st = job_.strategy;
    const double small = largest_length(job_.units) / 100;  // 1 in or 25 mm
    if (auto v = t.number("finish_allowance", 0, small))
      st.finish_allowance = to_mm(*v, job_.units);
    if (auto v = t.number("rough_allowance", 0, small)) st.rough_allowance = to_mm(*v, job_.units);
    if (auto v = t.number("floor_allowance", 0, small)) st.floor_allowance = to_mm(*v, job_.units);
    st.direction = t.choice<MillingMode>(
        "direction", {{key_of(MillingMode::Conventional), MillingMode::Conventional},
                      {key_of(MillingMode::Climb), MillingMode::Climb}});
    if (t.has("checkpoints")) {
      const auto* array = table->get("checkpoints")->as_array();
      if (!array)
        t.fail("checkpoints", "expected an array such as [\"after-roughing\", \"after-finish\"]");
      std::vector<CheckpointAt> at;
      for (const auto& item : *array) {
        const auto* word = item.as_string();
        const std::string w = word ? word->get() : "";
        if (const auto point = from_key<CheckpointAt>(w))
          at.push_back(*point);
        else
          throw InputError("each checkpoint is " + key_list<CheckpointAt>("or"),
                           detail::place_of(item, file_), "strategy.checkpoints");
      }
      st.checkpoints = at;
    }
    t.allow("checkpoints");
    st.spring_pass = t.flag("spring_pass").value_or(true);
    st.optional_stops = t.flag("optional_stops").value_or(false);
    if (auto n = t.integer("end_mill", 1, 9999)) {
      const Tool* tool = find_tool(job_, static_cast<int>(*n));
      if (!tool || tool->kind != ToolKind::EndMill)
        t.fail("end_mill", "no [[tool]] with this number and kind = \"end-mill\"");
      st.end_mill = static_cast<int>(*n);
    }
    if (auto n = t.integer("dovetail_cutter", 1, 9999)) {
      const Tool* tool = find_tool(job_, static_cast<int>(*n));
      if (!tool || tool->kind != ToolKind::Dovetail)
        t.fail("dovetail_cutter", "no [[tool]] with this number and kind = \"dovetail\"");
      st.dovetail_cutter = static_cast<int>(*n);
    }
    t.reject_unknown();
  }

  void read_fixtures(TableReader& top) {
    int index = 0;
    for (const auto* table : top.tables("fixture")) {
      ++index;
      TableReader t(*table, fmt::format("fixture[{}]", index), file_);
      Fixture f;
      f.name = t.text("name").value_or(fmt::format("fixture {}", index));
      f.kind = t.choice<FixtureKind>("kind").value_or(FixtureKind::Other);
      const double big = largest_length(job_.units);
      const auto span = [&](std::string_view key, double& low, double& high) {
        auto v = t.numbers(key, 2, -big, big);
        if (!v)
          t.fail(key, fmt::format("missing; give {} = [from, to] in work coordinates ({})", key,
                                  unit_name(job_.units)));
        if ((*v)[0] >= (*v)[1]) t.fail(key, "give [from, to] with from below to");
        low = to_mm((*v)[0], job_.units);
        high = to_mm((*v)[1], job_.units);
      };
      span("x", f.x_min, f.x_max);
      span("y", f.y_min, f.y_max);
      span("z", f.z_min, f.z_max);
      t.reject_unknown();
      // The stock spans the stock faces in x, 0..length in y, -height..0 in z.
      const double eps = 1e-9;
      const bool inside = f.x_max > stock_left_x(job_) + eps &&
                          f.x_min < stock_right_x(job_) - eps && f.y_max > eps &&
                          f.y_min < job_.stock.length - eps && f.z_max > -job_.stock.height + eps &&
                          f.z_min < -eps;
      if (inside)
        t.fail("x",
               "the box reaches into the stock; a fixture may touch the stock's faces but not "
               "overlap it (work zero is the top face, on the dovetail centre line, at the front "
               "end)");
      job_.fixtures.push_back(f);
    }
  }

  // [program]: where a program written elsewhere puts its zero and its
  // axes, its work offsets and home positions (job.hpp, ProgramSetup).
  void read_program(TableReader& top) {
    const auto* table = top.table("program");
    if (!table) return;
    TableReader t(*table, "program", file_);
    ProgramSetup& p = job_.program;
    const double big = largest_length(job_.units);
    // Machine coordinates reach further than any stock: up to 10 times the
    // largest length (1000 in / 25 m).
    const auto point = [&](TableReader& r, std::string_view key,
                           double limit) -> std::optional<Point3> {
      auto v = r.numbers(key, 3, -limit, limit);
      if (!v) return std::nullopt;
      return Point3{to_mm((*v)[0], job_.units), to_mm((*v)[1], job_.units),
                    to_mm((*v)[2], job_.units)};
    };
    p.zero = point(t, "zero", big).value_or(Point3{});
    p.slide = t.choice<SlideAxis>("slide").value_or(SlideAxis::PlusY);
    p.g28_home = point(t, "g28", 10 * big);
    p.g30_home = point(t, "g30", 10 * big);
    if (const auto* offsets = t.table("offsets")) {
      TableReader o(*offsets, "program.offsets", file_);
      static constexpr std::array<std::string_view, 9> names{"g54", "g55",   "g56",   "g57",  "g58",
                                                             "g59", "g59_1", "g59_2", "g59_3"};
      for (std::size_t n = 0; n < names.size(); ++n) p.offsets[n] = point(o, names[n], 10 * big);
      o.reject_unknown();
    }
    t.reject_unknown();
  }

  void check_combinations() {
    const auto& d = job_.dovetail;
    const int angled = d.sides == AngledSides::Both ? 2 : 1;
    const double bottom = design_width_bottom(d);
    const double top = width_top_from_bottom(d.type, bottom, d.depth, d.angle, angled);
    const auto show = [&](double mm) { return fmt::format("{}", shown(mm, job_.units)); };
    if (bottom <= 0 || top <= 0)
      throw InputError(
          fmt::format("a {} dovetail {} deep at {} deg with this width has a {} of {}: the "
                      "flanks cross; give a wider dovetail or a shallower depth",
                      key_of(d.type), show(d.depth), d.angle,
                      bottom <= 0 ? "base-plane width" : "mouth width",
                      show(bottom <= 0 ? bottom : top)),
          dovetail_place_, "dovetail.width");
    if (d.depth >= job_.stock.height)
      throw InputError(fmt::format("the dovetail is {} deep but the stock is only {} high",
                                   show(d.depth), show(job_.stock.height)),
                       dovetail_place_, "dovetail.depth");
    const auto section = section_of(d);
    const double widest_left = std::min(section.left.base.x, section.left.top.x);
    const double widest_right = std::max(section.right.base.x, section.right.top.x);
    if (widest_left < stock_left_x(job_) || widest_right > stock_right_x(job_))
      throw InputError(
          fmt::format("the dovetail spans x = {} to {} from its centre line, but the stock "
                      "spans {} to {}; give wider stock or move dovetail.center",
                      show(widest_left), show(widest_right), show(stock_left_x(job_)),
                      show(stock_right_x(job_))),
          stock_place_, "stock.size");
    if (job_.gauge) {
      const Tool* cutter = first_tool(job_, ToolKind::Dovetail);
      const auto problems = pin_problems_for(section, cutter ? cutter->corner_radius : 0);
      if (!problems.empty()) throw InputError(problems.front(), gauge_place_, "gauge.pin_diameter");
    }
  }

  std::vector<std::string> pin_problems_for(const DovetailSection& section, double corner_radius) {
    return pin_problems(section, job_.gauge->pin_diameter, corner_radius, job_.units,
                        stock_faces(job_));
  }

  std::string file_;
  toml::table root_;
  Job job_;
  SourcePlace stock_place_;
  SourcePlace dovetail_place_;
  SourcePlace gauge_place_;
};

}  // namespace

Job read_job(std::string_view text, const std::string& file) {
  return JobReader(text, file).read();
}

}  // namespace dovetailor
