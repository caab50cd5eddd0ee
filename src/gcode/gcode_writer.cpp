#include <algorithm>
#include <cmath>
#include <map>
#include <stdexcept>

#include <fmt/format.h>

#include <dovetailor/base/error.hpp>
#include <dovetailor/base/length.hpp>
#include <dovetailor/gcode/gcode_writer.hpp>
#include <dovetailor/gcode/program_text.hpp>
#include <dovetailor/report/plan_note_text.hpp>

#include "gcode_writer_detail.hpp"

namespace dovetailor {
namespace {

bool finishing(PassRole role) {
  return role == PassRole::SemiFinish || role == PassRole::Finish || role == PassRole::Spring;
}

// A pass the compensated path can be written for: its entry comes straight
// down and its exit goes straight up at the ends of a cut of one straight
// feed along the pass's line, both ends outside the stock (open ends).
bool straight_between_open_ends(const Pass& pass) {
  if (pass.entry.empty() || pass.cut.size() != 1 || pass.exit.empty()) return false;
  const auto same_xy = [](const Point3& a, const Point3& b) {
    return std::abs(a.x - b.x) < 1e-9 && std::abs(a.y - b.y) < 1e-9;
  };
  const Point3 start = pass.cut_start(), end = pass.cut.back().to;
  const auto at = [&](const std::vector<Move>& part, const Point3& p) {
    return std::all_of(part.begin(), part.end(), [&](const Move& m) { return same_xy(m.to, p); });
  };
  return pass.cut.front().kind == MoveKind::Feed && std::abs(start.z - pass.z) < 1e-9 &&
         std::abs(end.z - pass.z) < 1e-9 && at(pass.entry, start) && at(pass.exit, end);
}

const Tool& tool_of(const Plan& plan, int number) {
  const Tool* tool = find_tool(plan.job, number);
  if (!tool)
    throw std::logic_error(fmt::format("G-code writer: the plan uses unknown T{}", number));
  return *tool;
}

class Writer {
 public:
  Writer(const Plan& plan, const Post& post, const ProgramOptions& options)
      : plan_(plan),
        post_(post),
        options_(options),
        units_(options.units.value_or(program_units(post, plan.job.units))),
        style_(sizing_style(plan, post)),
        text_(post, units_) {}

  std::string run() {
    for (const auto& line : detail::header_lines(plan_, post_, options_, units_, style_))
      comment(line);
    std::vector<Word> setup = {
        {'G', units_ == Units::Inch ? 20.0 : 21.0}, {'G', 17}, {'G', 90}, {'G', 94}};
    if (post_.cutter_compensation) setup.push_back({'G', 40});
    if (post_.tool_length_offset) setup.push_back({'G', 49});
    if (post_.canned_cycles) setup.push_back({'G', 80});
    text_.add({.words = setup, .comment = "modal set-up"});
    if (style_ == SizingStyle::Parameters)
      text_.add({.settings = {{.number = flank_parameter(Side::Left), .length = 0},
                              {.number = flank_parameter(Side::Right), .length = 0}},
                 .comment = "flank offsets, + leaves stock"});
    int tool = -1;
    for (const auto& op : plan_.operations) {
      if (op.tool != tool) change_tool(op);
      tool = op.tool;
      for (const auto& pass : op.passes) write_pass(op, pass);
    }
    spindle_off("program end");
    motion(MoveKind::Rapid, {position_.x, position_.y, plan_.safe_z}, 0);
    motion(MoveKind::Rapid, {0, park_y(), plan_.safe_z}, 0, {}, {},
           "clear of the front end for unloading");
    return text_.finish();
  }

 private:
  void comment(const std::string& text) {
    const int frame = 2 + (post_.line_numbers.enabled ? 7 : 0);  // "()" or "; ", "N99999 "
    const auto width = static_cast<std::size_t>(std::min(80, post_.max_line_length) - frame);
    for (const auto& line : detail::wrap_words(text, width)) text_.add_comment(line);
  }

  std::optional<int> coolant_code(bool on) const {
    const auto& c = post_.coolant;
    const auto missing = [&](const char* what) {
      return InputError(fmt::format("the post has no {} coolant code; choose another coolant "
                                    "or a post with one",
                                    what),
                        {}, "coolant");
    };
    switch (options_.coolant) {
      case CoolantChoice::Off:
        return std::nullopt;
      case CoolantChoice::Flood:
        if (!c.flood) throw missing("flood");
        return on ? c.flood : c.off;
      case CoolantChoice::Mist:
        if (!c.mist) throw missing("mist");
        return on ? c.mist : c.off;
    }
    return std::nullopt;
  }

  void spindle_on(double rpm, const std::string& why) {
    if (spindle_ && std::abs(rpm - rpm_) < 0.5) return;
    std::vector<Word> words = {{'S', rpm}, {'M', 3}};
    if (!spindle_)
      if (auto code = coolant_code(true)) words.push_back({'M', static_cast<double>(*code)});
    text_.add({.words = words, .comment = why});
    spindle_ = true;
    rpm_ = rpm;
  }

  void spindle_off(const std::string& why, bool stop_spindle = true) {
    if (!spindle_) return;
    std::vector<Word> words;
    if (stop_spindle) words.push_back({'M', 5});
    if (auto code = coolant_code(false)) words.push_back({'M', static_cast<double>(*code)});
    if (!words.empty()) text_.add({.words = words, .comment = why});
    spindle_ = false;
  }

  void change_tool(const Operation& op) {
    const Tool& t = tool_of(plan_, op.tool);
    // Without a changer tool_change_blocks stops the spindle itself.
    spindle_off("before the tool change", post_.tool_changer);
    const std::string what =
        fmt::format("{} {} dia", t.kind == ToolKind::EndMill ? "end mill" : "dovetail cutter",
                    shown(t.diameter, units_));
    for (const auto& block : tool_change_blocks(post_, t.number, what)) text_.add(block);
    comment(operation_title(op));
    // The tool change may have moved X and Y: the next move writes them again.
    Block up{.words = {{'G', 0}, {'Z', plan_.safe_z}}, .comment = "to the safe height"};
    if (post_.tool_length_offset) {
      up.words = {{'G', 0}, {'G', 43}, {'Z', plan_.safe_z}, {'H', static_cast<double>(t.number)}};
      up.comment = "length offset, to the safe height";
    }
    text_.add(up);
    last_ = {{'Z', format_length(plan_.safe_z, post_, units_)}};
    position_.z = plan_.safe_z;
  }

  // One motion block. Axis words whose text has not changed are left out; a
  // block with nothing to move is not written.
  void motion(MoveKind kind, Point3 to, double feed, const std::vector<Word>& extra = {},
              const std::string& x_expression = {}, std::string why = {}) {
    Block block;
    for (const auto& w : extra)
      if (w.letter == 'G') block.words.push_back(w);
    block.words.push_back({'G', kind == MoveKind::Rapid ? 0.0 : 1.0});
    bool moved = false;
    const auto axis = [&](char letter, double value, const std::string& expression) {
      const std::string text =
          expression.empty() ? format_length(value, post_, units_) : expression;
      if (expression.empty() && last_.contains(letter) && last_[letter] == text) return;
      last_[letter] = text;
      moved = true;
      block.words.push_back(expression.empty() ? Word{letter, value}
                                               : Word{.letter = letter, .expression = expression});
    };
    axis('X', to.x, x_expression);
    axis('Y', to.y, {});
    axis('Z', to.z, {});
    if (!moved && extra.empty()) return;
    if (kind == MoveKind::Feed && std::abs(feed - feed_) > 1e-9) {
      block.words.push_back({'F', feed});
      feed_ = feed;
    }
    for (const auto& w : extra)
      if (w.letter != 'G') block.words.push_back(w);
    block.comment = std::move(why);
    text_.add(block);
    position_ = to;
  }

  std::string parameter_x(const Pass& pass, double x) const {
    const double s = toward_flank(plan_.target.type, *pass.side);
    return fmt::format("[{} {} #{}]", format_length(x, post_, units_), s > 0 ? '-' : '+',
                       flank_parameter(*pass.side));
  }

  void write_pass(const Operation& op, const Pass& pass) {
    const std::string_view role = pass.role == PassRole::Spring ? "spring pass" : key_of(pass.role);
    comment(fmt::format("pass {}: {}{}, stock left {}", pass.number, role,
                        pass.side ? (*pass.side == Side::Left ? ", left" : ", right") : ", centre",
                        shown(pass.stock_left, units_)));
    spindle_on(pass.rpm, "spindle and coolant on before the cut");
    const bool sized = op.kind == OperationKind::Undercut && finishing(pass.role) && pass.side;
    if (sized && style_ == SizingStyle::CutterCompensation) {
      compensated_pass(pass);
    } else {
      for (const auto& m : pass.moves())
        motion(m.kind, m.to, m.feed, {},
               sized && style_ == SizingStyle::Parameters ? parameter_x(pass, m.to.x) : "");
    }
    int letter = 0;
    for (const auto& c : plan_.checkpoints) {
      if (c.after_pass == pass.number) stop(c, static_cast<char>('A' + letter));
      ++letter;
    }
  }

  // See write_program in gcode_writer.hpp for the shape of the path: the
  // pass's entry and exit moved back and forward along the flank line by the
  // lead, its cut with compensation turned on before and off after it.
  void compensated_pass(const Pass& pass) {
    if (!straight_between_open_ends(pass))
      throw std::logic_error(fmt::format(
          "G-code writer: pass {} is not a straight cut between open ends", pass.number));
    const double y0 = pass.cut_start().y, y1 = pass.cut.back().to.y;
    const double dir = pass.cut_travel() > 0 ? 1.0 : -1.0;
    const double off = contour_offset(plan_, pass), lead = lead_length(plan_);
    const auto on_line = [&](double y, double z) { return Point3{pass.x_at(y) + off, y, z}; };
    const double ya = y0 - dir * lead, yb = y1 + dir * lead;
    const int g = compensation_code(plan_.target.type, *pass.side, dir);
    const double feed = pass.cut.front().feed;
    // Under RS274NGC an axis word left out means "where the tool is", and
    // with compensation on (or just turned off) the tool is not on the
    // programmed line: X is written on every block from the lead-in to the
    // exit, so each names its point on the flank line (NISTIR 6556, cutter
    // radius compensation, from memory).
    const auto with_x = [&](auto&&... args) {
      last_.erase('X');
      motion(args...);
    };
    for (std::size_t i = 0; i < pass.entry.size(); ++i) {
      const Move& m = pass.entry[i];
      if (i == 0)
        with_x(m.kind, on_line(ya, m.to.z), m.feed, std::vector<Word>{}, std::string{},
               std::string("lead-in on the flank line"));
      else
        motion(m.kind, on_line(ya, m.to.z), m.feed);
    }
    with_x(MoveKind::Feed, on_line(y0, pass.z), feed,
           std::vector<Word>{{'G', static_cast<double>(g)}, {'D', static_cast<double>(pass.tool)}},
           std::string{}, std::string("compensation on: straight entry outside the stock"));
    with_x(MoveKind::Feed, on_line(y1, pass.z), feed, std::vector<Word>{}, std::string{},
           std::string{});
    with_x(MoveKind::Feed, on_line(yb, pass.z), feed, std::vector<Word>{{'G', 40}}, std::string{},
           std::string("compensation off: straight exit outside the stock"));
    for (const Move& m : pass.exit) motion(m.kind, on_line(yb, m.to.z), m.feed);
  }

  void stop(const Checkpoint& c, char letter) {
    spindle_off("spindle and coolant off to measure");
    for (const auto& line : detail::checkpoint_lines(plan_, c, letter, units_, style_))
      comment(line);
    const bool optional = plan_.job.strategy.optional_stops && post_.optional_stop;
    text_.add({.words = {{'M', optional ? 1.0 : 0.0}},
               .comment = fmt::format("checkpoint {}: measure, then cycle start", letter)});
  }

  double park_y() const {
    double radius = 0;
    for (const auto& t : plan_.job.tools) radius = std::max(radius, t.diameter / 2);
    return -(radius + plan_.clearance);
  }

  const Plan& plan_;
  const Post& post_;
  const ProgramOptions& options_;
  Units units_;
  SizingStyle style_;
  ProgramText text_;
  std::map<char, std::string> last_;
  Point3 position_{};
  double feed_ = -1;
  bool spindle_ = false;
  double rpm_ = 0;
};

}  // namespace

int compensation_code(DovetailType type, Side side, double travel_y) {
  const bool flank_plus_x = toward_flank(type, side) > 0;
  return flank_plus_x == (travel_y > 0) ? 41 : 42;
}

double contour_offset(const Plan& plan, const Pass& pass) {
  if (!pass.side) throw std::logic_error("G-code writer: contour offset of a centre pass");
  const double radius = tool_of(plan, pass.tool).diameter / 2;
  return toward_flank(plan.target.type, *pass.side) * radius *
         std::sqrt(1 + pass.taper_slope * pass.taper_slope);
}

double lead_length(const Plan& plan) {
  double radius = 0;
  for (const auto& op : plan.operations)
    if (op.kind == OperationKind::Undercut) radius = tool_of(plan, op.tool).diameter / 2;
  return radius + plan.clearance;
}

std::string write_program(const Plan& plan, const Post& post, const ProgramOptions& options) {
  return Writer(plan, post, options).run();
}

}  // namespace dovetailor
