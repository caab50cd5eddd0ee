// Benchmark of the checker: programs of 10^4, 10^5 and 10^6 moves generated on
// the fly (never held in memory), checked against the male stop-block sample
// with 20 stations. Reports moves per second and the process's peak resident
// memory (getrusage), which must stay flat as the program grows.
//
// Each cycle of the generated program is what a CAM system writes for one
// shoulder pass of the end mill: 4 moves to enter outside the front end and
// take one straight pass through the whole length, a return in 36 segments
// of 5 mm (one pass written as short moves), and 20 short entry moves
// outside the stock (they reach no station). Pass positions step across the
// shoulder: in "repeat" programs over 48 positions again and again (as
// repeated and spring passes do), in "distinct" programs to a new position
// every cycle, so every pass cuts new material.
//
//   ./build/bench/dovetailor_bench --benchmark_counters_tabular=true

#include <fstream>
#include <sstream>
#include <string>
#include <sys/resource.h>
#include <vector>

#include <benchmark/benchmark.h>
#include <fmt/format.h>

#include <dovetailor/check/checker.hpp>
#include <dovetailor/gcode/gcode_writer.hpp>
#include <dovetailor/input/job_reader.hpp>
#include <dovetailor/plan/planner.hpp>
#include <dovetailor/shop/post.hpp>

namespace {

using namespace dovetailor;

class GeneratedProgram : public ProgramSource {
 public:
  // kind 1 repeat, 0 distinct, 2 tapered (distinct, each pass slanted).
  GeneratedProgram(long moves, int kind) : moves_(moves), repeat_(kind == 1), taper_(kind == 2) {}

  bool next_line(std::string& line) override {
    if (!header_.empty()) {
      line = header_.front();
      header_.erase(header_.begin());
      return true;
    }
    if (written_ >= moves_) {
      if (ended_) return false;
      ended_ = true;
      line = "M30";
      return true;
    }
    line = next_move();
    ++written_;
    return true;
  }
  const std::string& name() const override { return name_; }

 private:
  // Shoulder passes of the 12 mm end mill between x = 20 and 44 (the tongue's
  // root is at x = 14), 6 mm deep, through the 160 mm length.
  std::string next_move() {
    const int step = static_cast<int>(in_cycle_++ % cycle);
    if (step == 0) {
      x_ = repeat_
               ? 44 - 0.5 * static_cast<double>(cycles_ % 48)
               : 44 - 24 * static_cast<double>(cycles_) / static_cast<double>(moves_ / cycle + 1);
      ++cycles_;
      return fmt::format("G0 X{:.4f} Y-20 Z5", x_);
    }
    if (step == 1) return "G1 Z-6 F600";
    if (step == 2) return taper_ ? fmt::format("G1 X{:.4f} Y180", x_ + 0.5) : "G1 Y180";
    if (step < 3 + 36) {
      const int y = 180 - 5 * (step - 2);
      return taper_ ? fmt::format("G1 X{:.4f} Y{}", x_ + 0.5 * (y + 20) / 200.0, y)
                    : fmt::format("G1 Y{}", y);
    }
    if (step == 3 + 36) return "G0 Z5";
    // Short moves outside the front end.
    return fmt::format("G1 X{:.4f} Y{:.1f}", x_ + (step % 2 ? 0.2 : 0), step % 2 ? -20.5 : -20);
  }

  static constexpr long cycle = 60;
  long moves_;
  bool repeat_;
  bool taper_;
  std::vector<std::string> header_{"G21 G90 G17", "T3 M6", "S3000 M3"};
  long written_ = 0;
  long in_cycle_ = 0;
  long cycles_ = 0;
  double x_ = 44;
  bool ended_ = false;
  std::string name_ = "generated.ngc";
};

std::string source_file(const std::string& name) {
  const std::string path = std::string(DOVETAILOR_SOURCE_DIR) + "/" + name;
  std::ifstream in(path, std::ios::binary);
  std::stringstream text;
  text << in.rdbuf();
  return text.str();
}

Job sample_job(const std::string& name = "stop-block-male") {
  return read_job(source_file("samples/" + name + ".toml"), name + ".toml");
}

void check_program(benchmark::State& state) {
  static const Job job = sample_job();
  const long moves = state.range(0);
  const int kind = static_cast<int>(state.range(1));
  long findings = 0;
  for (auto _ : state) {
    GeneratedProgram program(moves, kind);
    const CheckReport report = check(program, job, {.stations = 20});
    findings = static_cast<long>(report.findings.size());
    benchmark::DoNotOptimize(report.stations.size());
  }
  rusage usage{};
  getrusage(RUSAGE_SELF, &usage);
  state.SetItemsProcessed(state.iterations() * moves);
  state.counters["moves_per_s"] =
      benchmark::Counter(static_cast<double>(moves), benchmark::Counter::kIsIterationInvariantRate);
  state.counters["peak_rss_MiB"] = static_cast<double>(usage.ru_maxrss) / 1024.0;
  state.counters["findings"] = static_cast<double>(findings);
  state.SetLabel(kind == 1 ? "repeat" : kind == 0 ? "distinct" : "tapered");
}

// The planner's own program for a sample (rs274ngc-full post), checked
// whole: every cutting move takes new material, the cost a real program
// pays. Moves per second over the program's motion events.
const char* const planned_samples[] = {"stop-block-male", "fixture-slide-male",
                                       "fixture-slide-female", "height-stop-half-female"};

void check_planned_program(benchmark::State& state) {
  const std::string name = planned_samples[state.range(0)];
  const Job job = sample_job(name);
  const Post post = read_post(source_file("post/rs274ngc-full.toml"), "rs274ngc-full.toml");
  const std::string text = write_program(plan(job), post, {.date = "2000-01-01"});
  long moves = 0;
  for (auto _ : state) {
    StringProgramSource program(text, name + ".ngc");
    const CheckReport report = check(program, job, {.stations = 20});
    moves = report.moves;
    benchmark::DoNotOptimize(report.stations.size());
  }
  state.SetItemsProcessed(state.iterations() * moves);
  state.counters["moves"] = static_cast<double>(moves);
  state.counters["moves_per_s"] =
      benchmark::Counter(static_cast<double>(moves), benchmark::Counter::kIsIterationInvariantRate);
  state.SetLabel(name);
}

BENCHMARK(check_planned_program)->DenseRange(0, 3)->Unit(benchmark::kMillisecond);

BENCHMARK(check_program)
    ->ArgsProduct({{10000, 100000, 1000000}, {1, 0, 2}})
    ->Unit(benchmark::kMillisecond)
    ->Iterations(1);

}  // namespace

BENCHMARK_MAIN();
