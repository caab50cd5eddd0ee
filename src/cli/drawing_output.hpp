#pragma once

// Shared by the subcommands that write drawings (draw, check --draw).

#include <string>

#include <dovetailor/drawing.hpp>

namespace dovetailor::cli {

// Refuses an output path that does not end in .svg, .png or .pdf, naming
// the option that gave it.
void require_drawing_format(const std::string& path, const std::string& option);

// The drawing laid out on a page and painted in the format the path's
// extension names: SVG or PDF on a 270 x 170 mm page (fits landscape A4 and
// Letter), PNG of png_width x png_height pixels.
std::string drawing_file_bytes(const Drawing& drawing, const std::string& path, int png_width,
                               int png_height);

}  // namespace dovetailor::cli
