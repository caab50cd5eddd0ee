#include <algorithm>
#include <cassert>
#include <cmath>

#include <dovetailor/shop/cutting_data.hpp>
#include <dovetailor/shop/deflection.hpp>

namespace dovetailor {

double youngs_modulus(ToolMaterial material) {
  return material == ToolMaterial::Carbide ? carbide_modulus : hss_modulus;
}

double specific_cutting_force(const Material& material, double chip_thickness) {
  assert(chip_thickness > 0);
  return material.kc11 * std::pow(chip_thickness, -material.mc);
}

double cutting_force(const Material& material, double chip_width, double chip_thickness) {
  assert(chip_width >= 0 && chip_thickness >= 0);
  if (chip_thickness == 0) return 0;
  return specific_cutting_force(material, chip_thickness) * chip_width * chip_thickness;
}

double round_second_moment(double diameter) { return pi * std::pow(diameter, 4) / 64.0; }

double cantilever_deflection(double force, double length, double diameter, double modulus) {
  return force * std::pow(length, 3) / (3.0 * modulus * round_second_moment(diameter));
}

double stepped_cantilever_deflection(double force, double load_at,
                                     const std::vector<BeamSection>& sections, double modulus) {
  assert(modulus > 0 && load_at >= 0);
  double sum = 0;
  double start = 0;
  for (const auto& section : sections) {
    if (start >= load_at) break;
    assert(section.length >= 0 && section.diameter > 0);
    const double end = std::min(start + section.length, load_at);
    sum += (std::pow(load_at - start, 3) - std::pow(load_at - end, 3)) /
           round_second_moment(section.diameter);
    start = end;
  }
  assert(start >= load_at - 1e-9 * load_at && "the load lies beyond the end of the beam");
  return force * sum / (3.0 * modulus);
}

double ToolBeam::length() const {
  double total = 0;
  for (const auto& s : sections) total += s.length;
  return total;
}

ToolBeam tool_beam(const Tool& tool) {
  assert(tool.diameter > 0 && tool.flute_length > 0);
  ToolBeam beam;
  beam.modulus = youngs_modulus(tool.material);
  const BodyDimensions d = body_dimensions(tool);
  beam.shank_assumed = d.shank_assumed;
  beam.stickout_assumed = d.stickout_assumed;
  if (tool.kind != ToolKind::Dovetail) {
    beam.sections = {{d.stickout - tool.flute_length, d.shank_diameter},
                     {tool.flute_length, fluted_diameter_factor * tool.diameter}};
  } else {
    const double head = std::max(d.neck_diameter, fluted_diameter_factor * d.flute_top_diameter);
    beam.sections = {{d.stickout - tool.flute_length - d.neck_length, d.shank_diameter},
                     {d.neck_length, d.neck_diameter},
                     {tool.flute_length, head}};
  }
  return beam;
}

DeflectionEstimate predict_deflection(const Tool& tool, const Material& material,
                                      const PassLoad& pass) {
  assert(pass.radial_step >= 0 && pass.axial_length > 0 && pass.feed_per_tooth >= 0);
  DeflectionEstimate out;
  const double lead = tool.kind == ToolKind::Dovetail ? radians(tool.angle) : pi / 2;
  const double phi = engagement_angle(pass.radial_step, tool.diameter);
  const double ap = std::min(pass.axial_length, tool.flute_length);
  const double width = ap / std::sin(lead);
  const double fz = pass.feed_per_tooth * std::sin(lead);
  out.engagement_angle = phi;
  out.chip_thickness = fz * std::sin(std::min(phi, pi / 2));
  out.mean_chip_thickness = phi > 0 ? fz * (1 - std::cos(phi)) / phi : 0;
  out.teeth_in_cut = tool.flutes * phi / (2 * pi);
  const double peak = cutting_force(material, width, out.chip_thickness);
  const double mean = cutting_force(material, width, out.mean_chip_thickness) * out.teeth_in_cut;
  out.force = std::max(peak, mean);
  const auto beam = tool_beam(tool);
  const double load_at = beam.length() - ap / 2;
  out.deflection = stepped_cantilever_deflection(out.force, load_at, beam.sections, beam.modulus);
  return out;
}

double max_radial_step(const Tool& tool, const Material& material, const StepSearch& search) {
  assert(search.deflection_limit > 0 && search.chip_load > 0);
  const auto deflection = [&](double step) {
    double fz = search.chip_load;
    if (search.feed_raised_for_chip_thinning)
      fz *= chip_thinning_factor(step, tool.diameter, search.chip_thinning_limit);
    return predict_deflection(tool, material, {step, search.axial_length, fz}).deflection;
  };
  const double largest = search.largest_step > 0 ? search.largest_step : tool.diameter;
  if (deflection(largest) <= search.deflection_limit) return largest;
  double low = 0;  // within the limit (no cut, no force)
  double high = largest;
  while (high - low > 1e-9 * tool.diameter) {
    const double mid = 0.5 * (low + high);
    (deflection(mid) <= search.deflection_limit ? low : high) = mid;
  }
  return low;
}

}  // namespace dovetailor
