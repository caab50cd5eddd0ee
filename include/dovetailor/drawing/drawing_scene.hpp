#pragma once

#include <string>
#include <vector>

#include <dovetailor/drawing/drawing.hpp>

namespace dovetailor {

// A drawing laid out on paper: paths and texts in paper millimetres, origin at
// the top left, y down, with the look of each element decided (this project's
// own palette: a light fill and a distinct hatch per operation so the
// regions stay apart in greyscale print; tools as dashed outlines; pins
// white with a centre cross). Painters (SVG here, cairo in the render
// library) paint it as it is and decide nothing.

struct Rgb {
  double r = 0, g = 0, b = 0;  // 0..1

  bool operator==(const Rgb&) const = default;
};

enum class Hatch { None, Diagonal, BackDiagonal, Cross, Horizontal };

struct PaintStyle {
  bool fill = false;
  Rgb fill_colour;
  Hatch hatch = Hatch::None;
  Rgb hatch_colour;
  double hatch_spacing = 1.6;  // mm between hatch lines
  bool stroke = false;
  Rgb stroke_colour;
  double stroke_width = 0.25;  // mm
  std::vector<double> dash;    // mm on, off, ...; empty for a solid line

  bool operator==(const PaintStyle&) const = default;
};

// One path: rings (closed) or polylines (open), filled by the even-odd rule.
struct ScenePath {
  std::vector<std::vector<Point2>> rings;  // paper mm; Point2::z is paper y (down)
  bool closed = true;
  PaintStyle style;

  bool operator==(const ScenePath&) const = default;
};

enum class TextAnchor { Start, Middle, End };

struct SceneText {
  Point2 at;  // baseline point, paper mm (z is y, down)
  std::string text;
  double size = 3;  // mm, the font's em height
  TextAnchor anchor = TextAnchor::Start;
  bool bold = false;
  // The text must fit in this width (mm); a painter that measures text
  // shrinks it to fit. 0: no limit.
  double max_width = 0;
  bool halo = false;  // drawn over a white backing so it reads over hatching

  bool operator==(const SceneText&) const = default;
};

struct Scene {
  double width = 0;  // mm
  double height = 0;
  std::vector<ScenePath> paths;
  std::vector<SceneText> texts;
  double scale = 1;  // paper mm per section mm (the drawing's scale)

  bool operator==(const Scene&) const = default;
};

// Lays out a drawing on a sheet of `width` x `height` mm: a title, the
// section to a scale of the usual series (1:1, 2:1, 5:1, 1:2, ...; stated
// under the title) with its dimensions, and the legend beside it (below it
// when the sheet is taller than wide). Text widths are estimated from the
// character count; painters that measure keep texts within max_width.
Scene layout_drawing(const Drawing& drawing, double width, double height);

// The scene as an SVG document (SVG 1.1, sizes in mm, UTF-8).
std::string drawing_svg(const Scene& scene);

}  // namespace dovetailor
