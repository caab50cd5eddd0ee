#pragma once

#include <string>

#include <dovetailor/drawing/drawing_scene.hpp>
#include <dovetailor/report/sheet.hpp>

namespace dovetailor {

// Renderers that paint through the cairo graphics library (Debian
// libcairo2-dev). They live in their own library, dovetailor_render, so the
// core stays free of it; each returns the bytes of a file and writes nothing.

enum class Paper { Letter, A4 };

// The drawing as a PNG image of exactly width_px x height_px pixels, white
// background. Lay the scene out at the same aspect for an undistorted image.
std::string drawing_png(const Scene& scene, int width_px, int height_px);

// The drawing as a one-page PDF of the scene's size (1 mm of scene = 1 mm).
std::string drawing_pdf(const Scene& scene);

// The pass sheet as a printable PDF on Letter or A4: the title block, the
// cautions, the set-up steps, the section drawing (given as a drawing model;
// laid out to the page), and the operation tables with the checkpoint boxes.
// Text is measured with the font it is set in and wrapped inside its cell;
// a table's heading row repeats after a page break; a checkpoint box is kept
// on one page.
std::string sheet_pdf(const Sheet& sheet, const Drawing* drawing, Paper paper);

}  // namespace dovetailor
