#pragma once

// Numbers in a job's units and the short words the text writers (plan,
// sheet, program header) share. Internal to the core library.

#include <algorithm>
#include <cmath>
#include <string>
#include <vector>

#include <fmt/format.h>

#include <dovetailor/base/length.hpp>
#include <dovetailor/job/job_words.hpp>
#include <dovetailor/plan/plan.hpp>

namespace dovetailor::detail {

struct UnitText {
  Units u;
  // Feeds: 0.1 in/min, or whole mm/min.
  std::string feed(double mm_per_min) const {
    return u == Units::Inch ? fmt::format("{:.1f}", from_mm(mm_per_min, u))
                            : fmt::format("{:.0f}", mm_per_min);
  }
  std::string feed_unit() const { return u == Units::Inch ? "in/min" : "mm/min"; }
};

// The spindle speeds and cutting feeds of some passes (a tool's or an
// operation's), taken from the passes themselves, so every writer states
// the feeds the passes run at: roughing passes and finishing ones
// (semi-finish, finish, spring) apart, each as its lowest and highest.
struct PassFeeds {
  struct Span {
    double low = HUGE_VAL, high = -HUGE_VAL;
    bool empty() const { return low > high; }
    void add(double v) {
      low = std::min(low, v);
      high = std::max(high, v);
    }
  };
  Span rpm, rough, finish;
};

inline PassFeeds pass_feeds(const std::vector<const Pass*>& passes) {
  PassFeeds f;
  for (const Pass* p : passes) {
    f.rpm.add(p->rpm);
    (p->role == PassRole::Rough ? f.rough : f.finish).add(p->feed);
  }
  return f;
}

inline std::vector<const Pass*> passes_of(const Operation& op) {
  std::vector<const Pass*> out;
  for (const auto& p : op.passes) out.push_back(&p);
  return out;
}

inline std::vector<const Pass*> passes_of_tool(const Plan& plan, int tool) {
  std::vector<const Pass*> out;
  for (const Pass* p : all_passes(plan))
    if (p->tool == tool) out.push_back(p);
  return out;
}

// "764 rev/min" or "700 to 764 rev/min"; `rpm` names the unit.
inline std::string rpm_words(const PassFeeds& f, const std::string& rpm) {
  const std::string low = fmt::format("{:.0f}", f.rpm.low),
                    high = fmt::format("{:.0f}", f.rpm.high);
  return (low == high ? high : low + " to " + high) + " " + rpm;
}

// "feed 3.8 in/min, finishing 1.9 in/min", "feed 3.1 in/min" (one kind of
// pass), or with ranges "feed 1.6 to 3.1 in/min". `num` formats a feed
// without its unit.
template <class Num>
std::string feed_words(const PassFeeds& f, Num num, const std::string& unit) {
  const auto span = [&](const PassFeeds::Span& s) {
    const std::string low = num(s.low), high = num(s.high);
    return (low == high ? high : low + " to " + high) + " " + unit;
  };
  if (f.rough.empty() && f.finish.empty()) return "no cutting feed";
  if (f.rough.empty()) return "feed " + span(f.finish);
  if (f.finish.empty()) return "feed " + span(f.rough);
  return "feed " + span(f.rough) + ", finishing " + span(f.finish);
}

// A pass's role for a table column: "rough", "semi", "finish", "spring".
inline std::string role_name(PassRole r) { return std::string(text_of(r)); }

// The flank a pass works toward: "left", "right", or "centre".
inline std::string side_name(std::optional<Side> s) {
  return s ? std::string(text_of(*s)) : "centre";
}

// How the reading is taken: "over 2 pins", "between 2 pins", ...
inline std::string method_words(const PinReading& r) { return std::string(text_of(r.method)); }

// For a checkpoint on a tapered gib, where its readings hold and how they
// change along the slide (Checkpoint::reading_per_length); empty without a
// taper. `back_y` is the back end of the dovetail, mm.
inline std::string taper_words(const Checkpoint& c, double back_y, const UnitText& s) {
  if (c.reading_per_length == 0) return {};
  const double rate = c.reading_per_length;
  const auto per = [&](double r) {
    return fmt::format("{:.6f} {} per {}", std::abs(r), unit_symbol(s.u), unit_symbol(s.u));
  };
  std::string text = fmt::format(
      "Tapered gib: these readings hold at the front end, y = {}. Toward the back the reading "
      "{} {} of y ({} at the back end, y = {}); measured at y, compare it with the expected "
      "reading {} {} x y.",
      shown(c.reading_at_y, s.u), rate > 0 ? "grows" : "drops", per(rate),
      shown(c.expected.value + rate * (back_y - c.reading_at_y), s.u), shown(back_y, s.u),
      rate > 0 ? "plus" : "less", fmt::format("{:.6f}", std::abs(rate)));
  if (c.reference_reading)
    text += c.reference_per_length == 0
                ? " The one-pin reading from the stock face does not change along the slide."
                : fmt::format(" The one-pin reading from the stock face {} {} of y.",
                              c.reference_per_length > 0 ? "grows" : "drops",
                              per(c.reference_per_length));
  return text;
}

}  // namespace dovetailor::detail
