#pragma once

// The feeds a text states, against the feeds the plan's passes run at
// (shared by the plan, sheet and G-code writers' tests): every writer must
// state the feeds of the passes it describes, and no other.

#include <cmath>
#include <regex>
#include <set>
#include <string>
#include <vector>

#include <fmt/format.h>

#include <dovetailor/plan.hpp>

namespace dovetailor::testing {

// Feeds as the writers print them: 0.1 in/min, whole mm/min.
inline std::string feed_figure(double mm_per_min, Units units) {
  return units == Units::Inch ? fmt::format("{:.1f}", mm_per_min / 25.4)
                              : fmt::format("{:.0f}", mm_per_min);
}

// Every figure in `text` written as a feed: "3.1 in/min", and both ends of
// "1.6 to 3.1 in/min".
inline std::set<std::string> stated_feeds(const std::string& text) {
  static const std::regex feed(
      R"(([0-9]+(?:\.[0-9]+)?)(?: to ([0-9]+(?:\.[0-9]+)?))? (?:in|mm)/min)");
  std::set<std::string> out;
  for (auto it = std::sregex_iterator(text.begin(), text.end(), feed); it != std::sregex_iterator();
       ++it) {
    out.insert((*it)[1].str());
    if ((*it)[2].matched) out.insert((*it)[2].str());
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
