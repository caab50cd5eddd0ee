#include <cmath>
#include <random>

#include <gtest/gtest.h>

#include <dovetailor/shop/cutting_data.hpp>
#include <dovetailor/shop/deflection.hpp>

namespace dovetailor {
namespace {

const Material& material(const char* name) { return find_material(builtin_materials(), name); }

Tool end_mill(double diameter, int flutes, double flute_length, ToolMaterial tool_material) {
  Tool tool;
  tool.kind = ToolKind::EndMill;
  tool.diameter = diameter;
  tool.flutes = flutes;
  tool.flute_length = flute_length;
  tool.material = tool_material;
  return tool;
}

Tool dovetail_cutter(double diameter, double angle, double flute_length, double neck) {
  Tool tool;
  tool.kind = ToolKind::Dovetail;
  tool.diameter = diameter;
  tool.flutes = 6;
  tool.flute_length = flute_length;
  tool.material = ToolMaterial::Hss;
  tool.angle = angle;
  tool.neck_diameter = neck;
  return tool;
}

TEST(deflection, kienzle_force_hand_worked) {
  // Low-carbon steel kc11 1500 N/mm^2, mc 0.25 (turning catalogue table per
  // ISO 513 group P, from memory; data/materials.toml). At h = 0.1 mm:
  // kc = 1500 x 0.1^-0.25 = 1500 x 1.778279 = 2667.419 N/mm^2; with b = 2 mm,
  // Fc = kc b h = 533.484 N (hand-computed).
  const auto& steel = material("1018");
  EXPECT_NEAR(specific_cutting_force(steel, 0.1), 2667.419, 1e-3);
  EXPECT_NEAR(cutting_force(steel, 2, 0.1), 533.484, 1e-3);
  EXPECT_NEAR(specific_cutting_force(steel, 1.0), 1500, 1e-9);  // kc11 is kc at h = 1 mm
  EXPECT_EQ(cutting_force(steel, 2, 0), 0);
}

TEST(deflection, cantilever_hand_worked) {
  // Euler-Bernoulli cantilever d = F L^3 / (3 E I), I = pi d^4 / 64 (domain
  // brief). F = 100 N, L = 50 mm, d = 10 mm, E = 200 000 N/mm^2:
  // I = pi 10^4 / 64 = 490.8739 mm^4; d = 100 x 125 000 / (3 x 200 000 x 490.8739)
  //   = 12 500 000 / 294 524 311 = 0.0424413 mm (hand-computed).
  EXPECT_NEAR(round_second_moment(10), 490.8739, 1e-4);
  EXPECT_NEAR(cantilever_deflection(100, 50, 10, 200'000), 0.0424413, 1e-7);
}

TEST(deflection, moduli_from_the_brief) {
  // HSS about 200 GPa, carbide 550-650 GPa (domain brief; carbide range from memory).
  EXPECT_EQ(youngs_modulus(ToolMaterial::Hss), 200'000);
  EXPECT_GE(youngs_modulus(ToolMaterial::Carbide), 550'000);
  EXPECT_LE(youngs_modulus(ToolMaterial::Carbide), 650'000);
}

TEST(deflection, stepped_cantilever_with_one_diameter_is_the_uniform_one) {
  const std::vector<BeamSection> one = {{20, 10}, {30, 10}};
  EXPECT_NEAR(stepped_cantilever_deflection(100, 50, one, 200'000),
              cantilever_deflection(100, 50, 10, 200'000), 1e-15);
  // Load part-way along: the beam beyond the load does not matter.
  EXPECT_NEAR(stepped_cantilever_deflection(100, 35, one, 200'000),
              cantilever_deflection(100, 35, 10, 200'000), 1e-15);
  const std::vector<BeamSection> many = {{5, 8}, {5, 8}, {12, 8}, {3, 8}};
  EXPECT_NEAR(stepped_cantilever_deflection(40, 25, many, 600'000),
              cantilever_deflection(40, 25, 8, 600'000), 1e-15);
}

TEST(deflection, stepped_cantilever_hand_worked) {
  // Shank 12 mm x 30 mm, then neck 6 mm x 20 mm, F = 50 N at the tip (a = 50),
  // E = 200 000. Moment-area: d = F/(3E) [(50^3 - 20^3)/I1 + 20^3/I2],
  // I1 = 1017.876, I2 = 63.6173: 50/600000 x (114.945 + 125.752) = 0.0200581 mm.
  EXPECT_NEAR(stepped_cantilever_deflection(50, 50, {{30, 12}, {20, 6}}, 200'000), 0.0200581, 1e-7);
  // Stiffer than a 6 mm bar, softer than a 12 mm bar of the whole length.
  EXPECT_GT(stepped_cantilever_deflection(50, 50, {{30, 12}, {20, 6}}, 200'000),
            cantilever_deflection(50, 50, 12, 200'000));
  EXPECT_LT(stepped_cantilever_deflection(50, 50, {{30, 12}, {20, 6}}, 200'000),
            cantilever_deflection(50, 50, 6, 200'000));
}

TEST(deflection, tool_beam_defaults) {
  // End mill 12 mm x 24 mm flutes, no body data: shank 12 mm, stickout
  // 24 + 6 = 30 mm, flutes as a 9.6 mm bar (assumptions in deflection.hpp).
  const auto beam = tool_beam(end_mill(12, 4, 24, ToolMaterial::Carbide));
  ASSERT_EQ(beam.sections.size(), 2u);
  EXPECT_EQ(beam.sections[0], (BeamSection{6, 12}));
  EXPECT_EQ(beam.sections[1].length, 24);
  EXPECT_NEAR(beam.sections[1].diameter, 9.6, 1e-12);
  EXPECT_EQ(beam.modulus, carbide_modulus);
  EXPECT_TRUE(beam.stickout_assumed);
  EXPECT_TRUE(beam.shank_assumed);
  // Dovetail cutter 25 mm, 60 deg, 10 mm flutes, 8 mm neck: small diameter
  // 25 - 20 cot 60 = 13.453, head 0.8 x that = 10.762; neck 12.5 long;
  // shank 12.5; stickout 10 + 12.5 + 12.5 = 35.
  const auto dovetail = tool_beam(dovetail_cutter(25, 60, 10, 8));
  ASSERT_EQ(dovetail.sections.size(), 3u);
  EXPECT_EQ(dovetail.sections[0], (BeamSection{12.5, 12.5}));
  EXPECT_EQ(dovetail.sections[1], (BeamSection{12.5, 8}));
  EXPECT_NEAR(dovetail.sections[2].diameter, 0.8 * (25 - 20 / std::sqrt(3.0)), 1e-12);
  EXPECT_NEAR(dovetail.length(), 35, 1e-12);
  // A given stickout shorter than the default neck shortens the neck.
  auto short_one = dovetail_cutter(25, 60, 10, 8);
  short_one.stickout = 15;
  short_one.shank_diameter = 16;
  const auto short_beam = tool_beam(short_one);
  EXPECT_EQ(short_beam.sections[0], (BeamSection{0, 16}));
  EXPECT_EQ(short_beam.sections[1], (BeamSection{5, 8}));
  EXPECT_FALSE(short_beam.stickout_assumed);
}

TEST(deflection, slot_in_mild_steel_hand_worked) {
  // HSS end mill 10 mm, 4 flutes, 20 mm flutes, stickout 30, shank 10; full
  // slot (phi = 180 deg), ap 5 mm, fz 0.05 mm, steel 1500 / 0.25 (catalogue
  // table, from memory; data/materials.toml), with the force model in
  // deflection.hpp (Kienzle in milling form, from memory):
  //   one tooth: 1500 x 5 x 0.05^0.75 = 793.03 N
  //   mean: h_m = 2 fz / pi = 0.031831; 1500 x 5 x 0.031831^0.75 x (4/2) = 1130.39 N
  // The load acts at 30 - 5/2 = 27.5 mm from the holder; the beam is the
  // shank {10 mm long, 10 mm} then the flutes {20 mm, 0.8 x 10 = 8 mm}:
  //   d = F/(3E) [(27.5^3 - 17.5^3)/I(10) + 17.5^3/I(8)]
  //     = 1130.391 / 600 000 x (31.4490 + 26.6553) = 0.109468 mm (hand-computed).
  auto tool = end_mill(10, 4, 20, ToolMaterial::Hss);
  tool.stickout = 30;
  tool.shank_diameter = 10;
  const auto estimate = predict_deflection(tool, material("1018"), {10, 5, 0.05});
  EXPECT_NEAR(estimate.engagement_angle, pi, 1e-12);
  EXPECT_NEAR(estimate.chip_thickness, 0.05, 1e-12);
  EXPECT_NEAR(estimate.teeth_in_cut, 2, 1e-12);
  EXPECT_NEAR(estimate.force, 1130.391, 1e-3);
  EXPECT_NEAR(estimate.deflection, 0.109468, 1e-6);
}

TEST(deflection, carbide_springs_a_third_of_hss) {
  auto hss = end_mill(10, 4, 20, ToolMaterial::Hss);
  auto carbide = hss;
  carbide.material = ToolMaterial::Carbide;
  const PassLoad pass{2, 10, 0.03};
  EXPECT_NEAR(predict_deflection(carbide, material("brass"), pass).deflection,
              predict_deflection(hss, material("brass"), pass).deflection / 3, 1e-12);
}

// Random valid tools and passes, fixed seed.
struct RandomCase {
  Tool tool;
  const Material* material = nullptr;
  StepSearch search;
};

RandomCase random_case(std::mt19937_64& rng) {
  std::uniform_real_distribution<double> unit(0, 1);
  const auto between = [&](double lo, double hi) { return lo + (hi - lo) * unit(rng); };
  const auto& materials = builtin_materials().materials;
  RandomCase c;
  c.material = &materials[rng() % materials.size()];
  if (rng() % 2) {
    const double d = between(3, 25);
    c.tool = end_mill(d, 2 + static_cast<int>(rng() % 5), d * between(1, 3),
                      rng() % 2 ? ToolMaterial::Hss : ToolMaterial::Carbide);
  } else {
    const double d = between(10, 40);
    const double angle = rng() % 2 ? 60.0 : 45.0;
    const double flutes = between(0.1, 0.3) * d * std::tan(radians(angle));
    const double small = d - 2 * flutes / std::tan(radians(angle));
    c.tool = dovetail_cutter(d, angle, flutes, small * between(0.4, 1.0));
    if (rng() % 2) c.tool.material = ToolMaterial::Carbide;
  }
  if (rng() % 2) c.tool.stickout = c.tool.flute_length * between(1.2, 4);
  c.search.axial_length = c.tool.flute_length * between(0.1, 1);
  c.search.chip_load = between(0.005, 0.1);
  c.search.deflection_limit = between(0.001, 0.05);
  c.search.feed_raised_for_chip_thinning = rng() % 2;
  return c;
}

double deflection_at(const RandomCase& c, double step) {
  double fz = c.search.chip_load;
  if (c.search.feed_raised_for_chip_thinning)
    fz *= chip_thinning_factor(step, c.tool.diameter, c.search.chip_thinning_limit);
  return predict_deflection(c.tool, *c.material, {step, c.search.axial_length, fz}).deflection;
}

TEST(deflection, deflection_never_falls_as_the_step_grows) {
  std::mt19937_64 rng(20261202);
  for (int n = 0; n < 200; ++n) {
    const auto c = random_case(rng);
    double previous = 0;
    for (int i = 1; i <= 100; ++i) {
      const double d = deflection_at(c, c.tool.diameter * i / 100.0);
      EXPECT_GE(d, previous * (1 - 1e-12)) << "case " << n << " step " << i;
      previous = d;
    }
  }
}

TEST(deflection, max_radial_step_stays_under_the_limit_and_is_the_largest) {
  std::mt19937_64 rng(7);
  int limited = 0;
  for (int n = 0; n < 500; ++n) {
    const auto c = random_case(rng);
    const double step = max_radial_step(c.tool, *c.material, c.search);
    ASSERT_GT(step, 0) << "case " << n;
    ASSERT_LE(step, c.tool.diameter) << "case " << n;
    EXPECT_LE(deflection_at(c, step), c.search.deflection_limit) << "case " << n;
    if (step < c.tool.diameter) {
      ++limited;
      EXPECT_GT(deflection_at(c, step + 1e-6 * c.tool.diameter), c.search.deflection_limit)
          << "case " << n;
    }
  }
  EXPECT_GT(limited, 100);  // the property is exercised, not only the full-width answer
}

TEST(deflection, max_radial_step_respects_the_largest_step) {
  auto tool = end_mill(10, 4, 20, ToolMaterial::Carbide);
  const StepSearch easy{
      .axial_length = 1, .chip_load = 0.01, .deflection_limit = 1.0, .largest_step = 3};
  EXPECT_EQ(max_radial_step(tool, material("acetal"), easy), 3);
  const StepSearch hard{.axial_length = 20, .chip_load = 0.05, .deflection_limit = 0.005};
  const double step = max_radial_step(tool, material("4140"), hard);
  EXPECT_GT(step, 0);
  EXPECT_LT(step, 10);
  // Tighter limit, smaller step.
  auto tighter = hard;
  tighter.deflection_limit = 0.0025;
  EXPECT_LT(max_radial_step(tool, material("4140"), tighter), step);
}

}  // namespace
}  // namespace dovetailor
