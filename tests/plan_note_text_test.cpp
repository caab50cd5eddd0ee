// The plan's notes and warnings are data; these tests hold the words each
// kind is written in (the text plan, the sheet, the program header and the
// terminal all use them). Exact text, as for any writer.

#include <set>
#include <string>

#include <gtest/gtest.h>

#include <dovetailor/report/plan_note_text.hpp>

namespace dovetailor {
namespace {

double inch(double value) { return to_mm(value, Units::Inch); }

TEST(plan_note_text, a_male_mate_gives_the_mouth_from_its_root) {
  const MateNote n{.mate = {.type = DovetailType::Male,
                            .reading = inch(1.2345),
                            .pin_diameter = inch(0.25),
                            .clearance = inch(0.0015)},
                   .derivation = {.mate_width = inch(1.0), .width = inch(1.0015)}};
  // A mate's figures carry one decimal more than the plan's lengths.
  EXPECT_EQ(note_text(n, Units::Inch),
            "mate: male read 1.23450 in over 0.25000 in pins -> root width 1.00000 in; "
            "mouth = root + clearance 0.00150 in = 1.00150 in");
}

TEST(plan_note_text, a_female_mate_gives_the_root_less_what_the_depths_close) {
  const MateNote n{.mate = {.type = DovetailType::Female,
                            .reading = inch(1.25),
                            .pin_diameter = inch(0.25),
                            .depth = inch(0.375),
                            .clearance = inch(0.0015)},
                   .derivation = {.mate_width = inch(1.1),
                                  .mate_mouth = inch(1.5),
                                  .depth_loss = inch(0.0288675),
                                  .depth_difference = inch(0.025),
                                  .width = inch(1.4696325)}};
  EXPECT_EQ(note_text(n, Units::Inch),
            "mate: female read 1.25000 in between 0.25000 in pins, depth 0.37500 in -> floor "
            "width 1.10000 in, mouth 1.50000 in; root = mouth - clearance 0.00150 in - 0.02887 "
            "in for the male 0.02500 in deeper than the female = 1.46963 in");
}

TEST(plan_note_text, a_cutter_off_angle_says_which_way_and_what_is_held) {
  CutterAngleNote n{.tool = 2,
                    .cutter_angle = 45.1,
                    .dovetail_angle = 45,
                    .tolerance = 0.1,
                    .width_bottom = 28,
                    .width_top = 39.95819,
                    .nominal_width_top = 40};
  EXPECT_EQ(note_text(n, Units::Millimetre),
            "T2 is 45.1 deg, 0.1 deg steeper than the dovetail's 45 deg (within 0.1 deg): the "
            "flanks are planned at 45.1 deg. The base-plane width 28.000 mm is held (the "
            "cutter's tip corner sets it); the top-plane width comes out 39.958 mm (40.000 mm "
            "at 45 deg), and the pin readings are those of 45.1 deg flanks.");
  n.cutter_angle = 44.9;
  n.gib = true;
  const std::string text = note_text(n, Units::Millimetre);
  EXPECT_NE(text.find("0.1 deg shallower"), std::string::npos) << text;
  EXPECT_NE(text.find("held (the cutter's tip corner sets it), the gib's allowance taken at the "
                      "cutter's angle;"),
            std::string::npos)
      << text;
}

TEST(plan_note_text, the_aimed_width_says_over_or_under_the_nominal) {
  AimedWidthNote n{.width_bottom = 28.01, .offset = 0.01, .nominal_width_bottom = 28};
  EXPECT_EQ(note_text(n, Units::Millimetre),
            "Aimed at the middle of the width tolerance: 28.010 mm at the base plane, 0.010 mm "
            "over the nominal 28.000 mm, so that rounding the program's last decimal keeps the "
            "part inside the band.");
  n = {.width_bottom = 27.99, .offset = -0.01, .nominal_width_bottom = 28};
  EXPECT_NE(note_text(n, Units::Millimetre).find("27.990 mm at the base plane, 0.010 mm under"),
            std::string::npos);
}

TEST(plan_note_text, milling_names_the_material_and_the_direction) {
  EXPECT_EQ(
      note_text(
          MillingNote{.material = "cast iron", .mode = MillingMode::Conventional, .manual = true},
          Units::Inch),
      "Material: cast iron. Milling conventional on the flanks (manual machine: always "
      "conventional).");
  EXPECT_EQ(note_text(MillingNote{.material = "6061-T6", .mode = MillingMode::Climb}, Units::Inch),
            "Material: 6061-T6. Milling climb on the flanks.");
}

TEST(plan_note_text, allowances_name_the_floor_and_the_last_cut_only_where_there_are_some) {
  EXPECT_EQ(note_text(AllowanceNote{.rough = inch(0.010),
                                    .floor = inch(0.005),
                                    .finish = inch(0.008),
                                    .last_cut = inch(0.002)},
                      Units::Inch),
            "Allowances: end mill leaves 0.0100 in per side and 0.0050 in on the floor; the "
            "dovetail cutter leaves 0.0080 in per flank for finishing, then a semi-finish pass "
            "leaves 0.0020 in.");
  EXPECT_EQ(note_text(AllowanceNote{.rough = 0.25, .floor = std::nullopt, .finish = 0.1},
                      Units::Millimetre),
            "Allowances: end mill leaves 0.250 mm per side; the dovetail cutter leaves 0.100 mm "
            "per flank for finishing.");
  // A female floor left with nothing on it still says so.
  EXPECT_NE(note_text(AllowanceNote{.rough = 0.25, .floor = 0.0, .finish = 0.1}, Units::Millimetre)
                .find("and 0.000 mm on the floor"),
            std::string::npos);
}

TEST(plan_note_text, bend_limits_give_both_limits) {
  EXPECT_EQ(note_text(BendLimitNote{.rough = inch(0.004), .finish = inch(0.0005)}, Units::Inch),
            "Radial steps are sized so the predicted bend of the dovetail cutter stays under "
            "0.0040 in; the finishing pass should bend it under 0.0005 in (a quarter of the "
            "tolerance). A spring pass at the same setting takes out what the cutter sprang "
            "away on the finishing pass.");
}

TEST(plan_note_text, each_warning_kind_has_its_words) {
  const CuttingWarning capped{
      .kind = CuttingWarningKind::RpmCapped, .wanted = 4583.662, .used = 4000};
  EXPECT_EQ(warning_text(CuttingDataWarning{.tool = 1, .warning = capped}, Units::Inch),
            "T1: " + warning_text(capped, Units::Inch));
  EXPECT_EQ(warning_text(ClimbOnManualWarning{}, Units::Inch),
            "strategy.direction = \"climb\" is ignored on a manual machine: table backlash can "
            "pull the work into the cutter; every pass is conventional");
  EXPECT_EQ(warning_text(LargeFinishAllowanceWarning{.finish = 6, .rough = 0.25}, Units::Inch),
            "the finish allowance is unusually large");
  EXPECT_EQ(warning_text(FinishBendWarning{.pass = 42, .deflection = inch(0.0012), .limit = 0},
                         Units::Inch),
            "pass 42: predicted deflection 0.0012 in on the finishing pass is more than a quarter "
            "of the tolerance; the spring pass matters, and a smaller finish allowance would "
            "help");
  EXPECT_EQ(warning_text(NoGaugeWarning{}, Units::Millimetre),
            "no [gauge] pin_diameter: the checkpoints give widths but no pin readings");
}

TEST(plan_note_text, operations_are_titled_by_kind_and_the_square_walls_side) {
  Operation op;
  op.kind = OperationKind::FinishSquareWall;
  Pass wall;
  wall.side = Side::Left;
  op.passes = {wall};
  EXPECT_EQ(operation_title(op), "Finish the square left wall");
  op.passes.front().side = Side::Right;
  EXPECT_EQ(operation_title(op), "Finish the square right wall");
  op = Operation{};
  op.kind = OperationKind::Undercut;
  EXPECT_EQ(operation_title(op), "Undercut and finish the flanks");
  op.corrective = true;
  EXPECT_EQ(operation_title(op), "Trim the flanks to size");
  // The dovetail cutter never comes down inside the stock, whatever the ends.
  for (Ends ends : {Ends::Open, Ends::FrontOpen})
    EXPECT_NE(entry_words(op, ends).find("never plunges"), std::string::npos);
  op.kind = OperationKind::RoughSlot;
  EXPECT_NE(entry_words(op, Ends::FrontOpen).find("leaves upward"), std::string::npos);
}

TEST(plan_note_text, every_kind_has_its_own_json_word) {
  const PlanNote notes[] = {MateNote{},    CutterAngleNote{}, AimedWidthNote{},
                            MillingNote{}, AllowanceNote{},   BendLimitNote{}};
  std::set<std::string> words;
  for (const auto& n : notes) words.insert(std::string(note_kind(n)));
  EXPECT_EQ(words.size(), std::size(notes));
  const PlanWarning warnings[] = {CuttingDataWarning{}, ClimbOnManualWarning{},
                                  LargeFinishAllowanceWarning{}, FinishBendWarning{},
                                  NoGaugeWarning{}};
  words.clear();
  for (const auto& w : warnings) words.insert(std::string(warning_kind(w)));
  EXPECT_EQ(words.size(), std::size(warnings));
  EXPECT_EQ(note_kind(MateNote{}), "mate");
  EXPECT_EQ(warning_kind(FinishBendWarning{}), "finish_bend");
}

}  // namespace
}  // namespace dovetailor
