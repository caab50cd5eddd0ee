#include "scene_painter.hpp"

#include <algorithm>
#include <cmath>
#include <string>

#include <cairo-pdf.h>

#include <dovetailor/render/cairo_render.hpp>

#include "cairo_handles.hpp"

namespace dovetailor {
namespace detail {
namespace {

void set_colour(cairo_t* cr, const Rgb& c) { cairo_set_source_rgb(cr, c.r, c.g, c.b); }

void trace(cairo_t* cr, const ScenePath& p) {
  cairo_new_path(cr);
  for (const auto& ring : p.rings) {
    for (std::size_t i = 0; i < ring.size(); ++i) {
      if (i == 0)
        cairo_move_to(cr, ring[i].x, ring[i].z);
      else
        cairo_line_to(cr, ring[i].x, ring[i].z);
    }
    if (p.closed) cairo_close_path(cr);
  }
}

// Parallel lines across the clip at `angle` degrees, `gap` mm apart.
void hatch_lines(cairo_t* cr, double angle, double gap) {
  double x0, y0, x1, y1;
  cairo_clip_extents(cr, &x0, &y0, &x1, &y1);
  const double cx = (x0 + x1) / 2, cy = (y0 + y1) / 2;
  const double reach = std::hypot(x1 - x0, y1 - y0) / 2 + gap;
  const double a = angle * 3.14159265358979323846 / 180;
  const double ux = std::cos(a), uy = std::sin(a);  // along the lines
  for (double t = -reach; t <= reach; t += gap) {
    const double px = cx - uy * t, py = cy + ux * t;
    cairo_move_to(cr, px - ux * reach, py - uy * reach);
    cairo_line_to(cr, px + ux * reach, py + uy * reach);
  }
  cairo_stroke(cr);
}

void paint_path(cairo_t* cr, const ScenePath& p) {
  const auto& s = p.style;
  cairo_set_fill_rule(cr, CAIRO_FILL_RULE_EVEN_ODD);
  if (s.fill) {
    trace(cr, p);
    set_colour(cr, s.fill_colour);
    cairo_fill(cr);
  }
  if (s.hatch != Hatch::None) {
    cairo_save(cr);
    trace(cr, p);
    cairo_clip(cr);
    set_colour(cr, s.hatch_colour);
    cairo_set_line_width(cr, 0.18);
    switch (s.hatch) {
      case Hatch::Diagonal:
        hatch_lines(cr, -45, s.hatch_spacing);
        break;
      case Hatch::BackDiagonal:
        hatch_lines(cr, 45, s.hatch_spacing);
        break;
      case Hatch::Cross:
        hatch_lines(cr, 45, s.hatch_spacing);
        hatch_lines(cr, -45, s.hatch_spacing);
        break;
      case Hatch::Horizontal:
        hatch_lines(cr, 0, s.hatch_spacing);
        break;
      case Hatch::None:
        break;
    }
    cairo_restore(cr);
  }
  if (s.stroke) {
    trace(cr, p);
    set_colour(cr, s.stroke_colour);
    cairo_set_line_width(cr, s.stroke_width);
    cairo_set_line_join(cr, CAIRO_LINE_JOIN_ROUND);
    cairo_set_dash(cr, s.dash.empty() ? nullptr : s.dash.data(), static_cast<int>(s.dash.size()),
                   0);
    cairo_stroke(cr);
    cairo_set_dash(cr, nullptr, 0, 0);
  }
}

void paint_text(cairo_t* cr, const SceneText& t) {
  cairo_select_font_face(cr, font_family, CAIRO_FONT_SLANT_NORMAL,
                         t.bold ? CAIRO_FONT_WEIGHT_BOLD : CAIRO_FONT_WEIGHT_NORMAL);
  double size = t.size;
  cairo_set_font_size(cr, size);
  cairo_text_extents_t e;
  cairo_text_extents(cr, t.text.c_str(), &e);
  if (t.max_width > 0 && e.x_advance > t.max_width) {
    size *= t.max_width / e.x_advance;
    cairo_set_font_size(cr, size);
    cairo_text_extents(cr, t.text.c_str(), &e);
  }
  double x = t.at.x;
  if (t.anchor == TextAnchor::Middle) x -= e.x_advance / 2;
  if (t.anchor == TextAnchor::End) x -= e.x_advance;
  cairo_move_to(cr, x, t.at.z);
  if (t.halo) {
    cairo_text_path(cr, t.text.c_str());
    cairo_set_source_rgb(cr, 1, 1, 1);
    cairo_set_line_width(cr, 0.9);
    cairo_stroke_preserve(cr);
    cairo_set_source_rgb(cr, 0.05, 0.05, 0.05);
    cairo_fill(cr);
    cairo_new_path(cr);
    // The outline path carries no text for extraction; the text itself follows.
    cairo_move_to(cr, x, t.at.z);
  }
  cairo_set_source_rgb(cr, 0.05, 0.05, 0.05);
  cairo_show_text(cr, t.text.c_str());
}

}  // namespace

void paint_scene(cairo_t* cr, const Scene& scene) {
  cairo_save(cr);
  cairo_rectangle(cr, 0, 0, scene.width, scene.height);
  cairo_set_source_rgb(cr, 1, 1, 1);
  cairo_fill(cr);
  for (const auto& p : scene.paths) paint_path(cr, p);
  for (const auto& t : scene.texts) paint_text(cr, t);
  cairo_restore(cr);
}

cairo_status_t append_bytes(void* closure, const unsigned char* data, unsigned int length) {
  static_cast<std::string*>(closure)->append(reinterpret_cast<const char*>(data), length);
  return CAIRO_STATUS_SUCCESS;
}

}  // namespace detail

std::string drawing_png(const Scene& scene, int width_px, int height_px) {
  const std::string what = "PNG drawing";
  auto surface = detail::own_surface(
      cairo_image_surface_create(CAIRO_FORMAT_RGB24, width_px, height_px), what);
  auto cr = detail::make_context(surface.get(), what);
  cairo_set_source_rgb(cr.get(), 1, 1, 1);
  cairo_paint(cr.get());
  const double s = std::min(width_px / scene.width, height_px / scene.height);
  cairo_scale(cr.get(), s, s);
  detail::paint_scene(cr.get(), scene);
  detail::check_cairo(cairo_status(cr.get()), what);
  cr.reset();
  std::string bytes;
  detail::check_cairo(
      cairo_surface_write_to_png_stream(surface.get(), detail::append_bytes, &bytes), what);
  return bytes;
}

std::string drawing_pdf(const Scene& scene) {
  constexpr double pt_per_mm = 72 / 25.4;
  const std::string what = "PDF drawing";
  std::string bytes;
  auto surface = detail::own_surface(
      cairo_pdf_surface_create_for_stream(detail::append_bytes, &bytes, scene.width * pt_per_mm,
                                          scene.height * pt_per_mm),
      what);
  auto cr = detail::make_context(surface.get(), what);
  cairo_scale(cr.get(), pt_per_mm, pt_per_mm);
  detail::paint_scene(cr.get(), scene);
  cairo_show_page(cr.get());
  detail::finish_surface(cr, surface, what);
  return bytes;
}

}  // namespace dovetailor
