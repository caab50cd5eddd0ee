#include <cmath>
#include <functional>
#include <random>

#include <geos_c.h>
#include <gtest/gtest.h>

#include <dovetailor/geometry/section_region.hpp>

namespace dovetailor {
namespace {

// A random star-shaped (so simple) polygon, its points on the region grid so
// that the reference and the region start from the same coordinates.
Ring random_star(std::mt19937_64& rng) {
  std::uniform_real_distribution<double> centre(-40, 40), size(20, 100), unit(0, 1);
  std::uniform_int_distribution<int> count(5, 24);
  const double cx = centre(rng), cz = centre(rng), r = size(rng);
  // One vertex in each of n equal sectors: no gap reaches half a turn, so
  // the polygon is star-shaped about its centre.
  const int n = count(rng);
  std::vector<double> angles;
  for (int i = 0; i < n; ++i) angles.push_back(2 * pi * (i + 0.1 + 0.8 * unit(rng)) / n);
  Ring ring;
  for (double a : angles) {
    const double rr = r * (0.3 + 0.7 * unit(rng));
    ring.push_back(
        {from_grid(to_grid(cx + rr * std::cos(a))), from_grid(to_grid(cz + rr * std::sin(a)))});
  }
  return ring;
}

// The reference: GEOS (libgeos-dev, C API), an independent geometry engine.
class Geos {
 public:
  Geos() : context_(GEOS_init_r()) {}
  ~Geos() { GEOS_finish_r(context_); }
  Geos(const Geos&) = delete;
  Geos& operator=(const Geos&) = delete;

  using Op = GEOSGeometry* (*)(GEOSContextHandle_t, const GEOSGeometry*, const GEOSGeometry*);

  double area_of(const Ring& a, const Ring& b, Op op) {
    GEOSGeometry* ga = polygon(a);
    GEOSGeometry* gb = polygon(b);
    GEOSGeometry* result = op(context_, ga, gb);
    double area = std::nan("");
    if (result) {
      GEOSArea_r(context_, result, &area);
      GEOSGeom_destroy_r(context_, result);
    }
    GEOSGeom_destroy_r(context_, gb);
    GEOSGeom_destroy_r(context_, ga);
    return area;
  }

 private:
  GEOSGeometry* polygon(const Ring& ring) {
    const auto n = static_cast<unsigned>(ring.size());
    GEOSCoordSequence* seq = GEOSCoordSeq_create_r(context_, n + 1, 2);
    for (unsigned i = 0; i <= n; ++i) {
      const Point2& p = ring[i % n];
      GEOSCoordSeq_setXY_r(context_, seq, i, p.x, p.z);
    }
    return GEOSGeom_createPolygon_r(context_, GEOSGeom_createLinearRing_r(context_, seq), nullptr,
                                    0);
  }

  GEOSContextHandle_t context_;
};

TEST(section_region, boolean_areas_agree_with_geos_on_random_polygons) {
  std::mt19937_64 rng(20240611);
  Geos geos;
  for (int i = 0; i < 200; ++i) {
    const Ring a = random_star(rng), b = random_star(rng);
    const SectionRegion ra = SectionRegion::from_ring(a), rb = SectionRegion::from_ring(b);
    // Relative to the operands' size: a difference may be nearly empty.
    const double scale = ra.area() + rb.area();
    SCOPED_TRACE(i);
    EXPECT_NEAR(unite(ra, rb).area(), geos.area_of(a, b, GEOSUnion_r), 1e-6 * scale);
    EXPECT_NEAR(subtract(ra, rb).area(), geos.area_of(a, b, GEOSDifference_r), 1e-6 * scale);
    EXPECT_NEAR(intersect(ra, rb).area(), geos.area_of(a, b, GEOSIntersection_r), 1e-6 * scale);
  }
}

TEST(section_region, single_ring_area_agrees_with_geos_either_orientation) {
  std::mt19937_64 rng(7);
  for (int i = 0; i < 50; ++i) {
    Ring a = random_star(rng);
    const double forward = SectionRegion::from_ring(a).area();
    std::reverse(a.begin(), a.end());
    EXPECT_DOUBLE_EQ(SectionRegion::from_ring(a).area(), forward);
    // Shoelace formula on the same grid points (exact in double for these sizes).
    double shoelace = 0;
    for (std::size_t k = 0; k < a.size(); ++k) {
      const Point2& p = a[k];
      const Point2& q = a[(k + 1) % a.size()];
      shoelace += p.x * q.z - q.x * p.z;
    }
    EXPECT_NEAR(forward, std::abs(shoelace) / 2, 1e-9 * forward);
  }
}

TEST(section_region, inclusion_exclusion_holds) {
  std::mt19937_64 rng(99);
  for (int i = 0; i < 100; ++i) {
    const SectionRegion a = SectionRegion::from_ring(random_star(rng));
    const SectionRegion b = SectionRegion::from_ring(random_star(rng));
    const double lhs = unite(a, b).area() + intersect(a, b).area();
    EXPECT_NEAR(lhs, a.area() + b.area(), 1e-6 * lhs);
    EXPECT_NEAR(subtract(a, b).area(), a.area() - intersect(a, b).area(), 1e-6 * lhs);
  }
}

TEST(section_region, nested_rings_make_a_hole) {
  const SectionRegion r = SectionRegion::from_rings(
      {{{0, 0}, {10, 0}, {10, 10}, {0, 10}}, {{2, 2}, {2, 8}, {8, 8}, {8, 2}}});
  EXPECT_NEAR(r.area(), 100 - 36, 1e-12);
  ASSERT_EQ(r.rings().size(), 2u);
  const auto row = r.row(5);
  ASSERT_EQ(row.size(), 2u);
  EXPECT_EQ(row[0], (Span{0, 2}));
  EXPECT_EQ(row[1], (Span{8, 10}));
  const auto column = r.column(1);
  ASSERT_EQ(column.size(), 1u);
  EXPECT_EQ(column[0], (Span{0, 10}));
}

TEST(section_region, rows_on_edges_count_the_side_the_region_is_on) {
  const SectionRegion r = SectionRegion::rectangle(-3, -2, 4, 5);
  EXPECT_EQ(r.row(-2).size(), 1u);  // bottom edge: region above
  EXPECT_TRUE(r.row(5).empty());    // top edge: region below
  EXPECT_EQ(r.column(-3).size(), 1u);
  EXPECT_TRUE(r.column(4).empty());
  EXPECT_EQ(*r.bounds(), (Bounds2{-3, -2, 4, 5}));
}

TEST(section_region, union_of_rings_of_either_orientation) {
  const SectionRegion r =
      SectionRegion::union_of({{{0, 0}, {2, 0}, {2, 2}, {0, 2}}, {{1, 1}, {1, 3}, {3, 3}, {3, 1}}});
  EXPECT_NEAR(r.area(), 4 + 4 - 1, 1e-12);
}

TEST(section_region, grown_square_follows_steiner_formula) {
  // Area of a convex set grown by r: A + P*r + pi*r^2 (Steiner formula for
  // parallel sets). Round corners are chords inside the arc, within 1e-5 mm.
  const SectionRegion square = SectionRegion::rectangle(0, 0, 10, 10);
  const double expected = 100 + 40 * 1.5 + pi * 1.5 * 1.5;
  const double grown = offset(square, 1.5, 1e-5).area();
  EXPECT_LE(grown, expected + 1e-9);
  EXPECT_GE(grown, expected - 2 * pi * 1.5 * 1e-5);
  EXPECT_NEAR(offset(square, -1, 1e-5).area(), 64, 1e-9);  // shrunk square: sharp corners
}

TEST(section_region, shrunk_wedge_has_its_sharp_corner_on_the_bisector) {
  // A 60 degree wedge shrunk by r: the corner moves r / sin(30 deg) = 2r along
  // the bisector (plane trigonometry).
  const double r = 1.25;
  const double len = 40;
  const SectionRegion wedge = SectionRegion::from_ring(
      {{0, 0}, {len, 0}, {len * std::cos(radians(60)), len * std::sin(radians(60))}});
  const auto bounds = offset(wedge, -r).bounds();
  ASSERT_TRUE(bounds);
  EXPECT_NEAR(bounds->x_min, 2 * r * std::cos(radians(30)), 2e-5);
  EXPECT_NEAR(bounds->z_min, r, 2e-5);
}

TEST(section_region, empty_region_has_no_bounds) {
  EXPECT_TRUE(SectionRegion().empty());
  EXPECT_FALSE(SectionRegion().bounds());
  EXPECT_EQ(SectionRegion().area(), 0);
  EXPECT_TRUE(subtract(SectionRegion::rectangle(0, 0, 1, 1), SectionRegion::rectangle(-1, -1, 2, 2))
                  .empty());
}

TEST(section_region, grid_is_ten_nanometres) {
  EXPECT_EQ(to_grid(1.0), 100000);
  EXPECT_EQ(to_grid(-0.000014), -1);
  EXPECT_DOUBLE_EQ(from_grid(254000), 2.54);
}

}  // namespace
}  // namespace dovetailor
