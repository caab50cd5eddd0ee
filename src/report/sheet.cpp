#include <cmath>
#include <cstdlib>

#include <fmt/format.h>

#include <dovetailor/base/caution.hpp>
#include <dovetailor/base/length.hpp>
#include <dovetailor/job/job_words.hpp>
#include <dovetailor/report/plan_note_text.hpp>
#include <dovetailor/report/sheet.hpp>

#include "unit_text.hpp"

namespace dovetailor {
namespace {

using Show = detail::UnitText;
using detail::method_words;
using detail::role_name;
using detail::side_name;

std::string direction_word(AxisDirection d, char axis) {
  return fmt::format("{}{}", d == AxisDirection::Plus ? '+' : '-', axis);
}

std::string tool_words(const Tool& t, const Show& s) {
  const std::string_view material = text_of(t.material);
  if (t.kind == ToolKind::EndMill)
    return fmt::format("T{} end mill {} dia, {} flutes, {}", t.number, shown(t.diameter, s.u),
                       t.flutes, material);
  return fmt::format("T{} dovetail cutter {} dia x {:g} deg, {} flutes, neck {}, {}", t.number,
                     shown(t.diameter, s.u), t.angle, t.flutes, shown(t.neck_diameter, s.u),
                     material);
}

// The cut's direction along the slide.
std::string feed_direction(const Pass& p) { return p.cut_travel() < -1e-9 ? "-Y" : "+Y"; }

// How the dial reaches one setting from the last: the reading, marked '*'
// when the wheel must first be turned back past it.
struct DialStep {
  std::string text;
  bool back_off = false;
};

DialStep dial_step(const Handwheel& wheel, double from, double to) {
  const DialMove move = dial_move(wheel, from, to);
  return {dial_text(dial_setting(wheel, to).reading) + (move.back_off ? "*" : ""),
          move.back_off.has_value()};
}

std::string dial_words(const Handwheel& w, std::string_view name, char axis, const Show& s) {
  const long margin =
      static_cast<long>(std::ceil(w.backlash / w.division() - 1e-9)) + (w.divisions + 3) / 4;
  return fmt::format(
      "{} dial: {} per turn, {} graduations of {}; the reading grows while the tool moves {} "
      "over the work. Reach every setting moving {} (the reading {}), so the {} of backlash "
      "stays taken up. A setting marked * lies behind the last one: turn back at least {} "
      "graduations past it, then come forward onto it.",
      name, shown(w.travel_per_turn, s.u), w.divisions, shown(w.division(), s.u),
      direction_word(w.reading_grows, axis), direction_word(w.approach, axis),
      reading_rises(w, w.approach) ? "rising" : "falling", shown(w.backlash, s.u), margin);
}

std::string x_datum_words(const Plan& plan, const ManualFeeds& f, const Show& s) {
  const Job& job = plan.job;
  const bool left = f.datum.x_face == Side::Left;
  const double face = left ? stock_left_x(job) : stock_right_x(job);
  const double zero = x_dial_zero(plan, f);
  const std::string face_words = left ? "left side face" : "right side face";
  const std::string motion = left ? "+X" : "-X";
  std::string how;
  if (f.datum.x_method == XDatumMethod::EdgeFinder) {
    how = fmt::format(
        "X zero: with the {} edge finder in the spindle, bring it to the {} moving {} until "
        "it kicks off centre; zero the X dial there. The spindle axis then stands {} (the "
        "edge finder's radius) outside the face",
        shown(f.datum.edge_finder_diameter, s.u), face_words, motion,
        shown(f.datum.edge_finder_diameter / 2, s.u));
  } else {
    const Tool* first = find_tool(job, plan.operations.front().tool);
    how = fmt::format(
        "X zero: with T{} running, bring it to the {} moving {} until it just marks a paper "
        "held on the face, less the paper; zero the X dial there. The spindle axis then stands "
        "{} (the tool's radius) outside the face",
        first->number, face_words, motion, shown(first->diameter / 2, s.u));
  }
  return how + fmt::format(
                   ", at X = {} from the dovetail centre line (the face is at X = {}). "
                   "All X dial settings below count from this zero.",
                   shown(zero, s.u), shown(face, s.u));
}

// What to do for readings around the one expected at a checkpoint.
SheetTable correction_table(const Plan& plan, const Checkpoint& c, const Handwheel* x_dial,
                            const Show& s) {
  const Units u = plan.job.units;
  const double step = u == Units::Inch ? to_mm(0.001, Units::Inch) : 0.02;
  const ReadingBand band = final_reading_band(plan);
  const bool female = plan.target.type == DovetailType::Female;
  const bool final_stop = c.remaining_per_flank <= 0;
  SheetTable t;
  t.columns = {{"Reading", CellAlign::Right},
               {"Left per flank", CellAlign::Right},
               {"Then (the next passes)", CellAlign::Left}};
  if (x_dial) t.columns.push_back({"X dial", CellAlign::Left});
  for (int k = -3; k <= 3; ++k) {
    const double error = k * step;
    const double reading = c.expected.value + error;
    const double left = c.remaining_per_flank + error * c.correction_per_reading;
    const double shift = left - c.remaining_per_flank;  // more to cut on each flank
    std::string then;
    long divisions = 0;
    // A reading inside the width tolerance (reading and width move together).
    const bool in_band = reading >= band.low - 1e-9 && reading <= band.high + 1e-9;
    if (final_stop) {
      if (in_band) {
        then = "on size: done";
      } else if (left > 1e-9) {
        then = fmt::format("trim {} off the flank", shown(left, s.u));
        if (x_dial) divisions = std::lround(left / x_dial->division());
      } else {
        then = "past size: stop, decide with the mating part";
      }
    } else if (left <= 1e-9) {
      then = "at size or past: stop cutting";
    } else if (std::abs(shift) < 1e-9) {
      then = "as planned";
    } else {
      then = fmt::format("move {} {} the flank", shown(std::abs(shift), s.u),
                         shift > 0 ? "into" : "away from");
      if (x_dial) divisions = std::lround(shift / x_dial->division());
    }
    std::vector<std::string> row = {fmt::format("{:n}", shown(reading, s.u)),
                                    left > 1e-9 ? fmt::format("{:n}", shown(left, s.u)) : "-",
                                    then};
    if (x_dial) {
      std::string dial;
      for (Side side : {Side::Left, Side::Right}) {
        if (!plan.target.flank(side).angled || divisions == 0) continue;
        // Into a female flank is outward from the centre line; into a male's, inward.
        const bool plus_x = (side == Side::Right) == female;
        const bool rises =
            reading_rises(*x_dial, plus_x ? AxisDirection::Plus : AxisDirection::Minus);
        dial += fmt::format("{}{} {:+d}", dial.empty() ? "" : ", ", side == Side::Left ? "L" : "R",
                            rises ? divisions : -divisions);
      }
      row.push_back(dial);
    }
    t.rows.push_back(row);
  }
  return t;
}

CheckpointBox checkpoint_box(const Plan& plan, const Checkpoint& c, char letter,
                             const Handwheel* x_dial, const Show& s) {
  const Job& job = plan.job;
  CheckpointBox box;
  box.title = fmt::format("STOP - checkpoint {}: {} (after pass {})", letter, c.name, c.after_pass);
  box.lines.push_back("Stop the spindle, clear the chips, deburr the edges the pins touch.");
  if (job.gauge) {
    box.lines.push_back(fmt::format("Measure {} of {}: expect {} (final {}).",
                                    method_words(c.expected), shown(job.gauge->pin_diameter, s.u),
                                    shown(c.expected.value, s.u),
                                    shown(c.final_reading.value, s.u)));
    if (c.reference_reading)
      box.lines.push_back(
          fmt::format("Or with one pin on the right flank, from the left stock "
                      "face: expect {}.",
                      shown(*c.reference_reading, s.u)));
  }
  box.lines.push_back(fmt::format("Stock left on {}: {} laterally. Depth from the top face: {}.",
                                  plan.target.angled_flanks() == 2 ? "each flank" : "the flank",
                                  shown(c.remaining_per_flank, s.u), shown(c.expected_depth, s.u)));
  if (job.gauge) {
    const std::string taper = detail::taper_words(c, job.dovetail.length, s);
    if (!taper.empty()) box.lines.push_back(taper + " The table below is for the front end.");
  }
  if (job.gauge) {
    box.measured_label = fmt::format("Measured reading ({})", unit_symbol(job.units));
    box.corrections = correction_table(plan, c, x_dial, s);
  }
  return box;
}

std::vector<SheetFact> title_facts(const Plan& plan, const SheetOptions& o, const Show& s) {
  const Job& job = plan.job;
  const auto& t = plan.target;
  std::vector<SheetFact> f;
  f.push_back({"Part", job.part.name.empty() ? job.source : job.part.name});
  f.push_back({"Material", job.part.material.empty() ? "-" : job.part.material});
  f.push_back({"Units", fmt::format("{} (every length on this sheet)", unit_name(job.units))});
  f.push_back({"Date", o.date.empty() ? "-" : o.date});
  f.push_back({"Stock", fmt::format("{:n} x {:n} x {} (X x Y x Z)", shown(job.stock.width, s.u),
                                    shown(job.stock.length, s.u), shown(job.stock.height, s.u))});
  f.push_back({"Dovetail", fmt::format("{} {:g} deg, {}, depth {}", key_of(t.type), t.angle,
                                       t.angled_flanks() == 2 ? "both flanks angled"
                                       : t.left.angled        ? "left flank angled"
                                                              : "right flank angled",
                                       shown(t.depth, s.u))});
  f.push_back({"Widths", fmt::format("{} at the base plane, {} at the top plane",
                                     shown(t.width_bottom(), s.u), shown(t.width_top(), s.u))});
  if (job.gauge) {
    const ReadingBand band = final_reading_band(plan);
    f.push_back({"Final reading",
                 fmt::format("{} {} (good from {:n} to {})", shown(plan.final_reading.value, s.u),
                             method_words(plan.final_reading), shown(band.low, s.u),
                             shown(band.high, s.u))});
    f.push_back(
        {"Pins",
         fmt::format("{} x {} dia{}", plan.final_reading.pins, shown(job.gauge->pin_diameter, s.u),
                     job.gauge->pin_class.empty() ? "" : ", class " + job.gauge->pin_class)});
  }
  return f;
}

// The cautions, each an item, and the sheet's own: those of a manual mill
// and the chips.
SheetBlock cautions_block(bool manual) {
  SheetBlock b{"Cautions", {}, false, true};
  for (const Caution& c : cautions)
    b.items.emplace_back(caution_line(c, manual ? CautionForm::Manual : CautionForm::Long));
  if (manual) {
    b.items.push_back("Lock every axis that is not moving during a pass.");
    b.items.push_back(
        "Conventional milling only on this machine (table backlash): feed each pass in the "
        "direction the sheet gives.");
  }
  b.items.push_back("Chips are sharp and hot; deburr the acute edges.");
  return b;
}

// The manual mill's dials, or none on a CNC job.
const ManualFeeds* dials_of(const Job& job) {
  return job.machine.kind == MachineKind::Manual && job.machine.manual ? &*job.machine.manual
                                                                       : nullptr;
}

// A tool and the speeds and feeds `passes` run at: "T2 dovetail cutter ...:
// 306 rev/min, feed ..." (`after_tool` ": ", `after_rpm` ", ") in the set-up.
std::string cutting_words(const Tool& tool, const std::vector<const Pass*>& passes,
                          std::string_view after_tool, std::string_view after_rpm, const Show& s) {
  const detail::PassFeeds f = detail::pass_feeds(passes);
  return fmt::format("{}{}{}{}{}.", tool_words(tool, s), after_tool,
                     detail::rpm_words(f, "rev/min"), after_rpm,
                     detail::feed_words(
                         f, [&](double v) { return s.feed(v); }, s.feed_unit()));
}

SheetBlock setup_block(const Plan& plan, const ManualFeeds* dials, const Show& s) {
  const Job& job = plan.job;
  SheetBlock setup{"Set-up", {}, true, false};
  auto& steps = setup.items;
  steps.push_back(fmt::format(
      "Square the stock; hold it top face up with the slide running along Y from the front end "
      "(y = 0) for {}. Work zero: the top face, on the dovetail centre line, at the front end.",
      shown(job.dovetail.length, s.u)));
  for (const auto& tool : job.tools) {
    const auto passes = detail::passes_of_tool(plan, tool.number);
    if (!passes.empty()) steps.push_back(cutting_words(tool, passes, ": ", ", ", s));
  }
  if (dials) {
    steps.push_back(x_datum_words(plan, *dials, s));
    steps.push_back(fmt::format(
        "Z zero, for each tool before its first pass: lower the tip onto a {} feeler on the top "
        "face moving -Z until the feeler just drags; zero the Z dial there (the tip is then at "
        "Z = {}). Z dial settings count from this zero.",
        shown(dials->datum.shim, s.u), shown(dials->datum.shim, s.u)));
    steps.push_back(dial_words(dials->x, "X", 'X', s));
    steps.push_back(dial_words(dials->z, "Z", 'Z', s));
  } else {
    steps.push_back("Set X zero on the dovetail centre line and Z zero on the top face.");
  }
  return setup;
}

// Where the operator's hands are between operations: the dial positions
// last set (mm from each dial's zero), the tool in the spindle and the
// next checkpoint's letter.
struct SheetWalk {
  double x_at = 0, z_at = 0;
  int tool_in_spindle = 0;
  char letter = 'A';
};

std::vector<SheetColumn> pass_columns(bool dials) {
  std::vector<SheetColumn> columns = {
      {"Pass", CellAlign::Right}, {"Cut"}, {"Side"}, {"X", CellAlign::Right}};
  if (dials) columns.push_back({"X dial", CellAlign::Right});
  columns.push_back({"Z", CellAlign::Right});
  if (dials) columns.push_back({"Z dial", CellAlign::Right});
  columns.push_back({"Feed", CellAlign::Left});
  columns.push_back({"Left", CellAlign::Right});
  columns.push_back({"Done", CellAlign::Left, ColumnKind::Tick});
  return columns;
}

OperationRow pass_row(const Plan& plan, const Pass& p, const ManualFeeds* dials, SheetWalk& walk,
                      const Show& s) {
  OperationRow row;
  row.cells = {std::to_string(p.number), role_name(p.role), side_name(p.side),
               fmt::format("{:n}", shown(p.x, s.u)) + (p.taper_slope != 0 ? "~" : "")};
  if (dials) {
    const double x = p.x - x_dial_zero(plan, *dials);
    row.cells.push_back(dial_step(dials->x, walk.x_at, x).text);
    walk.x_at = x;
  }
  row.cells.push_back(fmt::format("{:n}", shown(p.z, s.u)));
  if (dials) {
    const double z = p.z - dials->datum.shim;
    row.cells.push_back(dial_step(dials->z, walk.z_at, z).text);
    walk.z_at = z;
  }
  row.cells.push_back(feed_direction(p) + " " + s.feed(p.feed));
  row.cells.push_back(fmt::format("{:n}", shown(p.stock_left, s.u)));
  row.cells.push_back("[ ]");
  return row;
}

OperationTable operation_table(const Plan& plan, const Operation& op, int number,
                               const ManualFeeds* dials, SheetWalk& walk, const Show& s) {
  OperationTable table;
  table.title = fmt::format("Operation {}: {} with T{}", number, operation_title(op), op.tool);
  if (const Tool* tool = find_tool(plan.job, op.tool))
    table.intro.push_back(cutting_words(*tool, detail::passes_of(op), "; ", "; ", s));
  table.intro.push_back(fmt::format("Entry: {}.", entry_words(op, plan.job.dovetail.ends)));
  if (dials && op.tool != walk.tool_in_spindle) {
    table.intro.push_back(fmt::format(
        "Change to T{}; touch it off on the top face and zero the Z dial (set-up step).", op.tool));
    walk.z_at = 0;
    walk.tool_in_spindle = op.tool;
  }
  table.columns = pass_columns(dials != nullptr);
  for (const auto& p : op.passes) {
    table.rows.push_back(pass_row(plan, p, dials, walk, s));
    for (const auto& c : plan.checkpoints)
      if (c.after_pass == p.number)
        table.rows.push_back(
            {{}, checkpoint_box(plan, c, walk.letter++, dials ? &dials->x : nullptr, s)});
  }
  return table;
}

SheetBlock legend_block(const Plan& plan, bool dials, const Show& s) {
  SheetBlock legend{"Reading the tables", {}, false, false};
  legend.items.push_back(fmt::format(
      "X: the tool axis from the dovetail centre line; Z: the tool tip from the top face; "
      "Feed: the direction along the slide and the rate in {}; Left: stock left on that flank "
      "or wall after the pass; Done: tick when the pass is cut.",
      s.feed_unit()));
  if (dials)
    legend.items.push_back(
        "Dial: whole turns from the dial zero + the collar reading (\"5+192\": five turns, "
        "then 192 on the collar; \"-1+167\": turned back past zero, the collar at 167), "
        "rounded to the nearest graduation. * : turn back past the setting first (set-up). "
        "X dial in a checkpoint table: graduations to add to (+) or take off (-) the X dial "
        "settings of the passes still to come on that flank (L left, R right).");
  bool taper = false;
  for (const auto* p : all_passes(plan)) taper = taper || p->taper_slope != 0;
  if (taper) legend.items.push_back("~ : X at the front end; the pass runs at the gib's taper.");
  if (!plan.job.gauge)
    legend.items.push_back("The job gives no gauge pins: measure the widths directly.");
  return legend;
}

}  // namespace

std::string dial_text(const DialReading& reading) {
  return fmt::format("{}+{}", reading.turns, reading.division);
}

double x_dial_zero(const Plan& plan, const ManualFeeds& feeds) {
  const bool left = feeds.datum.x_face == Side::Left;
  const double face = left ? stock_left_x(plan.job) : stock_right_x(plan.job);
  double radius = feeds.datum.edge_finder_diameter / 2;
  if (feeds.datum.x_method == XDatumMethod::TouchOff && !plan.operations.empty())
    if (const Tool* t = find_tool(plan.job, plan.operations.front().tool)) radius = t->diameter / 2;
  return left ? face - radius : face + radius;
}

Sheet build_sheet(const Plan& plan, const SheetOptions& options) {
  const Job& job = plan.job;
  const Show s{job.units};
  const ManualFeeds* dials = dials_of(job);
  Sheet sheet;
  sheet.has_dials = dials != nullptr;
  sheet.title = fmt::format("Pass sheet: {}", job.part.name.empty() ? job.source : job.part.name);
  sheet.facts = title_facts(plan, options, s);
  sheet.cautions = cautions_block(job.machine.kind == MachineKind::Manual);
  sheet.setup = setup_block(plan, dials, s);
  SheetWalk walk;
  int op_number = 0;
  for (const auto& op : plan.operations)
    sheet.operations.push_back(operation_table(plan, op, ++op_number, dials, walk, s));
  sheet.legend = legend_block(plan, dials != nullptr, s);
  sheet.notes = {"Notes", note_texts(plan), false, false};
  for (const auto& w : warning_texts(plan)) sheet.notes.items.push_back("WARNING: " + w);
  return sheet;
}

}  // namespace dovetailor
