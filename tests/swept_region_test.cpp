#include <cmath>

#include <gtest/gtest.h>

#include <dovetailor/geometry/swept_region.hpp>

namespace dovetailor {
namespace {

Tool end_mill(double diameter, double flute_length) {
  Tool t;
  t.kind = ToolKind::EndMill;
  t.diameter = diameter;
  t.flute_length = flute_length;
  return t;
}

// A sharp 60 degree dovetail cutter, 25 mm large diameter, 8 mm flutes (example).
Tool sharp_dovetail() {
  Tool t;
  t.kind = ToolKind::Dovetail;
  t.diameter = 25;
  t.flute_length = 8;
  t.angle = 60;
  t.neck_diameter = 12;
  t.shank_diameter = 12;
  return t;
}

const SweptPart* find(const std::vector<SweptPart>& parts, BodyPart which) {
  for (const SweptPart& p : parts)
    if (p.part == which) return &p;
  return nullptr;
}

Ring moved(Ring ring, double dx, double dz) {
  for (Point2& p : ring) p = {p.x + dx, p.z + dz};
  return ring;
}

double symmetric_difference(const SectionRegion& a, const SectionRegion& b) {
  return subtract(a, b).area() + subtract(b, a).area();
}

TEST(swept_region, silhouette_of_sharp_dovetail_cutter_is_its_trapezoid) {
  // Trapezoid: height h_f, widths D and D - 2*h_f*cot(a) (domain brief).
  const ToolBody body = tool_body(sharp_dovetail());
  const Ring flutes = chord_profile(body.sections[0], 0);
  const double small = 25 - 2 * 8 / std::tan(radians(60));
  // Rounding the corners onto the 10 nm grid moves the area by at most
  // perimeter x half a grid step.
  const double perimeter = 25 + small + 2 * 8 / std::sin(radians(60));
  EXPECT_NEAR(SectionRegion::from_ring(flutes).area(), 8 * (25 + small) / 2,
              perimeter * region_rounding);
}

TEST(swept_region, move_along_the_slide_through_the_plane_is_the_silhouette) {
  const ToolBody body = tool_body(sharp_dovetail());
  const auto parts = sweep_line(body, {3, -10, -6}, {3, 40, -6}, 12.5);
  const SweptPart* flutes = find(parts, BodyPart::Flutes);
  ASSERT_TRUE(flutes);
  ASSERT_EQ(flutes->pieces.size(), 1u);
  const SectionRegion expected =
      SectionRegion::from_ring(moved(chord_profile(body.sections[0], 0), 3, -6));
  EXPECT_LT(symmetric_difference(region_of(*flutes), expected), 1e-9);
  EXPECT_TRUE(find(parts, BodyPart::Neck));
  EXPECT_TRUE(find(parts, BodyPart::Shank));
}

TEST(swept_region, move_stopping_short_of_the_plane_leaves_a_chord) {
  // A cylinder of radius R cut 2 mm off its axis: half-width sqrt(R^2 - 4).
  const ToolBody body = tool_body(end_mill(10, 20));
  const auto parts = sweep_line(body, {0, -30, -5}, {0, 8, -5}, 10);
  const SweptPart* flutes = find(parts, BodyPart::Flutes);
  ASSERT_TRUE(flutes);
  const auto b = region_of(*flutes).bounds();
  ASSERT_TRUE(b);
  EXPECT_NEAR(b->x_max, std::sqrt(25.0 - 4.0), 1e-5);
  EXPECT_NEAR(b->x_min, -std::sqrt(25.0 - 4.0), 1e-5);
  EXPECT_NEAR(b->z_min, -5, 1e-5);
  EXPECT_NEAR(b->z_max, 15, 1e-5);
  EXPECT_TRUE(sweep_line(body, {0, -30, -5}, {0, 4.9, -5}, 10).empty());
  EXPECT_FALSE(reaches_plane(body, {0, -30, -5}, {0, 4.9, -5}, 10));
}

TEST(swept_region, in_plane_move_adds_the_swept_band) {
  // Cylinder of width w = 2R and flute height L swept by (dx, dz): a
  // rectangle's Minkowski sum with a segment, area w*L + |dx|*L + |dz|*w
  // (plane geometry: the rectangle plus two parallelograms).
  const ToolBody body = tool_body(end_mill(12, 25));
  const double dx = 17, dz = -4;
  for (double dy : {0.0, 2.5, -5.0}) {
    SCOPED_TRACE(dy);
    const auto parts = sweep_line(body, {-5, 30 + dy, 1}, {-5 + dx, 30 + dy, 1 + dz}, 30);
    const SweptPart* flutes = find(parts, BodyPart::Flutes);
    ASSERT_TRUE(flutes);
    ASSERT_EQ(flutes->pieces.size(), 1u);
    const double w = 2 * std::sqrt(36 - dy * dy);  // chord of the cylinder off its axis
    const double silhouette = w * 25;
    const double band = std::abs(dx) * 25 + std::abs(dz) * w;
    const double perimeter = 2 * (w + 25) + 2 * std::hypot(dx, dz);  // grid rounding bound
    EXPECT_NEAR(region_of(*flutes).area(), silhouette + band, perimeter * region_rounding);
  }
}

TEST(swept_region, diagonal_move_across_the_plane_cuts_a_slanted_slot) {
  // An end mill moving at 30 degrees to X across the plane: each slice of the
  // slot is 2R / sin(30 deg) wide where the plane crosses the slot's straight
  // part (plane geometry). General line: sampled, within 1e-4 mm, inside.
  const double r = 6, len = 25;
  const ToolBody body = tool_body(end_mill(2 * r, len));
  const double c = std::cos(radians(30)), s = std::sin(radians(30));
  const Point3 from{-60 * c, 50 - 60 * s, -3}, to{60 * c, 50 + 60 * s, -3};
  const auto parts = sweep_line(body, from, to, 50);
  const SweptPart* flutes = find(parts, BodyPart::Flutes);
  ASSERT_TRUE(flutes);
  const double width = 2 * r / s;
  const double area = region_of(*flutes).area();
  const double perimeter = 2 * (width + len);
  EXPECT_LE(area, width * len + 1e-6);
  EXPECT_GE(area, width * len - 1e-4 * perimeter);
  const auto b = region_of(*flutes).bounds();
  EXPECT_NEAR(b->x_max, r / s, 1e-4);
  EXPECT_NEAR(b->x_min, -r / s, 1e-4);
}

TEST(swept_region, ramp_along_the_slide_is_bounded_by_its_ends) {
  // Ramping down while moving along Y through the plane (a general line):
  // the tool touches the plane from y = 15 to y = 25, its tip going from
  // z = -3 to z = -5; widest (2R) where its axis is in the plane. Bounds by
  // plane geometry.
  const double r = 5, len = 15;
  const ToolBody body = tool_body(end_mill(2 * r, len));
  const auto parts = sweep_line(body, {0, 0, 0}, {0, 40, -8}, 20);
  const SweptPart* flutes = find(parts, BodyPart::Flutes);
  ASSERT_TRUE(flutes);
  const auto b = region_of(*flutes).bounds();
  ASSERT_TRUE(b);
  // Lowest tip: where the plane leaves the tool at y = 25 (z = -5);
  // highest flute top: where the tool first reaches it at y = 15 (z = -3).
  EXPECT_NEAR(b->x_max, r, 1e-4);
  EXPECT_NEAR(b->x_min, -r, 1e-4);
  EXPECT_NEAR(b->z_min, -5, 1e-4);
  EXPECT_NEAR(b->z_max, -3 + len, 1e-4);
}

TEST(swept_region, full_circle_around_the_plane_cuts_two_slots) {
  // An end mill of radius R on a circle of radius rho centred in the plane
  // sweeps an annulus; the plane through its centre cuts two 2R slots.
  const double r = 4, rho = 20, len = 10;
  const ToolBody body = tool_body(end_mill(2 * r, len));
  const PathSegment circle{
      {rho, 50, -2}, {rho, 50, -2}, ArcShape{.centre = {0, 50, 0}, .plane = Plane::XY}};
  const auto parts = sweep_arc(body, circle, 50);
  const SweptPart* flutes = find(parts, BodyPart::Flutes);
  ASSERT_TRUE(flutes);
  const SectionRegion cut = region_of(*flutes);
  EXPECT_NEAR(cut.area(), 2 * 2 * r * len, 2 * 2 * len * 1e-4);
  const auto row = cut.row(0);
  ASSERT_EQ(row.size(), 2u);
  EXPECT_NEAR(row[0].low, -rho - r, 1e-4);
  EXPECT_NEAR(row[0].high, -rho + r, 1e-4);
  EXPECT_NEAR(row[1].low, rho - r, 1e-4);
  EXPECT_NEAR(row[1].high, rho + r, 1e-4);
}

TEST(swept_region, body_parts_are_reported_apart) {
  // A plunge deeper than the flutes: the shank's area starts at the flute top.
  Tool t = end_mill(10, 12);
  t.shank_diameter = 8;
  const ToolBody body = tool_body(t);
  const auto parts = sweep_line(body, {0, 5, 5}, {0, 5, -20}, 5);
  const SweptPart* shank = find(parts, BodyPart::Shank);
  ASSERT_TRUE(shank);
  const auto b = region_of(*shank).bounds();
  EXPECT_NEAR(b->z_min, -20 + 12, 1e-5);
  EXPECT_NEAR(b->x_max, 4, 1e-5);
}

}  // namespace
}  // namespace dovetailor
