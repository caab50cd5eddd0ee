#include <algorithm>
#include <cctype>
#include <cmath>
#include <stdexcept>

#include <fmt/format.h>

#include <dovetailor/base/error.hpp>
#include <dovetailor/plan/trim.hpp>

namespace dovetailor {
namespace {

constexpr double tiny = 1e-9;  // mm

const Operation& undercut_of(const Plan& plan) {
  for (const auto& op : plan.operations)
    if (op.kind == OperationKind::Undercut) return op;
  throw std::logic_error("trim: the plan has no undercut operation");
}

// A copy of the plan's finishing pass `finish` (stock 0) that leaves `left`
// on its flank and cuts `taken`. `error` is how much more stock the cutter
// left than planned at the checkpoint (stock now - planned): the process
// left that much, so every position moves toward the flank by it. The lines
// a pass runs on away from the flank (a front-open return) move with the
// stock the pass starts from.
Pass shifted(const Plan& plan, const Pass& finish, PassRole role, double left, double taken,
             double error, double z_correction, int number) {
  const double toward = toward_flank(plan.target.type, *finish.side);
  Pass p = finish;
  p.number = number;
  p.role = role;
  p.x = finish.x - toward * (left - error);
  p.z = finish.z + z_correction;
  p.radial_step = taken;
  p.stock_left = left;
  p.deflection = 0;
  for (auto* part : {&p.entry, &p.cut, &p.exit})
    for (auto& m : *part) {
      const bool on_line = std::abs(m.to.x - finish.x_at(m.to.y)) < tiny;
      m.to.x -= toward * ((on_line ? left : left + taken) - error);
      if (std::abs(m.to.z - finish.z) < tiny) m.to.z = p.z;
    }
  return p;
}

Plan corrective_plan(const Plan& plan, const Checkpoint& c, double stock, double z_correction) {
  const double error = stock - c.remaining_per_flank;
  const Operation& undercut = undercut_of(plan);
  Operation op = undercut;
  op.corrective = true;
  op.passes.clear();
  // The plan's last cut per flank: the radial step of its finishing pass.
  std::vector<const Pass*> finishes;
  for (const auto& p : undercut.passes)
    if (p.role == PassRole::Finish && p.side) finishes.push_back(&p);
  int number = 1;
  const auto add = [&](PassRole role, double left, double taken) {
    for (const Pass* f : finishes)
      op.passes.push_back(shifted(plan, *f, role, left, taken, error, z_correction, number++));
  };
  const double last_cut = finishes.empty() ? 0 : finishes.front()->radial_step;
  if (stock > last_cut + tiny) {
    add(PassRole::SemiFinish, last_cut, stock - last_cut);
    add(PassRole::Finish, 0, last_cut);
  } else {
    add(PassRole::Finish, 0, stock);
  }
  if (plan.job.strategy.spring_pass) add(PassRole::Spring, 0, 0);

  Plan out = plan;
  out.operations = {op};
  out.notes.clear();
  out.warnings.clear();
  Checkpoint after = c;
  after.after_pass = number - 1;
  after.name = "after the trim";
  after.expected = plan.final_reading;
  after.remaining_per_flank = 0;
  after.remaining_normal = 0;
  if (after.reference_reading) *after.reference_reading -= c.remaining_per_flank;
  out.checkpoints = {after};
  return out;
}

}  // namespace

std::size_t find_checkpoint(const Plan& plan, std::string_view text) {
  const std::size_t n = plan.checkpoints.size();
  std::string choices;
  for (std::size_t i = 0; i < n; ++i)
    choices += fmt::format("{}{} or {} ({})", i ? ", " : "", i + 1, static_cast<char>('A' + i),
                           plan.checkpoints[i].name);
  const auto refuse = [&] {
    return InputError(fmt::format("no checkpoint \"{}\" in the plan; give {}", text,
                                  n ? choices : "none: the plan has no checkpoints"),
                      {}, "--checkpoint");
  };
  if (text.size() == 1 && std::isalpha(static_cast<unsigned char>(text[0]))) {
    const auto i =
        static_cast<std::size_t>(std::toupper(static_cast<unsigned char>(text[0])) - 'A');
    if (i < n) return i;
    throw refuse();
  }
  if (text.empty() || text.size() > 3 ||
      !std::all_of(text.begin(), text.end(), [](char ch) { return ch >= '0' && ch <= '9'; }))
    throw refuse();
  const auto i = static_cast<std::size_t>(std::stoi(std::string(text)));
  if (i < 1 || i > n) throw refuse();
  return i - 1;
}

Trim trim(const Plan& plan, const TrimRequest& request) {
  if (request.checkpoint >= plan.checkpoints.size())
    throw std::logic_error("trim: checkpoint index out of range");
  if (!std::isfinite(request.reading) || request.reading <= 0)
    throw InputError("the reading must be a positive number, as read from the micrometer", {},
                     "--reading");
  if (request.depth && (!std::isfinite(*request.depth) || *request.depth <= 0))
    throw InputError("the depth must be a positive number, measured from the top face", {},
                     "--depth");
  const Checkpoint& c = plan.checkpoints[request.checkpoint];
  const double length = plan.job.dovetail.length;
  if (!std::isfinite(request.at_y) || request.at_y < -tiny || request.at_y > length + tiny)
    throw InputError(fmt::format("the reading must be taken on the dovetail, y from 0 at the "
                                 "front end to {:g} at the back, in the job's units",
                                 from_mm(length, plan.job.units)),
                     {}, "--at");
  const bool female = plan.target.type == DovetailType::Female;
  const int n = plan.target.angled_flanks();
  const auto& tol = plan.job.dovetail.tolerance;

  Trim t;
  t.checkpoint = request.checkpoint;
  t.letter = static_cast<char>('A' + request.checkpoint);
  t.reading = request.reading;
  t.at_y = request.at_y;
  t.expected = c.expected.value + c.reading_per_length * (request.at_y - c.reading_at_y);
  t.reading_error = request.reading - t.expected;
  const double stock = c.remaining_per_flank + t.reading_error * c.correction_per_reading;
  for (Side side : {Side::Left, Side::Right})
    if (plan.target.flank(side).angled)
      t.flanks.push_back({.side = side, .planned = c.remaining_per_flank, .now = stock});
  // Stock left narrows a female and widens a male, by n * stock.
  t.width_error = (female ? -1.0 : 1.0) * n * stock;
  // The final width is the middle of the band: against the nominal the part
  // is off by the width error plus that.
  const double off_nominal = t.width_error + band_middle(tol);
  const bool past = female ? off_nominal > tol.upper + tiny : off_nominal < tol.lower - tiny;
  const bool within = off_nominal >= tol.lower - tiny && off_nominal <= tol.upper + tiny;
  t.verdict = past ? TrimVerdict::OverCut : (within ? TrimVerdict::OnSize : TrimVerdict::Trim);

  if (request.depth) {
    DepthCheck d{.measured = *request.depth,
                 .expected = c.expected_depth,
                 .tolerance = tol.upper - tol.lower};
    if (d.beyond() && d.error() < 0) d.z_correction = d.error();  // shallow: lower by the error
    t.depth = d;
  }
  t.offset_change = -(stock - c.remaining_per_flank);
  for (const Pass* p : all_passes(plan))
    if (p->role != PassRole::Rough && t.first_finishing_pass == 0)
      t.first_finishing_pass = p->number;
  t.passes = plan;
  t.passes.operations.clear();
  t.passes.checkpoints.clear();
  if (t.verdict == TrimVerdict::Trim)
    t.passes = corrective_plan(plan, c, stock, t.depth ? t.depth->z_correction : 0);
  return t;
}

}  // namespace dovetailor
