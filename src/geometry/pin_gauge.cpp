#include <algorithm>
#include <cmath>

#include <fmt/format.h>

#include <dovetailor/base/length.hpp>
#include <dovetailor/geometry/pin_gauge.hpp>

namespace dovetailor {

double pin_constant(double angle) { return 1.0 + cot_deg(angle / 2); }

double contact_height(double pin_diameter, double angle) {
  return pin_diameter / 2 * (1 + std::cos(radians(angle)));
}

ReadingMethod reading_method(DovetailType type, int angled_flanks) {
  if (angled_flanks < 2) return ReadingMethod::SquareSideToPin;
  return type == DovetailType::Male ? ReadingMethod::OverPins : ReadingMethod::BetweenPins;
}

namespace {
// What the pins add to (male) or take from (female) the base-plane width.
double pin_offset(DovetailType type, int angled_flanks, double pin_diameter, double angle) {
  const double per_pin = pin_diameter / 2 * pin_constant(angle);
  const double sign = type == DovetailType::Male ? 1.0 : -1.0;
  return sign * angled_flanks * per_pin;
}
}  // namespace

double reading_for_width(DovetailType type, int angled_flanks, double width_bottom,
                         double pin_diameter, double angle) {
  return width_bottom + pin_offset(type, angled_flanks, pin_diameter, angle);
}

double width_for_reading(DovetailType type, int angled_flanks, double reading, double pin_diameter,
                         double angle) {
  return reading - pin_offset(type, angled_flanks, pin_diameter, angle);
}

PinReading reading_of(const DovetailSection& section, double pin_diameter) {
  const int n = section.angled_flanks();
  return {reading_method(section.type, n), n, pin_diameter,
          reading_for_width(section.type, n, section.width_bottom(), pin_diameter, section.angle)};
}

PinPlacement place_pin(const DovetailSection& section, Side side, double pin_diameter) {
  const double r = pin_diameter / 2;
  const Flank& flank = section.flank(side);
  // The centre lies on the bisector of the corner between base plane and
  // flank, r*cot(a/2) from the corner, away from the flank into the void.
  // On a female the void is toward the centre line; on a male, away from it.
  const double along = r * cot_deg(section.angle / 2);
  const double toward_middle = side == Side::Left ? 1.0 : -1.0;
  const double into_void = section.type == DovetailType::Female ? toward_middle : -toward_middle;
  PinPlacement p;
  p.center = {flank.base.x + into_void * along, flank.base.z + r};
  p.measuring_edge_x = p.center.x + into_void * r;
  p.contact_height = contact_height(pin_diameter, section.angle);
  return p;
}

double reference_reading(const DovetailSection& section, Side side, double pin_diameter,
                         double reference_x) {
  return std::abs(place_pin(section, side, pin_diameter).measuring_edge_x - reference_x);
}

double largest_pin(double depth, double chamfer, double angle) {
  return 2 * (depth - chamfer) / (1 + std::cos(radians(angle)));
}

StockFaces stock_faces(const Job& job) { return {stock_left_x(job), stock_right_x(job)}; }

namespace {

// The pins of a female fit beside each other (or beside the square flank)
// while the reading between them is positive (pin_gauge.hpp).
double female_room(const DovetailSection& section, double pin_diameter) {
  return reading_of(section, pin_diameter).value;
}

// How far the contact of a pin with a male's shelf, under its centre, lies
// inside the stock face on that side (negative: beyond it).
double shelf_room(const DovetailSection& section, Side side, double pin_diameter,
                  const StockFaces& stock) {
  const double x = place_pin(section, side, pin_diameter).center.x;
  return side == Side::Left ? x - stock.left : stock.right - x;
}

}  // namespace

double largest_usable_pin(const DovetailSection& section, const std::optional<StockFaces>& stock) {
  double largest = largest_pin(section.depth, section.chamfer, section.angle);
  const double k = pin_constant(section.angle);
  if (section.type == DovetailType::Female) {
    // W_bottom - n (D/2) k > 0.
    largest = std::min(largest, 2 * section.width_bottom() / (section.angled_flanks() * k));
  } else if (stock) {
    // (D/2) cot(a/2) < shelf width on each angled side.
    for (Side side : {Side::Left, Side::Right}) {
      const Flank& f = section.flank(side);
      if (!f.angled) continue;
      const double shelf = side == Side::Left ? f.base.x - stock->left : stock->right - f.base.x;
      largest = std::min(largest, 2 * shelf / cot_deg(section.angle / 2));
    }
  }
  return largest;
}

std::vector<std::string> pin_problems(const DovetailSection& section, double pin_diameter,
                                      double corner_radius, Units units,
                                      const std::optional<StockFaces>& stock) {
  std::vector<std::string> problems;
  const auto show = [&](double mm) { return fmt::format("{}", shown(mm, units)); };
  const double usable = section.depth - section.chamfer;
  const double h = contact_height(pin_diameter, section.angle);
  if (h >= usable) {
    problems.push_back(fmt::format(
        "a {} pin touches the flank {} above the base plane, but the flank ends at {}{}; "
        "use a pin smaller than {}",
        show(pin_diameter), show(h), show(usable),
        section.chamfer > 0 ? " (below the chamfer)" : "",
        show(largest_pin(section.depth, section.chamfer, section.angle))));
  }
  if (pin_diameter / 2 <= corner_radius) {
    problems.push_back(fmt::format(
        "a {} pin is no larger than the {} corner radius the cutter leaves: it would rest on "
        "the fillet and read wrong; use a pin larger than {}",
        show(pin_diameter), show(corner_radius), show(2 * corner_radius)));
  }
  if (section.type == DovetailType::Female && female_room(section, pin_diameter) <= 0) {
    const bool two = section.angled_flanks() == 2;
    problems.push_back(fmt::format(
        "{} pins do not fit on the {} floor: {} (the reading between them would be {}); use a "
        "pin smaller than {}",
        show(pin_diameter), show(section.width_bottom()),
        two ? "two of them overlap or touch, their centres less than one diameter apart"
            : "one in the corner reaches the square flank",
        show(female_room(section, pin_diameter)), show(largest_usable_pin(section, stock))));
  }
  if (section.type == DovetailType::Male && stock) {
    for (Side side : {Side::Left, Side::Right}) {
      if (!section.flank(side).angled) continue;
      const double room = shelf_room(section, side, pin_diameter, *stock);
      if (room > 0) continue;
      problems.push_back(fmt::format(
          "a {} pin in the {} corner cannot rest on the shelf: its contact with the shelf, "
          "under its centre, lies at or beyond the stock face (by {}); use a pin smaller "
          "than {}",
          show(pin_diameter), side == Side::Left ? "left" : "right", show(-room),
          show(largest_usable_pin(section, stock))));
    }
  }
  return problems;
}

std::vector<double> common_pin_sizes(Units units) {
  std::vector<double> sizes;
  if (units == Units::Inch) {
    // Fractional sizes 1/16 .. 1 in by sixteenths: stocked as gauge pins and drill rod.
    for (int sixteenths = 1; sixteenths <= 16; ++sixteenths)
      sizes.push_back(to_mm(sixteenths / 16.0, Units::Inch));
  } else {
    for (double d : {1.0, 1.5, 2.0, 2.5, 3.0, 4.0, 5.0, 6.0, 8.0, 10.0, 12.0, 16.0, 20.0, 25.0})
      sizes.push_back(d);
  }
  return sizes;
}

std::vector<PinAdvice> advise_pins(const DovetailSection& section, double corner_radius,
                                   Units units, const std::optional<StockFaces>& stock) {
  std::vector<PinAdvice> advice;
  const double usable = section.depth - section.chamfer;
  for (double d : common_pin_sizes(units)) {
    if (!pin_problems(section, d, corner_radius, units, stock).empty()) continue;
    const double h = contact_height(d, section.angle);
    advice.push_back({d, h, h >= usable / 3 && h <= 2 * usable / 3});
  }
  return advice;
}

}  // namespace dovetailor
