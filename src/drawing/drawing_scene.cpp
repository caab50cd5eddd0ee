#include <algorithm>
#include <cmath>
#include <limits>

#include <fmt/format.h>

#include <dovetailor/drawing/drawing_scene.hpp>
#include <dovetailor/report/sheet_text.hpp>

namespace dovetailor {
namespace {

constexpr Rgb black{0.1, 0.1, 0.1};
constexpr Rgb white{1, 1, 1};

Rgb hex(unsigned v) {
  return {((v >> 16) & 0xff) / 255.0, ((v >> 8) & 0xff) / 255.0, (v & 0xff) / 255.0};
}

// Styles are built from these two, so every field is set on purpose.
PaintStyle filled(Rgb fill, Rgb edge, double width, Hatch hatch = Hatch::None, Rgb ink = black) {
  PaintStyle s;
  s.fill = true;
  s.fill_colour = fill;
  s.hatch = hatch;
  s.hatch_colour = ink;
  s.stroke = width > 0;
  s.stroke_colour = edge;
  s.stroke_width = width;
  return s;
}

PaintStyle stroked(Rgb edge, double width, std::vector<double> dash = {}) {
  PaintStyle s;
  s.stroke = true;
  s.stroke_colour = edge;
  s.stroke_width = width;
  s.dash = std::move(dash);
  return s;
}

// This project's palette: light fills of clearly different lightness, each
// with its own hatch, so the operations stay apart in greyscale.
PaintStyle removed_style(int index) {
  struct Entry {
    unsigned fill, ink;
    Hatch hatch;
  };
  static const Entry entries[] = {{0xf1cf8e, 0x8a6420, Hatch::Diagonal},
                                  {0xa9d6cb, 0x2e6355, Hatch::BackDiagonal},
                                  {0xd4bde0, 0x5d3b6b, Hatch::Cross},
                                  {0xe0e0e0, 0x444444, Hatch::Horizontal}};
  const Entry& e = entries[static_cast<std::size_t>(index) % std::size(entries)];
  return filled(hex(e.fill), hex(e.ink), 0.15, e.hatch, hex(e.ink));
}

PaintStyle region_style(const Region& r) {
  switch (r.fill) {
    case RegionFill::Removed:
      return removed_style(r.index);
    case RegionFill::Part:
      return filled(hex(0x8e8a82), black, 0.4);
    case RegionFill::Simulated:
      return filled(hex(0xb9c6d6), hex(0x24405f), 0.3);
    case RegionFill::Gouge:
      return filled(hex(0xe06a5a), black, 0.25, Hatch::Cross);
    case RegionFill::Leftover:
      return filled(hex(0xf5e663), black, 0.25, Hatch::Horizontal);
  }
  return {};
}

PaintStyle outline_style(OutlineStyle s) {
  switch (s) {
    case OutlineStyle::Stock:
      return stroked(hex(0x333333), 0.3, {2.5, 1.2});
    case OutlineStyle::ToolFirst:
      return stroked(hex(0x1d4e9e), 0.4, {4, 1, 0.8, 1});
    case OutlineStyle::ToolFinal:
      return stroked(hex(0xa02c20), 0.55);
    case OutlineStyle::Target:
      return stroked(black, 0.35, {1.2, 0.8});
  }
  return {};
}

const PaintStyle pin_style = filled(white, black, 0.3);
const PaintStyle thin_line = stroked(black, 0.18);
const PaintStyle arrow_style = filled(black, black, 0);

std::vector<Point2> circle(Point2 c, double r) {
  std::vector<Point2> ring;
  for (int i = 0; i < 72; ++i) {
    const double a = radians(5.0 * i);
    ring.push_back({c.x + r * std::cos(a), c.z + r * std::sin(a)});
  }
  return ring;
}

struct Mapper {
  double scale, x0, z1, ox, oy;
  Point2 operator()(Point2 p) const { return {ox + (p.x - x0) * scale, oy + (z1 - p.z) * scale}; }
  std::vector<Point2> ring(const std::vector<Point2>& r) const {
    std::vector<Point2> out;
    out.reserve(r.size());
    for (const auto& p : r) out.push_back((*this)(p));
    return out;
  }
};

double nice_scale(double fit) {
  for (double s : {20.0, 10.0, 5.0, 4.0, 3.0, 2.5, 2.0, 1.5, 1.0, 0.75, 0.5, 0.4, 0.25, 0.2, 0.1})
    if (s <= fit) return s;
  return fit;
}

std::string scale_words(double s) {
  return s >= 1 ? fmt::format("Scale {:g}:1", s) : fmt::format("Scale 1:{:g}", 1 / s);
}

class Layout {
 public:
  explicit Layout(Scene& scene) : scene_(scene) {}

  void line(Point2 a, Point2 b, const PaintStyle& style = thin_line) {
    scene_.paths.push_back({{{a, b}}, false, style});
  }

  // A filled arrowhead with its tip at `tip`, pointing along (dx, dy).
  void arrow(Point2 tip, double dx, double dy) {
    const double len = std::hypot(dx, dy);
    const double ux = dx / len, uy = dy / len;
    const double l = 2.2, w = 0.7;
    scene_.paths.push_back({{{tip,
                              {tip.x - ux * l - uy * w, tip.z - uy * l + ux * w},
                              {tip.x - ux * l + uy * w, tip.z - uy * l - ux * w}}},
                            true,
                            arrow_style});
  }

  void text(Point2 at, std::string t, double size, TextAnchor anchor, bool halo = false,
            bool bold = false, double max_width = 0) {
    scene_.texts.push_back({at, std::move(t), size, anchor, bold, max_width, halo});
  }

  // A linear dimension between paper points a and b, its line through
  // `through` (paper), horizontal or vertical.
  void linear(const Dimension& d, const Mapper& m) {
    const Point2 a = m(d.a), b = m(d.b);
    const bool horizontal = d.kind == DimensionKind::Horizontal;
    const double off = d.offset * m.scale;
    if (horizontal) {
      const double y = a.z - off;  // offset + is up on paper
      for (const Point2& p : {a, b})
        if (std::abs(off) > 0.01)
          line({p.x, p.z + (off > 0 ? -1.0 : 1.0)}, {p.x, y + (off > 0 ? -1.5 : 1.5)});
      const double x0 = std::min(a.x, b.x), x1 = std::max(a.x, b.x);
      line({x0, y}, {x1, y});
      const bool outside = x1 - x0 < 9;
      arrow({x0, y}, outside ? 1 : -1, 0);
      arrow({x1, y}, outside ? -1 : 1, 0);
      if (outside) {
        line({x0 - 4, y}, {x0, y});
        line({x1, y}, {x1 + 4, y});
      }
      text({(x0 + x1) / 2, y - 1.0}, d.text, 3.0, TextAnchor::Middle, true);
    } else {
      const double x = a.x + off;
      for (const Point2& p : {a, b}) line({p.x + 1.0, p.z}, {x + 1.5, p.z});
      const double y0 = std::min(a.z, b.z), y1 = std::max(a.z, b.z);
      line({x, y0}, {x, y1});
      arrow({x, y0}, 0, -1);
      arrow({x, y1}, 0, 1);
      text({x + 1.5, (y0 + y1) / 2 + 1.0}, d.text, 3.0, TextAnchor::Start, true);
    }
  }

  void angle(const Dimension& d, const Mapper& m) {
    const Point2 c = m(d.a);
    const double r = d.offset * m.scale;
    std::vector<Point2> arc;
    for (int i = 0; i <= 24; ++i) {
      const double a = radians(d.from_deg + (d.to_deg - d.from_deg) * i / 24.0);
      arc.push_back({c.x + r * std::cos(a), c.z - r * std::sin(a)});
    }
    scene_.paths.push_back({{arc}, false, thin_line});
    const double mid = radians((d.from_deg + d.to_deg) / 2);
    const double tr = r + 2.5;
    const double cx = std::cos(mid);
    text({c.x + tr * cx, c.z - tr * std::sin(mid) + 1.0}, d.text, 3.0,
         cx > 0.3    ? TextAnchor::Start
         : cx < -0.3 ? TextAnchor::End
                     : TextAnchor::Middle,
         true);
  }

 private:
  Scene& scene_;
};

struct Box {
  double x0 = std::numeric_limits<double>::max(), z0 = x0;
  double x1 = -x0, z1 = -x0;
  void add(Point2 p) {
    x0 = std::min(x0, p.x), x1 = std::max(x1, p.x);
    z0 = std::min(z0, p.z), z1 = std::max(z1, p.z);
  }
};

// The section's extent, dimension lines included.
Box section_box(const Drawing& drawing) {
  Box box;
  for (const auto& r : drawing.regions)
    for (const auto& ring : r.polygons)
      for (const auto& p : ring) box.add(p);
  for (const auto& o : drawing.outlines)
    for (const auto& p : o.points) box.add(p);
  for (const auto& d : drawing.dimensions) {
    if (d.kind == DimensionKind::Horizontal) box.add({d.a.x, d.a.z + d.offset});
    if (d.kind == DimensionKind::Vertical) box.add({d.a.x + d.offset, d.a.z});
  }
  return box;
}

// Where things go on the page: the legend beside the section (a wide page)
// or below it, and the section at a standard scale centred in the rest.
struct Page {
  static constexpr double margin = 6;
  static constexpr double top = 24;
  bool side_legend = false;
  double legend_width = 0, legend_height = 0;
  Mapper map{};
};

Page page_layout(const Drawing& drawing, double width, double height) {
  const double margin = Page::margin, top = Page::top;
  const Box box = section_box(drawing);
  Page page;
  page.side_legend = width >= 1.25 * height;
  page.legend_width = page.side_legend ? std::max(0.3 * width, 62.0) : width - 2 * margin;
  const auto labelled = std::count_if(drawing.outlines.begin(), drawing.outlines.end(),
                                      [](const Outline& o) { return !o.label.empty(); });
  const std::size_t entries =
      drawing.regions.size() + static_cast<std::size_t>(labelled) + (drawing.pins.empty() ? 0 : 1);
  page.legend_height = page.side_legend ? 0 : 10 + 8.5 * static_cast<double>(entries);
  const double area_w =
      (page.side_legend ? width - page.legend_width - margin : width) - 2 * margin;
  const double area_h = height - top - margin - page.legend_height;
  // Room for dimension texts beyond the extent: 14 mm right, 8 mm elsewhere.
  const double fit =
      std::min((area_w - 8 - 22) / (box.x1 - box.x0), (area_h - 16) / (box.z1 - box.z0));
  const double s = nice_scale(fit);
  const double used_w = (box.x1 - box.x0) * s, used_h = (box.z1 - box.z0) * s;
  page.map = {s, box.x0, box.z1, margin + 8 + (area_w - 30 - used_w) / 2,
              top + 8 + (area_h - 16 - used_h) / 2};
  return page;
}

// The regions, outlines with their tags, pins and dimensions, to scale.
void draw_section(Scene& scene, Layout& lay, const Drawing& drawing, const Mapper& map) {
  for (const auto& r : drawing.regions) {
    ScenePath path{{}, true, region_style(r)};
    for (const auto& ring : r.polygons) path.rings.push_back(map.ring(ring));
    scene.paths.push_back(path);
  }
  for (const auto& o : drawing.outlines) {
    scene.paths.push_back({{map.ring(o.points)}, true, outline_style(o.style)});
    if (!o.tag.empty()) {
      Point2 high = o.points.front();
      for (const auto& p : o.points)
        if (p.z > high.z || (p.z == high.z && p.x > high.x)) high = p;
      const Point2 at = map(high);
      lay.text({at.x + 1.0, at.z + (o.style == OutlineStyle::ToolFinal ? 6.0 : 2.5)}, o.tag, 2.6,
               TextAnchor::Start, true);
    }
  }
  for (const auto& pin : drawing.pins) {
    const Point2 c = map(pin.center);
    const double r = pin.diameter / 2 * map.scale;
    scene.paths.push_back({{circle(c, r)}, true, pin_style});
    lay.line({c.x - r * 0.4, c.z}, {c.x + r * 0.4, c.z});
    lay.line({c.x, c.z - r * 0.4}, {c.x, c.z + r * 0.4});
  }
  for (const auto& d : drawing.dimensions) {
    if (d.kind == DimensionKind::Angle)
      lay.angle(d, map);
    else
      lay.linear(d, map);
  }
}

// The legend: a swatch and the words for each element.
void draw_legend(Scene& scene, Layout& lay, const Drawing& drawing, const Page& page) {
  const double margin = Page::margin;
  double lx = page.side_legend ? scene.width - page.legend_width : margin;
  double ly = page.side_legend ? Page::top + 4 : scene.height - page.legend_height + 2;
  const double text_size = 3.0;
  const double text_room = page.legend_width - margin - 14;
  lay.text({lx, ly}, "Legend", 3.6, TextAnchor::Start, false, true);
  ly += 4;
  const auto entry = [&](const std::string& words, auto&& swatch) {
    const auto max_chars = static_cast<std::size_t>(text_room / (0.52 * text_size));
    const auto lines = wrap_words(words, std::max<std::size_t>(max_chars, 10));
    swatch(Point2{lx, ly});
    double y = ly + 4.0;
    for (const auto& l : lines) {
      lay.text({lx + 14, y}, l, text_size, TextAnchor::Start, false, false, text_room);
      y += 1.25 * text_size;
    }
    ly = std::max(y, ly + 7.5) + 1.0;
  };
  const auto rect = [](Point2 p) {
    return std::vector<Point2>{
        {p.x, p.z + 1}, {p.x + 11, p.z + 1}, {p.x + 11, p.z + 6}, {p.x, p.z + 6}};
  };
  for (const auto& r : drawing.regions)
    entry(r.label, [&](Point2 p) { scene.paths.push_back({{rect(p)}, true, region_style(r)}); });
  for (const auto& o : drawing.outlines) {
    if (o.label.empty()) continue;
    entry(o.label, [&](Point2 p) {
      scene.paths.push_back(
          {{{{p.x, p.z + 3.5}, {p.x + 11, p.z + 3.5}}}, false, outline_style(o.style)});
    });
  }
  if (!drawing.pins.empty())
    entry(drawing.pin_label, [&](Point2 p) {
      scene.paths.push_back({{circle({p.x + 5.5, p.z + 3.5}, 2.5)}, true, pin_style});
    });
}

}  // namespace

Scene layout_drawing(const Drawing& drawing, double width, double height) {
  Scene scene;
  scene.width = width;
  scene.height = height;
  Layout lay(scene);
  const double margin = Page::margin;
  lay.text({margin, 10}, drawing.title, 5.0, TextAnchor::Start, false, true, width - 2 * margin);
  const Page page = page_layout(drawing, width, height);
  scene.scale = page.map.scale;
  lay.text({margin, 16}, drawing.subtitle + "; " + scale_words(page.map.scale) + " on this page",
           3.2, TextAnchor::Start, false, false, width - 2 * margin);
  draw_section(scene, lay, drawing, page.map);
  draw_legend(scene, lay, drawing, page);
  return scene;
}

}  // namespace dovetailor
