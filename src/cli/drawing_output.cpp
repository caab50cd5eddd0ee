#include "drawing_output.hpp"

#include <dovetailor/base/error.hpp>
#include <dovetailor/drawing/drawing_scene.hpp>
#include <dovetailor/render/cairo_render.hpp>

#include "file_io.hpp"

namespace dovetailor::cli {

void require_drawing_format(const std::string& path, const std::string& option) {
  const std::string ext = output_extension(path);
  if (ext != ".svg" && ext != ".png" && ext != ".pdf")
    throw InputError("give an output file ending in .svg, .png or .pdf", {path}, option);
}

void add_png_size_options(CLI::App& cmd, PngSize& size) {
  cmd.add_option("--width", size.width, "PNG width in pixels")->check(CLI::Range(200, 8000));
  cmd.add_option("--height", size.height, "PNG height in pixels")->check(CLI::Range(150, 8000));
}

std::string drawing_file_bytes(const Drawing& drawing, const std::string& path, PngSize png) {
  const std::string ext = output_extension(path);
  // A PNG keeps its pixels' aspect.
  const double width = 270;
  const double height = ext == ".png" ? width * png.height / png.width : 170;
  const Scene scene = layout_drawing(drawing, width, height);
  if (ext == ".svg") return drawing_svg(scene);
  if (ext == ".png") return drawing_png(scene, png.width, png.height);
  return drawing_pdf(scene);
}

}  // namespace dovetailor::cli
