#pragma once

// The feeds a text states, against the feeds the plan's passes run at
// (shared by the plan, sheet and G-code writers' tests): every writer must
// state the feeds of the passes it describes, and no other.

#include <cmath>
#include <set>
#include <string>
#include <vector>

#include <fmt/format.h>

#include <dovetailor/plan/plan.hpp>

namespace dovetailor::testing {

// Feeds as the writers print them: 0.1 in/min, whole mm/min.
inline std::string feed_figure(double mm_per_min, Units units) {
  return units == Units::Inch ? fmt::format("{:.1f}", mm_per_min / 25.4)
                              : fmt::format("{:.0f}", mm_per_min);
}

// Every figure in `text` written as a feed: "3.1 in/min", and both ends of
// "1.6 to 3.1 in/min".
inline std::set<std::string> stated_feeds(const std::string& text) {
  // Scanned by hand: std::regex trips GCC 12's -Wmaybe-uninitialized in the
  // sanitizer build (a false warning inside libstdc++).
  const auto is_figure = [](char c) { return (c >= '0' && c <= '9') || c == '.'; };
  // The figure that ends just before `end`, or "" when none does.
  const auto figure_before = [&](std::size_t end) {
    std::size_t begin = end;
    while (begin > 0 && is_figure(text[begin - 1])) --begin;
    return text.substr(begin, end - begin);
  };
  std::set<std::string> out;
  for (const std::string unit : {" in/min", " mm/min"})
    for (std::size_t at = text.find(unit); at != std::string::npos; at = text.find(unit, at + 1)) {
      const std::string last = figure_before(at);
      if (last.empty() || last.front() == '.') continue;
      out.insert(last);
      const std::size_t to = at - last.size();
      if (to >= 4 && text.compare(to - 4, 4, " to ") == 0) {
        const std::string first = figure_before(to - 4);
        if (!first.empty() && first.front() != '.') out.insert(first);
      }
    }
  return out;
}

// What a summary of these passes must state: the lowest and the highest
// feed of the roughing passes and of the finishing ones (semi-finish,
// finish, spring), as printed.
inline std::set<std::string> expected_feeds(const std::vector<const Pass*>& passes, Units units) {
  std::set<std::string> out;
  for (bool rough : {true, false}) {
    double low = HUGE_VAL, high = -HUGE_VAL;
    for (const Pass* p : passes)
      if ((p->role == PassRole::Rough) == rough) {
        low = std::min(low, p->feed);
        high = std::max(high, p->feed);
      }
    if (low > high) continue;
    out.insert(feed_figure(low, units));
    out.insert(feed_figure(high, units));
  }
  return out;
}

inline std::vector<const Pass*> tool_passes(const Plan& plan, int tool) {
  std::vector<const Pass*> out;
  for (const Pass* p : all_passes(plan))
    if (p->tool == tool) out.push_back(p);
  return out;
}

}  // namespace dovetailor::testing
