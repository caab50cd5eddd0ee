#include <cmath>

#include <dovetailor/geometry/dovetail_section.hpp>

namespace dovetailor {

double cot_deg(double angle) { return 1.0 / std::tan(radians(angle)); }

double width_top_from_bottom(DovetailType type, double width_bottom, double depth, double angle,
                             int angled) {
  const double run = angled * depth * cot_deg(angle);
  return type == DovetailType::Female ? width_bottom - run : width_bottom + run;
}

double width_bottom_from_top(DovetailType type, double width_top, double depth, double angle,
                             int angled) {
  const double run = angled * depth * cot_deg(angle);
  return type == DovetailType::Female ? width_top + run : width_top - run;
}

double gib_lateral_allowance(double thickness, double angle) {
  return thickness / std::sin(radians(angle));
}

namespace {
int angled_count(AngledSides sides) { return sides == AngledSides::Both ? 2 : 1; }
}  // namespace

double design_width_bottom(const DovetailSpec& spec) {
  if (spec.width_at == WidthAt::Bottom) return spec.width;
  return width_bottom_from_top(spec.type, spec.width, spec.depth, spec.angle,
                               angled_count(spec.sides));
}

DovetailSection section_of(const DovetailSpec& spec) {
  DovetailSection s;
  s.type = spec.type;
  s.angle = spec.angle;
  s.depth = spec.depth;
  s.chamfer = spec.chamfer;
  const double half = design_width_bottom(spec) / 2;
  const double run = spec.depth * cot_deg(spec.angle);
  // Female flanks lean in toward the mouth, male flanks lean out toward the top.
  const double lean = spec.type == DovetailType::Female ? run : -run;
  const bool left_angled = spec.sides != AngledSides::Right;
  const bool right_angled = spec.sides != AngledSides::Left;
  s.left = {{-half, -spec.depth}, {-half + (left_angled ? lean : 0), 0}, left_angled};
  s.right = {{half, -spec.depth}, {half - (right_angled ? lean : 0), 0}, right_angled};
  if (spec.gib) {
    s.gib_side = spec.gib->side;
    s.gib_allowance = gib_lateral_allowance(spec.gib->thickness, spec.angle);
    // Outward is -X on the left, +X on the right; a male flank moves inward.
    double shift = spec.type == DovetailType::Female ? s.gib_allowance : -s.gib_allowance;
    Flank& f = spec.gib->side == Side::Left ? s.left : s.right;
    if (spec.gib->side == Side::Left) shift = -shift;
    f.base.x += shift;
    f.top.x += shift;
  }
  return s;
}

double band_middle(const Tolerance& tolerance) { return (tolerance.lower + tolerance.upper) / 2; }

DovetailSpec aimed_spec(const DovetailSpec& spec) {
  DovetailSpec aimed = spec;
  aimed.width += band_middle(spec.tolerance);
  return aimed;
}

double flank_x_at(const Flank& flank, double z) {
  const double t = (z - flank.base.z) / (flank.top.z - flank.base.z);
  return flank.base.x + t * (flank.top.x - flank.base.x);
}

std::vector<Point2> part_outline(const DovetailSection& s, double stock_left, double stock_right,
                                 double stock_height) {
  const double floor = -s.depth;
  if (s.type == DovetailType::Female) {
    return {{stock_left, -stock_height},
            {stock_right, -stock_height},
            {stock_right, 0},
            s.right.top,
            s.right.base,
            s.left.base,
            s.left.top,
            {stock_left, 0}};
  }
  return {{stock_left, -stock_height},
          {stock_right, -stock_height},
          {stock_right, floor},
          s.right.base,
          s.right.top,
          s.left.top,
          s.left.base,
          {stock_left, floor}};
}

double flank_taper_slope(const DovetailSpec& spec, Side side) {
  const auto& gib = spec.gib;
  if (!gib || gib->side != side || gib->taper <= 0) return 0;
  const double lateral = 1.0 / (gib->taper * std::sin(radians(spec.angle)));
  const double outward = side == Side::Right ? lateral : -lateral;
  return spec.type == DovetailType::Female ? outward : -outward;
}

DovetailSection section_at(const DovetailSpec& spec, double y) {
  DovetailSection s = section_of(spec);
  for (Side side : {Side::Left, Side::Right}) {
    const double shift = flank_taper_slope(spec, side) * y;
    Flank& f = side == Side::Left ? s.left : s.right;
    f.base.x += shift;
    f.top.x += shift;
  }
  return s;
}

double stock_left_x(const Job& job) { return -job.dovetail.center - job.stock.width / 2; }
double stock_right_x(const Job& job) { return -job.dovetail.center + job.stock.width / 2; }

double toward_flank(DovetailType type, Side side) {
  const bool plus = (type == DovetailType::Female) == (side == Side::Right);
  return plus ? 1.0 : -1.0;
}

}  // namespace dovetailor
