#include <cmath>

#include <gtest/gtest.h>

#include <dovetailor/geometry/section_measure.hpp>

namespace dovetailor {
namespace {

struct Case {
  DovetailType type;
  double angle;
  Units units;
  AngledSides sides;
};

// Example dovetails: 1.5 in wide, 3/8 in deep, 1/4 in pins; 40 mm wide,
// 10 mm deep, 6 mm pins. Width at the base plane.
DovetailSpec spec_for(const Case& c) {
  DovetailSpec s;
  s.type = c.type;
  s.angle = c.angle;
  s.sides = c.sides;
  s.depth = to_mm(c.units == Units::Inch ? 0.375 : 10, c.units);
  s.width = to_mm(c.units == Units::Inch ? 1.5 : 40, c.units);
  s.width_at = WidthAt::Bottom;
  return s;
}

double pin_for(Units units) { return to_mm(units == Units::Inch ? 0.25 : 6, units); }

// The reading's tolerance: 0.00005 in or 0.001 mm, half the last place a
// micrometer shows (common practice, no source).
double tolerance_for(Units units) { return units == Units::Inch ? to_mm(0.00005, units) : 0.001; }

SectionRegion part_region(const DovetailSection& section) {
  const double half = 60;
  return SectionRegion::from_ring(part_outline(section, -half, half, 30));
}

std::vector<Case> all_cases() {
  std::vector<Case> cases;
  for (DovetailType type : {DovetailType::Male, DovetailType::Female})
    for (double angle : {45.0, 55.0, 60.0})
      for (Units units : {Units::Inch, Units::Millimetre})
        for (AngledSides sides : {AngledSides::Both, AngledSides::Left, AngledSides::Right})
          cases.push_back({type, angle, units, sides});
  return cases;
}

std::string describe(const Case& c) {
  return std::string(c.type == DovetailType::Male ? "male " : "female ") + std::to_string(c.angle) +
         " deg " + std::string(unit_name(c.units)) +
         (c.sides == AngledSides::Both   ? " both flanks"
          : c.sides == AngledSides::Left ? " left flank"
                                         : " right flank");
}

TEST(section_measure, virtual_pin_reading_matches_handbook_formula) {
  // Handbook method for dovetail slides with rolls (Machinery's Handbook,
  // "Measuring Dovetail Slides"): M = W + D(1 + cot(a/2)), P = W - D(1 +
  // cot(a/2)); one pin from the square side adds or takes (D/2)(1 + cot(a/2))
  // (domain brief) -- reading_of() holds these formulas.
  for (const Case& c : all_cases()) {
    SCOPED_TRACE(describe(c));
    const DovetailSection target = section_of(spec_for(c));
    const double pin = pin_for(c.units);
    const auto m = measure_section(part_region(target), target, {.pin_diameter = pin});
    ASSERT_TRUE(m.reading) << m.problems.size() << " problem(s)";
    const PinReading expected = reading_of(target, pin);
    EXPECT_EQ(m.reading->method, expected.method);
    EXPECT_EQ(m.reading->pins, expected.pins);
    EXPECT_NEAR(m.reading->value, expected.value, tolerance_for(c.units));
  }
}

TEST(section_measure, exact_section_measures_its_own_dimensions) {
  for (const Case& c : all_cases()) {
    SCOPED_TRACE(describe(c));
    const DovetailSection target = section_of(spec_for(c));
    const auto m = measure_section(part_region(target), target, {.pin_diameter = pin_for(c.units)});
    EXPECT_NEAR(m.depth, target.depth, 1e-5);
    EXPECT_NEAR(m.top_z, 0, 1e-5);
    EXPECT_NEAR(m.width_bottom, target.width_bottom(), 1e-4);
    EXPECT_NEAR(m.width_top, target.width_top(), 1e-4);
    for (Side side : {Side::Left, Side::Right}) {
      const FlankMeasurement& f = m.flank(side);
      EXPECT_TRUE(f.found);
      EXPECT_NEAR(f.angle, f.angled ? c.angle : 90.0, 1e-4);
      EXPECT_LT(f.max_deviation, 1e-4);
      EXPECT_NEAR(f.floor_z, -target.depth, 1e-5);
    }
  }
}

TEST(section_measure, pin_centre_touches_floor_and_flank) {
  // The pin centre lies r above the base plane and r*cot(a/2) from the
  // corner along it (plane geometry, the bisector of the corner).
  const Case c{DovetailType::Female, 60, Units::Millimetre, AngledSides::Both};
  const DovetailSection target = section_of(spec_for(c));
  const auto m = measure_section(part_region(target), target, {.pin_diameter = 6});
  ASSERT_TRUE(m.left.pin_center);
  EXPECT_NEAR(m.left.pin_center->z, -10 + 3, 1e-5);
  EXPECT_NEAR(m.left.pin_center->x, -20 + 3 / std::tan(radians(30)), 1e-5);
}

// The target with `s` of stock left on every angled flank, normal to it:
// a band s thick laid on the flank's void side, between base and top plane.
SectionRegion with_stock_on_flanks(const DovetailSection& target, double s) {
  SectionRegion part = part_region(target);
  const SectionRegion slab = SectionRegion::rectangle(-100, -target.depth, 100, 0);
  for (Side side : {Side::Left, Side::Right}) {
    const Flank& f = target.flank(side);
    const double len = std::hypot(f.top.x - f.base.x, f.top.z - f.base.z);
    const Point2 dir{(f.top.x - f.base.x) / len, (f.top.z - f.base.z) / len};
    // The flank's normal pointing into the void (the side toward the pin).
    Point2 normal{dir.z, -dir.x};
    const double toward_middle = side == Side::Left ? 1.0 : -1.0;
    const double into_void = target.type == DovetailType::Female ? toward_middle : -toward_middle;
    if (normal.x * into_void < 0) normal = {-normal.x, -normal.z};
    const double ext = 5;  // run past both planes; the slab trims it
    const Point2 a{f.base.x - ext * dir.x, f.base.z - ext * dir.z};
    const Point2 b{f.top.x + ext * dir.x, f.top.z + ext * dir.z};
    const Ring band{
        a, b, {b.x + s * normal.x, b.z + s * normal.z}, {a.x + s * normal.x, a.z + s * normal.z}};
    part = unite(part, intersect(SectionRegion::from_ring(band), slab));
  }
  return part;
}

TEST(section_measure, stock_on_both_flanks_moves_reading_by_2s_over_sin_a) {
  // Stock s left normal to each flank changes the two-pin reading by
  // 2s/sin(a) (domain brief, reference values, derived): a male reads more,
  // a female less.
  for (const Case& c : all_cases()) {
    if (c.sides != AngledSides::Both) continue;
    SCOPED_TRACE(describe(c));
    const DovetailSection target = section_of(spec_for(c));
    const double pin = pin_for(c.units);
    const double s = to_mm(c.units == Units::Inch ? 0.002 : 0.05, c.units);
    const auto exact = measure_section(part_region(target), target, {.pin_diameter = pin});
    const auto left_on =
        measure_section(with_stock_on_flanks(target, s), target, {.pin_diameter = pin});
    ASSERT_TRUE(exact.reading && left_on.reading);
    const double sign = c.type == DovetailType::Male ? 1.0 : -1.0;
    EXPECT_NEAR(left_on.reading->value - exact.reading->value,
                sign * 2 * s / std::sin(radians(c.angle)), tolerance_for(c.units));
    // The flanks stay straight and keep their angle.
    EXPECT_NEAR(left_on.left.angle, c.angle, 1e-4);
    EXPECT_LT(left_on.right.max_deviation, 1e-4);
  }
}

TEST(section_measure, step_on_a_flank_shows_as_deviation) {
  // A 0.1 mm step left halfway up the left flank by a coarse pass: the
  // least-squares line runs between the two levels, so the largest
  // deviation lies between a quarter and a whole step (example).
  const Case c{DovetailType::Female, 60, Units::Millimetre, AngledSides::Both};
  const DovetailSection target = section_of(spec_for(c));
  const double step = 0.1;
  const Flank& f = target.left;
  const Point2 mid{(f.base.x + f.top.x) / 2, (f.base.z + f.top.z) / 2};
  const double n = step / std::sin(radians(60));  // lateral size of the step
  const SectionRegion part =
      unite(part_region(target),
            SectionRegion::from_ring({f.base, {f.base.x + n, f.base.z}, {mid.x + n, mid.z}, mid}));
  const auto m = measure_section(part, target, {.pin_diameter = 6});
  ASSERT_TRUE(m.left.found);
  EXPECT_GT(m.left.max_deviation, step / 4);
  EXPECT_LT(m.left.max_deviation, step);
  EXPECT_LT(m.right.max_deviation, 1e-4);
}

TEST(section_measure, uncut_stock_reports_no_flanks) {
  const Case c{DovetailType::Female, 60, Units::Millimetre, AngledSides::Both};
  const DovetailSection target = section_of(spec_for(c));
  const auto m =
      measure_section(SectionRegion::rectangle(-60, -30, 60, 0), target, {.pin_diameter = 6});
  EXPECT_FALSE(m.reading);
  EXPECT_EQ(m.problems, (std::vector<MeasureProblem>{{MeasureProblemKind::NoFlank, Side::Left},
                                                     {MeasureProblemKind::NoFlank, Side::Right}}));
  EXPECT_NEAR(m.depth, 0, 1e-9);
  const auto nothing = measure_section(SectionRegion(), target, {.pin_diameter = 6});
  EXPECT_FALSE(nothing.reading);
  EXPECT_EQ(nothing.problems, std::vector<MeasureProblem>{{MeasureProblemKind::NoMaterial}});
}

}  // namespace
}  // namespace dovetailor
