#pragma once

// The section-plane half of the checker: the material at every station and
// what each move does to it. Internal to the core library.

#include <cstdint>
#include <unordered_map>
#include <vector>

#include "check_detail.hpp"

namespace dovetailor::detail {

class StationSimulator {
 public:
  // `targets[i]` is the finished part at station `ys[i]` (ys ascending).
  StationSimulator(std::vector<double> ys, std::vector<StationTarget> targets,
                   const SectionRegion& stock, FindingSink& sink);

  // One straight move of the tool tip. Moves along Y at one X and Z, and
  // other moves that continue one straight line (every joint within
  // `straight_within` of it), are gathered into a run and simulated when the
  // run ends (flush()): the union of their sweeps is the sweep of the whole
  // line.
  void line(const SimTool& tool, const Point3& from, const Point3& to, const MoveFacts& facts);
  // One circular move.
  void arc(const SimTool& tool, const PathSegment& arc, const MoveFacts& facts);
  // Simulates the gathered run, if any.
  void flush();

  const std::vector<double>& ys() const { return ys_; }
  const SectionRegion& material(std::size_t station) const { return material_[station]->region; }
  const StationTarget& target(std::size_t station) const { return targets_[target_of_[station]]; }

 private:
  struct Run {
    const SimTool* tool = nullptr;
    MoveFacts facts;
    double x = 0, z = 0;
    double y_start = 0, y_end = 0;
    int first_line = 0, last_line = 0;
    std::vector<int> crossing_line;  // per station, 0 until a move crosses it
  };

  // Straight moves not along Y (tapered passes, ramps) on one line.
  struct LineRun {
    const SimTool* tool = nullptr;
    MoveFacts facts;
    Point3 from, to;
    std::vector<Point3> joints;      // where one move of the run meets the next
    std::vector<int> crossing_line;  // per station, 0 until a move crosses it
    int first_line = 0, last_line = 0;
  };

  // The area a straight move sweeps in a plane it crosses at least the
  // body's largest radius inside both of its ends depends only on the tool
  // and the move's direction: it is this shape moved to where the tip
  // crosses the plane. Kept per (tool, dx/dy, dz/dy) so that the stations a
  // long slanted pass crosses, and every later pass of the same slope, share
  // one sweep.
  struct ShapeKey {
    int tool = 0;
    std::int64_t sx = 0, sz = 0;  // slopes in steps of slope_step
    bool operator==(const ShapeKey&) const = default;
  };
  struct ShapeHash {
    std::size_t operator()(const ShapeKey& k) const;
  };
  const StationSweep& crossing_shape(const SimTool& tool, double sx, double sz);

  struct MemoKey {
    std::uint64_t material = 0;
    int target = 0;
    int tool = 0;
    std::int64_t x = 0, z = 0;
    int flags = 0;
    bool operator==(const MemoKey&) const = default;
  };
  struct MemoHash {
    std::size_t operator()(const MemoKey& k) const;
  };

  // Stations whose plane the y-interval [low, high] comes within `reach` of.
  std::pair<std::size_t, std::size_t> stations_near(double low, double high, double reach) const;
  void start_run(const SimTool& tool, const Point3& from, const Point3& to, const MoveFacts& facts);
  void extend_run(const Point3& from, const Point3& to, int line);
  bool continues_line(const SimTool& tool, const Point3& from, const Point3& to,
                      const MoveFacts& facts) const;
  void start_line_run(const SimTool& tool, const Point3& from, const Point3& to,
                      const MoveFacts& facts);
  void extend_line_run(const Point3& from, const Point3& to, int line);
  // Sweeps one straight move, or a gathered run of them (`run`: each station
  // is then named by the move that crossed it, or the run's nearer end).
  void sweep_straight(const SimTool& tool, const Point3& from, const Point3& to,
                      const MoveFacts& facts, const LineRun* run);
  // Marks the stations that the y-span of one move of a run crosses, keeping
  // the first move's line.
  void mark_crossings(std::vector<int>& crossing_line, const Point3& from, const Point3& to,
                      int line) const;
  void apply(std::size_t station, const Outcome& outcome, int line);
  void apply_general(std::size_t station, const StationSweep& sweep, const MoveFacts& facts,
                     const SimTool& tool);

  std::vector<double> ys_;
  std::vector<StationTarget> targets_;
  std::vector<int> target_of_;
  std::vector<MaterialPtr> material_;
  FindingSink& sink_;
  std::uint64_t next_id_ = 1;
  bool run_open_ = false;
  Run run_;
  bool line_run_open_ = false;
  LineRun line_run_;
  std::unordered_map<ShapeKey, StationSweep, ShapeHash> shapes_;
  std::unordered_map<MemoKey, Outcome, MemoHash> memo_;
};

// Measures the material at every station against its target (virtual pins,
// section_measure.hpp), adds stock-left and reading findings at `end_line`,
// and fills report.stations, reading_taper and reading_spread.
void measure_stations(const Job& job, const StationSimulator& sim, FindingSink& sink, int end_line,
                      CheckReport& report);

}  // namespace dovetailor::detail
