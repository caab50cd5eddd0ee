#pragma once

#include <array>
#include <optional>
#include <string>
#include <vector>

#include <dovetailor/base/words.hpp>
#include <dovetailor/geometry/dovetail_section.hpp>

namespace dovetailor {

// Measurement of dovetails over (male) or between (female) precision pins,
// after the handbook method for measuring dovetail slides with rolls
// (Machinery's Handbook, "Measuring Dovetail Slides"): with k = 1 + cot(a/2),
//   male   M = W_bottom + D*k
//   female P = W_bottom - D*k
// where W_bottom is the width at the base plane the pins rest on.

// k = 1 + cot(a/2); 2.7320508 for a = 60 degrees.
double pin_constant(double angle);

// Height above the base plane where a pin of diameter D touches a flank at
// angle a: (D/2)(1 + cos a).
double contact_height(double pin_diameter, double angle);

// How a dovetail is read with pins.
enum class ReadingMethod {
  OverPins,         // male, both flanks angled: micrometer over two pins
  BetweenPins,      // female, both flanks angled: inside measurement between two pins
  SquareSideToPin,  // one flank angled: from the square flank to one pin
};

// Keys for JSON ("over-pins"), words for reports ("over 2 pins").
constexpr std::array<EnumWord<ReadingMethod>, 3> word_table(ReadingMethod) {
  return {
      {{ReadingMethod::OverPins, "over-pins", "over 2 pins"},
       {ReadingMethod::BetweenPins, "between-pins", "between 2 pins"},
       {ReadingMethod::SquareSideToPin, "square-side-to-pin", "from the square side to 1 pin"}}};
}

struct PinReading {
  ReadingMethod method = ReadingMethod::OverPins;
  int pins = 2;
  double pin_diameter = 0;
  double value = 0;  // the reading, mm

  bool operator==(const PinReading&) const = default;
};

ReadingMethod reading_method(DovetailType type, int angled_flanks);

// The reading for a width at the base plane (as cut), and back. With one
// angled flank the pin adds (D/2)*k to the square-side-to-corner distance
// (male) or takes it away (female).
double reading_for_width(DovetailType type, int angled_flanks, double width_bottom,
                         double pin_diameter, double angle);
double width_for_reading(DovetailType type, int angled_flanks, double reading, double pin_diameter,
                         double angle);

// The reading the finished section gives with pins of diameter D.
PinReading reading_of(const DovetailSection& section, double pin_diameter);

// A pin resting on the base plane in the corner of one flank: its centre, and
// the lateral position of the edge a micrometer or height gauge touches (the
// edge away from the flank on a male, toward the void's middle on a female).
struct PinPlacement {
  Point2 center;
  double measuring_edge_x = 0;
  double contact_height = 0;  // above the base plane

  bool operator==(const PinPlacement&) const = default;
};
PinPlacement place_pin(const DovetailSection& section, Side side, double pin_diameter);

// The reading from a reference face at lateral position `reference_x` (for
// instance a side face of the stock, the part stood on it on a surface plate)
// to the measuring edge of one pin in the corner of `side`.
double reference_reading(const DovetailSection& section, Side side, double pin_diameter,
                         double reference_x);

// The stock's side faces in work X. A male's shelf runs from the root of
// each flank out to the face on its side.
struct StockFaces {
  double left = 0;
  double right = 0;

  bool operator==(const StockFaces&) const = default;
};
StockFaces stock_faces(const Job& job);

// Why a pin cannot measure this dovetail, each reason in words:
//  - its contact point lies above the flank (into the chamfer or past the
//    top plane);
//  - it is no larger than the corner radius the cutter leaves and would rest
//    on the fillet;
//  - female: the pins do not fit beside each other on the floor. Two pins'
//    centres lie W_bottom - D cot(a/2) apart, and they overlap or touch when
//    that is D or less, that is when the reading P = W_bottom - D k <= 0
//    (with one angled flank, the pin reaches (D/2) k from the corner toward
//    the square flank: W_bottom - (D/2) k <= 0);
//  - male, when `stock` is given: the pin cannot rest on the shelf, because
//    its contact with the shelf (under its centre, r cot(a/2) out from the
//    root corner) lies at or beyond the stock face.
// Empty when the pin is usable.
std::vector<std::string> pin_problems(const DovetailSection& section, double pin_diameter,
                                      double corner_radius, Units units,
                                      const std::optional<StockFaces>& stock = std::nullopt);

// The largest pin that the section holds: the contact below the chamfer, the
// pins apart on a female floor, the pin on a male's shelf (when `stock` is
// given). Pins must be smaller than this.
double largest_usable_pin(const DovetailSection& section,
                          const std::optional<StockFaces>& stock = std::nullopt);

// The largest pin whose contact point stays below the chamfer:
// D < 2(H - chamfer)/(1 + cos a).
double largest_pin(double depth, double chamfer, double angle);

struct PinAdvice {
  double diameter = 0;  // mm
  double contact_height = 0;
  bool middle_third = false;  // contact in the middle third of the usable flank

  bool operator==(const PinAdvice&) const = default;
};

// Common gauge-pin and roll sizes in `units` (fractional inch sizes from
// 1/16 to 1 in; metric 1 to 25 mm), as mm. Common practice, no source.
std::vector<double> common_pin_sizes(Units units);

// The usable sizes (no pin_problems) of the common series for this section, smallest first,
// with those whose contact lands in the middle third of the usable flank
// marked; a contact there is the comfortable choice (common practice).
std::vector<PinAdvice> advise_pins(const DovetailSection& section, double corner_radius,
                                   Units units,
                                   const std::optional<StockFaces>& stock = std::nullopt);

}  // namespace dovetailor
