#include <cmath>

#include <gtest/gtest.h>

#include <dovetailor/geometry/tool_body.hpp>
#include <dovetailor/shop/deflection.hpp>

namespace dovetailor {
namespace {

// A 3/4 in 60 degree dovetail cutter with 5/16 in of flutes (example).
Tool dovetail_cutter() {
  Tool t;
  t.kind = ToolKind::Dovetail;
  t.diameter = 19.05;
  t.flute_length = 7.9375;
  t.angle = 60;
  t.neck_diameter = 9.0;
  t.corner_radius = 0.4;
  t.shank_diameter = 9.525;
  t.stickout = 40;
  t.holder_diameter = 32;
  return t;
}

const BodySection& part(const ToolBody& body, BodyPart which) {
  for (const BodySection& s : body.sections)
    if (s.part == which) return s;
  throw std::logic_error("missing body part");
}

TEST(tool_body, dovetail_small_diameter_follows_the_cone) {
  // Small diameter = D - 2*h_f*cot(a) (domain brief, "The dovetail cutter").
  const Tool t = dovetail_cutter();
  const ToolBody body = tool_body(t);
  const BodySection& flutes = part(body, BodyPart::Flutes);
  const double small = 19.05 - 2 * 7.9375 / std::tan(radians(60));
  EXPECT_NEAR(2 * flutes.radius_at(t.flute_length), small, 1e-12);
  EXPECT_NEAR(flutes.top(), 7.9375, 1e-12);
  // The cone line passes through the sharp corner at D/2 on the tip plane.
  const double h = 5.0;
  EXPECT_NEAR(flutes.radius_at(h), 19.05 / 2 - h / std::tan(radians(60)), 1e-12);
}

TEST(tool_body, dovetail_corner_round_is_tangent_to_face_and_cone) {
  // Fillet of radius rc in a corner of angle a: tangent points rc*cot(a/2)
  // from the corner (plane geometry).
  const Tool t = dovetail_cutter();
  const ToolBody body = tool_body(t);
  const BodySection& flutes = part(body, BodyPart::Flutes);
  const double tangent = 0.4 / std::tan(radians(30));
  EXPECT_NEAR(flutes.profile[1].radius, 19.05 / 2 - tangent, 1e-12);
  EXPECT_EQ(flutes.profile[1].height, 0);
  // The widest point of the round: centre radius + rc, less at most the
  // chord tolerance (0.1 um) since chords lie inside the arc.
  EXPECT_LE(flutes.max_radius(), 19.05 / 2 - tangent + 0.4);
  EXPECT_GE(flutes.max_radius(), 19.05 / 2 - tangent + 0.4 - 1e-4);
  // Every chord point lies on the round (inscribed chords).
  const ProfilePoint centre{0.4, 19.05 / 2 - tangent};
  for (std::size_t i = 1; i + 1 < flutes.profile.size(); ++i) {
    const auto& p = flutes.profile[i];
    EXPECT_NEAR(std::hypot(p.height - centre.height, p.radius - centre.radius), 0.4, 1e-12);
  }
  // Chord error within the default 0.1 um: midpoint of a chord to the arc.
  const auto& a = flutes.profile[1];
  const auto& b = flutes.profile[2];
  const double mid = std::hypot((a.height + b.height) / 2 - centre.height,
                                (a.radius + b.radius) / 2 - centre.radius);
  EXPECT_LE(0.4 - mid, 1e-4);
}

TEST(tool_body, dovetail_parts_stack_up_to_the_holder) {
  const ToolBody body = tool_body(dovetail_cutter());
  ASSERT_EQ(body.sections.size(), 4u);
  EXPECT_EQ(body.sections[0].part, BodyPart::Flutes);
  EXPECT_EQ(body.sections[1].part, BodyPart::Neck);
  EXPECT_EQ(body.sections[2].part, BodyPart::Shank);
  EXPECT_EQ(body.sections[3].part, BodyPart::Holder);
  // The neck is assumed half the large diameter long; the shank runs to the
  // stickout.
  EXPECT_NEAR(body.sections[1].top(), 7.9375 + 19.05 / 2, 1e-12);
  EXPECT_NEAR(body.radius_at(10), 4.5, 1e-12);
  EXPECT_NEAR(body.radius_at(30), 9.525 / 2, 1e-12);
  EXPECT_NEAR(body.radius_at(50), 16, 1e-12);
  EXPECT_EQ(body.top(), 1000);
  EXPECT_EQ(body_part_name(body.sections[1].part), "neck");
}

// What the job leaves out is assumed once, for the planner, the deflection
// beam and the checker alike (tool_body.hpp): a neck half the large diameter
// long, a shank half the large diameter (not less than the neck), a stickout
// of flutes + neck + shank, and no holder without a holder diameter.
TEST(tool_body, a_cutter_without_body_data_gets_the_one_set_of_assumptions) {
  Tool t = dovetail_cutter();
  t.shank_diameter.reset();
  t.stickout.reset();
  t.holder_diameter.reset();
  const BodyDimensions d = body_dimensions(t);
  EXPECT_TRUE(d.shank_assumed);
  EXPECT_TRUE(d.stickout_assumed);
  EXPECT_NEAR(d.neck_length, 19.05 / 2, 1e-12);
  EXPECT_NEAR(d.shank_diameter, 19.05 / 2, 1e-12);
  EXPECT_NEAR(d.stickout, 7.9375 + 19.05 / 2 + 19.05 / 2, 1e-12);
  EXPECT_FALSE(d.holder_diameter);
  const ToolBody body = tool_body(t);
  ASSERT_EQ(body.sections.size(), 3u);
  EXPECT_NEAR(body.sections[1].top(), 7.9375 + 19.05 / 2, 1e-12);
  EXPECT_NEAR(body.radius_at(20), 19.05 / 4, 1e-12);
  EXPECT_NEAR(body.radius_at(500), 19.05 / 4, 1e-12);
  // The beam the deflection is worked out on has the same parts.
  const ToolBeam beam = tool_beam(t);
  ASSERT_EQ(beam.sections.size(), 3u);
  EXPECT_NEAR(beam.length(), d.stickout, 1e-12);
  EXPECT_NEAR(beam.sections[1].length, d.neck_length, 1e-12);
  EXPECT_NEAR(beam.sections[0].diameter, d.shank_diameter, 1e-12);
  // A holder diameter alone puts the holder at the assumed stickout.
  t.holder_diameter = 32;
  EXPECT_NEAR(tool_body(t).radius_at(d.stickout + 1), 16, 1e-12);
}

TEST(tool_body, end_mill_defaults_shank_to_its_diameter_without_holder) {
  Tool t;
  t.kind = ToolKind::EndMill;
  t.diameter = 12;
  t.flute_length = 25;
  const ToolBody body = tool_body(t);
  ASSERT_EQ(body.sections.size(), 2u);
  EXPECT_EQ(body.sections[0].profile, (std::vector<ProfilePoint>{{0, 0}, {0, 6}, {25, 6}}));
  EXPECT_EQ(body.sections[1].part, BodyPart::Shank);
  EXPECT_EQ(body.radius_at(500), 6);
  EXPECT_EQ(body.max_radius(), 6);
}

TEST(tool_body, bull_nose_end_mill_rounds_its_corner) {
  Tool t;
  t.kind = ToolKind::EndMill;
  t.diameter = 10;
  t.flute_length = 20;
  t.corner_radius = 1;
  const ToolBody body = tool_body(t);
  const BodySection& flutes = part(body, BodyPart::Flutes);
  EXPECT_NEAR(flutes.radius_at(0), 4, 1e-12);
  EXPECT_NEAR(flutes.radius_at(1), 5, 1e-12);
  // On the round (centre at height 1, radius 4) within the chord tolerance,
  // measured normal to the arc, and never outside it.
  const double from_centre = std::hypot(0.5 - 1, flutes.radius_at(0.5) - 4);
  EXPECT_LE(from_centre, 1 + 1e-12);
  EXPECT_GE(from_centre, 1 - 1e-4);
}

TEST(tool_body, drill_point_is_a_cone_of_its_point_angle) {
  // A 10 mm drill with the usual 118 deg point (common practice, no
  // source): the point is r / tan(59 deg) = 3.0043 mm long (right-triangle
  // trigonometry), then the body runs at the full diameter.
  Tool t;
  t.kind = ToolKind::Drill;
  t.diameter = 10;
  t.flute_length = 40;
  const ToolBody body = tool_body(t);
  const BodySection& flutes = part(body, BodyPart::Flutes);
  const double point = 5 / std::tan(radians(59));
  EXPECT_NEAR(point, 3.0043, 1e-4);
  EXPECT_NEAR(flutes.radius_at(0), 0, 1e-12);
  EXPECT_NEAR(flutes.radius_at(point / 2), 2.5, 1e-12);
  EXPECT_NEAR(flutes.radius_at(point), 5, 1e-12);
  EXPECT_NEAR(flutes.radius_at(20), 5, 1e-12);
  EXPECT_NEAR(flutes.top(), 40, 1e-12);
  EXPECT_EQ(part(body, BodyPart::Shank).max_radius(), 5);
}

TEST(tool_body, chamfer_mill_widens_from_its_tip_at_half_its_angle) {
  // A 90 deg chamfer mill, 12 mm across with a 2 mm tip: radius 1 + h
  // (tan 45 deg = 1) up to 6 mm at h = 5 mm.
  Tool t;
  t.kind = ToolKind::ChamferMill;
  t.diameter = 12;
  t.tip_diameter = 2;
  t.angle = 90;
  t.flute_length = 8;
  const ToolBody body = tool_body(t);
  const BodySection& flutes = part(body, BodyPart::Flutes);
  EXPECT_NEAR(flutes.radius_at(0), 1, 1e-12);
  EXPECT_NEAR(flutes.radius_at(2.5), 3.5, 1e-12);
  EXPECT_NEAR(flutes.radius_at(5), 6, 1e-12);
  EXPECT_NEAR(flutes.radius_at(7), 6, 1e-12);
  // 60 deg included: radius grows by tan 30 deg = 0.57735 per mm.
  t.angle = 60;
  t.flute_length = 9;
  EXPECT_NEAR(part(tool_body(t), BodyPart::Flutes).radius_at(3), 1 + 3 * std::tan(radians(30)),
              1e-12);
}

}  // namespace
}  // namespace dovetailor
