#include "station_simulator.hpp"

#include <algorithm>
#include <cmath>
#include <optional>

namespace dovetailor::detail {
namespace {

constexpr double still = 1e-9;
constexpr std::size_t memo_capacity = 4096;
constexpr std::size_t shape_capacity = 256;
// Moves are gathered into one straight line when every joint lies this
// close to it (0.1 um, the sweep's own chord tolerance), up to this many.
constexpr double straight_within = 1e-4;
constexpr std::size_t most_joints = 64;
// Slopes (dx/dy, dz/dy) are rounded to this step for the shared crossing
// shapes: a body of radius R then lies within R * step / 2 of its true
// place (20 nm for a 40 mm holder), and the shape does not depend on which
// move came first.
constexpr double slope_step = 1e-6;

double distance_to_line(const Point3& p, const Point3& a, const Point3& b) {
  const double ux = b.x - a.x, uy = b.y - a.y, uz = b.z - a.z;
  const double vx = p.x - a.x, vy = p.y - a.y, vz = p.z - a.z;
  const double cx = uy * vz - uz * vy, cy = uz * vx - ux * vz, cz = ux * vy - uy * vx;
  const double len = std::sqrt(ux * ux + uy * uy + uz * uz);
  return std::sqrt(cx * cx + cy * cy + cz * cz) / len;
}

// The box in a station plane that the body can reach while its tip stays in
// [x_lo, x_hi] x [z_lo, z_hi]: the cheap test that spares sweeping moves
// that run clear of the material (rapids above the stock, moves outside it).
Bounds2 reach_box(const ToolBody& body, double x_lo, double x_hi, double z_lo, double z_hi) {
  const double r = body.max_radius();
  return {x_lo - r, z_lo, x_hi + r, z_hi + body.top()};
}

bool clear_of(const MaterialPtr& material, const Bounds2& box) {
  return !material->bounds || !overlaps(*material->bounds, box);
}

// Folds one more value into a hash (the usual golden-ratio mix).
void mix(std::size_t& h, std::uint64_t v) { h ^= v + 0x9e3779b97f4a7c15ULL + (h << 6) + (h >> 2); }

}  // namespace

std::size_t StationSimulator::MemoHash::operator()(const MemoKey& k) const {
  std::size_t h = std::hash<std::uint64_t>()(k.material);
  mix(h, static_cast<std::uint64_t>(k.target));
  mix(h, static_cast<std::uint64_t>(k.tool));
  mix(h, static_cast<std::uint64_t>(k.x));
  mix(h, static_cast<std::uint64_t>(k.z));
  mix(h, static_cast<std::uint64_t>(k.flags));
  return h;
}

std::size_t StationSimulator::ShapeHash::operator()(const ShapeKey& k) const {
  std::size_t h = std::hash<std::int64_t>()(k.sx);
  mix(h, static_cast<std::uint64_t>(k.sz));
  mix(h, static_cast<std::uint64_t>(k.tool));
  return h;
}

StationSimulator::StationSimulator(std::vector<double> ys, std::vector<StationTarget> targets,
                                   const SectionRegion& stock, FindingSink& sink)
    : ys_(std::move(ys)), sink_(sink) {
  for (StationTarget& t : targets) {
    auto same = std::find_if(targets_.begin(), targets_.end(),
                             [&](const StationTarget& known) { return known.id == t.id; });
    if (same == targets_.end()) {
      target_of_.push_back(static_cast<int>(targets_.size()));
      targets_.push_back(std::move(t));
    } else {
      target_of_.push_back(static_cast<int>(same - targets_.begin()));
    }
  }
  auto start = std::make_shared<Material>();
  start->id = next_id_++;
  start->region = stock;
  start->bounds = stock.bounds();
  material_.assign(ys_.size(), start);
  run_.crossing_line.assign(ys_.size(), 0);
}

std::pair<std::size_t, std::size_t> StationSimulator::stations_near(double low, double high,
                                                                    double reach) const {
  const auto first = std::lower_bound(ys_.begin(), ys_.end(), low - reach);
  const auto last = std::upper_bound(first, ys_.end(), high + reach);
  return {static_cast<std::size_t>(first - ys_.begin()),
          static_cast<std::size_t>(last - ys_.begin())};
}

void StationSimulator::apply(std::size_t station, const Outcome& outcome, int line) {
  if (outcome.after) material_[station] = outcome.after;
  for (Finding f : outcome.findings) {
    f.line = line;
    f.station_y = ys_[station];
    sink_.add(std::move(f));
  }
}

void StationSimulator::apply_general(std::size_t station, const StationSweep& sweep,
                                     const MoveFacts& facts, const SimTool& tool) {
  Outcome outcome =
      evaluate_move(*material_[station], targets_[target_of_[station]], sweep, facts, tool);
  if (outcome.after) outcome.after->id = next_id_++;
  apply(station, outcome, facts.line);
}

void StationSimulator::line(const SimTool& tool, const Point3& from, const Point3& to,
                            const MoveFacts& facts) {
  const double dx = to.x - from.x, dy = to.y - from.y, dz = to.z - from.z;
  if (std::abs(dx) <= still && std::abs(dy) <= still && std::abs(dz) <= still) return;
  const bool along_y = std::abs(dx) <= still && std::abs(dz) <= still;
  if (along_y && run_open_ && run_.tool == &tool && run_.facts.kind == facts.kind &&
      run_.facts.spindle_on == facts.spindle_on && run_.x == from.x && run_.z == from.z &&
      std::abs(run_.y_end - from.y) <= still && ((run_.y_end - run_.y_start > 0) == (dy > 0))) {
    extend_run(from, to, facts.line);
    return;
  }
  if (!along_y && line_run_open_ && continues_line(tool, from, to, facts)) {
    extend_line_run(from, to, facts.line);
    return;
  }
  flush();
  if (along_y) {
    start_run(tool, from, to, facts);
    return;
  }
  if (std::abs(dy) > still) {
    start_line_run(tool, from, to, facts);
    return;
  }
  sweep_straight(tool, from, to, facts, nullptr);
}

bool StationSimulator::continues_line(const SimTool& tool, const Point3& from, const Point3& to,
                                      const MoveFacts& facts) const {
  const LineRun& r = line_run_;
  if (r.tool != &tool || r.facts.kind != facts.kind || r.facts.spindle_on != facts.spindle_on ||
      r.joints.size() >= most_joints)
    return false;
  if (std::abs(r.to.x - from.x) > still || std::abs(r.to.y - from.y) > still ||
      std::abs(r.to.z - from.z) > still)
    return false;
  const double dot = (r.to.x - r.from.x) * (to.x - from.x) + (r.to.y - r.from.y) * (to.y - from.y) +
                     (r.to.z - r.from.z) * (to.z - from.z);
  if (dot <= 0) return false;
  if (distance_to_line(r.to, r.from, to) > straight_within) return false;
  for (const Point3& j : r.joints)
    if (distance_to_line(j, r.from, to) > straight_within) return false;
  return true;
}

void StationSimulator::start_line_run(const SimTool& tool, const Point3& from, const Point3& to,
                                      const MoveFacts& facts) {
  line_run_open_ = true;
  line_run_.tool = &tool;
  line_run_.facts = facts;
  line_run_.from = from;
  line_run_.to = from;
  line_run_.joints.clear();
  line_run_.first_line = facts.line;
  line_run_.last_line = 0;
  line_run_.crossing_line.assign(ys_.size(), 0);
  extend_line_run(from, to, facts.line);
}

void StationSimulator::extend_line_run(const Point3& from, const Point3& to, int line) {
  LineRun& r = line_run_;
  if (r.last_line != 0) r.joints.push_back(from);
  mark_crossings(r.crossing_line, from, to, line);
  r.to = to;
  r.last_line = line;
}

const StationSweep& StationSimulator::crossing_shape(const SimTool& tool, double sx, double sz) {
  const ShapeKey key{tool.index, std::llround(sx / slope_step), std::llround(sz / slope_step)};
  auto found = shapes_.find(key);
  if (found != shapes_.end()) return found->second;
  if (shapes_.size() >= shape_capacity) shapes_.clear();
  // A line at the key's slope through the tip at the origin, crossing the
  // plane y = 0 well inside both ends.
  const double half = 2 * tool.body.max_radius() + 1;
  const double kx = static_cast<double>(key.sx) * slope_step;
  const double kz = static_cast<double>(key.sz) * slope_step;
  const Point3 a{-kx * half, -half, -kz * half}, b{kx * half, half, kz * half};
  return shapes_
      .emplace(key,
               sweep_from_parts(sweep_line(tool.body, a, b, 0), sweep_line(tool.column, a, b, 0)))
      .first->second;
}

void StationSimulator::sweep_straight(const SimTool& tool, const Point3& from, const Point3& to,
                                      const MoveFacts& facts, const LineRun* run) {
  const double dx = to.x - from.x, dy = to.y - from.y, dz = to.z - from.z;
  const double reach = tool.body.max_radius();
  const auto [first, last] = stations_near(std::min(from.y, to.y), std::max(from.y, to.y), reach);
  MoveFacts f = facts;
  f.tip_z = std::max(from.z, to.z);
  const Bounds2 box = reach_box(tool.body, std::min(from.x, to.x), std::max(from.x, to.x),
                                std::min(from.z, to.z), std::max(from.z, to.z));
  for (std::size_t s = first; s < last; ++s) {
    if (clear_of(material_[s], box)) continue;
    const double y = ys_[s];
    if (run) {
      const int crossing = run->crossing_line[s];
      f.line = crossing != 0                               ? crossing
               : std::abs(y - from.y) < std::abs(y - to.y) ? run->first_line
                                                           : run->last_line;
    }
    const bool through = std::abs(dy) > still && (y - from.y) * (to.y - y) > 0 &&
                         std::min(std::abs(y - from.y), std::abs(y - to.y)) >= reach;
    if (through) {
      const StationSweep& shape = crossing_shape(tool, dx / dy, dz / dy);
      const double t = (y - from.y) / dy;
      MoveFacts crossing = f;
      crossing.along_y = std::abs(dx) <= std::abs(dy);
      crossing.axis_x = from.x + t * dx;
      crossing.axis_z = from.z + t * dz;
      crossing.axis_slope = dx / dy;
      apply_general(s, shifted(shape, to_grid(crossing.axis_x), to_grid(crossing.axis_z)), crossing,
                    tool);
      continue;
    }
    const auto body = sweep_line(tool.body, from, to, y);
    if (body.empty()) continue;
    apply_general(s, sweep_from_parts(body, sweep_line(tool.column, from, to, y)), f, tool);
  }
}

void StationSimulator::arc(const SimTool& tool, const PathSegment& arc, const MoveFacts& facts) {
  flush();
  const std::vector<Point3> points = path_points(arc, 1e-3);
  double low = points.front().y, high = low, top = points.front().z, bottom = top;
  double left = points.front().x, right = left;
  for (const Point3& p : points) {
    low = std::min(low, p.y);
    high = std::max(high, p.y);
    top = std::max(top, p.z);
    bottom = std::min(bottom, p.z);
    left = std::min(left, p.x);
    right = std::max(right, p.x);
  }
  const Bounds2 box = reach_box(tool.body, left, right, bottom, top);
  MoveFacts f = facts;
  f.tip_z = top;
  const auto [first, last] = stations_near(low, high, tool.body.max_radius());
  for (std::size_t s = first; s < last; ++s) {
    if (clear_of(material_[s], box)) continue;
    const auto body = sweep_arc(tool.body, arc, ys_[s]);
    if (body.empty()) continue;
    apply_general(s, sweep_from_parts(body, sweep_arc(tool.column, arc, ys_[s])), f, tool);
  }
}

void StationSimulator::start_run(const SimTool& tool, const Point3& from, const Point3& to,
                                 const MoveFacts& facts) {
  run_open_ = true;
  run_.tool = &tool;
  run_.facts = facts;
  run_.facts.along_y = true;
  run_.facts.plunging = false;
  run_.facts.axis_x = from.x;
  run_.facts.axis_z = from.z;
  run_.facts.axis_slope = 0;
  run_.facts.tip_z = from.z;
  run_.x = from.x;
  run_.z = from.z;
  run_.y_start = from.y;
  run_.y_end = from.y;
  run_.first_line = facts.line;
  std::fill(run_.crossing_line.begin(), run_.crossing_line.end(), 0);
  extend_run(from, to, facts.line);
}

void StationSimulator::mark_crossings(std::vector<int>& crossing_line, const Point3& from,
                                      const Point3& to, int line) const {
  const auto [first, last] = stations_near(std::min(from.y, to.y), std::max(from.y, to.y), 0);
  for (std::size_t s = first; s < last; ++s)
    if (crossing_line[s] == 0) crossing_line[s] = line;
}

void StationSimulator::extend_run(const Point3& from, const Point3& to, int line) {
  mark_crossings(run_.crossing_line, from, to, line);
  run_.y_end = to.y;
  run_.last_line = line;
}

void StationSimulator::flush() {
  if (line_run_open_) {
    line_run_open_ = false;
    sweep_straight(*line_run_.tool, line_run_.from, line_run_.to, line_run_.facts, &line_run_);
  }
  if (!run_open_) return;
  run_open_ = false;
  const SimTool& tool = *run_.tool;
  const double low = std::min(run_.y_start, run_.y_end);
  const double high = std::max(run_.y_start, run_.y_end);
  const auto [first, last] = stations_near(low, high, tool.body.max_radius());
  std::optional<StationSweep> crossing;
  const Bounds2 box = reach_box(tool.body, run_.x, run_.x, run_.z, run_.z);
  const int flags = static_cast<int>(run_.facts.kind) | (run_.facts.spindle_on ? 4 : 0);
  for (std::size_t s = first; s < last; ++s) {
    if (clear_of(material_[s], box)) continue;
    if (run_.crossing_line[s] != 0) {
      const MemoKey key{material_[s]->id, target_of_[s],   tool.index,
                        to_grid(run_.x),  to_grid(run_.z), flags};
      auto found = memo_.find(key);
      if (found == memo_.end()) {
        if (!crossing) crossing = sweep_silhouettes(tool, run_.x, run_.z);
        Outcome outcome =
            evaluate_move(*material_[s], targets_[target_of_[s]], *crossing, run_.facts, tool);
        if (outcome.after) outcome.after->id = next_id_++;
        if (memo_.size() >= memo_capacity) memo_.clear();
        found = memo_.emplace(key, std::move(outcome)).first;
      }
      apply(s, found->second, run_.crossing_line[s]);
      continue;
    }
    const bool near_start = std::abs(ys_[s] - run_.y_start) < std::abs(ys_[s] - run_.y_end);
    const Point3 end{run_.x, near_start ? run_.y_start : run_.y_end, run_.z};
    const auto body = sweep_line(tool.body, end, end, ys_[s]);
    if (body.empty()) continue;
    MoveFacts f = run_.facts;
    f.line = near_start ? run_.first_line : run_.last_line;
    apply_general(s, sweep_from_parts(body, sweep_line(tool.column, end, end, ys_[s])), f, tool);
  }
}

}  // namespace dovetailor::detail
