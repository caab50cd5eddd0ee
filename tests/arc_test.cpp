#include <cmath>
#include <cstddef>

#include <gtest/gtest.h>

#include <dovetailor/base/arc.hpp>
#include <dovetailor/base/units.hpp>

namespace dovetailor {
namespace {

PathSegment xy_arc(Point3 start, Point3 end, Point3 centre, ArcDirection direction, int turns = 1) {
  return {start, end, ArcShape{centre, Plane::XY, direction, turns}};
}

TEST(arc, g2_is_clockwise_seen_from_positive_z) {
  // NISTIR 6556 section 3.5.3 (from memory): G2 turns clockwise, G3
  // counterclockwise, seen from the positive end of the plane's normal axis.
  // From +X to +Y about the origin that is three quarters of a turn for G2
  // and one quarter for G3.
  const Point3 east{10, 0, 0}, north{0, 10, 0};
  EXPECT_NEAR(swept_angle(xy_arc(east, north, {}, ArcDirection::Clockwise)), 1.5 * pi, 1e-12);
  EXPECT_NEAR(swept_angle(xy_arc(east, north, {}, ArcDirection::Counterclockwise)), 0.5 * pi,
              1e-12);
}

TEST(arc, ends_that_agree_make_a_full_circle_and_turns_add_circles) {
  // NISTIR 6556 section 3.5.3 (from memory): an arc whose end point equals
  // its start point in the plane is a full circle.
  const Point3 p{5, 0, 0};
  EXPECT_NEAR(swept_angle(xy_arc(p, p, {}, ArcDirection::Counterclockwise)), 2 * pi, 1e-12);
  EXPECT_NEAR(swept_angle(xy_arc(p, p, {}, ArcDirection::Clockwise, 3)), 6 * pi, 1e-12);
}

TEST(arc, half_circle_is_pi_times_the_radius_long) {
  // Circumference of a circle: 2 pi r (elementary geometry, common practice,
  // no source).
  const auto half = xy_arc({7, 0, 0}, {-7, 0, 0}, {}, ArcDirection::Counterclockwise);
  EXPECT_NEAR(path_length(half), 7 * pi, 1e-12);
  EXPECT_NEAR(path_length({{0, 0, 0}, {3, 4, 12}, {}}), 13, 1e-12);  // 3-4-5, 5-12-13 triangles
}

TEST(arc, helix_length_is_the_unrolled_hypotenuse) {
  // Length of a helix: sqrt((2 pi r n)^2 + h^2) for n turns rising h, the
  // helix unrolled onto a plane (Machinery's Handbook, helix; from memory).
  const double r = 6, rise = 4;
  const auto helix = xy_arc({r, 0, 0}, {r, 0, -rise}, {}, ArcDirection::Clockwise, 2);
  EXPECT_NEAR(path_length(helix), std::hypot(2 * pi * r * 2, rise), 1e-9);
}

TEST(arc, plane_coordinates_follow_the_rs274_order) {
  // NISTIR 6556 section 3.5.3 (from memory): in G18 the first in-plane axis
  // is Z and the second X (I and K offsets: K, I); in G19 Y then Z.
  const Point3 p{1, 2, 3};
  EXPECT_EQ(in_plane(p, Plane::XY), (PlaneCoordinates{1, 2, 3}));
  EXPECT_EQ(in_plane(p, Plane::ZX), (PlaneCoordinates{3, 1, 2}));
  EXPECT_EQ(in_plane(p, Plane::YZ), (PlaneCoordinates{2, 3, 1}));
  for (Plane plane : {Plane::XY, Plane::ZX, Plane::YZ})
    EXPECT_EQ(from_plane(in_plane(p, plane), plane), p);
}

TEST(arc, g18_counterclockwise_runs_from_z_toward_x) {
  // Seen from +Y, counterclockwise in (Z, X) carries +Z toward +X.
  const PathSegment quarter{
      {0, 0, 10}, {10, 0, 0}, ArcShape{{}, Plane::ZX, ArcDirection::Counterclockwise, 1}};
  EXPECT_NEAR(swept_angle(quarter), 0.5 * pi, 1e-12);
  const auto points = path_points(quarter, 1e-3);
  ASSERT_GT(points.size(), 2u);
  const Point3& middle = points[points.size() / 2];
  EXPECT_GT(middle.x, 0);
  EXPECT_GT(middle.z, 0);
  EXPECT_NEAR(middle.y, 0, 1e-12);
}

TEST(arc, points_keep_every_chord_within_the_tolerance) {
  // Height of a circular segment (sagitta): r (1 - cos(theta / 2)) for a
  // chord of angle theta (Machinery's Handbook, segments of circles; from
  // memory). Every chord's midpoint lies no more than the tolerance inside.
  const auto arc = xy_arc({10, 0, 0}, {0, 10, -1}, {}, ArcDirection::Counterclockwise);
  const auto points = path_points(arc, 1e-4);
  ASSERT_GT(points.size(), 2u);
  EXPECT_EQ(points.front(), arc.start);
  EXPECT_EQ(points.back(), arc.end);
  const double step = 2 * std::acos(1 - 1e-4 / 10);
  EXPECT_EQ(points.size() - 1, static_cast<std::size_t>(std::ceil(0.5 * pi / step)));
  for (std::size_t i = 0; i + 1 < points.size(); ++i) {
    const Point3& a = points[i];
    const Point3& b = points[i + 1];
    EXPECT_NEAR(std::hypot(a.x, a.y), 10, 1e-12);
    EXPECT_LE(10 - std::hypot((a.x + b.x) / 2, (a.y + b.y) / 2), 1e-4);
    EXPECT_GE(b.y, a.y);  // counterclockwise from +X toward +Y
    EXPECT_LE(b.z, a.z);  // the helix falls linearly
  }
  // Clockwise the other way round: three quarters of a turn, three times the
  // points.
  const auto cw = path_points(xy_arc({10, 0, 0}, {0, 10, 0}, {}, ArcDirection::Clockwise), 1e-4);
  EXPECT_NEAR(static_cast<double>(cw.size() - 1) / static_cast<double>(points.size() - 1), 3, 0.05);
}

TEST(arc, a_line_samples_to_its_two_ends) {
  const PathSegment line{{0, 0, 0}, {1, 2, 3}, {}};
  const auto points = path_points(line, 1e-4);
  ASSERT_EQ(points.size(), 2u);
  EXPECT_EQ(points.front(), line.start);
  EXPECT_EQ(points.back(), line.end);
}

}  // namespace
}  // namespace dovetailor
