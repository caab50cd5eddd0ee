#pragma once

// cairo objects held by RAII, so an exception between creating and
// destroying them cannot leak them, and cairo's sticky error status turned
// into an exception a machinist can read. Internal to dovetailor_render.

#include <memory>
#include <string>

#include <cairo.h>

namespace dovetailor::detail {

struct CairoRelease {
  void operator()(cairo_t* cr) const { cairo_destroy(cr); }
  void operator()(cairo_surface_t* surface) const { cairo_surface_destroy(surface); }
};
using CairoContext = std::unique_ptr<cairo_t, CairoRelease>;
using CairoSurface = std::unique_ptr<cairo_surface_t, CairoRelease>;

// Take ownership of a new surface or context; throw InputError "cannot make
// the <what>: <cairo's reason>" when cairo could not make it (cairo returns
// an object in an error state rather than null).
CairoSurface own_surface(cairo_surface_t* surface, const std::string& what);
CairoContext make_context(cairo_surface_t* surface, const std::string& what);

// Throws the same InputError when `status` is not success.
void check_cairo(cairo_status_t status, const std::string& what);

// Ends drawing: checks the context, destroys it, finishes the surface (a PDF
// surface writes its last bytes to its stream here) and checks the surface.
void finish_surface(CairoContext& cr, CairoSurface& surface, const std::string& what);

}  // namespace dovetailor::detail
