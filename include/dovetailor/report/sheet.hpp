#pragma once

#include <optional>
#include <string>
#include <vector>

#include <dovetailor/plan/plan.hpp>

namespace dovetailor {

// The printed pass sheet for the machine, as a model: title block, blocks of
// sentences, and tables of cells, all text already formatted in the job's
// units. It is built once from a plan (build_sheet); the renderers (plain
// text: sheet_text.hpp; PDF: the render library) only lay it out, so every
// number on paper comes from the plan through this one place.

enum class CellAlign { Left, Right };

// What a column holds; a renderer may draw a Tick column as an empty box.
enum class ColumnKind { Text, Tick };

struct SheetColumn {
  std::string heading;
  CellAlign align = CellAlign::Left;
  ColumnKind kind = ColumnKind::Text;

  bool operator==(const SheetColumn&) const = default;
};

// A plain table: a heading row and rows of cells, one cell per column.
struct SheetTable {
  std::vector<SheetColumn> columns;
  std::vector<std::vector<std::string>> rows;

  bool operator==(const SheetTable&) const = default;
};

// A labelled line in the title block: "Part", "Height stop slideway".
struct SheetFact {
  std::string label;
  std::string value;

  bool operator==(const SheetFact&) const = default;
};

// Sentences under a heading (cautions, set-up steps). Each item is one
// paragraph; the renderer wraps it. Numbered blocks are steps to follow.
struct SheetBlock {
  std::string heading;
  std::vector<std::string> items;
  bool numbered = false;
  bool caution = false;  // printed so it stands out

  bool operator==(const SheetBlock&) const = default;
};

// A stop to measure, printed inside the pass table after its pass so it
// stands out: what to do, the reading to expect, a blank for the measured
// reading, and what to do for readings around the expected one.
struct CheckpointBox {
  std::string title;               // "STOP - checkpoint A: after roughing"
  std::vector<std::string> lines;  // instructions, pins, the reading to expect
  std::string measured_label;      // "Measured reading (in)"
  SheetTable corrections;          // reading -> stock left -> what to do

  bool operator==(const CheckpointBox&) const = default;
};

// One row of an operation table: a pass (cells) or a checkpoint after it.
struct OperationRow {
  std::vector<std::string> cells;  // empty for a checkpoint row
  std::optional<CheckpointBox> checkpoint;

  bool operator==(const OperationRow&) const = default;
};

struct OperationTable {
  std::string title;               // "Operation 1: Rough the slot with T1"
  std::vector<std::string> intro;  // tool, speed, feed, entry, touch-off
  std::vector<SheetColumn> columns;
  std::vector<OperationRow> rows;

  bool operator==(const OperationTable&) const = default;
};

struct Sheet {
  std::string title;
  std::vector<SheetFact> facts;  // the title block
  SheetBlock cautions;
  SheetBlock setup;
  std::vector<OperationTable> operations;
  SheetBlock legend;  // what the columns and marks mean
  SheetBlock notes;   // the plan's notes and warnings
  bool has_dials = false;

  bool operator==(const Sheet&) const = default;
};

struct SheetOptions {
  std::string date;  // printed in the title block as given (the CLI supplies today's)
};

// The sheet for a plan. With a manual machine that has dials in the job
// (Machine::manual) every X and Z setting also appears as a dial setting:
// whole turns from the dial zero and the collar reading (handwheel.hpp),
// reached in the dial's approach direction; without dials (a CNC plan, or a
// manual job that gives none) the sheet shows positions only.
Sheet build_sheet(const Plan& plan, const SheetOptions& options);

// The spindle axis position (work X, mm) at the X dial zero: beside the datum
// face, off it by the edge finder's radius, or the first tool's radius when
// touching off. The Z dial is zeroed with the tip at z = +shim.
double x_dial_zero(const Plan& plan, const ManualFeeds& feeds);

// A dial reading as printed: whole turns, a plus sign, the collar reading
// ("5+192"; "-1+167" one turn back past zero, then the collar at 167).
std::string dial_text(const DialReading& reading);

}  // namespace dovetailor
