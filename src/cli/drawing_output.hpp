#pragma once

// Shared by the subcommands that write drawings (draw, check --draw).

#include <string>

#include <CLI/CLI.hpp>

#include <dovetailor/drawing/drawing.hpp>

namespace dovetailor::cli {

// Refuses an output path that does not end in .svg, .png or .pdf, naming
// the option that gave it.
void require_drawing_format(const std::string& path, const std::string& option);

// A PNG's size in pixels.
struct PngSize {
  int width = 1600;
  int height = 1000;
};

// --width and --height, for a command that writes drawings.
void add_png_size_options(CLI::App& cmd, PngSize& size);

// The drawing laid out on a page and painted in the format the path's
// extension names: SVG or PDF on a 270 x 170 mm page (fits landscape A4 and
// Letter), PNG of `png` pixels.
std::string drawing_file_bytes(const Drawing& drawing, const std::string& path, PngSize png);

}  // namespace dovetailor::cli
