#pragma once

// Painting a laid-out scene on a cairo context. Internal to dovetailor_render.

#include <cairo.h>

#include <dovetailor/drawing/drawing_scene.hpp>

namespace dovetailor::detail {

// The font every renderer sets its text in (a sans-serif face with the
// degree sign; fontconfig substitutes when it is missing).
inline constexpr const char* font_family = "DejaVu Sans";

// Paints `scene` with its top left corner at the current origin, 1 scene mm
// = 1 user unit (the caller scales the context).
void paint_scene(cairo_t* cr, const Scene& scene);

// Appends cairo's output to a std::string (closure: the string).
cairo_status_t append_bytes(void* closure, const unsigned char* data, unsigned int length);

}  // namespace dovetailor::detail
