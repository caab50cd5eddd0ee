#include <cmath>

#include <gtest/gtest.h>

#include <dovetailor/geometry/dovetail_section.hpp>

namespace dovetailor {
namespace {

DovetailSpec spec(DovetailType type, AngledSides sides, double width, WidthAt at) {
  DovetailSpec s;
  s.type = type;
  s.angle = 60;
  s.depth = 10;
  s.width = width;
  s.width_at = at;
  s.sides = sides;
  return s;
}

// Domain brief, "Conventions": female W_top = W_bottom - 2 H cot a; male
// W_top = W_bottom + 2 H cot a. cot 60 = 0.5773503 (trigonometric table).
TEST(dovetail_section, female_mouth_is_narrower_by_two_runs) {
  const auto s = section_of(spec(DovetailType::Female, AngledSides::Both, 40, WidthAt::Bottom));
  EXPECT_NEAR(s.width_bottom(), 40, 1e-12);
  EXPECT_NEAR(s.width_top(), 40 - 2 * 10 * 0.5773503, 1e-6);
  EXPECT_NEAR(s.left.base.z, -10, 1e-12);
  EXPECT_NEAR(s.left.top.z, 0, 1e-12);
}

TEST(dovetail_section, male_top_is_wider_by_two_runs) {
  const auto s = section_of(spec(DovetailType::Male, AngledSides::Both, 40, WidthAt::Top));
  EXPECT_NEAR(s.width_top(), 40, 1e-12);
  EXPECT_NEAR(s.width_bottom(), 40 - 2 * 10 * 0.5773503, 1e-6);
}

TEST(dovetail_section, flank_makes_the_dovetail_angle_with_the_base_plane) {
  for (auto type : {DovetailType::Male, DovetailType::Female}) {
    const auto s = section_of(spec(type, AngledSides::Both, 40, WidthAt::Bottom));
    // Inside the void the angle at the base corner is acute: measure the
    // flank's inclination from the horizontal.
    const double rise = s.right.top.z - s.right.base.z;
    const double run = std::abs(s.right.top.x - s.right.base.x);
    EXPECT_NEAR(degrees(std::atan2(rise, run)), 60, 1e-9);
  }
}

TEST(dovetail_section, half_dovetail_keeps_one_square_flank) {
  const auto s = section_of(spec(DovetailType::Female, AngledSides::Left, 30, WidthAt::Bottom));
  EXPECT_TRUE(s.left.angled);
  EXPECT_FALSE(s.right.angled);
  EXPECT_EQ(s.right.base.x, s.right.top.x);
  EXPECT_NEAR(s.width_top(), 30 - 10 * 0.5773503, 1e-6);
  EXPECT_EQ(s.angled_flanks(), 1);
}

TEST(dovetail_section, gib_widens_female_and_narrows_male_by_t_over_sin_a) {
  auto female = spec(DovetailType::Female, AngledSides::Both, 40, WidthAt::Bottom);
  female.gib = Gib{Side::Left, 3, 0};
  const auto f = section_of(female);
  // t / sin 60 = 3 / 0.8660254 = 3.4641016 (domain brief, "Fit of a pair").
  EXPECT_NEAR(f.gib_allowance, 3.4641016, 1e-7);
  EXPECT_NEAR(f.width_bottom(), 40 + 3.4641016, 1e-7);
  EXPECT_NEAR(f.left.base.x, -20 - 3.4641016, 1e-7);
  auto male = spec(DovetailType::Male, AngledSides::Both, 40, WidthAt::Bottom);
  male.gib = Gib{Side::Right, 3, 0};
  const auto m = section_of(male);
  EXPECT_NEAR(m.width_bottom(), 40 - 3.4641016, 1e-7);
  EXPECT_NEAR(m.right.base.x, 20 - 3.4641016, 1e-7);
}

TEST(dovetail_section, part_outline_area_is_stock_less_void) {
  const auto s = section_of(spec(DovetailType::Female, AngledSides::Both, 40, WidthAt::Bottom));
  const auto outline = part_outline(s, -50, 50, 30);
  double twice_area = 0;
  for (std::size_t i = 0; i < outline.size(); ++i) {
    const auto& a = outline[i];
    const auto& b = outline[(i + 1) % outline.size()];
    twice_area += a.x * b.z - b.x * a.z;
  }
  const double void_area = (s.width_bottom() + s.width_top()) / 2 * s.depth;
  EXPECT_NEAR(twice_area / 2, 100 * 30 - void_area, 1e-9);  // positive: counter-clockwise
}

TEST(dovetail_section, widths_convert_both_ways) {
  for (int n : {1, 2}) {
    const double top = width_top_from_bottom(DovetailType::Male, 25, 6, 45, n);
    EXPECT_NEAR(width_bottom_from_top(DovetailType::Male, top, 6, 45, n), 25, 1e-12);
    EXPECT_NEAR(top, 25 + n * 6.0, 1e-12);  // cot 45 = 1
  }
}

}  // namespace
}  // namespace dovetailor
