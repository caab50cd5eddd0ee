#include "cairo_handles.hpp"

#include <fmt/format.h>

#include <dovetailor/base/error.hpp>

namespace dovetailor::detail {

void check_cairo(cairo_status_t status, const std::string& what) {
  if (status != CAIRO_STATUS_SUCCESS)
    throw InputError(fmt::format("cannot make the {}: {}", what, cairo_status_to_string(status)));
}

CairoSurface own_surface(cairo_surface_t* surface, const std::string& what) {
  CairoSurface owned(surface);
  check_cairo(cairo_surface_status(surface), what);
  return owned;
}

CairoContext make_context(cairo_surface_t* surface, const std::string& what) {
  CairoContext cr(cairo_create(surface));
  check_cairo(cairo_status(cr.get()), what);
  return cr;
}

void finish_surface(CairoContext& cr, CairoSurface& surface, const std::string& what) {
  const cairo_status_t drawn = cairo_status(cr.get());
  cr.reset();
  check_cairo(drawn, what);
  cairo_surface_finish(surface.get());
  check_cairo(cairo_surface_status(surface.get()), what);
}

}  // namespace dovetailor::detail
