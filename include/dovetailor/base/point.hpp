#pragma once

namespace dovetailor {

// A point in the section plane across the slide: x lateral, z up (mm).
struct Point2 {
  double x = 0;
  double z = 0;

  bool operator==(const Point2&) const = default;
};

// A point in work coordinates (mm): x lateral, y along the slide, z up.
struct Point3 {
  double x = 0;
  double y = 0;
  double z = 0;

  bool operator==(const Point3&) const = default;
};

}  // namespace dovetailor
