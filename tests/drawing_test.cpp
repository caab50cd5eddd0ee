#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <fstream>
#include <sstream>
#include <utility>

#include <gtest/gtest.h>

#include <dovetailor/drawing/drawing.hpp>
#include <dovetailor/drawing/drawing_scene.hpp>
#include <dovetailor/geometry/tool_body.hpp>
#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/plan/planner.hpp>
#include <dovetailor/render/cairo_render.hpp>
#include <dovetailor/report/sheet.hpp>

#include "test_support.hpp"

namespace dovetailor {
namespace {

using testing::read_source_file;

Plan plan_of(const std::string& sample) { return plan(read_job(read_source_file(sample), sample)); }

std::string inches(double mm) {
  char text[32];
  std::snprintf(text, sizeof text, "%.4f in", mm / 25.4);
  return text;
}

double area(const Region& r) {
  double a = 0;
  for (const auto& ring : r.polygons) a += ring_area(ring);
  return a;
}

// Invariant: the operations remove the stock less the finished part, no more
// and no less (within the slivers the cutter's straight cone leaves at a
// 0.1 um clipping grid), and nothing twice.
TEST(drawing, removed_regions_and_part_fill_the_stock) {
  for (const char* sample : {"samples/height-stop-half-female.toml",
                             "samples/fixture-slide-female.toml", "samples/stop-block-male.toml"}) {
    const Plan p = plan_of(sample);
    const Drawing d = build_drawing(p);
    const double stock = p.job.stock.width * p.job.stock.height;
    double total = 0;
    for (const auto& r : d.regions) {
      EXPECT_GE(area(r), 0) << sample << " " << r.label;
      total += area(r);
    }
    EXPECT_NEAR(total, stock, 1e-3 * stock) << sample;
  }
}

// Where a ring's edges cross height z: the leftmost and the rightmost x.
std::pair<double, double> edges_at(const std::vector<Point2>& ring, double z) {
  double left = 1e300, right = -1e300;
  for (std::size_t i = 0; i < ring.size(); ++i) {
    const Point2& a = ring[i];
    const Point2& b = ring[(i + 1) % ring.size()];
    if ((a.z - z) * (b.z - z) > 0 || a.z == b.z) continue;
    const double at = a.x + (b.x - a.x) * (z - a.z) / (b.z - a.z);
    left = std::min(left, at);
    right = std::max(right, at);
  }
  return {left, right};
}

// The cutter the drawing shows is the body the planner and the checker
// sweep (tool_body.hpp): a 3/4 in 60 degree dovetail cutter (example) with a
// 0.4 mm corner round and no neck diameter given, so the neck is the
// assumed one (the small diameter). A drawing of its own once drew it with a
// sharp corner and a neck of no width.
TEST(drawing, cutter_outline_is_the_body_the_checker_sweeps) {
  Tool t;
  t.kind = ToolKind::Dovetail;
  t.diameter = 19.05;
  t.flute_length = 7.9375;
  t.angle = 60;
  t.corner_radius = 0.4;
  const double x = 10, z = -5, top = 20;
  const auto ring = tool_silhouette(t, x, z, top);
  const ToolBody body = tool_body(t);
  for (double h : {0.05, 0.2, 0.39, 1.0, 5.0, 7.9, 8.0, 12.0, 20.0, 24.9}) {
    const auto [left, right] = edges_at(ring, z + h);
    EXPECT_NEAR(right - x, body.radius_at(h), 1e-9) << h;
    EXPECT_NEAR(x - left, body.radius_at(h), 1e-9) << h;
  }
  EXPECT_NEAR(edges_at(ring, z + 10).second - x, body_dimensions(t).flute_top_diameter / 2, 1e-9);
  for (const Point2& p : ring) EXPECT_LE(p.z, top);
  EXPECT_GT(ring_area(ring), 0);  // counter-clockwise
}

// The pin dimension spans the plan's final reading, and every dimension text
// is the plan's number in the job's units (the text sheet prints the same).
TEST(drawing, dimension_texts_are_the_plan_numbers) {
  const Plan p = plan_of("samples/height-stop-half-female.toml");
  const Drawing d = build_drawing(p);
  ASSERT_FALSE(d.dimensions.empty());
  const Dimension& pins = d.dimensions.front();
  EXPECT_NEAR(std::abs(pins.b.x - pins.a.x), p.final_reading.value, 1e-9);
  EXPECT_EQ(pins.text, inches(p.final_reading.value));
  const std::string svg = drawing_svg(layout_drawing(d, 270, 170));
  for (const std::string& text :
       {inches(p.final_reading.value), inches(p.target.width_bottom()),
        inches(p.target.width_top()), inches(p.target.depth), std::string("60\u00b0")})
    EXPECT_NE(svg.find(">" + text + "<"), std::string::npos) << text;
  // 0.6194, 0.8755, 0.7312, 0.2500 in: the plan command's own figures (the
  // middle of the 0 to +0.001 in band).
  EXPECT_NE(svg.find(">0.6194 in<"), std::string::npos);
  EXPECT_NE(svg.find(">0.7312 in<"), std::string::npos);
}

// PNG signature and IHDR (ISO/IEC 15948, the PNG specification): bytes 16-23
// hold the width and height, big-endian.
TEST(drawing, png_has_the_requested_size) {
  const Scene scene = layout_drawing(build_drawing(plan_of("samples/stop-block-male.toml")), 270,
                                     270.0 * 300 / 640);
  const std::string png = drawing_png(scene, 640, 300);
  ASSERT_GT(png.size(), 24u);
  EXPECT_EQ(png.substr(0, 8), std::string("\x89PNG\r\n\x1a\n", 8));
  const auto be32 = [&](std::size_t at) {
    unsigned v = 0;
    for (std::size_t i = 0; i < 4; ++i) v = v << 8 | static_cast<unsigned char>(png[at + i]);
    return v;
  };
  EXPECT_EQ(be32(16), 640u);
  EXPECT_EQ(be32(20), 300u);
}

// cairo makes image surfaces of at most 32767 pixels a side (the limit in
// cairo's image backend, from memory) and hands back a surface in an error
// state rather than null: the renderer says so in words and owns nothing
// afterwards (the sanitizer build would see a leak).
TEST(drawing, png_larger_than_cairo_allows_is_refused_in_words) {
  const Scene scene =
      layout_drawing(build_drawing(plan_of("samples/stop-block-male.toml")), 270, 170);
  testing::expect_input_error([&] { drawing_png(scene, 40000, 300); },
                              {"cannot make the PNG drawing", "too big"});
}

// The PDF sheet's text, extracted by pdftotext (Debian poppler-utils), holds
// every pass setting and checkpoint reading of the plan.
TEST(drawing, pdf_sheet_text_holds_every_setting) {
  const Plan p = plan_of("samples/height-stop-half-female.toml");
  const Sheet sheet = build_sheet(p, {.date = "2024-05-01"});
  const Drawing d = build_drawing(p);
  const std::string pdf = sheet_pdf(sheet, &d, Paper::A4);
  ASSERT_EQ(pdf.substr(0, 5), "%PDF-");
  const std::string base = ::testing::TempDir() + "dovetailor_sheet_test";
  std::ofstream(base + ".pdf", std::ios::binary) << pdf;
  const std::string command = "pdftotext -layout " + base + ".pdf " + base + ".txt";
  ASSERT_EQ(std::system(command.c_str()), 0) << "pdftotext (poppler-utils) is needed";
  std::ifstream in(base + ".txt");
  std::stringstream text;
  text << in.rdbuf();
  const std::string t = text.str();
  const auto number = [](double mm) { return inches(mm).substr(0, inches(mm).size() - 3); };
  for (const Pass* pass : all_passes(p)) {
    EXPECT_NE(t.find(number(pass->x)), std::string::npos) << "pass " << pass->number;
    EXPECT_NE(t.find(number(pass->z)), std::string::npos) << "pass " << pass->number;
  }
  for (const auto& op : sheet.operations)
    for (const auto& row : op.rows)
      for (const auto& cell : row.cells)
        if (cell != "[ ]") {
          EXPECT_NE(t.find(cell), std::string::npos) << cell;
        }
  for (const auto& c : p.checkpoints)
    EXPECT_NE(t.find("expect " + inches(c.expected.value)), std::string::npos) << c.name;
  std::remove((base + ".pdf").c_str());
  std::remove((base + ".txt").c_str());
}

}  // namespace
}  // namespace dovetailor
