#include <algorithm>
#include <cmath>
#include <map>
#include <string>
#include <utility>

#include <fmt/format.h>

#include <dovetailor/drawing/drawing_scene.hpp>

namespace dovetailor {
namespace {

std::string colour(const Rgb& c) {
  const auto byte = [](double v) {
    return static_cast<int>(std::lround(std::clamp(v, 0.0, 1.0) * 255));
  };
  return fmt::format("#{:02x}{:02x}{:02x}", byte(c.r), byte(c.g), byte(c.b));
}

std::string escape(const std::string& text) {
  std::string out;
  for (char ch : text) {
    switch (ch) {
      case '&':
        out += "&amp;";
        break;
      case '<':
        out += "&lt;";
        break;
      case '>':
        out += "&gt;";
        break;
      case '"':
        out += "&quot;";
        break;
      default:
        out += ch;
    }
  }
  return out;
}

std::string path_data(const ScenePath& p) {
  std::string d;
  for (const auto& ring : p.rings) {
    for (std::size_t i = 0; i < ring.size(); ++i)
      d += fmt::format("{}{:.3f} {:.3f} ", i ? "L" : "M", ring[i].x, ring[i].z);
    if (p.closed) d += "Z ";
  }
  if (!d.empty()) d.pop_back();
  return d;
}

std::string stroke_attributes(const PaintStyle& s) {
  if (!s.stroke) return " stroke=\"none\"";
  std::string a = fmt::format(" stroke=\"{}\" stroke-width=\"{:.2f}\" stroke-linejoin=\"round\"",
                              colour(s.stroke_colour), s.stroke_width);
  if (!s.dash.empty()) {
    a += " stroke-dasharray=\"";
    for (std::size_t i = 0; i < s.dash.size(); ++i)
      a += fmt::format("{}{:g}", i ? " " : "", s.dash[i]);
    a += "\"";
  }
  return a;
}

// The lines of one hatch tile `g` wide and the tile's rotation, degrees.
std::pair<std::string, double> hatch_tile(Hatch hatch, double g, const std::string& ink) {
  const std::string line = fmt::format("<line x1=\"0\" y1=\"0\" x2=\"{:g}\" y2=\"0\" {}/>", g, ink);
  switch (hatch) {
    case Hatch::Diagonal:
      return {line, -45};
    case Hatch::BackDiagonal:
      return {line, 45};
    case Hatch::Cross:
      return {line + fmt::format("<line x1=\"0\" y1=\"0\" x2=\"0\" y2=\"{:g}\" {}/>", g, ink), 45};
    case Hatch::Horizontal:
      return {line, 0};
    case Hatch::None:
      break;
  }
  return {"", 0};
}

// One <pattern> per hatch look in use, written to `defs` the first time
// the look is asked for.
class HatchPatterns {
 public:
  const std::string& id(const PaintStyle& s) {
    const std::string key = fmt::format("{}-{}-{:g}", static_cast<int>(s.hatch),
                                        colour(s.hatch_colour), s.hatch_spacing);
    auto it = ids_.find(key);
    if (it != ids_.end()) return it->second;
    const double g = s.hatch_spacing;
    const auto [tile, angle] = hatch_tile(
        s.hatch, g, fmt::format("stroke=\"{}\" stroke-width=\"0.18\"", colour(s.hatch_colour)));
    const std::string id = fmt::format("hatch{}", ids_.size() + 1);
    defs_ += fmt::format(
        "<pattern id=\"{}\" patternUnits=\"userSpaceOnUse\" width=\"{:g}\" height=\"{:g}\" "
        "patternTransform=\"rotate({:g})\">{}</pattern>\n",
        id, g, g, angle, tile);
    return ids_[key] = id;
  }
  const std::string& defs() const { return defs_; }

 private:
  std::map<std::string, std::string> ids_;  // look -> id
  std::string defs_;
};

std::string text_element(const SceneText& t) {
  const char* anchor = t.anchor == TextAnchor::Start    ? "start"
                       : t.anchor == TextAnchor::Middle ? "middle"
                                                        : "end";
  return fmt::format(
      "<text x=\"{:.3f}\" y=\"{:.3f}\" font-family=\"DejaVu Sans, Helvetica, Arial, sans-serif\" "
      "font-size=\"{:.2f}\" text-anchor=\"{}\"{}{}>{}</text>\n",
      t.at.x, t.at.z, t.size, anchor, t.bold ? " font-weight=\"bold\"" : "",
      t.halo ? " stroke=\"#ffffff\" stroke-width=\"0.9\" paint-order=\"stroke\"" : "",
      escape(t.text));
}

}  // namespace

std::string drawing_svg(const Scene& scene) {
  HatchPatterns patterns;
  std::string body;
  for (const auto& p : scene.paths) {
    const std::string d = path_data(p);
    const auto& s = p.style;
    body += fmt::format("<path d=\"{}\" fill=\"{}\" fill-rule=\"evenodd\"{}/>\n", d,
                        s.fill ? colour(s.fill_colour) : "none", stroke_attributes(s));
    if (s.hatch != Hatch::None)
      body +=
          fmt::format("<path d=\"{}\" fill=\"url(#{})\" fill-rule=\"evenodd\" stroke=\"none\"/>\n",
                      d, patterns.id(s));
  }
  for (const auto& t : scene.texts) body += text_element(t);
  return fmt::format(
      "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n"
      "<svg xmlns=\"http://www.w3.org/2000/svg\" version=\"1.1\" width=\"{0:g}mm\" "
      "height=\"{1:g}mm\" viewBox=\"0 0 {0:g} {1:g}\">\n"
      "<defs>\n{2}</defs>\n"
      "<rect x=\"0\" y=\"0\" width=\"{0:g}\" height=\"{1:g}\" fill=\"#ffffff\"/>\n"
      "{3}</svg>\n",
      scene.width, scene.height, patterns.defs(), body);
}

}  // namespace dovetailor
