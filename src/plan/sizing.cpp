#include <dovetailor/plan/sizing.hpp>

namespace dovetailor {

SizingStyle sizing_style(const Plan& plan, const Post& post) {
  if (post.cutter_compensation && plan.job.dovetail.ends == Ends::Open)
    return SizingStyle::CutterCompensation;
  if (post.parameters) return SizingStyle::Parameters;
  return SizingStyle::Plain;
}

int flank_parameter(Side side) { return side == Side::Left ? 101 : 102; }

}  // namespace dovetailor
