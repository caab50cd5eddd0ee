#include <array>

#include <fmt/format.h>

#include <dovetailor/base/error.hpp>
#include <dovetailor/shop/post.hpp>

#include "input/toml_fields.hpp"

namespace dovetailor {
namespace {

using detail::TableReader;

// M codes that mean something else in RS274NGC (stops, program end, spindle,
// tool change) and so cannot double as coolant codes (NISTIR 6556, from
// memory: section 3.6.1 and table 7).
constexpr std::array reserved_m_codes = {0, 1, 2, 3, 4, 5, 6, 30, 60};

bool printable_ascii(const std::string& line) {
  for (char c : line)
    if (c < ' ' || c > '~') return false;
  return true;
}

class PostReader {
 public:
  PostReader(std::string_view text, const std::string& file)
      : file_(file), root_(detail::parse_toml(text, file)) {}

  Post read() {
    TableReader top(root_, "", file_);
    const auto name = top.text("name");
    post_.name = name.value_or("");
    post_.description = top.text("description").value_or("");
    if (auto units = top.choice<PostUnits>(
            "units",
            {{"inch", PostUnits::Inch}, {"mm", PostUnits::Millimetre}, {"both", PostUnits::Both}}))
      post_.units = *units;
    if (auto style = top.choice<CommentStyle>(
            "comments",
            {{"parentheses", CommentStyle::Parentheses}, {"semicolon", CommentStyle::Semicolon}}))
      post_.comments = *style;
    if (auto arcs = top.choice<ArcFormat>(
            "arc_format", {{"ijk", ArcFormat::Centre}, {"radius", ArcFormat::Radius}}))
      post_.arc_format = *arcs;
    post_.tool_changer = top.flag("tool_changer").value_or(post_.tool_changer);
    post_.tool_length_offset = top.flag("tool_length_offset").value_or(post_.tool_length_offset);
    post_.cutter_compensation = top.flag("cutter_compensation").value_or(post_.cutter_compensation);
    post_.parameters = top.flag("parameters").value_or(post_.parameters);
    post_.optional_stop = top.flag("optional_stop").value_or(post_.optional_stop);
    post_.canned_cycles = top.flag("canned_cycles").value_or(post_.canned_cycles);
    post_.two_digit_codes = top.flag("two_digit_codes").value_or(post_.two_digit_codes);
    // 256 is the RS274NGC limit; below 32 not even a short move with its N word fits.
    post_.max_line_length =
        static_cast<int>(top.integer("max_line_length", 32, 256).value_or(post_.max_line_length));
    if (auto lines = read_lines(top, "start")) post_.start_lines = *lines;
    if (auto lines = read_lines(top, "end")) post_.end_lines = *lines;
    read_line_numbers(top);
    read_decimals(top);
    read_coolant(top);
    top.reject_unknown();
    // A post must say what it is: an empty or foreign file is refused rather
    // than silently taken as all defaults.
    if (post_.name.empty())
      top.fail("name",
               "missing; every post file names itself: name = \"...\" (see post/README.md)");
    return post_;
  }

 private:
  std::optional<std::vector<std::string>> read_lines(TableReader& top, std::string_view key) {
    const auto* array = top.array(key);
    if (!array) return std::nullopt;
    std::vector<std::string> lines;
    for (const auto& item : *array) {
      const auto where = detail::place_of(item, file_);
      const auto* s = item.as_string();
      if (!s) throw InputError("each line must be a string in quotes", where, top.field(key));
      const std::string& line = s->get();
      if (line.empty() || line.find_first_not_of(' ') == std::string::npos)
        throw InputError("empty line; leave it out of the list", where, top.field(key));
      if (!printable_ascii(line))
        throw InputError("line \"" + line +
                             "\" has characters a control may not read; use printable ASCII "
                             "only (letters, digits, punctuation, spaces), one line per string",
                         where, top.field(key));
      if (static_cast<int>(line.size()) > post_.max_line_length)
        throw InputError(fmt::format("line \"{}\" is {} characters long; max_line_length is {}",
                                     line, line.size(), post_.max_line_length),
                         where, top.field(key));
      lines.push_back(line);
    }
    return lines;
  }

  void read_line_numbers(TableReader& top) {
    const auto* table = top.table("line_numbers");
    if (!table) return;
    TableReader t(*table, "line_numbers", file_);
    auto& n = post_.line_numbers;
    n.enabled = t.flag("enabled").value_or(n.enabled);
    // N words are at most five digits (NISTIR 6556, from memory: section 3.3).
    n.start = static_cast<long>(t.integer("start", 0, 99999).value_or(n.start));
    n.step = static_cast<long>(t.integer("step", 1, 1000).value_or(n.step));
    t.reject_unknown();
  }

  void read_decimals(TableReader& top) {
    const auto* table = top.table("decimals");
    if (!table) return;
    TableReader t(*table, "decimals", file_);
    auto& d = post_.decimals;
    d.inch = static_cast<int>(t.integer("inch", 1, 6).value_or(d.inch));
    d.mm = static_cast<int>(t.integer("mm", 0, 5).value_or(d.mm));
    d.feed = static_cast<int>(t.integer("feed", 0, 4).value_or(d.feed));
    t.reject_unknown();
  }

  void read_coolant(TableReader& top) {
    const auto* table = top.table("coolant");
    if (!table) return;
    TableReader t(*table, "coolant", file_);
    auto& c = post_.coolant;
    c.flood = coolant_code(t, *table, "flood", c.flood);
    c.mist = coolant_code(t, *table, "mist", c.mist);
    c.off = coolant_code(t, *table, "off", c.off);
    t.reject_unknown();
    if ((c.flood || c.mist) && !c.off)
      t.fail("off",
             "a control that switches coolant on needs a code to switch it off; give "
             "off = 9 (the RS274NGC code) or set flood and mist to \"none\" too");
  }

  std::optional<int> coolant_code(TableReader& t, const toml::table& table, std::string_view key,
                                  std::optional<int> fallback) {
    const auto* value = table.get(key);
    if (value && value->is_string()) {
      auto word = t.choice<int>(key, {{"none", 0}});
      (void)word;
      return std::nullopt;
    }
    auto code = t.integer(key, 0, 999);
    if (!code) return fallback;
    for (int reserved : reserved_m_codes)
      if (*code == reserved)
        t.fail(key, fmt::format("M{} already means something else (stop, program end, spindle or "
                                "tool change); give the control's coolant M code, or \"none\"",
                                reserved));
    return static_cast<int>(*code);
  }

  std::string file_;
  toml::table root_;
  Post post_;
};

}  // namespace

Post read_post(std::string_view text, const std::string& file) {
  return PostReader(text, file).read();
}

}  // namespace dovetailor
